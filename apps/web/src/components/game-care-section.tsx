// A game's meters (the newest reading of each, and a form to record one) and its keep cost over the last 12 months.
import { useState } from 'react';
import { Gauge } from 'lucide-react';
import { meterKindLabels, meterKinds, type MeterKind } from '@bumperline/contracts/care-vocabulary';
import { useKeepCost, useLatestReadings, useRecordReading } from '../api/meters.ts';
import { useLocaleSettings } from '../api/me.ts';
import { useCan } from '../api/use-can.ts';
import { ApiError } from '../lib/api-client.ts';
import { asSentence, formatDateTime, formatMoney } from '../lib/format.ts';
import { formatMinutes } from '../lib/duration-entry.ts';
import { inputClass } from './field.tsx';
import { ErrorState, Loading } from './states.tsx';

const count = new Intl.NumberFormat('en-US');

function RecordReading({ gameId }: { gameId: string }) {
  const record = useRecordReading(gameId);
  const [meter, setMeter] = useState<MeterKind>('plays');
  const [text, setText] = useState('');
  const [rolledOver, setRolledOver] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const digits = text.replace(/[\s,]/g, '');
    if (!/^\d+$/.test(digits)) return setProblem('Enter the meter as a whole number, such as 15,400.');
    setProblem(null);
    record.mutate(
      { meter, reading: Number(digits), rolledOver },
      {
        onSuccess: () => {
          setText('');
          setRolledOver(false);
        },
        onError: (err) =>
          setProblem(err instanceof ApiError ? asSentence(Object.values(err.fieldErrors())[0] ?? err.message) : 'Could not save.'),
      },
    );
  };
  return (
    <form onSubmit={submit} className="mt-3 flex flex-wrap items-end gap-2" aria-label="Record a meter reading">
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Meter</span>
        <select className={`${inputClass} w-auto`} value={meter} onChange={(e) => setMeter(e.target.value as MeterKind)}>
          {meterKinds.map((m) => (
            <option key={m} value={m}>
              {meterKindLabels[m]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Reading</span>
        <input
          className={`${inputClass} w-40`}
          inputMode="numeric"
          value={text}
          onChange={(e) => setText(e.target.value)}
          aria-invalid={!!problem}
        />
      </label>
      <label className="flex min-h-11 items-center gap-2">
        <input type="checkbox" className="size-5" checked={rolledOver} onChange={(e) => setRolledOver(e.target.checked)} />
        Rolled over
      </label>
      <button type="submit" className="btn-secondary" disabled={record.isPending}>
        {record.isPending ? 'Saving…' : 'Record reading'}
      </button>
      {problem && (
        <p role="alert" className="w-full text-sm font-semibold text-down">
          {problem}
        </p>
      )}
    </form>
  );
}

export function GameCareSection({ gameId }: { gameId: string }) {
  const readings = useLatestReadings(gameId);
  const cost = useKeepCost(gameId);
  const locale = useLocaleSettings();
  const canRead = useCan('meters:write');
  return (
    <section className="card" aria-labelledby="meters-heading">
      <h2 id="meters-heading" className="mb-2 flex items-center gap-2 text-lg font-bold">
        <Gauge aria-hidden className="size-5" /> Meters and keep cost
      </h2>
      {readings.isLoading ? (
        <Loading label="Loading meters…" />
      ) : readings.error ? (
        <ErrorState error={readings.error} onRetry={() => void readings.refetch()} />
      ) : (readings.data?.items.length ?? 0) === 0 ? (
        <p className="text-ink-soft">No meter readings yet.</p>
      ) : (
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
          {readings.data!.items.map((r) => (
            <div key={r.meter} className="contents">
              <dt className="font-semibold">{meterKindLabels[r.meter]}</dt>
              <dd className="tabular-nums">
                {count.format(r.reading)}
                {r.rolledOver ? ' (rolled over)' : ''} <span className="text-sm text-ink-soft">· {formatDateTime(r.readAt, locale)}</span>
              </dd>
            </div>
          ))}
        </dl>
      )}
      {canRead && <RecordReading gameId={gameId} />}
      <div className="mt-4 border-t border-paper-line pt-3">
        {cost.isLoading ? (
          <Loading label="Loading keep cost…" />
        ) : cost.error ? (
          <ErrorState error={cost.error} onRetry={() => void cost.refetch()} />
        ) : (
          <p>
            <span className="font-semibold">Keep cost, last 12 months: </span>
            <span className="tabular-nums">
              {formatMoney(cost.data!.totalCents, locale ? { ...locale, currency: cost.data!.currency } : undefined)}
            </span>
            <span className="text-sm text-ink-soft">
              {' '}
              — parts {formatMoney(cost.data!.partsCents, locale)}, labour {formatMoney(cost.data!.labourCents, locale)} (
              {formatMinutes(cost.data!.labourMinutes)}) over {cost.data!.jobs} {cost.data!.jobs === 1 ? 'job' : 'jobs'}
            </span>
          </p>
        )}
      </div>
    </section>
  );
}
