// Care-plan work at the stop: the tasks to tick, time on site as said ("45 min"), the meters read (plays, hours),
// parts fitted from the van, a note, then Done — or Skip with the reason. Queued, so it works without signal.
import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { workOrderQuery } from '../../api/work-orders.ts';
import { useEnqueueChange } from '../../api/technician-changes.ts';
import { formatMinutes, readMinutes } from '../../lib/duration-entry.ts';
import { asSentence } from '../../lib/format.ts';
import type { ItemView } from './day-overlay.ts';
import { ItemStateBadge } from './item-state-badge.tsx';
import { PartsUsedSection } from './parts-used-section.tsx';

const input = 'w-full rounded-md border border-paper-line bg-white px-3 py-3 text-lg text-ink aria-[invalid=true]:border-down';

/** A meter as typed: empty (not read) or a whole number. */
function meterValue(text: string): number | null | 'bad' {
  const t = text.replace(/[\s,]/g, '');
  if (t === '') return null;
  return /^\d{1,12}$/.test(t) ? Number(t) : 'bad';
}

export function WorkOrderItem({ item, venueName }: { item: ItemView; venueName: string }) {
  const order = useQuery(workOrderQuery(item.id));
  const enqueue = useEnqueueChange();
  const [ticked, setTicked] = useState<Set<number>>(new Set());
  const [time, setTime] = useState('');
  const [plays, setPlays] = useState('');
  const [hours, setHours] = useState('');
  const [note, setNote] = useState('');
  const [skipping, setSkipping] = useState(false);
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const closed = (item.pendingState ?? item.state) !== 'open';
  const where = venueName;

  function markDone() {
    const problems: Record<string, string> = {};
    const spent = readMinutes(time, { min: 0 });
    const labourMinutes = spent.ok ? spent.value : 0;
    if (!spent.ok) problems.labourMinutes = asSentence(spent.message);
    const readings: { meter: 'plays' | 'hours'; reading: number; rolledOver: boolean }[] = [];
    for (const [meter, text] of [
      ['plays', plays],
      ['hours', hours],
    ] as const) {
      const v = meterValue(text);
      if (v === 'bad') problems[meter] = 'Write the meter as a whole number, e.g. 48210.';
      else if (v !== null) readings.push({ meter, reading: v, rolledOver: false });
    }
    setErrors(problems);
    if (Object.keys(problems).length > 0) return;
    enqueue({
      kind: 'work-order-done',
      workOrderId: item.id,
      version: item.version,
      labourMinutes,
      note: note.trim(),
      readings,
      label: { what: `Done: ${item.title} (${formatMinutes(labourMinutes)})`, where },
    });
  }

  function skip() {
    if (!reason.trim()) {
      setErrors({ reason: 'Say why the work is skipped.' });
      return;
    }
    enqueue({
      kind: 'work-order-skip',
      workOrderId: item.id,
      version: item.version,
      reason: reason.trim(),
      label: { what: `Skipped: ${item.title}`, where },
    });
  }

  const tasks = order.data?.tasks ?? [];
  const fieldId = (name: string) => `wo-${item.id}-${name}`;
  const errorOf = (name: string) =>
    errors[name] ? (
      <p id={fieldId(name) + '-error'} className="font-semibold text-down">
        {errors[name]}
      </p>
    ) : null;

  return (
    <div className="grid gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h4 className="text-lg font-extrabold text-ink">{item.title}</h4>
        <ItemStateBadge item={item} />
      </div>
      {tasks.length > 0 && (
        <fieldset className="grid gap-1">
          <legend className="font-semibold text-ink">Tasks</legend>
          {tasks.map((t, i) => (
            <label key={i} className="flex min-h-12 cursor-pointer items-center gap-3 rounded-md px-1 text-ink">
              <input
                type="checkbox"
                className="size-6 shrink-0 accent-[var(--bl-running)]"
                checked={ticked.has(i)}
                disabled={closed}
                onChange={() => setTicked((s) => new Set(s.has(i) ? [...s].filter((x) => x !== i) : [...s, i]))}
              />
              {t}
            </label>
          ))}
        </fieldset>
      )}
      {order.isLoading && <p className="text-ink-muted">Loading the tasks…</p>}
      {!closed && (
        <>
          <PartsUsedSection on="work-order" id={item.id} title={item.title} where={where} />
          <div className="grid gap-3 sm:grid-cols-3">
            <label className="grid gap-1 font-semibold text-ink" htmlFor={fieldId('labourMinutes')}>
              Time on site
              <input
                id={fieldId('labourMinutes')}
                className={input}
                value={time}
                onChange={(e) => setTime(e.target.value)}
                placeholder={formatMinutes(item.onSiteMinutes)}
                inputMode="text"
                aria-invalid={!!errors.labourMinutes}
                aria-describedby={errors.labourMinutes ? fieldId('labourMinutes') + '-error' : undefined}
              />
              {errorOf('labourMinutes')}
            </label>
            <label className="grid gap-1 font-semibold text-ink" htmlFor={fieldId('plays')}>
              Plays meter
              <input
                id={fieldId('plays')}
                className={input}
                value={plays}
                onChange={(e) => setPlays(e.target.value)}
                inputMode="numeric"
                aria-invalid={!!errors.plays}
              />
              {errorOf('plays')}
            </label>
            <label className="grid gap-1 font-semibold text-ink" htmlFor={fieldId('hours')}>
              Hours meter
              <input
                id={fieldId('hours')}
                className={input}
                value={hours}
                onChange={(e) => setHours(e.target.value)}
                inputMode="numeric"
                aria-invalid={!!errors.hours}
              />
              {errorOf('hours')}
            </label>
          </div>
          <label className="grid gap-1 font-semibold text-ink">
            Note
            <textarea value={note} onChange={(e) => setNote(e.target.value)} rows={2} className={input} />
          </label>
          <div className="grid grid-cols-2 gap-2">
            <button type="button" className="btn-primary min-h-14 text-lg" onClick={markDone}>
              Done
            </button>
            <button
              type="button"
              className="btn-secondary min-h-14 text-lg"
              onClick={() => setSkipping((s) => !s)}
              aria-expanded={skipping}
            >
              Skip…
            </button>
          </div>
          {skipping && (
            <div className="grid gap-2">
              <label className="grid gap-1 font-semibold text-ink" htmlFor={fieldId('reason')}>
                Why is it skipped?
                <input
                  id={fieldId('reason')}
                  className={input}
                  value={reason}
                  onChange={(e) => setReason(e.target.value)}
                  aria-invalid={!!errors.reason}
                />
                {errorOf('reason')}
              </label>
              <button type="button" className="btn-danger min-h-14 text-lg" onClick={skip}>
                Skip this work
              </button>
            </div>
          )}
        </>
      )}
    </div>
  );
}
