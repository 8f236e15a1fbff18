import { z } from 'zod';
import { listQueryBase, requiredText, rowVersion, shortText } from './common.ts';

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

export interface Venue {
  id: string;
  name: string;
  addressLine: string;
  city: string;
  postcode: string;
  latitude: number;
  longitude: number;
  openingHours: z.infer<typeof openingHours>;
  contactName: string;
  contactPhone: string;
  contactEmail: string;
  notes: string;
  version: number;
  createdAt: string;
  updatedAt: string;
  retiredAt: string | null;
  gameCount: number;
}
