import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate, useParams, Link } from 'react-router-dom';
import { useState } from 'react';
import type { z } from 'zod';
import { venueInput, type Venue } from '@bumperline/contracts/venues';
import { Field, inputClass } from '../../components/field.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading } from '../../components/states.tsx';
import { applyServerErrors, fieldMessage } from '../../components/form-errors.ts';
import { ApiError } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { useSaveVenue, useVenue } from '../../api/venues.ts';

type FormIn = z.input<typeof venueInput>;
type FormOut = z.output<typeof venueInput>;

const days = [
  ['1', 'Monday'],
  ['2', 'Tuesday'],
  ['3', 'Wednesday'],
  ['4', 'Thursday'],
  ['5', 'Friday'],
  ['6', 'Saturday'],
  ['7', 'Sunday'],
] as const;

const FIELDS = [
  'name',
  'addressLine',
  'city',
  'postcode',
  'latitude',
  'longitude',
  'openingHours',
  'contactName',
  'contactPhone',
  'contactEmail',
  'notes',
] as const;

export function EditVenuePage() {
  const { id = '' } = useParams();
  const venue = useVenue(id);
  if (venue.isLoading) return <Loading />;
  if (venue.error || !venue.data) return <ErrorState error={venue.error} onRetry={() => venue.refetch()} />;
  return <VenueForm venue={venue.data} />;
}

export function NewVenuePage() {
  return <VenueForm />;
}

function toForm(v?: Venue): FormIn {
  return v
    ? {
        name: v.name,
        addressLine: v.addressLine,
        city: v.city,
        postcode: v.postcode,
        latitude: v.latitude,
        longitude: v.longitude,
        openingHours: v.openingHours,
        contactName: v.contactName,
        contactPhone: v.contactPhone,
        contactEmail: v.contactEmail,
        notes: v.notes,
      }
    : {
        name: '',
        addressLine: '',
        city: '',
        postcode: '',
        latitude: undefined as unknown as number,
        longitude: undefined as unknown as number,
        openingHours: {},
        contactName: '',
        contactPhone: '',
        contactEmail: '',
        notes: '',
      };
}

