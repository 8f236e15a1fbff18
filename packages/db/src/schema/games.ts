// Game models (maker and title) and the games themselves, each with its game tag's secret.
import { sql } from 'drizzle-orm';
import { date, foreignKey, index, integer, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { gameKind, gameStatus } from './enums.ts';
import { venues } from './venues.ts';
import { tenantTable } from './tenant-table.ts';

export const gameModels = tenantTable(
  'game_models',
  {
    id: uuid('id').notNull().defaultRandom(),
    maker: text('maker').notNull(),
    title: text('title').notNull(),
    kind: gameKind.column('kind').notNull(),
    year: integer('year'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    gameKind.check('game_models_kind_check', t.kind),
    uniqueIndex('game_models_tenant_maker_title_key').on(t.tenantId, t.maker, t.title),
  ],
);

export const games = tenantTable(
  'games',
  {
    id: uuid('id').notNull().defaultRandom(),
    modelId: uuid('model_id').notNull(),
    venueId: uuid('venue_id'),
    serial: text('serial').notNull(),
    status: gameStatus.column('status').notNull().default('running'),
    installedOn: date('installed_on'),
    pricePerPlayCents: integer('price_per_play_cents').notNull().default(100),
    // The game tag's secret: an unguessable token printed as a QR code on the cabinet.
    tagToken: text('tag_token').notNull(),
    notes: text('notes').notNull().default(''),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    retiredAt: timestamp('retired_at', { withTimezone: true }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.modelId], foreignColumns: [gameModels.tenantId, gameModels.id] }),
    foreignKey({ columns: [t.tenantId, t.venueId], foreignColumns: [venues.tenantId, venues.id] }),
    uniqueIndex('games_tag_token_key').on(t.tagToken),
    uniqueIndex('games_tenant_serial_key').on(t.tenantId, t.modelId, t.serial),
    gameStatus.check('games_status_check', t.status),
    index('games_tenant_venue_idx').on(t.tenantId, t.venueId),
    index('games_tenant_status_idx').on(t.tenantId, t.status),
    index('games_tenant_created_idx').on(t.tenantId, t.createdAt, t.id),
    index('games_tenant_serial_idx').on(t.tenantId, sql`lower(${t.serial})`),
  ],
);
