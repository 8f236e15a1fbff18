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

/**
 * A phone number or e-mail address for someone who may see that a message went out but not whom to
 * reach: the last two digits of a number, the first letter and domain of an address.
 */
export function maskAddress(address: string): string {
  const at = address.indexOf('@');
  if (at > 0) return `${address[0]}•••${address.slice(at)}`;
  const digits = address.replace(/\D/g, '');
  return `•••• ${digits.slice(-2)}`;
}
