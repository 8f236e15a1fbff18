import { sql } from 'drizzle-orm';
import { boolean, doublePrecision, text, uuid } from 'drizzle-orm/pg-core';
import { users } from './identity.ts';
import { tenantTable } from './tenant-table.ts';

/** A technician's skills (game kinds and specialities) and where their day starts. */
export const technicianProfiles = tenantTable(
  'technician_profiles',
  {
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    skills: text('skills')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    homeLatitude: doublePrecision('home_latitude'),
    homeLongitude: doublePrecision('home_longitude'),
    active: boolean('active').notNull().default(true),
    /** The route day's hours, local "HH:MM": leave the start point, be back by. */
    dayStart: text('day_start').notNull().default('08:00'),
    dayEnd: text('day_end').notNull().default('17:00'),
  },
  () => [],
  { key: (t) => [t.userId] },
);
