// The account: signing up, confirming an address, resetting a password, and who is signed in.
import { z } from 'zod';
import { requiredText, uuid } from './common.ts';
import { currency, ianaZone } from './company.ts';
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

export const signUpInput = z.strictObject({
  companyName: requiredText(120),
  name: requiredText(120),
  email,
  password,
  timeZone: ianaZone.default('America/Chicago'),
  currency: currency.default('USD'),
});
export type SignUpInput = z.input<typeof signUpInput>;

export const passwordResetRequest = z.strictObject({ email });
const emailedToken = z.string().min(20, { error: 'is not a link we sent' }).max(200, { error: 'is not a link we sent' });
export const passwordResetConfirm = z.strictObject({ token: emailedToken, password });
/**
 * Opening the link that confirms a new sign-up's address, with the password chosen at sign-up: someone
 * who did not sign up (the address's real owner, clicking a link they never asked for) cannot confirm a
 * stranger's password onto their own address.
 */
export const verifyEmailInput = z.strictObject({
  token: emailedToken,
  password: z.string().min(1, { error: 'is required' }).max(200, { error: 'is not the password chosen at sign-up' }),
});

/** What sign-up answers, whether or not the address already has an account. */
export const signUpAnswer = { status: 'check-your-email' } as const;
export const signUpAnswered = z.strictObject({ status: z.literal(signUpAnswer.status) });
export type SignUpAnswered = z.infer<typeof signUpAnswered>;
/** What the e-mail forms (reset, sign-in link, resend confirmation) answer, whether or not the address has an account. */
export const mailSentIfKnown = z.strictObject({ status: z.literal('sent-if-known') });
export type MailSentIfKnown = z.infer<typeof mailSentIfKnown>;

// Re-exported beside the other sign-in shapes; the web app imports sign-in-refusals.ts, which has no zod.
export { signInRefusals } from './sign-in-refusals.ts';
export type { SignInRefusal } from './sign-in-refusals.ts';

export const switchCompanyInput = z.strictObject({ tenantId: uuid });

/** Who is signed in, the company they work in now (none before they join one) and their role there. */
export const me = z.strictObject({
  user: z.strictObject({ id: uuid, email: z.string(), name: z.string() }),
  company: z.strictObject({ id: uuid, name: z.string(), timeZone: z.string(), currency: z.string(), locale: z.string() }).nullable(),
  role: z.enum(roles).nullable(),
  companies: z.array(z.strictObject({ id: uuid, name: z.string(), role: z.enum(roles) })),
  isPlatformAdmin: z.boolean(),
});
export type Me = z.infer<typeof me>;
