// Caps the e-mails anyone can make us send without signing in (sign-up confirmations and notices,
// password-reset and sign-in links) per recipient and kind, so those forms cannot flood a mailbox.
// The forms still answer 202 beyond the cap; they just send nothing. Counted in the shared HitCounter.
import type { HitCounter } from '../http/rate-limit-counter.ts';

export type AccountMailKind = 'sign-up' | 'password-reset' | 'sign-in-link';

export class AccountMailLimiter {
  constructor(
    private readonly counter: HitCounter,
    private readonly perWindow = 5,
    private readonly windowMs = 60 * 60_000,
  ) {}

  /** Counts one request for a mail of `kind` to `email`; false once past the cap. */
  async allow(kind: AccountMailKind, email: string): Promise<boolean> {
    const { hits } = await this.counter.hit(`account-mail:${kind}:${email.toLowerCase()}`, this.windowMs);
    return hits <= this.perWindow;
  }
}
