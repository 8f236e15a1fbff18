// Slows password guessing: at most `max` attempts per e-mail and address within the window, counted
// in the shared HitCounter (PostgreSQL in the product) so that every API instance sees the same count.
import type { HitCounter } from '../http/rate-limit-counter.ts';

export class SignInLimiter {
  constructor(
    private readonly counter: HitCounter,
    private readonly max = 10,
    private readonly windowMs = 15 * 60_000,
  ) {}

  /** Counts this attempt; false once the limit is passed. */
  async allow(email: string, ip: string): Promise<boolean> {
    const { hits } = await this.counter.hit(`sign-in:${email}|${ip}`, this.windowMs);
    return hits <= this.max;
  }

  /** A successful sign-in clears the count. */
  async reset(email: string, ip: string): Promise<void> {
    await this.counter.reset(`sign-in:${email}|${ip}`);
  }
}
