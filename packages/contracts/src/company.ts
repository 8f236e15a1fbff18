// The signed-in person's operator company: its name and how its times and money are shown.
import { z } from 'zod';
import { isoDateTime, requiredText, uuid } from './common.ts';

export const ianaZone = z.string().refine(
  (tz) => {
    try {
      new Intl.DateTimeFormat('en', { timeZone: tz });
      return true;
    } catch {
      return false;
    }
  },
  { error: 'must be an IANA time zone such as America/Chicago' },
);
export const currency = z
  .string()
  .regex(/^[A-Z]{3}$/, { error: 'must be an ISO 4217 code such as USD' })
  .refine((c) => Intl.supportedValuesOf('currency').includes(c), { error: 'is not an ISO 4217 currency' });

/** A BCP 47 language tag the browser can format with (Intl throws on anything else, and so would every screen). */
export const locale = z
  .string()
  .max(35)
  .refine(
    (tag) => {
      try {
        return Intl.getCanonicalLocales(tag).length === 1;
      } catch {
        return false;
      }
    },
    { error: 'must be a language tag such as en-US' },
  );

export const companyUpdate = z.strictObject({
  name: requiredText(120).optional(),
  timeZone: ianaZone.optional(),
  currency: currency.optional(),
  locale: locale.optional(),
});
export type CompanyUpdate = z.input<typeof companyUpdate>;

export const company = z.strictObject({
  id: uuid,
  name: z.string(),
  timeZone: z.string(),
  currency: z.string(),
  locale: z.string(),
  createdAt: isoDateTime,
});
export type Company = z.infer<typeof company>;
