// Where rate-limit hits are counted: PostgreSQL in the running product (shared by every API instance),
// or memory (unit tests). express-rate-limit and the sign-in limiter both count through this.
import type { Options, Store } from 'express-rate-limit';
import type { Db } from '@bumperline/db/client';
import { hitCounter, resetCounter, unhitCounter } from '@bumperline/db/queries/rate-limits';

export interface HitCounter {
  hit(key: string, windowMs: number): Promise<{ hits: number; resetAt: Date }>;
  unhit(key: string): Promise<void>;
  reset(key: string): Promise<void>;
}

export function postgresCounter(db: Db): HitCounter {
  return {
    hit: (key, windowMs) => hitCounter(db, key, windowMs),
    unhit: (key) => unhitCounter(db, key),
    reset: (key) => resetCounter(db, key),
  };
}

export function memoryCounter(now: () => number = Date.now): HitCounter {
  const counts = new Map<string, { hits: number; resetAt: number }>();
  return {
    async hit(key, windowMs) {
      const current = counts.get(key);
      const entry = current && current.resetAt > now() ? { ...current, hits: current.hits + 1 } : { hits: 1, resetAt: now() + windowMs };
      counts.set(key, entry);
      return { hits: entry.hits, resetAt: new Date(entry.resetAt) };
    },
    async unhit(key) {
      const current = counts.get(key);
      if (current) current.hits = Math.max(0, current.hits - 1);
    },
    async reset(key) {
      counts.delete(key);
    },
  };
}

/** An express-rate-limit store over a HitCounter; `prefix` keeps each limiter's keys apart. */
export class CounterStore implements Store {
  private windowMs = 60_000;
  readonly localKeys = false;
  constructor(
    private readonly counter: HitCounter,
    readonly prefix: string,
  ) {}
  init(options: Options) {
    this.windowMs = options.windowMs;
  }
  async increment(key: string) {
    const { hits, resetAt } = await this.counter.hit(`${this.prefix}:${key}`, this.windowMs);
    return { totalHits: hits, resetTime: resetAt };
  }
  async decrement(key: string) {
    await this.counter.unhit(`${this.prefix}:${key}`);
  }
  async resetKey(key: string) {
    await this.counter.reset(`${this.prefix}:${key}`);
  }
}
