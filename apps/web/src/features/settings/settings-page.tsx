// The owner's dispatch settings: response targets per severity, warning lead, dispatch phone, map tiles.
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { PageHeader } from '../../components/page-header.tsx';
import { Field, inputClass } from '../../components/field.tsx';
import { applyServerErrors } from '../../components/form-errors.ts';
import { ErrorState, Loading } from '../../components/states.tsx';
import { severities, severityLabels } from '@bumperline/contracts/call-vocabulary';
import type { CompanySettings } from '@bumperline/contracts/settings';
import { useSaveSettings, useSettings } from '../../api/settings.ts';

export function SettingsPage() {
  const settings = useSettings();
  if (settings.isLoading) return <Loading />;
  if (settings.error || !settings.data) return <ErrorState error={settings.error} onRetry={() => settings.refetch()} />;
  return <SettingsForm settings={settings.data} />;
}

type FormValues = { down: number; fault: number; cosmetic: number; warnBeforeMinutes: number; dispatchPhone: string; mapTileUrl: string };

function SettingsForm({ settings }: { settings: CompanySettings }) {
  const save = useSaveSettings();
  const [saved, setSaved] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<FormValues>({
    defaultValues: {
      ...settings.responseTargets,
      warnBeforeMinutes: settings.warnBeforeMinutes,
      dispatchPhone: settings.dispatchPhone,
      mapTileUrl: settings.mapTileUrl,
    },
  });
  const { register, handleSubmit, formState, setError } = form;
  const onSubmit = handleSubmit(async (v) => {
    setSaved(false);
    setFormError(null);
    try {
      await save.mutateAsync({
        responseTargets: { down: v.down, fault: v.fault, cosmetic: v.cosmetic },
        warnBeforeMinutes: v.warnBeforeMinutes,
        dispatchPhone: v.dispatchPhone,
        mapTileUrl: v.mapTileUrl,
      });
      setSaved(true);
    } catch (err) {
      // The API names nested fields as responseTargets.down: map them onto the form's own names.
      setFormError(
        applyServerErrors(err, (name, e) => setError(String(name).replace('responseTargets.', '') as keyof FormValues, e), [
          'responseTargets',
          'warnBeforeMinutes',
          'dispatchPhone',
          'mapTileUrl',
        ]),
      );
    }
  });
  return (
    <>
      <PageHeader title="Settings" subtitle="How fast calls should be answered, who is warned, and where map tiles come from." />
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
          <legend className="mb-2 font-bold">Response target, in minutes</legend>
          {severities.map((s) => (
            <Field key={s} label={severityLabels[s]} error={formState.errors[s]?.message}>
              {(a) => <input {...a} inputMode="numeric" className={inputClass} {...register(s, { valueAsNumber: true })} />}
            </Field>
          ))}
        </fieldset>
        <Field label="Warn dispatch this many minutes before a target is missed" error={formState.errors.warnBeforeMinutes?.message}>
          {(a) => <input {...a} inputMode="numeric" className={inputClass} {...register('warnBeforeMinutes', { valueAsNumber: true })} />}
        </Field>
        <Field
          label="Dispatch phone for SMS warnings"
          hint="Leave empty to warn only dispatchers who have a phone number."
          error={formState.errors.dispatchPhone?.message}
        >
          {(a) => <input {...a} type="tel" className={inputClass} {...register('dispatchPhone')} />}
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
