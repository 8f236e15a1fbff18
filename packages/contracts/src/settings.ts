// The company's settings: response targets per severity, warning lead, map tiles, dispatch phone; the labour rate
// keep cost uses and the driving speed route days plan with.
import { z } from 'zod';
import { uuid } from './common.ts';
import { phoneNumber } from './phone.ts';

const minutes = z
  .number()
  .int()
  .min(5, { error: 'must be at least 5 minutes' })
  .max(60 * 24 * 30);

/** The longest warning lead a company may choose: the warnings job looks no further ahead than this. */
export const longestWarningLeadMinutes = 24 * 60;

export const settingsUpdate = z.strictObject({
  responseTargets: z.strictObject({ down: minutes, fault: minutes, cosmetic: minutes }).optional(),
  warnBeforeMinutes: z.number().int().min(0).max(longestWarningLeadMinutes).optional(),
  mapTileUrl: z
    .union([
      z.literal(''),
      z
        .string()
        .url()
        .max(300)
        .regex(/^https?:\/\//, { error: 'must start with https:// or http://' })
        .regex(/\{z\}.*\{x\}.*\{y\}/, { error: 'must contain {z}, {x} and {y}' }),
    ])
    .optional(),
  dispatchPhone: z.union([z.literal(''), phoneNumber]).optional(),
  /** Labour at cost per hour on site, in cents: keep cost prices a job's time with it. */
  labourRateCents: z.number().int().min(0, { error: 'must not be negative' }).max(1_000_000).optional(),
  /** Average driving speed between venues, for route days. */
  averageSpeedKmh: z.number().int().min(5, { error: 'must be at least 5 km/h' }).max(130, { error: 'must be at most 130 km/h' }).optional(),
});
export type SettingsUpdate = z.input<typeof settingsUpdate>;

export const companySettings = z.strictObject({
  tenantId: uuid,
  /** Minutes from a report to the technician's arrival, per severity. */
  responseTargets: z.strictObject({ down: z.number().int(), fault: z.number().int(), cosmetic: z.number().int() }),
  warnBeforeMinutes: z.number().int(),
  /** Empty: no tiles are fetched, the map shows markers on a plain background. */
  mapTileUrl: z.string(),
  dispatchPhone: z.string(),
  labourRateCents: z.number().int(),
  averageSpeedKmh: z.number().int(),
});
export type CompanySettings = z.infer<typeof companySettings>;
