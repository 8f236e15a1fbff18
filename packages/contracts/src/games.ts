import { z } from 'zod';
import { listQueryBase, requiredText, rowVersion, shortText, uuid } from './common.ts';

export const gameKinds = ['pinball', 'video', 'jukebox', 'darts', 'other'] as const;
export const gameKindLabels: Record<(typeof gameKinds)[number], string> = {
  pinball: 'Pinball',
  video: 'Video / arcade',
  jukebox: 'Jukebox',
  darts: 'Darts',
  other: 'Other',
};
// Our own status words; each is shown with a word and an icon, never colour alone.
export const gameStatuses = ['running', 'attention', 'down', 'in_shop'] as const;
export type GameStatus = (typeof gameStatuses)[number];
export const gameStatusLabels: Record<GameStatus, string> = {
  running: 'Running',
  attention: 'Needs attention',
  down: 'Down',
  in_shop: 'At the shop',
};

export const gameModelInput = z.strictObject({
  maker: requiredText(100),
  title: requiredText(120),
  kind: z.enum(gameKinds, { error: `must be one of ${gameKinds.join(', ')}` }),
  year: z.number().int().min(1930).max(2100).nullable().default(null),
});
export type GameModelInput = z.input<typeof gameModelInput>;

export interface GameModel {
  id: string;
  maker: string;
  title: string;
  kind: (typeof gameKinds)[number];
  year: number | null;
}

const isoDate = z.iso.date({ error: 'must be a date as YYYY-MM-DD' });

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

export interface Game {
  id: string;
  modelId: string;
  venueId: string | null;
  serial: string;
  status: GameStatus;
  installedOn: string | null;
  pricePerPlayCents: number;
  notes: string;
  version: number;
  createdAt: string;
  updatedAt: string;
  retiredAt: string | null;
  model: GameModel;
  venueName: string | null;
  /** Only on a single game's page: the secret in its game tag's address (/t/<token>). */
  tagToken?: string;
}
