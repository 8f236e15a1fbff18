// Load at a fixed number of concurrent clients, for HTTP (autocannon) and for SQL sent straight through pg,
// summarised the same way: latency percentiles from every response, and requests per second.
import autocannon from 'autocannon';
import type pg from 'pg';

export interface LoadFigures {
  p50: number;
  p95: number;
  p99: number;
  rps: number;
  /** Answers that were not 2xx, plus connection errors: a figure with failures is not a figure. */
  failures: number;
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!;
}

function summarise(times: number[], seconds: number, failures: number): LoadFigures {
  const sorted = [...times].sort((a, b) => a - b);
  return { p50: percentile(sorted, 50), p95: percentile(sorted, 95), p99: percentile(sorted, 99), rps: times.length / seconds, failures };
}

/** autocannon against one URL. Its own summary has no p95, so every response time is kept. */
export async function httpLoad(
  url: string,
  opts: { seconds: number; connections: number; headers?: Record<string, string> },
): Promise<LoadFigures> {
  const times: number[] = [];
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon({ url, connections: opts.connections, duration: opts.seconds, headers: opts.headers ?? {} }, (err, r) =>
      err ? reject(err) : resolve(r),
    );
    instance.on('response', (_client: unknown, _status: number, _bytes: number, responseTime: number) => times.push(responseTime));
  });
  return summarise(times, opts.seconds, result.non2xx + result.errors + result.timeouts);
}

/** A statement as the API sent it: pg's query config (text, values, row mode, type parsers) or text and values. */
export interface CapturedStatement {
  query: string | pg.QueryConfig;
  values?: unknown[];
}

/** `connections` clients each replaying the transactions one after another, each on a connection from the pool. */
export async function sqlLoad(
  pool: pg.Pool,
  transactions: CapturedStatement[][],
  opts: { seconds: number; connections: number },
): Promise<LoadFigures> {
  const times: number[] = [];
  let failures = 0;
  const end = performance.now() + opts.seconds * 1000;
  await Promise.all(
    Array.from({ length: opts.connections }, async () => {
      while (performance.now() < end) {
        const started = performance.now();
        try {
          for (const statements of transactions) {
            const client = await pool.connect();
            try {
              for (const s of statements) await client.query(s.query as string, s.values);
            } finally {
              client.release();
            }
          }
          times.push(performance.now() - started);
        } catch {
          failures++;
        }
      }
    }),
  );
  return summarise(times, opts.seconds, failures);
}

/** Runs `measure` `runs` times and keeps the median of each figure. */
export async function medianOf(runs: number, measure: () => Promise<LoadFigures>): Promise<LoadFigures> {
  const all: LoadFigures[] = [];
  for (let i = 0; i < runs; i++) all.push(await measure());
  const median = (pick: (f: LoadFigures) => number) => {
    const sorted = all.map(pick).sort((a, b) => a - b);
    return sorted[Math.floor(sorted.length / 2)]!;
  };
  return {
    p50: median((f) => f.p50),
    p95: median((f) => f.p95),
    p99: median((f) => f.p99),
    rps: median((f) => f.rps),
    failures: all.reduce((sum, f) => sum + f.failures, 0),
  };
}
