import { DomainError } from '../errors.ts';
import { requireNonNegativeInteger } from '../input-checks.ts';
import { randomInt, seededRandom, type Random } from './seeded-random.ts';
import { isSymmetric, validateMatrix, type Matrix } from './travel-matrix.ts';

/**
 * The shortest closed tour through every point of a distance (or travel-time) matrix, from a start and back:
 * nearest-neighbour construction, then local search by 2-opt and Or-opt (moving runs of 1–3 stops, either way round)
 * over each point's nearest neighbours, then iterated local search — a seeded "double bridge" kick followed by local
 * search again, keeping the better tour. Deterministic for a given seed. Up to 9 points it tries every order instead.
 * Asymmetric matrices (one-way streets) are handled: moves that reverse a run count its cost in the new direction.
 */

export interface TourOptions {
  /** Index the tour starts and ends at (default 0). */
  start?: number;
  /** Seed for the kicks (default 1). */
  seed?: number;
  /** Independent starts from different first moves; the best is kept (default 1). */
  restarts?: number;
  /** Kicks per start (default scales with the number of points). */
  kicks?: number;
}

export interface Tour {
  /** Point indices in visiting order, starting at `start`; the return to `start` is implied. */
  order: number[];
  length: number;
}

const EPS = 1e-9;
const NEIGHBOURS = 10;
const BRUTE_FORCE_MAX = 9;

export function tourLength(matrix: Matrix, order: readonly number[]): number {
  let total = 0;
  for (let i = 0; i < order.length; i++) {
    const from = order[i] as number;
    const to = order[(i + 1) % order.length] as number;
    const d = matrix[from]?.[to];
    if (d === undefined) throw new DomainError('invalid-matrix', `no distance from ${from} to ${to}`, 'matrix');
    total += d;
  }
  return total;
}

/** The default effort: enough kicks that 50–100 points land within about 1 % of optimal in well under 200 ms. */
export function defaultKicks(n: number): number {
  return Math.min(3000, Math.max(300, 15 * n));
}

export function planTour(matrix: Matrix, options: TourOptions = {}): Tour {
  validateMatrix(matrix);
  const n = matrix.length;
  const start = options.start === undefined ? 0 : requireNonNegativeInteger(options.start, 'start');
  if (start >= n) throw new DomainError('out-of-range', `start ${start} is not one of the ${n} points`, 'start');
  const seed = options.seed === undefined ? 1 : requireNonNegativeInteger(options.seed, 'seed');
  const restarts = options.restarts === undefined ? 1 : requireNonNegativeInteger(options.restarts, 'restarts');
  const kicks = options.kicks === undefined ? defaultKicks(n) : requireNonNegativeInteger(options.kicks, 'kicks');
  if (restarts < 1) throw new DomainError('out-of-range', 'restarts must be at least 1', 'restarts');

  // Three points already have two orders, which differ on a one-way matrix, so small cases all go to brute force.
  if (n <= BRUTE_FORCE_MAX) return finish(matrix, bruteForce(matrix, start), start);

  const search = new TourSearch(matrix, isSymmetric(matrix));
  const random = seededRandom(seed);
  let best: Int32Array | null = null;
  let bestLength = Infinity;
  for (let r = 0; r < restarts; r++) {
    const first = r === 0 ? start : randomInt(random, n);
    search.load(nearestNeighbour(search, first));
    search.improveAll();
    search.iterate(kicks, random);
    if (search.length() < bestLength - EPS) {
      bestLength = search.length();
      best = search.tour.slice();
    }
  }
  return finish(matrix, Array.from(best ?? []), start);
}

function finish(matrix: Matrix, cycle: number[], start: number): Tour {
  const at = cycle.indexOf(start);
  const order = [...cycle.slice(at), ...cycle.slice(0, at)];
  return { order, length: tourLength(matrix, order) };
}

