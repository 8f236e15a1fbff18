// Boards fitted in games: fitting one (its date code read as printed — flagged when it reads two ways, refused
// when impossible), editing it, its page with every reading per part, the game's cabinet profile, and the
// company's recap list. Recap dates are worked out here from the rows (board-recap.ts), never stored.
import type {
  BoardInstance,
  BoardInstanceInput,
  BoardInstanceUpdate,
  BoardPage,
  CabinetProfile,
  GameBoards,
  RecapFleet,
  RecapFleetRow,
  RecapStatus,
} from '@bumperline/contracts/boards';
import { recapStatuses } from '@bumperline/contracts/bench-vocabulary';
import type { Tx } from '@bumperline/db/client';
import {
  getBoardInstance,
  insertBoardInstance,
  listBoardInstancesOfGame,
  listElectrolyticsOfBoards,
  listFleetBoardInstances,
  listPartsForBoardHistory,
  updateBoardInstance,
  type BoardInstanceRow,
} from '@bumperline/db/queries/board-instances';
import { listBenchJobsOfBoardInstance } from '@bumperline/db/queries/bench-jobs';
import { getCabinetProfile, listCabinetProfiles, saveCabinetProfile } from '@bumperline/db/queries/cabinet-profiles';
import { getGame } from '@bumperline/db/queries/games';
import { getModelBoard, listModelBoards } from '@bumperline/db/queries/model-boards';
import { listReadingsOfBoardInstance } from '@bumperline/db/queries/part-readings';
import { parseManufactureDate } from '@bumperline/domain/components/date-codes';
import { DomainError } from '@bumperline/domain/errors';
import { DEFAULT_CABINET_SLICES, estimateRecap, rememberedLives, type CabinetSliceRow, type ElectrolyticRow } from './board-recap.ts';
import { rankedPage } from './recap-ranking.ts';
import { Conflict, InvalidInput, NotFound } from './workflow-errors.ts';

type Field = { field: string; message: string };

/** What a date code says: a date, a flag for a person to settle (it reads two ways), or nothing (left blank). */
export function readDateCode(dateCode: string, today: string): { madeOn: string | null; dateCodeFlag: string | null } | Field {
  if (dateCode.trim() === '') return { madeOn: null, dateCodeFlag: null };
  try {
    return { madeOn: parseManufactureDate(dateCode, today).date, dateCodeFlag: null };
  } catch (err) {
    if (!(err instanceof DomainError)) throw err;
    // "2012": the year 2012 or week 12 of 2020? Saved as printed, with both readings and how to write it.
    if (err.code === 'ambiguous') return { madeOn: null, dateCodeFlag: err.message };
    return { field: 'dateCode', message: err.message };
  }
}

/** Reads the date code and checks the last recap against today and the date made; throws every bad field at once. */
function datedFields(input: { dateCode: string; lastRecapOn: string | null }, today: string) {
  const errors: Field[] = [];
  const read = readDateCode(input.dateCode, today);
  if ('field' in read) errors.push(read);
  const madeOn = 'field' in read ? null : read.madeOn;
  if (input.lastRecapOn && input.lastRecapOn > today) {
    errors.push({ field: 'lastRecapOn', message: `${input.lastRecapOn} is after today (${today}): a recap cannot be in the future` });
  } else if (input.lastRecapOn && madeOn && input.lastRecapOn < madeOn) {
    errors.push({
      field: 'lastRecapOn',
      message: `${input.lastRecapOn} is before the board was made (${madeOn}, from its date code): check the date of the recap`,
    });
  }
  if (errors.length || 'field' in read) throw new InvalidInput(errors);
  return read;
}

// ---- Reading the rows ----

const gameLabel = (row: { model: { title: string }; gameSerial: string | null }) =>
  row.gameSerial === null ? null : `${row.model.title} · ${row.gameSerial}`;

interface RecapInputs {
  electrolytics: Map<string, ElectrolyticRow[]>;
  profiles: Map<string, CabinetSliceRow[]>;
}

async function electrolyticsByBoard(tx: Tx, boardIds: string[]): Promise<RecapInputs['electrolytics']> {
  const electrolytics = new Map<string, ElectrolyticRow[]>();
  for (const c of await listElectrolyticsOfBoards(tx, boardIds)) {
    const list = electrolytics.get(c.boardId) ?? [];
    list.push(c);
    electrolytics.set(c.boardId, list);
  }
  return electrolytics;
}

