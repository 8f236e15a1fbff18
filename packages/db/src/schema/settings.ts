import { integer, jsonb, text } from 'drizzle-orm/pg-core';
import { tenantTable } from './tenant-table.ts';

/** Response targets in minutes per severity; map tiles; the threshold before a target at which dispatch is warned. */
export const tenantSettings = tenantTable(
  'tenant_settings',
  {
    responseTargets: jsonb('response_targets')
      .$type<{ down: number; fault: number; cosmetic: number }>()
      .notNull()
      .default({ down: 240, fault: 1440, cosmetic: 4320 }),
    warnBeforeMinutes: integer('warn_before_minutes').notNull().default(30),
    mapTileUrl: text('map_tile_url').notNull().default(''),
    dispatchPhone: text('dispatch_phone').notNull().default(''),
    /** Labour at cost, per hour on site, for keep cost. */
    labourRateCents: integer('labour_rate_cents').notNull().default(4500),
    /** Average driving speed between venues, for route days (haversine distance ÷ speed, until a road matrix). */
    averageSpeedKmh: integer('average_speed_kmh').notNull().default(35),
  },
  () => [],
  { key: 'tenant_id' }, // one row per company
);
