// A game model's boards and each board's parts list: what the web app sends and what the API answers. The
// parts' values are kept as the trade writes them ("4k7", "T2.5A 250V"); the domain code
// (packages/domain/src/components/parts-list-entry.ts) judges them, on the server and live in the editor alike.
import { z } from 'zod';
import { INT4_MAX, isoDateTime, requiredText, rowVersion, shortText, uuid } from './common.ts';
import { gameModel } from './games.ts';
import { partKinds } from './bench-vocabulary.ts';
import { MAX_PARTS_PER_BOARD } from './parts-list-csv.ts';

export { partKindLabels, partKinds } from './bench-vocabulary.ts';
export type { PartKind } from './bench-vocabulary.ts';

export { MAX_PARTS_PER_BOARD } from './parts-list-csv.ts';

export const modelBoardInput = z.strictObject({
  name: requiredText(80),
  partNumber: shortText(60).default(''),
  notes: shortText(2000).default(''),
});
export type ModelBoardInput = z.input<typeof modelBoardInput>;

/** Renaming a board (or its part number or notes); the parts list has its own save. */
export const modelBoardUpdate = modelBoardInput.partial();
export type ModelBoardUpdate = z.input<typeof modelBoardUpdate>;

export const modelBoard = z.strictObject({
  id: uuid,
  modelId: uuid,
  name: z.string(),
  partNumber: z.string(),
  notes: z.string(),
  /** The parts list's version: every save moves it on. */
  version: z.number().int(),
  /** Parts on the list now (removed ones not counted). */
  partCount: z.number().int(),
  updatedAt: isoDateTime,
});
export type ModelBoard = z.infer<typeof modelBoard>;
export const modelBoardList = z.strictObject({ items: z.array(modelBoard) });
export type ModelBoardList = z.infer<typeof modelBoardList>;

/** Every model of the company with its boards: the parts-lists screen. */
export const modelWithBoards = z.strictObject({ model: gameModel, boards: z.array(modelBoard) });
export type ModelWithBoards = z.infer<typeof modelWithBoards>;
export const partsListsOverview = z.strictObject({ items: z.array(modelWithBoards) });
export type PartsListsOverview = z.infer<typeof partsListsOverview>;

const optionalWhole = z
  .number({ error: 'must be a number' })
  .int({ error: 'must be a whole number' })
  .min(-INT4_MAX, { error: 'is too small' })
  .max(INT4_MAX, { error: 'is too large' })
  .nullable()
  .default(null);

/**
 * One line of a parts list as sent: text as typed. Only the shape is checked here; whether "100µF" fits a
 * resistor, a tolerance is over 100 % or a designator repeats is the domain's checkPartsList, whose problems
 * the API answers as `parts.<row>.<column>`.
 */
export const partRowInput = z.strictObject({
  /** The row's id when it came from the server; rows are matched by designator, so it is only echoed. */
  id: uuid.optional(),
  designator: shortText(30),
  kind: z.enum(partKinds, { error: 'must be one of the part kinds' }),
  value: shortText(120),
  tolerance: shortText(40).default(''),
  rating: shortText(80).default(''),
  ratedTemperatureC: optionalWhole,
  ratedLifeHours: optionalWhole,
  notes: shortText(500).default(''),
});
export type PartRowInput = z.input<typeof partRowInput>;

/** Saving a parts list: the whole list, in order, and the version it was opened at. */
export const partsListSave = z.strictObject({
  version: rowVersion,
  parts: z.array(partRowInput).max(MAX_PARTS_PER_BOARD, { error: `must have at most ${MAX_PARTS_PER_BOARD} parts` }),
});
export type PartsListSave = z.input<typeof partsListSave>;

export const partRow = z.strictObject({
  id: uuid,
  designator: z.string(),
  kind: z.enum(partKinds),
  value: z.string(),
  tolerance: z.string(),
  rating: z.string(),
  ratedTemperatureC: z.number().int().nullable(),
  ratedLifeHours: z.number().int().nullable(),
  notes: z.string(),
});
export type PartRow = z.infer<typeof partRow>;

/** A board with its parts list (the parts on it now, in list order) and the version to save against. */
export const boardPartsList = z.strictObject({
  board: modelBoard,
  model: gameModel,
  parts: z.array(partRow),
  version: z.number().int(),
});
export type BoardPartsList = z.infer<typeof boardPartsList>;

/** What a 409 on a parts-list save says: the list was saved by someone else after it was opened. */
export const PARTS_LIST_CONFLICT = 'Someone else saved this parts list since you opened it.';
