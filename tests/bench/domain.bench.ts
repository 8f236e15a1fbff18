/**
 * Speed and quality figures for packages/domain, printed as tables — no timed assertions.
 *   npx tsx tests/bench/domain.bench.ts
 * Targets: a 100-stop tour in under 200 ms; berlin52 within 2 % of its optimum; availability for 2,000 games ×
 * 3 years of downtime in under 300 ms.
 */
import { readFileSync } from 'node:fs';
import { groupReliability, type GroupMember } from '@bumperline/domain/reliability/availability';
import { planRouteDay, type RouteStop } from '@bumperline/domain/travel/route-day';
import { seededRandom } from '@bumperline/domain/travel/seeded-random';
import { planTour } from '@bumperline/domain/travel/tour-planner';
import { distanceMatrixKm, travelMinutesMatrix } from '@bumperline/domain/travel/travel-matrix';
import { parseTsplib, tsplibMatrix } from '@bumperline/domain/travel/tsplib';

function time<T>(run: () => T, repeats = 5): { result: T; medianMs: number } {
  run(); // warm up the JIT
  const times: number[] = [];
  let result = run();
  for (let i = 0; i < repeats; i++) {
    const start = performance.now();
    result = run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return { result, medianMs: times[Math.floor(times.length / 2)] ?? NaN };
}

const ms = (value: number) => `${value.toFixed(1)} ms`;
const pct = (value: number) => `${(value * 100).toFixed(2)} %`;

/** Venues scattered over a 30 km × 30 km metro area around 52.5° N, 13.4° E. */
function randomVenues(n: number, seed: number) {
  const random = seededRandom(seed);
  return Array.from({ length: n }, () => ({ lat: 52.38 + random() * 0.27, lon: 13.18 + random() * 0.44 }));
}

function tourBench(): void {
  const rows: Array<Record<string, string | number>> = [];
  for (const name of ['berlin52', 'eil51'] as const) {
    const optimum = name === 'berlin52' ? 7542 : 426;
    const matrix = tsplibMatrix(parseTsplib(readFileSync(new URL(`../../packages/domain/test-data/${name}.tsp`, import.meta.url), 'utf8')));
    const { result, medianMs } = time(() => planTour(matrix, { seed: 1 }));
    rows.push({
      instance: name,
      stops: matrix.length,
      time: ms(medianMs),
      length: result.length,
      best_known: `${optimum} (published optimum)`,
      gap: pct(result.length / optimum - 1),
    });
  }
  for (const n of [50, 100, 200]) {
    const matrix = distanceMatrixKm(randomVenues(n, n));
    const { result, medianMs } = time(() => planTour(matrix, { seed: 1 }));
    // Best known: the best of several long runs from other seeds.
    const best = Math.min(result.length, ...[2, 3, 4, 5].map((seed) => planTour(matrix, { seed, restarts: 2, kicks: 10_000 }).length));
    rows.push({
      instance: `random ${n}`,
      stops: n,
      time: ms(medianMs),
      length: result.length.toFixed(2),
      best_known: `${best.toFixed(2)} (best of 4 long runs)`,
      gap: pct(result.length / best - 1),
    });
  }
  console.log('\nRoute planner — closed tour, default effort (seed 1), median of 5 runs');
  console.table(rows);
}

function routeDayBench(): void {
  const rows: Array<Record<string, string | number>> = [];
  for (const n of [12, 25, 40]) {
    const random = seededRandom(1000 + n);
    const points = [{ lat: 52.52, lon: 13.405 }, ...randomVenues(n, 2000 + n)];
    const travelMinutes = travelMinutesMatrix(points, { speedKmh: 25 });
    // Bars open from 10:00–16:00 with four-hour windows; a third take visits any time.
    const stops: RouteStop[] = Array.from({ length: n }, (_, i) => {
      const open = 600 + Math.floor(random() * 6) * 60;
      return random() < 0.33
        ? { id: `v${i}`, serviceMinutes: 10 }
        : { id: `v${i}`, serviceMinutes: 10, earliestArrival: open, latestArrival: open + 240 };
    });
    const { result, medianMs } = time(() => planRouteDay({ stops, travelMinutes, dayStart: 540, dayEnd: 1260, seed: 1 }), 3);
    rows.push({
      stops: n,
      time: ms(medianMs),
      visited: result.visits.length,
      unscheduled: result.unscheduled.length,
      travel_min: result.totalTravelMinutes.toFixed(0),
    });
  }
  console.log('\nRoute day with arrival windows (09:00–21:00 day), median of 3 runs');
  console.table(rows);
}

function availabilityBench(): void {
  const random = seededRandom(42);
  const start = Date.UTC(2022, 0, 1);
  const end = Date.UTC(2025, 0, 1);
  const span = end - start;
  const hour = 3_600_000;
  let intervals = 0;
  const members: GroupMember[] = Array.from({ length: 2_000 }, (_, g) => {
    // About two service calls a month, 1–72 h each, some overlapping (two reports of one fault), some running past
    // either end of the period, and the ones begun in the last week possibly still open.
    const count = 48 + Math.floor(random() * 48);
    intervals += count;
    const downtime = Array.from({ length: count }, () => {
      const s = start - 48 * hour + random() * (span + 48 * hour);
      const stillDown = s > end - 7 * 24 * hour && random() < 0.5;
      return { start: s, end: stillDown ? null : s + (1 + random() * 71) * hour };
    });
    return { id: `game-${g}`, downtime };
  });
  const { result, medianMs } = time(() => groupReliability({ start, end }, members));
  console.log('\nAvailability — 2,000 games × 3 years, merged and clipped, median of 5 runs');
  console.table([
    {
      games: members.length,
      intervals,
      time: ms(medianMs),
      availability: result.availability.toFixed(4),
      mtbf_h: result.mtbfHours?.toFixed(1),
      mttr_h: result.mttrHours?.toFixed(1),
    },
  ]);
}

tourBench();
routeDayBench();
availabilityBench();
