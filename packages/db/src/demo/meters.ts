// The demo games' meters: which each game has (plays and power-on hours on pinball, plays and coins on the
// others; six- or seven-digit rollover points), how fast each counts (busier in winter, when bars fill up
// indoors, and on weekends), and a reading about once a week over the last months. Care-plan work reads the same
// counts (`totalAt`), so a work order's meters at done agree with the readings around it.
import type { MeterKind } from '@bumperline/contracts/care-vocabulary';
import type { Tx } from '../client.ts';
import { gameMeters, meterReadings } from '../schema/index.ts';

const HOUR = 3600_000;
const DAY = 24 * HOUR;
/** How far back the counts are modelled (the care-plan history reaches a year back). */
export const METER_HISTORY_DAYS = 400;
/** Readings are taken over the last this many weeks. */
const READING_WEEKS = 30;

export interface MeterGame {
  id: string;
  kind: string;
  venueId: string | null;
  status: string;
  installedOn: string | null;
  pricePerPlayCents: number;
  modelYear: number;
}

/** One meter of one game: its rollover point and its running total (never wrapped) by day. */
export interface DemoMeter {
  meter: MeterKind;
  rollsOverAt: number | null;
  /** daily[i] is the total at the start of day i of the modelled period. */
  daily: number[];
}

export interface DemoGameMeters {
  gameId: string;
  meters: DemoMeter[];
}

/** Plays a week at an average bar, by kind (a jukebox play is a song). */
const weeklyPlays: Record<string, [number, number]> = {
  pinball: [250, 520],
  video: [150, 380],
  jukebox: [300, 800],
  darts: [400, 900],
  other: [100, 300],
};

/** The meters and their modelled counts for every game, from `from` (ms) for METER_HISTORY_DAYS days. */
export function planMeters(games: readonly MeterGame[], from: number, rand: () => number): Map<string, DemoGameMeters> {
  const plans = new Map<string, DemoGameMeters>();
  games.forEach((game, index) => {
    const [low, high] = weeklyPlays[game.kind] ?? weeklyPlays.other!;
    const perWeek = low + rand() * (high - low);
    // Older cabinets count on six digits, newer ones on seven.
    const playsWrap = game.modelYear < 2000 ? 1_000_000 : 10_000_000;
    const installed = game.installedOn ? Date.parse(game.installedOn) : from;
    const yearsBefore = Math.max(0, (from - installed) / (365 * DAY));
    // Two old six-digit games are close to the end of their dial, so their history shows a rollover.
    const nearWrap = playsWrap === 1_000_000 && (index === 2 || index === 9);
    let plays = nearWrap ? playsWrap - 4_000 - Math.floor(rand() * 3_000) : Math.floor(yearsBefore * perWeek * 52 * (0.8 + rand() * 0.4));
    let hours = Math.floor(yearsBefore * 365 * (9 + rand() * 4));
    const coinsPerPlay = Math.max(1, Math.round(game.pricePerPlayCents / 25));
    let coins = Math.floor(plays * coinsPerPlay * (0.9 + rand() * 0.1));
    const daily = { plays: [] as number[], hours: [] as number[], coins: [] as number[] };
    for (let d = 0; d < METER_HISTORY_DAYS; d++) {
      daily.plays.push(plays);
      daily.hours.push(hours);
      daily.coins.push(coins);
      const at = from + d * DAY;
      if (at < installed) continue;
      const date = new Date(at);
      const dayOfYear = (at - Date.UTC(date.getUTCFullYear(), 0, 1)) / DAY;
      // Busiest in mid-January, quietest in mid-July; Friday and Saturday nights count double.
      const season = 1 + 0.22 * Math.cos((2 * Math.PI * (dayOfYear - 15)) / 365);
      const weekday = date.getUTCDay();
      const week = weekday === 5 || weekday === 6 ? 2 : weekday === 0 ? 1.2 : 0.7;
      const todays = Math.round(((perWeek / 7) * season * week * (0.75 + rand() * 0.5)) / 1.1);
      plays += todays;
      coins += Math.round(todays * coinsPerPlay * (0.92 + rand() * 0.08));
      hours += 10 + Math.round(rand() * 3);
    }
    const meters: DemoMeter[] = [{ meter: 'plays', rollsOverAt: playsWrap, daily: daily.plays }];
    if (game.kind === 'pinball') meters.push({ meter: 'hours', rollsOverAt: 1_000_000, daily: daily.hours });
    meters.push({ meter: 'coins_in', rollsOverAt: 1_000_000, daily: daily.coins });
    plans.set(game.id, { gameId: game.id, meters });
  });
  return plans;
}

/** The running total of a meter at `at` (ms), read from its daily counts; past the end it runs on at the last month's pace. */
export function totalAt(m: DemoMeter, from: number, at: number): number {
  const days = (at - from) / DAY;
  const last = m.daily.length - 1;
  if (days <= 0) return m.daily[0]!;
  if (days >= last) {
    const pace = (m.daily[last]! - m.daily[last - 30]!) / 30;
    return Math.round(m.daily[last]! + pace * (days - last));
  }
  const i = Math.floor(days);
  return Math.round(m.daily[i]! + (m.daily[i + 1]! - m.daily[i]!) * (days - i));
}