function bruteForce(matrix: Matrix, start: number): number[] {
  const rest = matrix.map((_, i) => i).filter((i) => i !== start);
  let best: number[] = [start, ...rest];
  let bestLength = tourLength(matrix, best);
  const permute = (k: number) => {
    if (k === rest.length) {
      const order = [start, ...rest];
      const length = tourLength(matrix, order);
      if (length < bestLength - EPS) {
        bestLength = length;
        best = order;
      }
      return;
    }
    for (let i = k; i < rest.length; i++) {
      [rest[k], rest[i]] = [rest[i] as number, rest[k] as number];
      permute(k + 1);
      [rest[k], rest[i]] = [rest[i] as number, rest[k] as number];
    }
  };
  permute(0);
  return best;
}

function nearestNeighbour(search: TourSearch, first: number): Int32Array {
  const n = search.n;
  const visited = new Uint8Array(n);
  const order = new Int32Array(n);
  let current = first;
  visited[current] = 1;
  order[0] = current;
  for (let k = 1; k < n; k++) {
    let next = -1;
    let nextDistance = Infinity;
    for (let j = 0; j < n; j++) {
      if (!visited[j] && search.d(current, j) < nextDistance) {
        next = j;
        nextDistance = search.d(current, j);
      }
    }
    visited[next] = 1;
    order[k] = next;
    current = next;
  }
  return order;
}

/** A tour held as an array with each point's position, and the moves that improve it. */
class TourSearch {
  readonly n: number;
  private readonly dist: Float64Array;
  private readonly neighbours: Int32Array[];
  readonly tour: Int32Array;
  private readonly pos: Int32Array;
  private readonly scratch: Int32Array;
  private readonly active: Uint8Array;
  private readonly queue: number[] = [];
  // The best Or-opt insertion found so far for the run being moved (fields, not closures: this is the hot loop).
  private runStart = 0;
  private runLength = 0;
  private bestDelta = 0;
  private bestAfter = -1;
  private bestReversed = false;

