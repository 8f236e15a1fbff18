import { z } from 'zod';
import { requiredText, uuid } from './common.ts';
import { roles } from './roles.ts';

export const email = z
  .email({ error: 'must be an e-mail address' })
  .max(200)
  .transform((e) => e.toLowerCase());
// NIST SP 800-63B: at least 8 characters, allow long passphrases.
export const password = z
  .string()
  .min(10, { error: 'must be at least 10 characters' })
  .max(200, { error: 'must be at most 200 characters' });

const ianaZone = z.string().refine(
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
const currency = z
  .string()
  .regex(/^[A-Z]{3}$/, { error: 'must be an ISO 4217 code such as USD' })
  .refine((c) => Intl.supportedValuesOf('currency').includes(c), { error: 'is not an ISO 4217 currency' });

export const signUpInput = z.strictObject({
  companyName: requiredText(120),
  name: requiredText(120),
  email,
  password,
  timeZone: ianaZone.default('America/Chicago'),
  currency: currency.default('USD'),
});
export type SignUpInput = z.input<typeof signUpInput>;

export const companyUpdate = z.strictObject({
  name: requiredText(120).optional(),
  timeZone: ianaZone.optional(),
  currency: currency.optional(),
  locale: z.string().min(2).max(20).optional(),
});

export const passwordResetRequest = z.strictObject({ email });
const emailedToken = z.string().min(20, { error: 'is not a link we sent' }).max(200, { error: 'is not a link we sent' });
export const passwordResetConfirm = z.strictObject({ token: emailedToken, password });
/** Opening the link that confirms a new sign-up's address. */
export const verifyEmailInput = z.strictObject({ token: emailedToken });

/** What sign-up answers, whether or not the address already has an account. */
export const signUpAnswer = { status: 'check-your-email' } as const;

/**
 * Why a password sign-in was refused, beyond a wrong e-mail or password (Auth.js's `credentials`); the
 * code comes back in the failed sign-in's url. `unverified` is only said to someone who gave the right
 * password; the other two depend on counts kept per e-mail and per network address, never on whether
 * the account exists.
 */
export const signInRefusals = ['unverified', 'account-paused', 'too-many-attempts'] as const;
export type SignInRefusal = (typeof signInRefusals)[number];

export const invitationInput = z.strictObject({ email, role: z.enum(roles) });
export type InvitationInput = z.input<typeof invitationInput>;
export const acceptInvitationInput = z.strictObject({
  name: requiredText(120).optional(),
  password: password.optional(),
});
export const switchCompanyInput = z.strictObject({ tenantId: uuid });
export const memberRoleUpdate = z.strictObject({ role: z.enum(roles) });

export interface Me {
  user: { id: string; email: string; name: string };
  company: { id: string; name: string; timeZone: string; currency: string; locale: string } | null;
  role: (typeof roles)[number] | null;
  companies: { id: string; name: string; role: (typeof roles)[number] }[];
  isPlatformAdmin: boolean;
}
