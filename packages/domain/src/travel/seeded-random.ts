/**
 * A small seeded generator (mulberry32) so the route planner gives the same plan for the same input every time,
 * which a dispatcher expects and a test can check.
 */
export type Random = () => number;

export function seededRandom(seed: number): Random {
  let state = Math.trunc(seed) >>> 0 || 0x9e3779b9;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
}

/** A whole number in [0, n). */
export function randomInt(random: Random, n: number): number {
  return Math.floor(random() * n);
}
