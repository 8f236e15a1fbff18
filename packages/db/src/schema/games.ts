import { sql } from 'drizzle-orm';
import { date, foreignKey, index, integer, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { gameKind, gameStatus } from './enums.ts';
import { tenants } from './tenancy.ts';
import { venues } from './venues.ts';
import { tenantIsolation } from './rls.ts';

export const gameModels = pgTable(
  'game_models',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    id: uuid('id').notNull().defaultRandom(),
    maker: text('maker').notNull(),
    title: text('title').notNull(),
    kind: gameKind('kind').notNull(),
    year: integer('year'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.tenantId, t.id] }),
    uniqueIndex('game_models_tenant_maker_title_key').on(t.tenantId, t.maker, t.title),
    tenantIsolation(t.tenantId),
  ],
).enableRLS();

export const games = pgTable(
  'games',
  {
    tenantId: uuid('tenant_id')
      .notNull()
      .references(() => tenants.id, { onDelete: 'cascade' }),
    id: uuid('id').notNull().defaultRandom(),
    modelId: uuid('model_id').notNull(),
    venueId: uuid('venue_id'),
    serial: text('serial').notNull(),
    status: gameStatus('status').notNull().default('running'),
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
    primaryKey({ columns: [t.tenantId, t.id] }),
    foreignKey({ columns: [t.tenantId, t.modelId], foreignColumns: [gameModels.tenantId, gameModels.id] }),
    foreignKey({ columns: [t.tenantId, t.venueId], foreignColumns: [venues.tenantId, venues.id] }),
    uniqueIndex('games_tag_token_key').on(t.tagToken),
    uniqueIndex('games_tenant_serial_key').on(t.tenantId, t.modelId, t.serial),
    index('games_tenant_venue_idx').on(t.tenantId, t.venueId),
    index('games_tenant_created_idx').on(t.tenantId, t.createdAt, t.id),
    index('games_tenant_serial_idx').on(t.tenantId, sql`lower(${t.serial})`),
    tenantIsolation(t.tenantId),
  ],
).enableRLS();
