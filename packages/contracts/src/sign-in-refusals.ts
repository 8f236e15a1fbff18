// Apart from auth.ts's schemas so that the web app's sign-out and sign-in helpers, loaded on every screen, need no zod.
/**
 * Why a password sign-in was refused, beyond a wrong e-mail or password (Auth.js's `credentials`); the
 * code comes back in the failed sign-in's url. `unverified` is only said to someone who gave the right
 * password; the other two depend on counts kept per e-mail and per network address, never on whether
 * the account exists.
 */
export const signInRefusals = ['unverified', 'account-paused', 'too-many-attempts'] as const;
export type SignInRefusal = (typeof signInRefusals)[number];
