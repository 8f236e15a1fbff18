// Slows password guessing: at most `max` failed attempts per e-mail and address within the window.
// In memory per API instance (common practice for a first line; a shared store would span instances).
export class SignInLimiter {
  private attempts = new Map<string, number[]>();
  constructor(
    private readonly max = 10,
    private readonly windowMs = 15 * 60_000,
  ) {}

  /** Counts this attempt; false when the limit is already reached. */
  allow(email: string, ip: string, now = Date.now()): boolean {
    const key = `${email}|${ip}`;
    const recent = (this.attempts.get(key) ?? []).filter((t) => now - t < this.windowMs);
    if (recent.length >= this.max) {
      this.attempts.set(key, recent);
      return false;
    }
    recent.push(now);
    this.attempts.set(key, recent);
    return true;
  }

  reset(email: string, ip: string): void {
    this.attempts.delete(`${email}|${ip}`);
  }
}
