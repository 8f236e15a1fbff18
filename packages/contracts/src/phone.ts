import { z } from 'zod';
import { parsePhoneNumberFromString } from 'libphonenumber-js';

/** A mobile number, normalised to E.164 (+13125550100). National numbers are read as US numbers. */
export const phoneNumber = z
  .string()
  .trim()
  .max(30, { error: 'must be at most 30 characters' })
  .transform((value, ctx) => {
    const parsed = parsePhoneNumberFromString(value, 'US');
    if (!parsed || !parsed.isValid()) {
      ctx.addIssue({ code: 'custom', message: 'must be a valid phone number, such as (312) 555-0142' });
      return z.NEVER;
    }
    return parsed.number;
  });
