// "Move to…" on a stop: another technician and/or another day, for when dragging is not at hand (a keyboard, a
// stop that goes to another date) — every item of the stop goes with it.
import { ArrowRightLeft } from 'lucide-react';
import { useId, useState, type FormEvent } from 'react';

interface Props {
  venueName: string;
  technicians: { id: string; name: string; letter: string }[];
  fromTechnicianId: string;
  day: string;
  pending: boolean;
  onMove: (toTechnicianId: string, toDay: string) => void;
}

export function MoveStopForm({ venueName, technicians, fromTechnicianId, day, pending, onMove }: Props) {
  const id = useId();
  const [to, setTo] = useState(fromTechnicianId);
  const [toDay, setToDay] = useState(day);
  const unchanged = to === fromTechnicianId && toDay === day;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!unchanged && toDay) onMove(to, toDay);
  };
  return (
    <details className="mt-2">
      <summary className="inline-flex min-h-11 cursor-pointer items-center gap-1 text-sm font-semibold text-ink underline decoration-brass-bright decoration-2 underline-offset-2">
        <ArrowRightLeft aria-hidden className="size-4" /> Move to…
      </summary>
      <form onSubmit={submit} className="mt-2 flex flex-wrap items-end gap-2" aria-label={`Move ${venueName}`}>
        <label className="flex flex-col text-sm font-semibold text-ink" htmlFor={`${id}-tech`}>
          Technician
          <select
            id={`${id}-tech`}
            value={to}
            onChange={(e) => setTo(e.target.value)}
            className="min-h-11 rounded-md border border-ink-muted bg-white px-2 font-normal"
          >
            {technicians.map((t) => (
              <option key={t.id} value={t.id}>
                {t.letter} · {t.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm font-semibold text-ink" htmlFor={`${id}-day`}>
          Day
          <input
            id={`${id}-day`}
            type="date"
            value={toDay}
            required
            onChange={(e) => setToDay(e.target.value)}
            className="min-h-11 rounded-md border border-ink-muted bg-white px-2 font-normal"
          />
        </label>
        <button type="submit" className="btn-secondary" disabled={pending || unchanged}>
          Move stop
        </button>
      </form>
    </details>
  );
}