function VenueForm({ venue }: { venue?: Venue }) {
  const navigate = useNavigate();
  const save = useSaveVenue(venue?.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [conflict, setConflict] = useState<Venue | null>(null);
  const [version, setVersion] = useState(venue?.version ?? 1);
  const form = useForm<FormIn, unknown, FormOut>({ resolver: zodResolver(venueInput), defaultValues: toForm(venue) });
  const { register, handleSubmit, formState, setError, setValue, reset, control } = form;
  const errors = formState.errors;
  const hours = useWatch({ control, name: 'openingHours' }) ?? {};

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setConflict(null);
    try {
      const saved = await save.mutateAsync(venue ? { ...values, version } : values);
      navigate(paths.venue(saved.id));
    } catch (err) {
      if (err instanceof ApiError && err.status === 409) {
        setConflict((err.problem.current as Venue) ?? null);
        setFormError(err.message);
      } else setFormError(applyServerErrors(err, setError, FIELDS));
    }
  });

  return (
    <>
      <PageHeader title={venue ? `Edit ${venue.name}` : 'Add a venue'} />
      <form onSubmit={onSubmit} noValidate className="card grid max-w-3xl gap-4">
        {formError && (
          <div role="alert" className="rounded-md border border-down bg-down-tint p-3 font-semibold text-down">
            {formError}
            {conflict && (
              <button
                type="button"
                className="btn-secondary mt-2 block"
                onClick={() => {
                  reset(toForm(conflict));
                  setVersion(conflict.version);
                  setConflict(null);
                  setFormError(null);
                }}
              >
                Load the current values
              </button>
            )}
          </div>
        )}
        <Field label="Name" error={fieldMessage(errors.name?.message)}>
          {(a) => <input {...a} className={inputClass} {...register('name')} autoComplete="organization" />}
        </Field>
        <div className="grid gap-4 sm:grid-cols-[2fr_1fr_1fr]">
          <Field label="Street address" error={fieldMessage(errors.addressLine?.message)}>
            {(a) => <input {...a} className={inputClass} {...register('addressLine')} autoComplete="street-address" />}
          </Field>
          <Field label="City" error={fieldMessage(errors.city?.message)}>
            {(a) => <input {...a} className={inputClass} {...register('city')} autoComplete="address-level2" />}
          </Field>
          <Field label="Postcode" error={fieldMessage(errors.postcode?.message)}>
            {(a) => <input {...a} className={inputClass} {...register('postcode')} autoComplete="postal-code" />}
          </Field>
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <Field label="Latitude" hint="Decimal degrees, e.g. 41.9088" error={fieldMessage(errors.latitude?.message)}>
            {(a) => <input {...a} className={inputClass} inputMode="decimal" {...register('latitude', { valueAsNumber: true })} />}
          </Field>
          <Field label="Longitude" hint="Decimal degrees, e.g. -87.6796" error={fieldMessage(errors.longitude?.message)}>
            {(a) => <input {...a} className={inputClass} inputMode="decimal" {...register('longitude', { valueAsNumber: true })} />}
          </Field>
        </div>
        <fieldset className="grid gap-2">
          <legend className="mb-1 font-semibold">Opening hours</legend>
          {days.map(([d, label]) => {
            const win = hours[d]?.[0];
            return (
              <div key={d} className="grid grid-cols-[7rem_auto_1fr_1fr] items-center gap-2">
                <span>{label}</span>
                <label className="flex min-h-11 items-center gap-1 text-sm">
                  <input
                    type="checkbox"
                    className="size-5"
                    checked={!!win}
                    onChange={(e) =>
                      setValue(
                        'openingHours',
                        { ...hours, [d]: e.target.checked ? [{ open: '12:00', close: '23:00' }] : undefined },
                        { shouldDirty: true },
                      )
                    }
                  />
                  Open
                </label>
                {win ? (
                  <>
                    <input
                      aria-label={`${label} opens`}
                      type="time"
                      className={inputClass}
                      value={win.open}
                      onChange={(e) =>
                        setValue('openingHours', { ...hours, [d]: [{ ...win, open: e.target.value }] }, { shouldDirty: true })
                      }
                    />
                    <input
                      aria-label={`${label} closes`}
                      type="time"
                      className={inputClass}
                      value={win.close}
                      onChange={(e) =>
                        setValue('openingHours', { ...hours, [d]: [{ ...win, close: e.target.value }] }, { shouldDirty: true })
                      }
                    />
                  </>
                ) : (
                  <span className="col-span-2 text-ink-muted">Closed</span>
                )}
              </div>
            );
          })}
          {errors.openingHours && <p className="text-sm font-semibold text-down">Opening hours: check the times (HH:MM).</p>}
        </fieldset>
        <div className="grid gap-4 sm:grid-cols-3">
          <Field label="Contact name" error={fieldMessage(errors.contactName?.message)}>
            {(a) => <input {...a} className={inputClass} {...register('contactName')} autoComplete="name" />}
          </Field>
          <Field label="Contact phone" error={fieldMessage(errors.contactPhone?.message)}>
            {(a) => <input {...a} type="tel" className={inputClass} {...register('contactPhone')} autoComplete="tel" />}
          </Field>
          <Field label="Contact e-mail" error={fieldMessage(errors.contactEmail?.message)}>
            {(a) => <input {...a} type="email" className={inputClass} {...register('contactEmail')} autoComplete="email" />}
          </Field>
        </div>
        <Field label="Notes for technicians" error={fieldMessage(errors.notes?.message)}>
          {(a) => <textarea {...a} rows={3} className={inputClass} {...register('notes')} />}
        </Field>
        <div className="flex gap-2">
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? 'Saving…' : venue ? 'Save changes' : 'Add venue'}
          </button>
          <Link to={venue ? paths.venue(venue.id) : paths.venues} className="btn-secondary">
            Cancel
          </Link>
        </div>
      </form>
    </>
  );
}
