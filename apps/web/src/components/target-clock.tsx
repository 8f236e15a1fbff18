// How long a call has been open against its response target: words first, then a bar.
import { useEffect, useState } from 'react';
import { AlarmClock } from 'lucide-react';

export function formatDuration(ms: number): string {
  const minutes = Math.max(0, Math.round(ms / 60_000));
  if (minutes < 60) return `${minutes} min`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return `${hours} h ${minutes % 60} min`;
  return `${Math.floor(hours / 24)} d ${hours % 24} h`;
}

export function useNow(intervalMs = 30_000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const t = setInterval(() => setNow(Date.now()), intervalMs);
    return () => clearInterval(t);
  }, [intervalMs]);
  return now;
}

export function TargetClock({ openedAt, targetAt, stoppedAt }: { openedAt: string; targetAt: string; stoppedAt?: string | null }) {
  const now = useNow();
  const end = stoppedAt ? Date.parse(stoppedAt) : now;
  const age = end - Date.parse(openedAt);
  const budget = Date.parse(targetAt) - Date.parse(openedAt);
  const late = end > Date.parse(targetAt);
  const share = Math.min(1, age / Math.max(budget, 1));
  return (
    <span
      className="inline-flex min-w-32 flex-col gap-1"
      title={`Open ${formatDuration(age)} against a target of ${formatDuration(budget)}`}
    >
      <span
        className={`inline-flex items-center gap-1 text-sm font-semibold tabular ${late ? 'text-down' : share > 0.75 ? 'text-attention' : 'text-ink'}`}
      >
        {late && <AlarmClock aria-hidden className="size-4" />}
        {stoppedAt
          ? `Fixed in ${formatDuration(age)} · ${late ? `${formatDuration(end - Date.parse(targetAt))} over target` : 'within target'}`
          : `${formatDuration(age)} · ${late ? `${formatDuration(end - Date.parse(targetAt))} late` : `${formatDuration(Date.parse(targetAt) - end)} left`}`}
      </span>
      <span aria-hidden className="h-1.5 w-full rounded bg-paper-line">
        <span
          className={`block h-1.5 rounded ${late ? 'bg-down' : share > 0.75 ? 'bg-attention' : 'bg-running'}`}
          style={{ width: `${Math.round(share * 100)}%` }}
        />
      </span>
    </span>
  );
}
