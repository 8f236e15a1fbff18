// The demo company's boards in their games: invented serials and date codes (year-week codes from 1987–2005, a
// couple written as ISO weeks, one that reads two ways and waits to be settled), recaps on some, cabinet profiles
// for some games (bar cabinets run hotter in the evening), and the readings of two or three earlier overhauls on
// the resistors of several boards, each judged by the bench's own domain code, so a part's drift shows as a chart.
import { and, asc, eq } from 'drizzle-orm';
import { judgeReading } from '@bumperline/domain/components/bench-judgement';
import { parseManufactureDate } from '@bumperline/domain/components/date-codes';
import { readPartEntry, type PartSpec } from '@bumperline/domain/components/parts-list-entry';
import { isDomainError } from '@bumperline/domain/errors';
import type { Tx } from '../client.ts';
import { boardInstances, boardParts, cabinetProfiles, gameModels, games, partReadings, type CabinetSlice } from '../schema/index.ts';
import type { DemoBoardIds } from './parts-lists.ts';
import { seededRandom } from './random.ts';

export interface BoardsSeedContext {
  tenantId: string;
  boardIds: DemoBoardIds;
  technicianIds: string[];
}

/** A fitted board the bench seed can open a job on. */
export interface DemoBoardInstance {
  id: string;
  boardId: string;
  gameId: string;
}

/** The models' years (scenario.ts): a board's date code falls a little before to a few years after. */
const modelYears: Record<string, number> = {
  'Comet Carnival': 1992,
  'Deep Sea Salvage': 1995,
  'Midnight Rodeo': 1989,
  'Star Courier': 1983,
  'Wallbox 120': 1998,
};

/** Serial prefixes as the invented makers stamp them. */
const serialPrefix: Record<string, string> = {
  'Power supply': 'PS',
  'Sound board': 'SB',
  'Driver board': 'DR',
};

/**
 * Cabinet days: [hours, °C]. A bar opens in the afternoon with the room cool, fills up in the evening (bodies,
 * lamps, the game's own heat) and stays warm until closing.
 */
const profiles: CabinetSlice[][] = [
  [
    { hours: 3, temperatureC: 30 },
    { hours: 5, temperatureC: 40 },
    { hours: 4, temperatureC: 48 },
  ],
  [
    { hours: 4, temperatureC: 32 },
    { hours: 6, temperatureC: 44 },
  ],
  [
    { hours: 6, temperatureC: 28 },
    { hours: 6, temperatureC: 38 },
    { hours: 2, temperatureC: 45 },
  ],
  // A game by a sunny front window in a place open all day.
  [
    { hours: 5, temperatureC: 38 },
    { hours: 7, temperatureC: 50 },
    { hours: 4, temperatureC: 42 },
  ],
];

const pad2 = (n: number) => String(n).padStart(2, '0');

/** How a technician types a meter's reading: three significant figures with the prefix ("4.62k", "612"). */
function typedReading(ohms: number): string {
  if (ohms >= 1e6) return `${Number((ohms / 1e6).toPrecision(3))}M`;
  if (ohms >= 1e3) return `${Number((ohms / 1e3).toPrecision(3))}k`;
  return String(Number(ohms.toPrecision(3)));
}

/** An overhaul's afternoon on the bench, as an instant (3 pm in Chicago is 20:00 or 21:00 UTC; near enough). */
const benchDay = (date: string) => new Date(`${date}T20:00:00Z`);

export async function seedBoards(tx: Tx, ctx: BoardsSeedContext): Promise<DemoBoardInstance[]> {
  const { tenantId } = ctx;
  const rand = seededRandom(20261203);
  const today = new Date().toISOString().slice(0, 10);
  const gameRows = await tx
    .select({ id: games.id, serial: games.serial, title: gameModels.title })
    .from(games)
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .where(eq(games.tenantId, tenantId))
    .orderBy(asc(games.serial));

  const fitted: (DemoBoardInstance & { name: string; title: string })[] = [];
  const profiled: { tenantId: string; gameId: string; slices: CabinetSlice[] }[] = [];
  let n = 0;
  let ambiguousGiven = false;
  for (const game of gameRows) {
    const boards = ctx.boardIds[game.title];
    const year = modelYears[game.title];
    if (!boards || year === undefined) continue;
    n += 1;
    // About three games in four have their boards on record.
    if (n % 4 === 3) continue;
    if (n % 3 === 0) profiled.push({ tenantId, gameId: game.id, slices: profiles[n % profiles.length]! });
    for (const [name, boardId] of Object.entries(boards)) {
      const madeYear = Math.min(2005, Math.max(1987, year - 1 + Math.floor(rand() * 5)));
      const week = 1 + Math.floor(rand() * 52);
      // Most stamp YYWW; a few boards carry an ISO week; one reads two ways ("2004": the year, or week 4 of 2020).
      const ambiguous: boolean = !ambiguousGiven && n === 5;
      ambiguousGiven ||= ambiguous;
      const dateCode = ambiguous ? '2004' : n % 11 === 0 ? `${madeYear}-W${pad2(week)}` : `${pad2(madeYear % 100)}${pad2(week)}`;
      let madeOn: string | null = null;
      let dateCodeFlag: string | null = null;
      try {
        madeOn = parseManufactureDate(dateCode, today).date;
      } catch (error) {
        if (!isDomainError(error) || error.code !== 'ambiguous') throw error;
        dateCodeFlag = error.message;
      }
      // A recap on record for most: long ago (overdue again), a while back (due soon or not) or recently; one in five never.
      const recapPick = Math.floor(rand() * 5);
      const lastRecapOn =
        recapPick === 0
          ? `${2009 + Math.floor(rand() * 4)}-${pad2(1 + Math.floor(rand() * 12))}-${pad2(1 + Math.floor(rand() * 28))}`
          : recapPick === 1
            ? `${2015 + Math.floor(rand() * 3)}-${pad2(1 + Math.floor(rand() * 12))}-${pad2(1 + Math.floor(rand() * 28))}`
            : recapPick === 2 || recapPick === 3
              ? `${2021 + Math.floor(rand() * 3)}-${pad2(1 + Math.floor(rand() * 12))}-${pad2(1 + Math.floor(rand() * 28))}`
              : null;
      const [row] = await tx
        .insert(boardInstances)
        .values({
          tenantId,
          boardId,
          gameId: game.id,
          serial: `${serialPrefix[name] ?? 'BD'}-${String(40000 + Math.floor(rand() * 50000))}`,
          dateCode,
          madeOn,
          dateCodeFlag,
          lastRecapOn,
          notes: n === 2 && name === 'Power supply' ? 'Board was reflowed at the headers by a previous owner.' : '',
        })
        .returning({ id: boardInstances.id });
      fitted.push({ id: row!.id, boardId, gameId: game.id, name, title: game.title });
    }
  }
  if (profiled.length) await tx.insert(cabinetProfiles).values(profiled);

  await seedReadingHistory(tx, ctx, fitted, rand);
  return fitted.map(({ id, boardId, gameId }) => ({ id, boardId, gameId }));
}

