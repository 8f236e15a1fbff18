import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { planTour, tourLength } from './tour-planner.ts';
import { parseTsplib, tsplibMatrix } from './tsplib.ts';

const load = (name: string) => tsplibMatrix(parseTsplib(readFileSync(new URL(`../../test-data/${name}.tsp`, import.meta.url), 'utf8')));

/** Exact optimum by Held–Karp dynamic programming (Held & Karp, 1962): an oracle independent of the planner. */
function heldKarp(d: number[][]): number {
  const n = d.length;
  const size = 1 << (n - 1);
  const best = Array.from({ length: size }, () => new Float64Array(n).fill(Infinity));
  for (let j = 1; j < n; j++) (best[1 << (j - 1)] as Float64Array)[j] = d[0]![j]!;
  for (let set = 1; set < size; set++) {
    for (let j = 1; j < n; j++) {
      const here = best[set]![j]!;
      if (!(set & (1 << (j - 1))) || here === Infinity) continue;
      for (let k = 1; k < n; k++) {
        if (set & (1 << (k - 1))) continue;
        const next = set | (1 << (k - 1));
        const value = here + d[j]![k]!;
        if (value < best[next]![k]!) best[next]![k] = value;
      }
    }
  }
  let answer = Infinity;
  for (let j = 1; j < n; j++) answer = Math.min(answer, best[size - 1]![j]! + d[j]![0]!);
  return answer;
}

const isPermutation = (order: number[], n: number) =>
  order.length === n && new Set(order).size === n && order.every((i) => i >= 0 && i < n);

describe('planTour on TSPLIB (Reinelt 1991; optima as published)', () => {
  it('berlin52 comes within 2 % of the optimum 7542', () => {
    const m = load('berlin52');
    const tour = planTour(m, { seed: 1 });
    expect(isPermutation(tour.order, 52)).toBe(true);
    expect(tour.length).toBe(tourLength(m, tour.order));
    expect(tour.length).toBeGreaterThanOrEqual(7542); // nothing beats the proven optimum
    expect(tour.length).toBeLessThanOrEqual(7542 * 1.02);
  });

  it('eil51 comes within 2 % of the optimum 426', () => {
    const tour = planTour(load('eil51'), { seed: 7 });
    expect(tour.length).toBeGreaterThanOrEqual(426);
    expect(tour.length).toBeLessThanOrEqual(426 * 1.02);
  });

  it('is deterministic for a seed and starts where asked', () => {
    const m = load('eil51');
    const a = planTour(m, { seed: 3, start: 10, kicks: 200 });
    const b = planTour(m, { seed: 3, start: 10, kicks: 200 });
    expect(a).toEqual(b);
    expect(a.order[0]).toBe(10);
  });
});

describe('planTour against exact optima (Held–Karp)', () => {
  const instance = (asymmetric: boolean) =>
    fc
      .integer({ min: 2, max: 12 })
      .chain((n) =>
        fc
          .array(fc.tuple(fc.integer({ min: 0, max: 1000 }), fc.integer({ min: 0, max: 1000 })), { minLength: n, maxLength: n })
          .chain((pts) =>
            fc
              .array(fc.integer({ min: 0, max: 300 }), { minLength: n * n, maxLength: n * n })
              .map((extra) =>
                pts.map(([x1, y1], i) =>
                  pts.map(([x2, y2], j) =>
                    i === j ? 0 : Math.round(Math.hypot(x1 - x2, y1 - y2)) + (asymmetric ? (extra[i * n + j] ?? 0) : 0),
                  ),
                ),
              ),
          ),
      );

  it('finds the optimum of small symmetric instances (property)', () => {
    fc.assert(
      fc.property(instance(false), fc.nat(1000), (m, seed) => {
        const tour = planTour(m, { seed });
        expect(isPermutation(tour.order, m.length)).toBe(true);
        expect(tour.length).toBe(heldKarp(m));
      }),
      { numRuns: 60 },
    );
  }, 30_000);

  it('finds the optimum of small one-way (asymmetric) instances (property)', () => {
    fc.assert(
      fc.property(instance(true), fc.nat(1000), (m, seed) => {
        const tour = planTour(m, { seed });
        expect(tour.length).toBe(tourLength(m, tour.order));
        expect(tour.length).toBe(heldKarp(m));
      }),
      { numRuns: 60 },
    );
  }, 30_000);

  it('three points on a one-way matrix: of the two orders, the cheaper, even when it is not the order given', () => {
    // 0 → 1 → 2 → 0 costs 10 + 10 + 10 = 30; 0 → 2 → 1 → 0 costs 1 + 1 + 1 = 3 (worked by hand).
    const m = [
      [0, 10, 1],
      [1, 0, 10],
      [10, 1, 0],
    ];
    expect(planTour(m)).toEqual({ order: [0, 2, 1], length: 3 });
    // From another start the cycle is the same, turned to begin there: 1 → 0 → 2 → 1.
    expect(planTour(m, { start: 1 })).toEqual({ order: [1, 0, 2], length: 3 });
    // Mirrored, the given order is the cheap one and stays: 0 → 1 → 2 → 0 = 1 + 1 + 1.
    const mirrored = [
      [0, 1, 10],
      [10, 0, 1],
      [1, 10, 0],
    ];
    expect(planTour(mirrored)).toEqual({ order: [0, 1, 2], length: 3 });
  });

  it('handles one, two and three points and refuses a bad start', () => {
    expect(planTour([[0]])).toEqual({ order: [0], length: 0 });
    expect(
      planTour([
        [0, 5],
        [7, 0],
      ]),
    ).toEqual({ order: [0, 1], length: 12 });
    expect(() =>
      planTour(
        [
          [0, 1],
          [1, 0],
        ],
        { start: 2 },
      ),
    ).toThrow(expect.objectContaining({ field: 'start' }));
    expect(() =>
      planTour(
        [
          [0, 1],
          [1, 0],
        ],
        { restarts: 0 },
      ),
    ).toThrow(expect.objectContaining({ field: 'restarts' }));
  });
});