async function recapInputs(tx: Tx, boardIds: string[], gameIds: string[]): Promise<RecapInputs> {
  const electrolytics = await electrolyticsByBoard(tx, boardIds);
  const profiles = new Map((await listCabinetProfiles(tx, gameIds)).map((p) => [p.gameId, p.slices]));
  return { electrolytics, profiles };
}

function profileFor(inputs: RecapInputs, gameId: string | null) {
  const own = gameId ? inputs.profiles.get(gameId) : undefined;
  return own ? { slices: own, isDefault: false } : { slices: DEFAULT_CABINET_SLICES, isDefault: true };
}

function toInstance(row: BoardInstanceRow, inputs: RecapInputs, today: string): BoardInstance {
  const { gameSerial: _gameSerial, ...rest } = row;
  return {
    ...rest,
    gameLabel: gameLabel(row),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    recap: estimateRecap(row, inputs.electrolytics.get(row.boardId) ?? [], profileFor(inputs, row.gameId), today),
  };
}

async function instanceOrThrow(tx: Tx, id: string, today: string): Promise<BoardInstance> {
  const row = await getBoardInstance(tx, id);
  if (!row) throw new NotFound('board');
  const inputs = await recapInputs(tx, [row.boardId], row.gameId ? [row.gameId] : []);
  return toInstance(row, inputs, today);
}

async function gameOrThrow(tx: Tx, gameId: string) {
  const game = await getGame(tx, gameId);
  if (!game) throw new NotFound('game');
  return game;
}

// ---- Workflows ----

export async function gameBoards(tx: Tx, gameId: string, today: string): Promise<GameBoards> {
  const game = await gameOrThrow(tx, gameId);
  const rows = await listBoardInstancesOfGame(tx, gameId);
  const inputs = await recapInputs(
    tx,
    rows.map((r) => r.boardId),
    [gameId],
  );
  const modelBoards = await listModelBoards(tx, game.modelId);
  return {
    items: rows.map((r) => toInstance(r, inputs, today)),
    modelBoards: modelBoards.map((b) => ({ id: b.id, name: b.name, partNumber: b.partNumber })),
  };
}

export async function fitBoard(tx: Tx, gameId: string, input: BoardInstanceInput & { lastRecapOn: string | null }, today: string) {
  const game = await gameOrThrow(tx, gameId);
  const board = await getModelBoard(tx, input.boardId);
  // A game holds its own model's boards only.
  if (!board || board.modelId !== game.modelId) {
    throw new InvalidInput([{ field: 'boardId', message: `is not a board of the ${game.model.title}` }]);
  }
  const dated = datedFields({ dateCode: input.dateCode ?? '', lastRecapOn: input.lastRecapOn }, today);
  const id = await insertBoardInstance(tx, {
    boardId: input.boardId,
    gameId,
    serial: input.serial ?? '',
    dateCode: (input.dateCode ?? '').trim(),
    madeOn: dated.madeOn,
    dateCodeFlag: dated.dateCodeFlag,
    lastRecapOn: input.lastRecapOn,
    notes: input.notes ?? '',
  });
  return instanceOrThrow(tx, id, today);
}

export async function editBoard(tx: Tx, id: string, update: BoardInstanceUpdate, today: string) {
  const before = await instanceOrThrow(tx, id, today);
  const { version, ...patch } = update;
  const dateCode = patch.dateCode === undefined ? before.dateCode : patch.dateCode.trim();
  const lastRecapOn = patch.lastRecapOn === undefined ? before.lastRecapOn : patch.lastRecapOn;
  const dated = datedFields({ dateCode, lastRecapOn }, today);
  const changed = await updateBoardInstance(tx, id, version, {
    ...(patch.serial === undefined ? {} : { serial: patch.serial }),
    ...(patch.notes === undefined ? {} : { notes: patch.notes }),
    dateCode,
    madeOn: dated.madeOn,
    dateCodeFlag: dated.dateCodeFlag,
    lastRecapOn,
  });
  if (!changed) {
    throw new Conflict('Someone else changed this board since you opened it. Review the current values and try again.', before);
  }
  return { before, after: await instanceOrThrow(tx, id, today) };
}