  constructor(
    matrix: Matrix,
    private readonly symmetric: boolean,
  ) {
    const n = matrix.length;
    this.n = n;
    this.dist = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) this.dist[i * n + j] = matrix[i]?.[j] ?? 0;
    const k = Math.min(NEIGHBOURS, n - 1);
    this.neighbours = Array.from({ length: n }, (_, i) => {
      const others = Array.from({ length: n }, (_, j) => j).filter((j) => j !== i);
      // Nearest either way, so one-way matrices still find their close points.
      others.sort((a, b) => Math.min(this.d(i, a), this.d(a, i)) - Math.min(this.d(i, b), this.d(b, i)) || a - b);
      return Int32Array.from(others.slice(0, k));
    });
    this.tour = new Int32Array(n);
    this.pos = new Int32Array(n);
    this.scratch = new Int32Array(n);
    this.active = new Uint8Array(n);
  }

  d(a: number, b: number): number {
    return this.dist[a * this.n + b] as number;
  }

  private at(position: number): number {
    const n = this.n;
    return this.tour[((position % n) + n) % n] as number;
  }

  private succ(node: number): number {
    const next = (this.pos[node] as number) + 1;
    return this.tour[next === this.n ? 0 : next] as number;
  }

  private pred(node: number): number {
    const previous = (this.pos[node] as number) - 1;
    return this.tour[previous < 0 ? this.n - 1 : previous] as number;
  }

  load(order: Int32Array): void {
    this.tour.set(order);
    for (let i = 0; i < this.n; i++) this.pos[this.tour[i] as number] = i;
  }

  length(): number {
    let total = 0;
    for (let i = 0; i < this.n; i++) total += this.d(this.tour[i] as number, this.tour[i + 1 === this.n ? 0 : i + 1] as number);
    return total;
  }

  private activate(node: number): void {
    if (!this.active[node]) {
      this.active[node] = 1;
      this.queue.push(node);
    }
  }

  improveAll(): void {
    for (let i = this.n - 1; i >= 0; i--) this.activate(this.tour[i] as number);
    this.run();
  }

  private run(): void {
    while (this.queue.length > 0) {
      const node = this.queue.pop() as number;
      this.active[node] = 0;
      if (this.twoOpt(node) || this.orOpt(node)) this.activate(node);
    }
  }

  /** Cost of the path along the tour from position i to position j (forward), and of the same path reversed. */
  private pathCosts(i: number, j: number): { forward: number; reversed: number } {
    let forward = 0;
    let reversed = 0;
    const length = (((j - i) % this.n) + this.n) % this.n;
    for (let k = 0; k < length; k++) {
      const a = this.at(i + k);
      const b = this.at(i + k + 1);
      forward += this.d(a, b);
      reversed += this.d(b, a);
    }
    return { forward, reversed };
  }

  /** Reverses the tour between positions i and j (inclusive, going forward). */
  private reverse(i: number, j: number): void {
    const n = this.n;
    let length = ((((j - i) % n) + n) % n) + 1;
    let from = i;
    let to = j;
    if (this.symmetric && length * 2 > n) {
      // Reversing the rest of the cycle gives the same edges for less work.
      from = j + 1;
      to = i - 1;
      length = n - length;
    }
    for (let k = 0; k < length >> 1; k++) {
      const p = (((from + k) % n) + n) % n;
      const q = (((to - k) % n) + n) % n;
      const a = this.tour[p] as number;
      const b = this.tour[q] as number;
      this.tour[p] = b;
      this.tour[q] = a;
      this.pos[b] = p;
      this.pos[a] = q;
    }
  }

  /** 2-opt: replace edges (a, succ a) and (c, succ c) by (a, c) and (succ a, succ c), and the mirror on the pred side. */
  private twoOpt(a: number): boolean {
    const b = this.succ(a);
    const ab = this.d(a, b);
    for (const c of this.neighbours[a] as Int32Array) {
      const ac = this.d(a, c);
      if (ac >= ab) break;
      const e = this.succ(c);
      if (c === b || e === a) continue;
      let delta = ac + this.d(b, e) - ab - this.d(c, e);
      if (!this.symmetric) {
        const inner = this.pathCosts(this.pos[b] as number, this.pos[c] as number);
        delta += inner.reversed - inner.forward;
      }
      if (delta < -EPS) {
        this.reverse(this.pos[b] as number, this.pos[c] as number);
        this.activate(b);
        this.activate(c);
        this.activate(e);
        return true;
      }
    }
    const p = this.pred(a);
    const pa = this.d(p, a);
    for (const c of this.neighbours[a] as Int32Array) {
      const ca = this.d(c, a);
      if (ca >= pa) break;
      const e = this.pred(c);
      if (c === p || e === a) continue;
      let delta = ca + this.d(e, p) - pa - this.d(e, c);
      if (!this.symmetric) {
        const inner = this.pathCosts(this.pos[c] as number, this.pos[p] as number);
        delta += inner.reversed - inner.forward;
      }
      if (delta < -EPS) {
        // ... e c ... p a ...  →  ... e p ... c a ...
        this.reverse(this.pos[c] as number, this.pos[p] as number);
        this.activate(p);
        this.activate(c);
        this.activate(e);
        return true;
      }
    }
    return false;
  }

  private inRun(node: number): boolean {
    const n = this.n;
    return ((((this.pos[node] as number) - this.runStart) % n) + n) % n < this.runLength;
  }

  /** Scores putting the run between x and y (an edge once the run is lifted out). */
  private tryInsert(x: number, y: number, first: number, last: number, base: number, innerChange: number): void {
    if (this.inRun(x) || this.inRun(y)) return;
    const around = base - this.d(x, y);
    const same = around + this.d(x, first) + this.d(last, y);
    const reversed = around + this.d(x, last) + this.d(first, y) + innerChange;
    if (same < this.bestDelta) {
      this.bestDelta = same;
      this.bestAfter = x;
      this.bestReversed = false;
    }
    if (reversed < this.bestDelta) {
      this.bestDelta = reversed;
      this.bestAfter = x;
      this.bestReversed = true;
    }
  }

  /** Or-opt: move the run of 1–3 points starting at `a` between two neighbouring points elsewhere, either way round. */
  private orOpt(a: number): boolean {
    for (let length = 1; length <= 3 && length + 3 <= this.n; length++) {
      const first = a;
      const startPos = this.pos[first] as number;
      const last = this.at(startPos + length - 1);
      const p = this.pred(first);
      const q = this.succ(last);
      const removeGain = this.d(p, first) + this.d(last, q) - this.d(p, q);
      if (removeGain <= EPS) continue;
      const inner = length === 1 ? { forward: 0, reversed: 0 } : this.pathCosts(startPos, startPos + length - 1);
      this.runStart = startPos;
      this.runLength = length;
      this.bestDelta = -EPS;
      this.bestAfter = -1;
      const base = -removeGain;
      const innerChange = inner.reversed - inner.forward;
      for (let end = 0; end < (length === 1 ? 1 : 2); end++) {
        for (const c of this.neighbours[end === 0 ? first : last] as Int32Array) {
          if (this.inRun(c)) continue;
          // Edges next to c once the run is lifted out (p and q become adjacent).
          const after = c === p ? q : this.succ(c);
          const before = c === q ? p : this.pred(c);
          if (!(c === p && after === q)) this.tryInsert(c, after, first, last, base, innerChange);
          if (!(before === p && c === q)) this.tryInsert(before, c, first, last, base, innerChange);
        }
      }
      if (this.bestAfter >= 0) {
        const x = this.bestAfter;
        const y = x === p ? q : this.succ(x);
        this.moveRun(startPos, length, x, this.bestReversed);
        for (const node of [p, q, last, x, y]) this.activate(node);
        return true;
      }
    }
    return false;
  }

  private moveRun(startPos: number, length: number, after: number, reversed: boolean): void {
    const n = this.n;
    let k = 0;
    // Walk the rest of the cycle from just after the run; drop the run in right after `after`.
    for (let i = length; i < n; i++) {
      const node = this.at(startPos + i);
      this.scratch[k++] = node;
      if (node === after) {
        for (let r = 0; r < length; r++) this.scratch[k++] = this.at(startPos + (reversed ? length - 1 - r : r));
      }
    }
    this.load(this.scratch);
  }

  /** Iterated local search: kick the best tour with a random double bridge, search again, keep it if no worse. */
  iterate(kicks: number, random: Random): void {
    if (this.n < 8) return;
    const best = this.tour.slice();
    let bestLength = this.length();
    for (let k = 0; k < kicks; k++) {
      this.doubleBridge(random);
      this.run();
      const length = this.length();
      if (length <= bestLength + EPS) {
        best.set(this.tour);
        bestLength = Math.min(bestLength, length);
      } else {
        this.load(best);
      }
    }
    this.load(best);
  }

  /**
   * A, B, C, D → A, C, B, D: three cuts that 2-opt and Or-opt cannot undo in one move. The cuts fall within a window
   * of nearby positions, so the kick changes one neighbourhood rather than scattering across the tour.
   */
  private doubleBridge(random: Random): void {
    const n = this.n;
    const window = Math.min(n, 50);
    const offset = randomInt(random, n);
    let c1 = 0;
    let c2 = 0;
    let c3 = 0;
    while (!(c1 < c2 && c2 < c3)) {
      const cuts = [1 + randomInt(random, window - 1), 1 + randomInt(random, window - 1), 1 + randomInt(random, window - 1)];
      cuts.sort((x, y) => x - y);
      [c1, c2, c3] = cuts as [number, number, number];
    }
    const segment = (from: number, to: number, k: number) => {
      for (let i = from; i < to; i++) this.scratch[k++] = this.at(offset + i);
      return k;
    };
    let k = segment(0, c1, 0);
    k = segment(c2, c3, k);
    k = segment(c1, c2, k);
    segment(c3, n, k);
    const ends = [0, c1 - 1, c1, c2 - 1, c2, c3 - 1, c3 % n, n - 1].map((i) => this.at(offset + i));
    this.load(this.scratch);
    for (const node of ends) this.activate(node);
  }
}
