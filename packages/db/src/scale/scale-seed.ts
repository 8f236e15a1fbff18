// The scale data: many operator companies, one of them large (by default 200 companies, the largest
// with 3,000 games in 800 venues and three years of calls), loaded with COPY into an empty, migrated
// database. `npm run seed:scale` (cli/seed-scale.ts) gives it a database of its own; tests and benchmarks
// call seedScale directly with a connection that may write for every company (the owner role or admin).
import pg from 'pg';
import { hashPassword } from '../passwords.ts';
import { Dice } from './dice.ts';
import { generateCompany, type CompanyPlan } from './scale-company.ts';
import { scaleTables } from './scale-tables.ts';

/** The scale data's own database (the demo's stays as it is). */
export const SCALE_DATABASE = 'bumperline_scale';
/** Every scale person's password (the data is invented; the addresses end in .scale.example). */
export const SCALE_PASSWORD = 'bumperline-scale';

export interface ScaleOptions {
  /** Operator companies in all, the largest included. Default 200. */
  companies?: number;
  /** The largest company. Default 3,000 games in 800 venues, three years of calls. */
  largest?: { games?: number; venues?: number; years?: number };
  /** Games per small company, lowest and highest. Default 5 to 40. */
  smallGames?: [number, number];
  /** The same seed loads the same rows. */
  seed?: number;
  /** The moment the data ends at (open calls are recent relative to it). Default: now. */
  now?: Date;
  /** VACUUM ANALYZE when loaded, so plans see statistics and a visibility map as on a settled database. Default true. */
  analyze?: boolean;
  onProgress?: (progress: ScaleProgress) => void;
}

export interface ScaleProgress {
  phase: 'loading' | 'analyzing' | 'done';
  companiesDone: number;
  companies: number;
  gamesDone: number;
  games: number;
  rowsWritten: number;
}

export interface ScaleResult {
  /** Rows loaded per table. */
  rows: Record<string, number>;
  /** The largest company's id (the first company). */
  largestTenantId: string;
  elapsedMs: number;
}

/** Send the held rows once this many are waiting. */
const FLUSH_AT = 50_000;

/** Where to load: a connection string, or a pool, with rights to write for every company (owner role or admin). */
export type ScaleTarget = { ownerUrl: string } | { pool: pg.Pool };

/** Loads the scale data into an empty, migrated database. */
export async function seedScale(options: ScaleOptions & ScaleTarget): Promise<ScaleResult> {
  const started = performance.now();
  const pool = 'pool' in options ? options.pool : new pg.Pool({ connectionString: options.ownerUrl, max: 1 });
  const client = await pool.connect();
  try {
    const existing = await client.query<{ n: number }>('select count(*)::int as n from tenants');
    if (existing.rows[0]!.n > 0) throw new Error('seedScale loads into an empty database; this one already has companies');

    const seed = options.seed ?? 20261214;
    const dice = new Dice(seed);
    const plans = planCompanies(dice, options);
    const games = plans.reduce((sum, p) => sum + p.games, 0);
    const tables = scaleTables();
    const all = Object.values(tables);
    const progress: ScaleProgress = { phase: 'loading', companiesDone: 0, companies: plans.length, gamesDone: 0, games, rowsWritten: 0 };
    const report = () => options.onProgress?.({ ...progress });
    const flush = async () => {
      // In load order: each row's parents are already in, or earlier in this round.
      for (const table of all) progress.rowsWritten += await table.flush(client);
      report();
    };
    const ctx = {
      tables,
      dice,
      benchDice: new Dice(seed + 1),
      careDice: new Dice(seed + 2),
      now: (options.now ?? new Date()).getTime(),
      passwordHash: await hashPassword(SCALE_PASSWORD),
      async afterGame() {
        progress.gamesDone++;
        if (all.reduce((sum, t) => sum + t.pending, 0) >= FLUSH_AT) await flush();
      },
    };
    // Not durable until the end: a crash mid-load means running the seed again anyway.
    await client.query('set synchronous_commit = off');
    report();
    const tenantIds: string[] = [];
    for (const plan of plans) {
      tenantIds.push(await generateCompany(plan, ctx));
      progress.companiesDone++;
    }
    await flush();

    if (options.analyze ?? true) {
      progress.phase = 'analyzing';
      report();
      await client.query('vacuum (analyze)');
    }
    progress.phase = 'done';
    report();
    return {
      rows: Object.fromEntries(all.map((t) => [t.name, t.written])),
      largestTenantId: tenantIds[0]!,
      elapsedMs: performance.now() - started,
    };
  } finally {
    client.release();
    if (!('pool' in options)) await pool.end();
  }
}

/** Company 0 is the largest; the others are small routes of a few to a few dozen games. */
function planCompanies(dice: Dice, options: ScaleOptions): CompanyPlan[] {
  const largest = { games: options.largest?.games ?? 3000, venues: options.largest?.venues ?? 800, years: options.largest?.years ?? 3 };
  const [minGames, maxGames] = options.smallGames ?? [5, 40];
  return Array.from({ length: options.companies ?? 200 }, (_, index) => {
    if (index === 0) return { index, ...largest };
    const games = dice.int(minGames, maxGames);
    return { index, games, venues: Math.max(1, Math.round(games / dice.int(2, 5))), years: dice.int(1, 3) };
  });
}
