// Checks an e-mail and password for Auth.js's credentials provider: the limiter first, then the
// password (against a stand-in hash when there is no account, so unknown addresses take as long), and
// only then whether the address is confirmed — so only someone who knows the password learns that.
import { CredentialsSignin } from '@auth/express';
import type { SignInRefusal } from '@bumperline/contracts/auth';
import type { Db } from '@bumperline/db/client';
import { findUserByEmail } from '@bumperline/db/queries/identity';
import { verifyPassword } from '@bumperline/db/passwords';
import type { SignInLimiter } from './sign-in-limiter.ts';

/** A refusal whose code Auth.js puts in the failed sign-in's url, for the sign-in page to explain. */
export class SignInRefused extends CredentialsSignin {
  constructor(code: SignInRefusal) {
    super();
    this.code = code;
  }
}

export async function passwordSignIn(
  deps: { db: Db; limiter: SignInLimiter },
  attempt: { email: string; password: string; ip: string },
): Promise<{ id: string; email: string; name: string } | null> {
  const { email, password, ip } = attempt;
  // Not an address anyone can have (PostgreSQL text cannot even hold a NUL): refused like a wrong password.
  if (!email || !password || email.length > 254 || email.includes('\u0000')) return null;
  const verdict = await deps.limiter.attempt(email, ip);
  if (verdict !== 'allowed') throw new SignInRefused(verdict);
  const user = await findUserByEmail(deps.db, email);
  const ok = await verifyPassword(user?.passwordHash, password);
  if (!user || !ok) return null;
  await deps.limiter.succeeded(email, ip);
  if (!user.emailVerifiedAt) throw new SignInRefused('unverified');
  return { id: user.id, email: user.email, name: user.name };
}
