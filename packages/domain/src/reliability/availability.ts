import { DomainError } from '../errors.ts';
import { requirePositive, requireNonNegative } from '../input-checks.ts';
import { mergeDowntime, requirePeriod, type DowntimeInterval, type Period } from './downtime-intervals.ts';

/**
 * Availability, MTBF and MTTR over a period, in the terms of IEC 60050-192 and IEC 61703 (and EN 13306):
 *   A = MUT / (MUT + MDT) = up time / (up time + down time)
 * with MUT the mean up time and MDT the mean down time. Here "MTBF" is the mean up time between failures (what
 * A = MTBF / (MTBF + MTTR) assumes) and MTTR is the mean time to restoration, which IEC 60050-192 counts from failure
 * to working again — waiting for a technician included, not just the repair. Each merged down spell inside the period
 * counts as one failure; a spell straddling the period's start counts in both periods it touches.
 */

const MS_PER_HOUR = 3_600_000;

export interface ReliabilityFigures {
  periodHours: number;
  upHours: number;
  downHours: number;
  /** Merged down spells within the period. */
  failures: number;
  /** up / (up + down), 0–1. */
  availability: number;
  /** Mean up time per failure, hours; null with no failures. */
  mtbfHours: number | null;
  /** Mean time to restoration, hours; null with no failures. */
  mttrHours: number | null;
}

function figures(periodMs: number, downMs: number, failures: number): ReliabilityFigures {
  const upMs = periodMs - downMs;
  return {
    periodHours: periodMs / MS_PER_HOUR,
    upHours: upMs / MS_PER_HOUR,
    downHours: downMs / MS_PER_HOUR,
    failures,
    availability: periodMs === 0 ? 1 : upMs / periodMs,
    mtbfHours: failures === 0 ? null : upMs / MS_PER_HOUR / failures,
    mttrHours: failures === 0 ? null : downMs / MS_PER_HOUR / failures,
  };
}

function measure(period: Period, downtime: readonly DowntimeInterval[]): { downMs: number; failures: number } {
  const spells = mergeDowntime(downtime, period);
  let downMs = 0;
  for (const spell of spells) downMs += spell.end - spell.start;
  return { downMs, failures: spells.length };
}

/** One game over a period. */
export function gameReliability(period: Period, downtime: readonly DowntimeInterval[]): ReliabilityFigures {
  requirePeriod(period);
  const { downMs, failures } = measure(period, downtime);
  return figures(period.end - period.start, downMs, failures);
}

export interface GroupMember {
  id: string;
  downtime: readonly DowntimeInterval[];
  /** When the game was on location; only that part of the period counts. Default: the whole period. */
  inService?: { start: number; end: number | null };
}

export interface GroupReliability extends ReliabilityFigures {
  members: Array<{ id: string } & ReliabilityFigures>;
}

/**
 * A venue or a model: every member game's time counts, so A = Σ up / Σ (up + down) and MTBF, MTTR are means over all
 * members' failures — a game on location half the period weighs half as much.
 */
export function groupReliability(period: Period, members: readonly GroupMember[]): GroupReliability {
  requirePeriod(period);
  if (!Array.isArray(members)) throw new DomainError('missing-input', 'members must be a list of games', 'members');
  let periodMs = 0;
  let downMs = 0;
  let failures = 0;
  const seen = new Set<string>();
  const results: GroupReliability['members'] = [];
  members.forEach((member, i) => {
    if (typeof member?.id !== 'string' || member.id === '')
      throw new DomainError('missing-input', `members[${i}] needs an id`, `members[${i}].id`);
    if (seen.has(member.id)) throw new DomainError('duplicate-id', `game ${member.id} appears twice`, `members[${i}].id`);
    seen.add(member.id);
    let own = period;
    if (member.inService) {
      const start = member.inService.start;
      const end = member.inService.end ?? period.end;
      if (!Number.isFinite(start) || !Number.isFinite(end)) {
        throw new DomainError('invalid-date', `members[${i}].inService needs a finite start`, `members[${i}].inService`);
      }
      if (end < start)
        throw new DomainError('inverted-period', `game ${member.id} leaves service before it enters`, `members[${i}].inService`);
      own = { start: Math.max(start, period.start), end: Math.min(end, period.end) };
      if (own.end <= own.start) return; // not on location during the period
    }
    const m = measure(own, member.downtime);
    results.push({ id: member.id, ...figures(own.end - own.start, m.downMs, m.failures) });
    periodMs += own.end - own.start;
    downMs += m.downMs;
    failures += m.failures;
  });
  return { ...figures(periodMs, downMs, failures), members: results };
}

/** Steady-state availability from the means: A = MTBF / (MTBF + MTTR) (IEC 61703). */
export function availabilityFromMeans(mtbfHours: number, mttrHours: number): number {
  const mtbf = requirePositive(mtbfHours, 'mtbfHours');
  const mttr = requireNonNegative(mttrHours, 'mttrHours');
  return mtbf / (mtbf + mttr);
}
