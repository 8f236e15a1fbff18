// How warm a game's cabinet runs through the day, typed the way people say it ("4 h", "45 °C"): the recap dates of
// the boards in it follow from it. Without a profile the API's assumed day is used, and this says so.
import { useState } from 'react';
import { Plus, Thermometer, Trash2 } from 'lucide-react';
import type { CabinetProfile } from '@bumperline/contracts/boards';
import { useCabinetProfile, useSaveCabinetProfile } from '../api/boards.ts';
import { useCan } from '../api/use-can.ts';
import { ApiError } from '../lib/api-client.ts';
import { formatHours, formatTemperature, readHours, readTemperature } from '../lib/cabinet-entry.ts';
import { inputClass } from './field.tsx';
import { ErrorState, Loading } from './states.tsx';

interface Row {
  /** Stable across removals, so React keeps each row's input where it is. */
  key: number;
  hours: string;
  temperature: string;
}

type RowErrors = Record<number, { hours?: string; temperature?: string }>;

const describeSlices = (p: CabinetProfile) =>
  p.slices.map((s) => `${formatHours(s.hours)} at ${formatTemperature(s.temperatureC)}`).join(', then ');

export function CabinetProfileEditor({ gameId }: { gameId: string }) {
  const profile = useCabinetProfile(gameId);
  const canWrite = useCan('boards:write');
  return (
    <section aria-labelledby={`cabinet-${gameId}`} className="rounded-md border border-paper-line bg-paper-dim p-3">
      <h3 id={`cabinet-${gameId}`} className="mb-2 flex items-center gap-2 font-bold">
        <Thermometer aria-hidden className="size-5" /> Cabinet temperature through the day
      </h3>
      {profile.isLoading ? (
        <Loading />
      ) : profile.error || !profile.data ? (
        <ErrorState error={profile.error} onRetry={() => profile.refetch()} />
      ) : (
        <>
          {profile.data.isDefault ? (
            <p className="mb-3 rounded-md bg-brass-light p-2 text-sm">
              Not profiled yet: recap dates use our assumed day — {describeSlices(profile.data)} ({formatHours(profile.data.hoursPerDay)}{' '}
              powered).
              {canWrite && ' Enter this cabinet’s own day to replace it.'}
            </p>
          ) : (
            <p className="mb-3 text-sm text-ink-soft">
              Powered {formatHours(profile.data.hoursPerDay)} a day: {describeSlices(profile.data)}.
            </p>
          )}
          {canWrite && <ProfileForm key={gameId} gameId={gameId} profile={profile.data} />}
        </>
      )}
    </section>
  );
}