export async function boardPage(tx: Tx, id: string, today: string): Promise<BoardPage> {
  const row = await getBoardInstance(tx, id);
  if (!row) throw new NotFound('board');
  const parts = await listPartsForBoardHistory(tx, row.boardId, id);
  // The parts list already holds the electrolytics the recap date follows: no second look at it.
  const electrolytics = new Map([[row.boardId, parts.filter((p) => p.kind === 'electrolytic' && p.removedAt === null)]]);
  const profiles = new Map((await listCabinetProfiles(tx, row.gameId ? [row.gameId] : [])).map((p) => [p.gameId, p.slices]));
  const instance = toInstance(row, { electrolytics, profiles }, today);
  const readings = await listReadingsOfBoardInstance(tx, id);
  const jobs = await listBenchJobsOfBoardInstance(tx, id);
  const byPart = new Map<string, BoardPage['parts'][number]['readings']>();
  for (const r of readings) {
    const list = byPart.get(r.partId) ?? [];
    const { partId: _partId, ...point } = r;
    list.push({ ...point, takenAt: r.takenAt.toISOString() });
    byPart.set(r.partId, list);
  }
  return {
    instance,
    parts: parts.map(({ removedAt, ...p }) => ({ ...p, removed: removedAt !== null, readings: byPart.get(p.partId) ?? [] })),
    benchJobs: jobs.map((j) => ({
      id: j.id,
      templateName: j.templateName,
      state: j.state,
      openedAt: j.openedAt.toISOString(),
      finishedAt: j.finishedAt?.toISOString() ?? null,
    })),
  };
}

export async function cabinetProfileOf(tx: Tx, gameId: string): Promise<CabinetProfile> {
  await gameOrThrow(tx, gameId);
  const row = await getCabinetProfile(tx, gameId);
  const slices = row?.slices ?? [...DEFAULT_CABINET_SLICES];
  return {
    gameId,
    slices,
    hoursPerDay: slices.reduce((sum, s) => sum + s.hours, 0),
    isDefault: !row,
    updatedAt: row?.updatedAt.toISOString() ?? null,
  };
}

export async function setCabinetProfile(tx: Tx, gameId: string, slices: CabinetSliceRow[]): Promise<CabinetProfile> {
  await gameOrThrow(tx, gameId);
  const row = await saveCabinetProfile(tx, gameId, slices);
  return {
    gameId,
    slices: row.slices,
    hoursPerDay: row.slices.reduce((sum, s) => sum + s.hours, 0),
    isDefault: false,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/**
 * Every board of the company, judged as of `today`, ranked; counts by status before the filter. Boards with no
 * electrolytics have nothing to recap: they are listed only when asked for by that status. One page is sent.
 */
export async function recapFleet(
  tx: Tx,
  today: string,
  query: { status?: RecapStatus | undefined; limit: number; cursor?: string | undefined },
): Promise<RecapFleet> {
  const { status } = query;
  // Two statements: the boards with their games' cabinet days, then the electrolytics of the boards' designs.
  const rows = await listFleetBoardInstances(tx);
  const inputs: RecapInputs = {
    electrolytics: await electrolyticsByBoard(
      tx,
      rows.map((r) => r.boardId),
    ),
    profiles: new Map(rows.flatMap((r) => (r.gameId && r.cabinetSlices ? [[r.gameId, r.cabinetSlices]] : []))),
  };
  const livesOf = rememberedLives();
  const all: RecapFleetRow[] = rows.map((r) => ({
    boardInstanceId: r.id,
    boardName: r.boardName,
    boardPartNumber: r.boardPartNumber,
    serial: r.serial,
    dateCode: r.dateCode,
    gameId: r.gameId,
    gameLabel: r.gameSerial === null ? null : `${r.modelTitle} · ${r.gameSerial}`,
    venueId: r.venueId,
    venueName: r.venueName,
    recap: estimateRecap(r, inputs.electrolytics.get(r.boardId) ?? [], profileFor(inputs, r.gameId), today, livesOf(r.boardId)),
  }));
  const counts = Object.fromEntries(recapStatuses.map((s) => [s, 0])) as RecapFleet['counts'];
  for (const row of all) counts[row.recap.status] += 1;
  const listed = all.filter((r) => (status ? r.recap.status === status : r.recap.status !== 'no-electrolytics'));
  // The whole ranking is worked out (it is cheap); only the page asked for is sent.
  return { asOf: today, counts, ...rankedPage(listed, query.limit, query.cursor) };
}
