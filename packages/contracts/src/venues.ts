import { z } from 'zod';
import { isoDateTime, listQueryBase, pageOf, requiredText, rowVersion, shortText, uuid } from './common.ts';

const hhmm = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, { error: 'must be a time as HH:MM' });
const dayHours = z.array(z.strictObject({ open: hhmm, close: hhmm })).max(4);
export const openingHours = z.strictObject({
  '1': dayHours.optional(),
  '2': dayHours.optional(),
  '3': dayHours.optional(),
  '4': dayHours.optional(),
  '5': dayHours.optional(),
  '6': dayHours.optional(),
  '7': dayHours.optional(),
});

export const venueInput = z.strictObject({
  name: requiredText(120),
  addressLine: requiredText(200),
  city: requiredText(100),
  postcode: shortText(20).default(''),
  latitude: z.number({ error: 'must be a number' }).min(-90).max(90),
  longitude: z.number({ error: 'must be a number' }).min(-180).max(180),
  openingHours: openingHours.default({}),
  contactName: shortText(120).default(''),
  contactPhone: z
    .string()
    .trim()
    .max(30)
    .regex(/^(\+?[0-9 ()-]{7,30})?$/, { error: 'must be a phone number' })
    .default(''),
  contactEmail: z.union([z.literal(''), z.email({ error: 'must be an e-mail address' }).max(200)]).default(''),
  notes: shortText(2000).default(''),
});
export type VenueInput = z.input<typeof venueInput>;

/** An edit names the version it started from, so two people editing at once cannot overwrite each other. */
export const venueUpdate = venueInput.partial().extend({ version: rowVersion });
export type VenueUpdate = z.input<typeof venueUpdate>;

export const venueSort = z.enum(['name', 'city', 'createdAt']);
export const venueListQuery = listQueryBase.extend({ sort: venueSort.default('name') });
export type VenueListQuery = z.input<typeof venueListQuery>;

export const venue = z.strictObject({
  id: uuid,
  name: z.string(),
  addressLine: z.string(),
  city: z.string(),
  postcode: z.string(),
  latitude: z.number(),
  longitude: z.number(),
  openingHours,
  contactName: z.string(),
  contactPhone: z.string(),
  contactEmail: z.string(),
  notes: z.string(),
  version: z.number().int(),
  createdAt: isoDateTime,
  updatedAt: isoDateTime,
  retiredAt: isoDateTime.nullable(),
  /** Active games at the venue. */
  gameCount: z.number().int(),
});
export type Venue = z.infer<typeof venue>;
export const venuePage = pageOf(venue);
export type VenuePage = z.infer<typeof venuePage>;

/** Linking a venue contact (a member whose role is venue contact) to a venue. */
export const venueContactInput = z.strictObject({ userId: uuid });

export const venueContactPerson = z.strictObject({ userId: uuid, name: z.string(), email: z.string() });
export type VenueContactPerson = z.infer<typeof venueContactPerson>;
/** The venue's contacts, and the company's venue contacts who could be linked to it. */
export const venueContactList = z.strictObject({ items: z.array(venueContactPerson), candidates: z.array(venueContactPerson) });
export type VenueContactList = z.infer<typeof venueContactList>;
/** After linking: the venue's contacts. */
export const venueContactsLinked = z.strictObject({ items: z.array(venueContactPerson) });
export type VenueContactsLinked = z.infer<typeof venueContactsLinked>;