function ProfileForm({ gameId, profile }: { gameId: string; profile: CabinetProfile }) {
  const save = useSaveCabinetProfile(gameId);
  const [nextKey, setNextKey] = useState(profile.slices.length);
  const [rows, setRows] = useState<Row[]>(() =>
    profile.slices.map((s, i) => ({ key: i, hours: formatHours(s.hours), temperature: formatTemperature(s.temperatureC) })),
  );
  const [rowErrors, setRowErrors] = useState<RowErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);

  const readRows = rows.map((r) => ({ hours: readHours(r.hours), temperature: readTemperature(r.temperature) }));
  const total = readRows.reduce((sum, r) => sum + (r.hours.ok ? r.hours.value : 0), 0);

  function update(key: number, change: Partial<Row>) {
    setSaved(false);
    setRows((prev) => prev.map((r) => (r.key === key ? { ...r, ...change } : r)));
  }

  function submit() {
    setSaved(false);
    setFormError(null);
    const errors: RowErrors = {};
    readRows.forEach((r, i) => {
      if (!r.hours.ok) errors[i] = { ...errors[i], hours: r.hours.message };
      if (!r.temperature.ok) errors[i] = { ...errors[i], temperature: r.temperature.message };
    });
    setRowErrors(errors);
    if (rows.length === 0) return setFormError('Add at least one stretch of hours powered.');
    if (Object.keys(errors).length > 0) return;
    if (total > 24) return setFormError(`These add up to ${formatHours(total)} powered a day: a day has 24 hours.`);
    const slices = readRows.map((r) => ({
      hours: r.hours.ok ? r.hours.value : 0,
      temperatureC: r.temperature.ok ? r.temperature.value : 0,
    }));
    save.mutate(
      { slices },
      {
        onSuccess: () => setSaved(true),
        onError: (err) => {
          if (!(err instanceof ApiError)) return setFormError('Could not save the profile.');
          const fromServer: RowErrors = {};
          let general: string | null = null;
          for (const [field, message] of Object.entries(err.fieldErrors())) {
            const m = /^slices\.(\d+)\.(hours|temperatureC)$/.exec(field);
            if (m) fromServer[Number(m[1])] = { ...fromServer[Number(m[1])], [m[2] === 'hours' ? 'hours' : 'temperature']: message };
            else general = `${general ? `${general} ` : ''}${field === 'slices' ? 'The hours' : field} ${message}.`;
          }
          setRowErrors(fromServer);
          setFormError(general ?? (Object.keys(fromServer).length ? null : err.message));
        },
      },
    );
  }

  return (
    <form
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <ol className="grid gap-2">
        {rows.map((row, i) => {
          const errors = rowErrors[i] ?? {};
          const hoursId = `cab-${gameId}-${row.key}-h`;
          const tempId = `cab-${gameId}-${row.key}-t`;
          return (
            <li key={row.key} className="grid grid-cols-[1fr_1fr_auto] items-start gap-2">
              <div className="grid gap-1">
                <label htmlFor={hoursId} className="text-sm font-semibold">
                  <span className="sr-only">Stretch {i + 1}: </span>Hours powered
                </label>
                <input
                  id={hoursId}
                  className={inputClass}
                  inputMode="decimal"
                  autoComplete="off"
                  placeholder="4 h"
                  value={row.hours}
                  aria-invalid={!!errors.hours}
                  aria-describedby={errors.hours ? `${hoursId}-error` : undefined}
                  onChange={(e) => update(row.key, { hours: e.target.value })}
                />
                {errors.hours && (
                  <p id={`${hoursId}-error`} className="text-sm font-semibold text-down">
                    {errors.hours}
                  </p>
                )}
              </div>
              <div className="grid gap-1">
                <label htmlFor={tempId} className="text-sm font-semibold">
                  <span className="sr-only">Stretch {i + 1}: </span>At
                </label>
                <input
                  id={tempId}
                  className={inputClass}
                  inputMode="decimal"
                  autoComplete="off"
                  placeholder="45 °C"
                  value={row.temperature}
                  aria-invalid={!!errors.temperature}
                  aria-describedby={errors.temperature ? `${tempId}-error` : undefined}
                  onChange={(e) => update(row.key, { temperature: e.target.value })}
                />
                {errors.temperature && (
                  <p id={`${tempId}-error`} className="text-sm font-semibold text-down">
                    {errors.temperature}
                  </p>
                )}
              </div>
              <button
                type="button"
                className="mt-7 inline-flex min-h-11 min-w-11 items-center justify-center rounded-md border border-paper-line bg-white text-ink-soft hover:text-down"
                aria-label={`Remove stretch ${i + 1}`}
                onClick={() => {
                  setSaved(false);
                  setRowErrors({});
                  setRows((prev) => prev.filter((r) => r.key !== row.key));
                }}
              >
                <Trash2 aria-hidden className="size-4" />
              </button>
            </li>
          );
        })}
      </ol>
      {/* The day's total only once every line reads: a half-typed line would make it wrong. */}
      {readRows.length > 0 && readRows.every((r) => r.hours.ok) && (
        <p className="mt-2 text-sm text-ink-soft" aria-live="polite">
          Powered {formatHours(total)} a day
          {total > 24 && <strong className="text-down"> — more than a day has</strong>}
        </p>
      )}
      {formError && (
        <p role="alert" className="mt-2 text-sm font-semibold text-down">
          {formError}
        </p>
      )}
      <div className="mt-3 flex flex-wrap gap-2">
        <button
          type="button"
          className="btn-secondary"
          disabled={rows.length >= 24}
          onClick={() => {
            setRows((prev) => [...prev, { key: nextKey, hours: '', temperature: '' }]);
            setNextKey((k) => k + 1);
          }}
        >
          <Plus aria-hidden className="size-4" /> Add a stretch
        </button>
        <button type="submit" className="btn-primary" disabled={save.isPending}>
          Save profile
        </button>
      </div>
      {saved && (
        <p role="status" className="mt-2 text-sm font-semibold text-running">
          Saved: recap dates now follow this cabinet’s day.
        </p>
      )}
    </form>
  );
}