/**
 * Earlier overhauls, years apart, on the resistors of several power supplies: each a little further from nominal
 * than the last (carbon resistors drift with heat and age), and on one board the bleeder R7 creeping out of its
 * ±10 % window. The last overhaul was a recap, so the board's recap date follows from it.
 */
async function seedReadingHistory(
  tx: Tx,
  ctx: BoardsSeedContext,
  fitted: { id: string; boardId: string; name: string; title: string }[],
  rand: () => number,
) {
  // A Comet Carnival supply first: its bleeder R7 (600 Ω ±10 %) is the one that drifts out.
  const supplies = fitted
    .filter((f) => f.name === 'Power supply')
    .sort((x, y) => Number(y.title === 'Comet Carnival') - Number(x.title === 'Comet Carnival'))
    .slice(0, 8);
  const rows: (typeof partReadings.$inferInsert)[] = [];
  const specsByBoard = new Map<string, { id: string; spec: PartSpec }[]>();
  for (const [index, board] of supplies.entries()) {
    let specs = specsByBoard.get(board.boardId);
    if (!specs) {
      const parts = await tx
        .select()
        .from(boardParts)
        .where(and(eq(boardParts.tenantId, ctx.tenantId), eq(boardParts.boardId, board.boardId), eq(boardParts.kind, 'resistor')))
        .orderBy(asc(boardParts.position));
      specs = parts.flatMap((p) => {
        try {
          const spec = readPartEntry({
            designator: p.designator,
            kind: p.kind,
            value: p.value,
            tolerance: p.tolerance,
            rating: p.rating,
            ratedTemperatureC: p.ratedTemperatureC,
            ratedLifeHours: p.ratedLifeHours,
          });
          // Below 10 Ω a meter's leads matter more than the part: nobody charts those.
          return spec.nominal !== null && spec.tolerance !== null && spec.nominal >= 10 ? [{ id: p.id, spec }] : [];
        } catch {
          return [];
        }
      });
      specsByBoard.set(board.boardId, specs);
    }
    const overhauls = index % 3 === 0 ? ['2007-04-18', '2014-10-02', '2022-03-09'] : ['2011-06-21', '2019-11-13'];
    const shifted = overhauls.map((d) => `${Number(d.slice(0, 4)) + (index % 2)}${d.slice(4)}`);
    const takenBy = ctx.technicianIds[index % Math.max(1, ctx.technicianIds.length)] ?? null;
    for (const { id: partId, spec } of specs) {
      const tolerancePercent = spec.tolerance!.kind === 'percent' ? spec.tolerance!.plus : 5;
      // Where this part started and how fast it drifts, as fractions of its tolerance.
      const start = (rand() - 0.5) * 0.5 * tolerancePercent;
      const rate = rand() * 0.22 * tolerancePercent;
      const drifting = index === 0 && board.title === 'Comet Carnival' && spec.designator === 'R7';
      shifted.forEach((date, k) => {
        // The bleeder on the first board: +2 %, +7 %, +11.5 % of its 600 Ω (window 540–660 Ω).
        const percent = drifting ? [2, 7, 11.5][k]! : start + rate * k;
        const inCircuit = index === 1 && spec.designator === 'R13' && k === shifted.length - 1;
        // In circuit, a parallel path pulls R13 down: the reading is only indicative.
        const measuredOhms = spec.nominal! * (1 + percent / 100) * (inCircuit ? 0.78 : 1);
        const judged = judgeReading(spec, typedReading(measuredOhms), inCircuit);
        if (!judged.ok) return;
        const j = judged.value;
        rows.push({
          tenantId: ctx.tenantId,
          boardInstanceId: board.id,
          partId,
          measuredText: typedReading(measuredOhms),
          measured: j.measured,
          unit: j.unit,
          inCircuit,
          verdict: j.verdict,
          indicative: j.indicative,
          min: j.min,
          max: j.max,
          deviationPercent: j.deviationPercent,
          note: j.note,
          takenAt: benchDay(date),
          takenBy,
        });
      });
    }
    await tx
      .update(boardInstances)
      .set({ lastRecapOn: shifted[shifted.length - 1]! })
      .where(and(eq(boardInstances.tenantId, ctx.tenantId), eq(boardInstances.id, board.id)));
  }
  if (rows.length) await tx.insert(partReadings).values(rows);
}
