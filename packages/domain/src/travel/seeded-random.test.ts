import { describe, expect, it } from 'vitest';
import { randomInt, seededRandom } from './seeded-random.ts';

describe('seededRandom', () => {
  it('repeats for a seed and differs between seeds', () => {
    const a = seededRandom(7);
    const b = seededRandom(7);
    const c = seededRandom(8);
    const first = Array.from({ length: 5 }, () => a());
    expect(Array.from({ length: 5 }, () => b())).toEqual(first);
    expect(Array.from({ length: 5 }, () => c())).not.toEqual(first);
  });

  it('is roughly uniform on [0, 1): each tenth gets 10 % ± 1 % of 100,000 draws', () => {
    const random = seededRandom(1);
    const buckets = new Array<number>(10).fill(0);
    let outside = 0;
    // One expect at the end, not 100,000 inside the loop: the loop then takes milliseconds, even on a busy machine.
    for (let i = 0; i < 100_000; i++) {
      const x = random();
      if (!(x >= 0 && x < 1)) outside++;
      else buckets[randomInt(() => x, 10)]! += 1;
    }
    expect(outside).toBe(0);
    for (const count of buckets) expect(Math.abs(count - 10_000)).toBeLessThan(1_000);
  });
});
