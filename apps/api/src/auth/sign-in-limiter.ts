// Slows password guessing in two ways, counted in the shared HitCounter (PostgreSQL in the product) so
// that every API instance sees the same counts:
// - per account, from every address together: past the limit, password sign-in for that e-mail pauses
//   until the window passes or the person proves the address with an e-mailed link (which always
//   works), so an attacker can slow an owner down but never lock them out;
// - per network address, across accounts (password spraying): only failures count, so a busy office
//   behind one address is not held back by its own successful sign-ins.
// Both are keyed on the typed e-mail, whether or not it has an account, so a pause reveals nothing.
import type { SignInRefusal } from '@bumperline/contracts/auth';
import type { HitCounter } from '../http/rate-limit-counter.ts';

export interface SignInLimits {
  perAccount: number;
  accountWindowMs: number;
  perAddress: number;
  addressWindowMs: number;
}

export const defaultSignInLimits: SignInLimits = {
  perAccount: 10,
  accountWindowMs: 60 * 60_000,
  perAddress: 30,
  addressWindowMs: 15 * 60_000,
};

export type SignInVerdict = 'allowed' | Exclude<SignInRefusal, 'unverified'>;

const accountKey = (email: string) => `sign-in:account:${email.toLowerCase()}`;
const addressKey = (ip: string) => `sign-in:address:${ip}`;

export class SignInLimiter {
  private readonly limits: SignInLimits;
  constructor(
    private readonly counter: HitCounter,
    limits: Partial<SignInLimits> = {},
  ) {
    this.limits = { ...defaultSignInLimits, ...limits };
  }

  /** Counts this attempt before the password is checked, so parallel guesses cannot slip past the limit. */
  async attempt(email: string, ip: string): Promise<SignInVerdict> {
    const address = await this.counter.hit(addressKey(ip), this.limits.addressWindowMs);
    // Refused for its address: not counted against the account, or a sprayer would pause everyone's.
    if (address.hits > this.limits.perAddress) return 'too-many-attempts';
    const account = await this.counter.hit(accountKey(email), this.limits.accountWindowMs);
    return account.hits > this.limits.perAccount ? 'account-paused' : 'allowed';
  }

  /** The right password: the attempt no longer counts against the address, and the account starts again. */
  async succeeded(email: string, ip: string): Promise<void> {
    await this.counter.unhit(addressKey(ip));
    await this.counter.reset(accountKey(email));
  }

  /** The person opened a link mailed to the address: password sign-in is no longer paused. */
  async addressProven(email: string): Promise<void> {
    await this.counter.reset(accountKey(email));
  }
}
