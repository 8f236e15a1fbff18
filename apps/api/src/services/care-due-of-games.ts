// When a care plan's work is next due on each game it covers: the calendar rule, plays and power-on hours through
// the domain's careDue (whichever comes first), and capacitor life through the boards' recap estimates
// (board-recap.ts). Counted from the plan's last done or skipped work order on the game, and the newest meters.
import type { DueReason } from '@bumperline/contracts/care-vocabulary';
import type { Tx } from '@bumperline/db/client';
import type { CarePlanRow } from '@bumperline/db/queries/care-plans';
import { listEarliestReadingsSince, listLatestReadings, listMetersOfGames } from '@bumperline/db/queries/meters';
import { listLastClosedWorkOrders } from '@bumperline/db/queries/work-orders';
import { DomainError } from '@bumperline/domain/errors';
import { meterDelta } from '@bumperline/domain/meters/meter-delta';
import { dateParts, parsePlainDate } from '@bumperline/domain/plain-date';
import { careDue, type CareDueInput } from '@bumperline/domain/schedules/care-due';
import { urgency, type DueState } from '@bumperline/domain/schedules/due-state';
import { instantOf } from '@bumperline/domain/schedules/zoned-time';
import { gameBoards } from './boards.ts';
import { dateInZone } from './company-today.ts';

export interface GameDue {
  state: DueState;
  /** The earliest known due moment; null when no trigger gives a date yet. */
  dueAt: Date | null;
  reason: DueReason | null;
}

const DAY = 86_400_000;
/** Meter readings this far back give a game's use per day (to project a plays or hours due date). */
const USAGE_WINDOW_DAYS = 365;

type Reading = { reading: number; readAt: Date };

/** Use per day between two readings of one meter (null with less than a day between them or a meter that went back). */
function perDay(first: Reading | undefined, last: Reading | undefined, modulus: number | null): number | undefined {
  if (!first || !last) return undefined;
  const days = (last.readAt.getTime() - first.readAt.getTime()) / DAY;
  if (days < 1) return undefined;
  try {
    return meterDelta(first.reading, last.reading, modulus).delta / days;
  } catch (err) {
    if (err instanceof DomainError) return undefined;
    throw err;
  }
}

/** A local date's midnight in the company's zone, as an instant. */
function startOfLocalDay(date: string, timeZone: string): Date {
  const { year, month, day } = dateParts(parsePlainDate(date));
  return new Date(instantOf({ year, month, day, hour: 0, minute: 0, second: 0 }, timeZone));
}

/**
 * Each game's due state for the plan as of `now`. Games that cannot be judged (a meter that went backwards with no
 * rollover point, a rule with no further dates) get state 'ok' with no date rather than failing the whole plan.
 */
export async function dueOfPlanGames(
  tx: Tx,
  plan: CarePlanRow,
  gameIds: readonly string[],
  at: { now: Date; timeZone: string },
): Promise<Map<string, GameDue>> {
  const { now, timeZone } = at;
  const out = new Map<string, GameDue>();
  if (gameIds.length === 0) return out;
  const lastClosed = await listLastClosedWorkOrders(tx, plan.id);
  const usesMeters = plan.playsEvery !== null || plan.hoursEvery !== null;
  const key = (gameId: string, meter: string) => `${gameId}/${meter}`;
  const latest = new Map<string, Reading>();
  const earliest = new Map<string, Reading>();
  const modulus = new Map<string, number | null>();
  if (usesMeters) {
    for (const r of await listLatestReadings(tx, gameIds)) latest.set(key(r.gameId, r.meter), r);
    for (const r of await listEarliestReadingsSince(tx, gameIds, new Date(now.getTime() - USAGE_WINDOW_DAYS * DAY))) {
      earliest.set(key(r.gameId, r.meter), r);
    }
    for (const m of await listMetersOfGames(tx, gameIds)) modulus.set(key(m.gameId, m.meter), m.rollsOverAt);
  }
  const today = dateInZone(timeZone, now);

  for (const gameId of gameIds) {
    const last = lastClosed.get(gameId);
    const input: CareDueInput = { now };
    if (plan.rule && plan.ruleStart) {
      // Counted from the later of the last work's due moment and when it was closed: work done early does not fall
      // due again at once, and work done late does not leave a backlog. Never done: from when the plan was made.
      const lastDone = last ? new Date(Math.max(last.dueAt.getTime(), last.closedAt?.getTime() ?? 0)) : plan.createdAt;
      input.calendar = { rule: plan.rule, start: { start: plan.ruleStart, timeZone }, lastDone, leadDays: plan.leadDays };
    }
    for (const [meter, every, atDone] of [
      ['plays', plan.playsEvery, last?.playsAtDone],
      ['hours', plan.hoursEvery, last?.hoursAtDone],
    ] as const) {
      const current = latest.get(key(gameId, meter));
      if (every === null || !current) continue;
      const first = earliest.get(key(gameId, meter));
      const baseline = atDone ?? first?.reading ?? current.reading;
      const mod = modulus.get(key(gameId, meter)) ?? null;
      const trigger = {
        every,
        lastServiceReading: baseline,
        currentReading: current.reading,
        meterModulus: mod,
        perDay: perDay(first, current, mod),
      };
      try {
        // Check the pair reads before handing it over, so one bad pair costs only this trigger.
        meterDelta(baseline, current.reading, mod);
        input[meter] = trigger;
      } catch (err) {
        if (!(err instanceof DomainError)) throw err;
      }
    }

    let due: GameDue = { state: 'ok', dueAt: null, reason: null };
    if (input.calendar || input.plays || input.hours) {
      try {
        const result = careDue(input);
        // A usage trigger due now without a projected date is due at this moment.
        const dueAt = result.dueAt ?? (result.state === 'ok' ? null : now);
        due = { state: result.state, dueAt, reason: result.triggeredBy };
      } catch (err) {
        if (!(err instanceof DomainError)) throw err;
      }
    }
    if (plan.byCapacitorLife) due = pickMoreUrgent(due, await capacitorDue(tx, gameId, today, timeZone, last?.closedAt ?? null));
    out.set(gameId, due);
  }
  return out;
}

/** The most urgent of the game's boards by capacitor life; a board recapped by this plan's last work counts from then. */
async function capacitorDue(tx: Tx, gameId: string, today: string, timeZone: string, lastClosed: Date | null): Promise<GameDue> {
  const boards = await gameBoards(tx, gameId, today);
  let best: GameDue = { state: 'ok', dueAt: null, reason: null };
  for (const board of boards.items) {
    const recap = board.recap;
    if (!recap.dueDate || (recap.status !== 'overdue' && recap.status !== 'due-soon' && recap.status !== 'ok')) continue;
    const dueAt = startOfLocalDay(recap.dueDate, timeZone);
    // Work closed after the date it fell due was that recap (or a decision to leave it): not due again from it.
    if (lastClosed && lastClosed >= dueAt) continue;
    best = pickMoreUrgent(best, { state: recap.status, dueAt, reason: 'capacitor_life' });
  }
  return best;
}

function pickMoreUrgent(a: GameDue, b: GameDue): GameDue {
  const byUrgency = urgency(b.state) - urgency(a.state);
  if (byUrgency !== 0) return byUrgency > 0 ? b : a;
  if (a.dueAt === null) return b.dueAt === null ? a : b;
  if (b.dueAt === null) return a;
  return b.dueAt < a.dueAt ? b : a;
}
