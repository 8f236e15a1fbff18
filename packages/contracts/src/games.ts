import { z } from 'zod';
import { isoDate, isoDateTime, listQueryBase, pageOf, requiredText, rowVersion, shortText, uuid } from './common.ts';
import { gameKinds, gameStatuses } from './game-vocabulary.ts';

// Re-exported so that server code finds the whole contract of a game here; web code imports game-vocabulary.ts,
// which does not pull zod into the screens' bundles.
export { gameKindLabels, gameKinds, gameStatusLabels, gameStatuses } from './game-vocabulary.ts';
export type { GameStatus } from './game-vocabulary.ts';

export const gameModelInput = z.strictObject({
  maker: requiredText(100),
  title: requiredText(120),
  kind: z.enum(gameKinds, { error: `must be one of ${gameKinds.join(', ')}` }),
  year: z.number().int().min(1930).max(2100).nullable().default(null),
});
export type GameModelInput = z.input<typeof gameModelInput>;

export const gameModel = z.strictObject({
  id: uuid,
  maker: z.string(),
  title: z.string(),
  kind: z.enum(gameKinds),
  year: z.number().int().nullable(),
});
export type GameModel = z.infer<typeof gameModel>;
export const gameModelList = z.strictObject({ items: z.array(gameModel) });
export type GameModelList = z.infer<typeof gameModelList>;

export const gameInput = z.strictObject({
  modelId: uuid,
  venueId: uuid.nullable().default(null),
  serial: requiredText(60),
  status: z.enum(gameStatuses).default('running'),
  installedOn: isoDate.nullable().default(null),
  pricePerPlayCents: z.number().int().min(0).max(100_000).default(100),
  notes: shortText(2000).default(''),
});
export type GameInput = z.input<typeof gameInput>;

export const gameUpdate = gameInput.partial().extend({ version: rowVersion });
export type GameUpdate = z.input<typeof gameUpdate>;

export const gameSort = z.enum(['title', 'serial', 'status', 'venue', 'createdAt']);
export const gameListQuery = listQueryBase.extend({
  sort: gameSort.default('title'),
  venueId: uuid.optional(),
  status: z.enum(gameStatuses).optional(),
  kind: z.enum(gameKinds).optional(),
});
export type GameListQuery = z.input<typeof gameListQuery>;

export const game = z.strictObject({
  id: uuid,
  modelId: uuid,
  venueId: uuid.nullable(),
  serial: z.string(),
  status: z.enum(gameStatuses),
  installedOn: isoDate.nullable(),
  pricePerPlayCents: z.number().int(),
  notes: z.string(),
  version: z.number().int(),
  createdAt: isoDateTime,
  updatedAt: isoDateTime,
  retiredAt: isoDateTime.nullable(),
  model: gameModel,
  venueName: z.string().nullable(),
});
export type Game = z.infer<typeof game>;
export const gamePage = pageOf(game);
export type GamePage = z.infer<typeof gamePage>;
/** A single game's page also carries the secret in its game tag's address (/t/<token>); lists never do. */
export const gameDetail = game.extend({ tagToken: z.string() });
export type GameDetail = z.infer<typeof gameDetail>;

/** How many active games are in each status (a status with none is left out). */
export const gameSummary = z.strictObject({
  byStatus: z.partialRecord(z.enum(gameStatuses), z.number().int()),
  total: z.number().int(),
});
export type GameSummary = z.infer<typeof gameSummary>;

/** When a game was down; an open interval has no end yet. */
export const downtimeInterval = z.strictObject({
  id: uuid,
  callId: uuid.nullable(),
  startedAt: isoDateTime,
  endedAt: isoDateTime.nullable(),
});
export type DowntimeInterval = z.infer<typeof downtimeInterval>;
export const downtimeList = z.strictObject({ items: z.array(downtimeInterval) });
export type DowntimeList = z.infer<typeof downtimeList>;

/** A new game tag: the address the new QR code opens (the printed one stops working). */
export const tagRegenerated = z.strictObject({ gameId: uuid, tagUrl: z.url() });
export type TagRegenerated = z.infer<typeof tagRegenerated>;