/** The first moment (ms) at or after `after` at which the meter has counted `count` more than it had at `after`. */
export function momentCounted(m: DemoMeter, from: number, after: number, count: number): number {
  const target = totalAt(m, from, after) + count;
  let lo = after;
  let hi = after + 30 * DAY;
  while (totalAt(m, from, hi) < target) hi += 30 * DAY;
  // A total only grows, so halving the window finds the moment to within an hour.
  while (hi - lo > HOUR) {
    const mid = (lo + hi) / 2;
    if (totalAt(m, from, mid) >= target) hi = mid;
    else lo = mid;
  }
  return hi;
}

/** What the meter's face shows for a running total: it wraps to zero at its rollover point. */
export const shown = (m: DemoMeter, total: number) => (m.rollsOverAt ? total % m.rollsOverAt : total);

/** A reading taken by a work order when it was done: written with the weekly ones. */
export interface WorkOrderReading {
  gameId: string;
  workOrderId: string;
  at: number;
  by: string | null;
}

/** Inserts every game's meters and its readings: about weekly at collections, plus those taken by work orders. */
export async function seedMeters(
  tx: Tx,
  p: {
    tenantId: string;
    games: readonly MeterGame[];
    plans: Map<string, DemoGameMeters>;
    from: number;
    now: number;
    technicianIds: readonly string[];
    workOrderReadings: readonly WorkOrderReading[];
    rand: () => number;
  },
): Promise<void> {
  const meterRows: (typeof gameMeters.$inferInsert)[] = [];
  const readings: {
    gameId: string;
    meter: DemoMeter;
    at: number;
    source: 'visit' | 'work_order' | 'collection';
    workOrderId: string | null;
    by: string | null;
  }[] = [];
  const byGame = new Map<string, WorkOrderReading[]>();
  for (const r of p.workOrderReadings) byGame.set(r.gameId, [...(byGame.get(r.gameId) ?? []), r]);
  for (const game of p.games) {
    const plan = p.plans.get(game.id)!;
    for (const m of plan.meters) meterRows.push({ tenantId: p.tenantId, gameId: game.id, meter: m.meter, rollsOverAt: m.rollsOverAt });
    if (!game.venueId) continue;
    const installed = game.installedOn ? Date.parse(game.installedOn) : p.from;
    // A collection every six to nine days, in the afternoon before the bar fills up (about 3 pm in Chicago).
    const visits: { at: number; source: 'visit' | 'collection'; by: string | null }[] = [];
    let day = Math.floor((p.now - READING_WEEKS * 7 * DAY) / DAY) + Math.floor(p.rand() * 7);
    while (day * DAY < p.now - DAY) {
      const at = day * DAY + 20 * HOUR + Math.floor(p.rand() * 3 * HOUR);
      if (at > installed && at < p.now) {
        const by = p.technicianIds[Math.floor(p.rand() * p.technicianIds.length)] ?? null;
        visits.push({ at, source: p.rand() < 0.85 ? 'collection' : 'visit', by });
      }
      day += 6 + Math.floor(p.rand() * 4);
    }
    for (const m of plan.meters) {
      for (const v of visits) readings.push({ gameId: game.id, meter: m, at: v.at, source: v.source, workOrderId: null, by: v.by });
      // A work order reads plays and hours (what its plan counts from), not the coin meter.
      if (m.meter === 'coins_in') continue;
      for (const w of byGame.get(game.id) ?? [])
        readings.push({ gameId: game.id, meter: m, at: w.at, source: 'work_order', workOrderId: w.workOrderId, by: w.by });
    }
  }
  for (let i = 0; i < meterRows.length; i += 1000) await tx.insert(gameMeters).values(meterRows.slice(i, i + 1000));

  // In time order per meter, so a reading below the one before it is marked as the meter rolling over.
  readings.sort((a, b) => a.gameId.localeCompare(b.gameId) || a.meter.meter.localeCompare(b.meter.meter) || a.at - b.at);
  const rows: (typeof meterReadings.$inferInsert)[] = [];
  let previous: { gameId: string; meter: MeterKind; reading: number } | null = null;
  for (const r of readings) {
    const reading = shown(r.meter, totalAt(r.meter, p.from, r.at));
    const same = previous?.gameId === r.gameId && previous.meter === r.meter.meter;
    rows.push({
      tenantId: p.tenantId,
      gameId: r.gameId,
      meter: r.meter.meter,
      reading,
      rolledOver: same && reading < previous!.reading,
      source: r.source,
      workOrderId: r.workOrderId,
      readAt: new Date(r.at),
      readBy: r.by,
    });
    previous = { gameId: r.gameId, meter: r.meter.meter, reading };
  }
  for (let i = 0; i < rows.length; i += 1000) await tx.insert(meterReadings).values(rows.slice(i, i + 1000));
}
