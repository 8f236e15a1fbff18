// Seeded draws for the scale data, so two runs with the same seed load the same rows (ids included) and
// their measurements can be compared.
import { seededRandom } from '../demo/random.ts';

export class Dice {
  private readonly next: () => number;

  constructor(seed: number) {
    this.next = seededRandom(seed);
  }

  /** In [0, 1). */
  float(): number {
    return this.next();
  }

  /** An integer in [min, max]. */
  int(min: number, max: number): number {
    return min + Math.floor(this.next() * (max - min + 1));
  }

  chance(p: number): boolean {
    return this.next() < p;
  }

  pick<T>(items: readonly T[]): T {
    return items[Math.floor(this.next() * items.length)]!;
  }

  /** One of `weights`' keys, each as likely as its weight. */
  weighted<K extends string>(weights: Readonly<Record<K, number>>): K {
    const entries = Object.entries(weights) as [K, number][];
    let r = this.next() * entries.reduce((sum, [, w]) => sum + w, 0);
    for (const [key, w] of entries) {
      r -= w;
      if (r < 0) return key;
    }
    return entries[entries.length - 1]![0];
  }

  /** A waiting time with this mean, as between independent failures (exponential). */
  exponential(mean: number): number {
    return -Math.log(1 - this.next()) * mean;
  }

  /** A version 4 UUID drawn from the seed. */
  uuid(): string {
    let hex = '';
    for (let i = 0; i < 4; i++)
      hex += Math.floor(this.next() * 0x1_0000_0000)
        .toString(16)
        .padStart(8, '0');
    const variant = ((parseInt(hex[16]!, 16) & 0x3) | 0x8).toString(16);
    return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-4${hex.slice(13, 16)}-${variant}${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
  }

  /** Lowercase hex of `length` characters (provider message ids). */
  hex(length: number): string {
    let out = '';
    while (out.length < length)
      out += Math.floor(this.next() * 0x1_0000_0000)
        .toString(16)
        .padStart(8, '0');
    return out.slice(0, length);
  }
}
