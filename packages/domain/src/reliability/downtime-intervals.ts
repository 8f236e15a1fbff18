import { DomainError } from '../errors.ts';

/**
 * Downtime as recorded: intervals that may overlap (two calls on the same dead game), run past either end of the
 * reporting period, or still be open (the game is down now). Before anything is summed they are clipped to the
 * period and merged, so no minute of downtime counts twice and none outside the period counts at all.
 * Times are epoch milliseconds (Date.getTime()).
 */

export interface Period {
  start: number;
  end: number;
}

export interface DowntimeInterval {
  start: number;
  /** null while the game is still down: counts up to the period's end. */
  end: number | null;
}

export function requirePeriod(period: Period, field = 'period'): Period {
  if (period === null || typeof period !== 'object' || !Number.isFinite(period.start) || !Number.isFinite(period.end)) {
    throw new DomainError('invalid-date', `${field} needs a finite start and end`, field);
  }
  if (period.end < period.start) {
    throw new DomainError(
      'inverted-period',
      `${field} ends (${new Date(period.end).toISOString()}) before it starts (${new Date(period.start).toISOString()})`,
      field,
    );
  }
  if (period.end === period.start) throw new DomainError('empty-period', `${field} has no length`, field);
  return period;
}

/** Clipped to the period, sorted, overlapping and touching intervals merged into one. */
export function mergeDowntime(intervals: readonly DowntimeInterval[], period: Period): Period[] {
  requirePeriod(period);
  if (!Array.isArray(intervals)) throw new DomainError('missing-input', 'downtime must be a list of intervals', 'downtime');
  const clipped: Period[] = [];
  for (let i = 0; i < intervals.length; i++) {
    const interval = intervals[i] as DowntimeInterval;
    const start = interval?.start;
    // Still down: open to the future, so it reaches the period's end (and nothing, if it began after the period).
    const end = interval?.end === null ? Infinity : interval?.end;
    if (!Number.isFinite(start) || !(Number.isFinite(end) || end === Infinity)) {
      throw new DomainError('invalid-date', `downtime[${i}] needs a finite start and an end (or null while still down)`, `downtime[${i}]`);
    }
    if ((end as number) < start) {
      throw new DomainError('inverted-period', `downtime[${i}] ends before it starts`, `downtime[${i}]`);
    }
    const s = Math.max(start, period.start);
    const e = Math.min(end as number, period.end);
    if (e > s) clipped.push({ start: s, end: e });
  }
  clipped.sort((a, b) => a.start - b.start);
  const merged: Period[] = [];
  for (const next of clipped) {
    const last = merged[merged.length - 1];
    if (last && next.start <= last.end) last.end = Math.max(last.end, next.end);
    else merged.push({ ...next });
  }
  return merged;
}
