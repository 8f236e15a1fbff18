// The owner's settings: response targets per severity, warning lead, dispatch phone, map tiles, labour rate, driving
// speed. Times and money are typed as people say them ("4 h", "3 days", "$52.00") and read here into the API's units.
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { PageHeader } from '../../components/page-header.tsx';
import { Field, inputClass } from '../../components/field.tsx';
import { applyServerErrors } from '../../components/form-errors.ts';
import { ErrorState, Loading } from '../../components/states.tsx';
import { severities, severityLabels } from '@bumperline/contracts/call-vocabulary';
import type { CompanySettings } from '@bumperline/contracts/settings';
import { useSaveSettings, useSettings } from '../../api/settings.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { formatMinutes, readMinutes } from '../../lib/duration-entry.ts';
import { moneyInputText, readMoney } from '../../lib/money-entry.ts';
import { defaultLocale, type LocaleSettings } from '../../lib/format.ts';

export function SettingsPage() {
  const settings = useSettings();
  const locale = useLocaleSettings();
  if (settings.isLoading) return <Loading />;
  if (settings.error || !settings.data) return <ErrorState error={settings.error} onRetry={() => settings.refetch()} />;
  return <SettingsForm settings={settings.data} locale={locale ?? defaultLocale} />;
}

type FormValues = {
  down: string;
  fault: string;
  cosmetic: string;
  warnBefore: string;
  dispatchPhone: string;
  mapTileUrl: string;
  labourRate: string;
  averageSpeedKmh: string;
};

const TARGET_BOUNDS = { min: 5, max: 30 * 24 * 60 };
const WARN_BOUNDS = { min: 0, max: 24 * 60 };

function SettingsForm({ settings, locale }: { settings: CompanySettings; locale: LocaleSettings }) {
  const save = useSaveSettings();
  const [saved, setSaved] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<FormValues>({
    defaultValues: {
      down: formatMinutes(settings.responseTargets.down),
      fault: formatMinutes(settings.responseTargets.fault),
      cosmetic: formatMinutes(settings.responseTargets.cosmetic),
      warnBefore: formatMinutes(settings.warnBeforeMinutes),
      dispatchPhone: settings.dispatchPhone,
      mapTileUrl: settings.mapTileUrl,
      labourRate: moneyInputText(settings.labourRateCents, locale),
      averageSpeedKmh: String(settings.averageSpeedKmh),
    },
  });
  const { register, handleSubmit, formState, setError } = form;
  const onSubmit = handleSubmit(async (v) => {
    setSaved(false);
    setFormError(null);
    // Read every typed field first; any that does not read is named at its field and nothing is sent.
    const targets = {
      down: readMinutes(v.down, TARGET_BOUNDS),
      fault: readMinutes(v.fault, TARGET_BOUNDS),
      cosmetic: readMinutes(v.cosmetic, TARGET_BOUNDS),
    };
    const warn = readMinutes(v.warnBefore, WARN_BOUNDS);
    const rate = readMoney(v.labourRate, locale);
    const speedText = v.averageSpeedKmh.trim().replace(/\s*km\/?h$/i, '');
    const speed = /^\d+$/.test(speedText) ? Number(speedText) : NaN;
    let bad = false;
    for (const s of severities) {
      const r = targets[s];
      if (!r.ok) {
        setError(s, { message: r.message });
        bad = true;
      }
    }
    if (!warn.ok) {
      setError('warnBefore', { message: warn.message });
      bad = true;
    }
    if (!rate.ok) {
      setError('labourRate', { message: rate.message });
      bad = true;
    }
    if (!Number.isInteger(speed)) {
      setError('averageSpeedKmh', { message: 'enter a whole number of km/h, such as 35' });
      bad = true;
    }
    if (bad || !targets.down.ok || !targets.fault.ok || !targets.cosmetic.ok || !warn.ok || !rate.ok) return;
    try {
      await save.mutateAsync({
        responseTargets: { down: targets.down.value, fault: targets.fault.value, cosmetic: targets.cosmetic.value },
        warnBeforeMinutes: warn.value,
        dispatchPhone: v.dispatchPhone,
        mapTileUrl: v.mapTileUrl,
        labourRateCents: rate.cents,
        averageSpeedKmh: speed,
      });
      setSaved(true);
    } catch (err) {
      // The API names fields in its own units (responseTargets.down, labourRateCents): map them onto the form's.
      const formName: Record<string, keyof FormValues> = {
        warnBeforeMinutes: 'warnBefore',
        labourRateCents: 'labourRate',
        averageSpeedKmh: 'averageSpeedKmh',
      };
      setFormError(
        applyServerErrors(
          err,
          (name, e) => {
            const key = String(name).replace('responseTargets.', '');
            setError(formName[key] ?? (key as keyof FormValues), e);
          },
          ['responseTargets', 'warnBeforeMinutes', 'dispatchPhone', 'mapTileUrl', 'labourRateCents', 'averageSpeedKmh'],
        ),
      );
    }
  });
  return (
    <>
      <PageHeader
        title="Settings"
        subtitle="How fast calls should be answered, who is warned, what labour costs, and how routes are timed."
      />
      <form onSubmit={onSubmit} noValidate className="card grid max-w-2xl gap-4">
        {saved && (
          <p role="status" className="font-semibold text-running">
            Settings saved.
          </p>
        )}
        {formError && (
          <p role="alert" className="font-semibold text-down">
            {formError}
          </p>
        )}
        <fieldset className="grid gap-3 sm:grid-cols-3">
          <legend className="mb-2 font-bold">Response target: from the report to the technician on site</legend>
          {severities.map((s) => (
            <Field key={s} label={severityLabels[s]} hint="e.g. 4 h or 3 days" error={formState.errors[s]?.message}>
              {(a) => <input {...a} className={inputClass} {...register(s)} />}
            </Field>
          ))}
        </fieldset>
        <Field label="Warn dispatch this long before a target is missed" hint="e.g. 30 min" error={formState.errors.warnBefore?.message}>
          {(a) => <input {...a} className={inputClass} {...register('warnBefore')} />}
        </Field>
        <Field
          label="Dispatch phone for SMS warnings"
          hint="Leave empty to warn only dispatchers who have a phone number."
          error={formState.errors.dispatchPhone?.message}
        >
          {(a) => <input {...a} type="tel" className={inputClass} {...register('dispatchPhone')} />}
        </Field>
        <Field
          label="Labour rate per hour on site"
          hint="What an hour of a technician's time costs the company; keep cost prices each job's time with it."
          error={formState.errors.labourRate?.message}
        >
          {(a) => <input {...a} inputMode="decimal" className={inputClass} {...register('labourRate')} />}
        </Field>
        <Field
          label="Average driving speed between venues, km/h"
          hint="Route days time the drive from the straight-line distance at this speed."
          error={formState.errors.averageSpeedKmh?.message}
        >
          {(a) => <input {...a} inputMode="numeric" className={inputClass} {...register('averageSpeedKmh')} />}
        </Field>
        <Field
          label="Map tile server"
          hint="A URL template with {z}, {x} and {y}. Leave empty to show markers on a plain background (works offline)."
          error={formState.errors.mapTileUrl?.message}
        >
          {(a) => <input {...a} className={inputClass} placeholder="https://tiles.example/{z}/{x}/{y}.png" {...register('mapTileUrl')} />}
        </Field>
        <button type="submit" className="btn-primary justify-self-start" disabled={formState.isSubmitting}>
          Save settings
        </button>
      </form>
    </>
  );
}
