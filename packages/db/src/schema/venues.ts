// Venues (the places games stand) and the venue contacts who speak for them.
import { sql } from 'drizzle-orm';
import { doublePrecision, foreignKey, index, integer, jsonb, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './identity.ts';
import { tenantTable } from './tenant-table.ts';

/** Opening hours per ISO weekday (1 = Monday … 7 = Sunday), "HH:MM" local time; close may pass midnight. */
export type OpeningHours = Partial<Record<'1' | '2' | '3' | '4' | '5' | '6' | '7', { open: string; close: string }[]>>;

export const venues = tenantTable(
  'venues',
  {
    id: uuid('id').notNull().defaultRandom(),
    name: text('name').notNull(),
    addressLine: text('address_line').notNull(),
    city: text('city').notNull(),
    postcode: text('postcode').notNull().default(''),
    latitude: doublePrecision('latitude').notNull(),
    longitude: doublePrecision('longitude').notNull(),
    openingHours: jsonb('opening_hours').$type<OpeningHours>().notNull().default({}),
    contactName: text('contact_name').notNull().default(''),
    contactPhone: text('contact_phone').notNull().default(''),
    contactEmail: text('contact_email').notNull().default(''),
    notes: text('notes').notNull().default(''),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    retiredAt: timestamp('retired_at', { withTimezone: true }),
  },
  (t) => [
    index('venues_tenant_name_idx').on(t.tenantId, sql`lower(${t.name})`, t.id),
    index('venues_tenant_created_idx').on(t.tenantId, t.createdAt, t.id),
  ],
);

/** Which venue a venue contact speaks for. */
export const venueContacts = tenantTable(
  'venue_contacts',
  {
    venueId: uuid('venue_id').notNull(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.venueId], foreignColumns: [venues.tenantId, venues.id] }).onDelete('cascade'),
    index('venue_contacts_user_idx').on(t.tenantId, t.userId),
  ],
  { key: (t) => [t.venueId, t.userId] },
);
