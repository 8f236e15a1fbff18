/**
 * The API's reads at scale, printed beside what they cost as bare SQL and beside the floors under them.
 * Figures only, never asserted.
 *   npm run bench -- endpoints            (BENCH_SECONDS=5 per run, BENCH_RUNS=3, medians; smaller for a quick look)
 *
 * On the scale data (`npm run seed:scale`: 200 companies, the largest with 3,000 games, 800 venues and
 * three years of calls), loaded first when its database is missing. It uses this checkout's private cluster
 * (or DATABASE_URL's server), started for the run: do not run it while `npm start` holds that cluster.
 *   (a) each list, detail and summary endpoint the web app calls, signed in as the largest company's owner,
 *       against the same statements sent straight through pg in the same tenant-scoped transaction as the
 *       app role (see support/statement-capture.ts for how they are captured);
 *   (b) p50/p95/p99 per endpoint at the largest and at a small company;
 *   (c) floors: Node's http hello-world, Express 5's, and /api/health without and with a session.
 * 10 concurrent clients throughout (autocannon for HTTP). The API runs in a child process as main.ts builds it
 * (without the scheduled jobs), asked for gzip like a browser.
 * The bench's reads use the company's heaviest rows: its longest parts list (400 parts at the largest company), the
 * board with the most readings, the finished job with the most readings. BENCH_ONLY=<text>[,<text>…] measures only
 * the endpoints whose names contain one of them (BENCH_ONLY=bench for the bench's).
 */
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import type { DatabaseUrls } from '@bumperline/db/lifecycle/provision';
import { readyScaleDatabase, refreshScaleDatabase } from '@bumperline/db/scale/scale-database';
import { SCALE_PASSWORD } from '@bumperline/db/scale/scale-seed';
import { startChildServer } from './support/child-server.ts';
import { httpLoad, medianOf, sqlLoad, type LoadFigures } from './support/load.ts';
import { signInCookie } from './support/sign-in.ts';
import { captureStatements } from './support/statement-capture.ts';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const CONNECTIONS = 10;
/** BENCH_ONLY=bench,games: only the endpoints whose names contain one of these. */
const ONLY = process.env.BENCH_ONLY?.split(',').filter(Boolean);
const WARM_UP_SECONDS = Math.min(1, SECONDS);
/** The issue's targets (issue 14), printed beside the figures. */
const TARGET = { ratio: 2, listP95: 50, summaryP95: 250, healthRatio: 2 };

type Kind = 'list' | 'detail' | 'summary';
interface Endpoint {
  name: string;
  kind: Kind;
  path: string;
}

interface Company {
  label: string;
  tenantId: string;
  games: number;
  ownerEmail: string;
  sample: { callId: string; gameId: string; venueId: string };
  bench: BenchSample;
}

interface BenchSample {
  modelId: string;
  boardId: string;
  boardParts: number;
  instanceId: string;
  instanceReadings: number;
  gameId: string;
  jobId: string;
  templateId: string;
}

/** What the web app's screens ask for (apps/web/src/api and the screens' query files). */
function endpointsFor(c: Company): Endpoint[] {
  const { callId, gameId, venueId } = c.sample;
  const all: Endpoint[] = [
    { name: 'account me', kind: 'detail', path: '/api/account/me' },
    { name: 'calls open (Today, 8)', kind: 'list', path: '/api/calls?state=open&sort=targetAt&order=asc&limit=8' },
    { name: 'calls open (table, 50)', kind: 'list', path: '/api/calls?state=open&sort=targetAt&order=asc&limit=50' },
    { name: 'calls open (map, 200)', kind: 'list', path: '/api/calls?state=open&sort=targetAt&order=asc&limit=200' },
    { name: 'calls all states (50)', kind: 'list', path: '/api/calls?state=all&sort=targetAt&order=asc&limit=50' },
    { name: 'calls of a game (20)', kind: 'list', path: `/api/calls?gameId=${gameId}&state=all&sort=openedAt&order=desc&limit=20` },
    { name: 'call detail', kind: 'detail', path: `/api/calls/${callId}` },
    { name: 'call technician ranking', kind: 'detail', path: `/api/calls/${callId}/technicians` },
    { name: 'games list (25)', kind: 'list', path: '/api/games?sort=title&order=asc&limit=25' },
    { name: 'games down (Today, 50)', kind: 'list', path: '/api/games?status=down&sort=venue&order=asc&limit=50' },
    { name: 'games summary', kind: 'summary', path: '/api/games/summary' },
    { name: 'game detail', kind: 'detail', path: `/api/games/${gameId}` },
    { name: 'game downtime', kind: 'list', path: `/api/games/${gameId}/downtime` },
    { name: 'venues list (25)', kind: 'list', path: '/api/venues?sort=name&order=asc&limit=25' },
    { name: 'venues filter (200)', kind: 'list', path: '/api/venues?sort=name&order=asc&limit=200' },
    { name: 'venue detail', kind: 'detail', path: `/api/venues/${venueId}` },
    { name: 'venue contacts', kind: 'list', path: `/api/venues/${venueId}/contacts` },
    { name: 'models', kind: 'list', path: '/api/models' },
    { name: 'technicians', kind: 'list', path: '/api/technicians' },
    { name: 'team', kind: 'list', path: '/api/team' },
    { name: 'activity (50)', kind: 'list', path: '/api/activity?limit=50' },
    { name: 'settings', kind: 'detail', path: '/api/settings' },
    { name: 'company', kind: 'detail', path: '/api/company' },
    { name: 'route days: office board (today)', kind: 'summary', path: '/api/route-days' },
    ...benchEndpointsFor(c.bench),
  ];
  return ONLY ? all.filter((e) => ONLY.some((part) => e.name.includes(part))) : all;
}

/** The bench's screens: parts lists, a game's boards, a board's page, the recap list, the bench and a job. */
function benchEndpointsFor(b: BenchSample): Endpoint[] {
  return [
    { name: 'bench: parts lists (every model)', kind: 'list', path: '/api/parts-lists' },
    { name: 'bench: boards of a model', kind: 'list', path: `/api/models/${b.modelId}/boards` },
    { name: `bench: parts list (${b.boardParts} parts)`, kind: 'detail', path: `/api/boards/${b.boardId}` },
    { name: 'bench: boards of a game', kind: 'list', path: `/api/games/${b.gameId}/boards` },
    { name: `bench: board page (${b.instanceReadings} readings)`, kind: 'detail', path: `/api/board-instances/${b.instanceId}` },
    { name: 'bench: recap due (fleet)', kind: 'summary', path: '/api/recap-due' },
    { name: 'bench: jobs in progress (100)', kind: 'list', path: '/api/bench-jobs?state=in_progress&limit=100' },
    { name: 'bench: jobs finished (10)', kind: 'list', path: '/api/bench-jobs?state=finished&limit=10' },
    { name: 'bench: jobs of a board', kind: 'list', path: `/api/bench-jobs?boardInstanceId=${b.instanceId}&limit=10` },
    { name: 'bench: job (finished)', kind: 'detail', path: `/api/bench-jobs/${b.jobId}` },
    { name: 'bench: templates', kind: 'list', path: '/api/bench-templates' },
    { name: 'bench: template', kind: 'detail', path: `/api/bench-templates/${b.templateId}` },
  ];
}

async function benchSample(client: pg.Client, tenantId: string): Promise<BenchSample> {
  const one = async <T>(text: string) => (await client.query<T & pg.QueryResultRow>(text, [tenantId])).rows[0]!;
  const board = await one<{ id: string; model_id: string; parts: number }>(
    `select b.id, b.model_id, count(*)::int as parts from model_boards b
     join board_parts p on p.tenant_id = b.tenant_id and p.board_id = b.id and p.removed_at is null
     where b.tenant_id = $1 group by b.id, b.model_id order by parts desc, b.id limit 1`,
  );
  const instance = await one<{ id: string; game_id: string; readings: number }>(
    `select i.id, i.game_id, count(r.id)::int as readings from board_instances i
     left join part_readings r on r.tenant_id = i.tenant_id and r.board_instance_id = i.id
     where i.tenant_id = $1 and i.game_id is not null group by i.id, i.game_id order by readings desc, i.id limit 1`,
  );
  const job = await one<{ id: string }>(
    `select bench_job_id as id from part_readings where tenant_id = $1 and bench_job_id is not null
     group by bench_job_id order by count(*) desc, bench_job_id limit 1`,
  );
  const template = await one<{ id: string }>(`select id from bench_templates where tenant_id = $1 order by name, id limit 1`);
  return {
    modelId: board.model_id,
    boardId: board.id,
    boardParts: board.parts,
    instanceId: instance.id,
    instanceReadings: instance.readings,
    gameId: instance.game_id,
    jobId: job.id,
    templateId: template.id,
  };
}

/** The largest company, and a small one of median size among the rest. */
async function pickCompanies(ownerUrl: string): Promise<[Company, Company]> {
  const client = new pg.Client({ connectionString: ownerUrl });
  await client.connect();
  try {
    const sizes = (
      await client.query<{ tenant_id: string; n: number }>(
        'select tenant_id, count(*)::int as n from games group by tenant_id order by n desc, tenant_id',
      )
    ).rows;
    const rest = sizes.slice(1);
    const picks = [
      { label: 'largest', row: sizes[0]! },
      { label: 'small', row: rest[Math.floor(rest.length / 2)]! },
    ];
    return (await Promise.all(
      picks.map(async ({ label, row }) => {
        const owner = await client.query<{ email: string }>(
          `select u.email from memberships m join users u on u.id = m.user_id where m.tenant_id = $1 and m.role = 'owner' order by u.email limit 1`,
          [row.tenant_id],
        );
        // A call still open (its ranking and timeline are live), else the latest one.
        const call = await client.query<{ id: string; game_id: string; venue_id: string }>(
          `select id, game_id, venue_id from service_calls where tenant_id = $1 and venue_id is not null
           order by closed_at is null desc, opened_at desc limit 1`,
          [row.tenant_id],
        );
        const c = call.rows[0]!;
        return {
          label,
          tenantId: row.tenant_id,
          games: row.n,
          ownerEmail: owner.rows[0]!.email,
          sample: { callId: c.id, gameId: c.game_id, venueId: c.venue_id },
          bench: await benchSample(client, row.tenant_id),
        };
      }),
    )) as [Company, Company];
  } finally {
    await client.end();
  }
}

const ms = (v: number) => (Number.isFinite(v) ? `${v < 10 ? v.toFixed(1) : Math.round(v)} ms` : '—');
const rps = (v: number) => `${Math.round(v)}/s`;
const failed = (f: LoadFigures) => (f.failures ? ` (${f.failures} failed)` : '');
const mark = (ok: boolean) => (ok ? '✓' : '✗');

async function measureHttp(url: string, headers: Record<string, string>): Promise<LoadFigures> {
  await httpLoad(url, { seconds: WARM_UP_SECONDS, connections: CONNECTIONS, headers });
  return medianOf(RUNS, () => httpLoad(url, { seconds: SECONDS, connections: CONNECTIONS, headers }));
}

const cluster = process.env.DATABASE_URL ? undefined : await startCluster({ mode: 'persistent', log: () => {} });
const stops: (() => Promise<void>)[] = [];
try {
  const adminUrl = process.env.DATABASE_URL ?? cluster!.adminUrl;
  let urls: DatabaseUrls | undefined = await readyScaleDatabase(adminUrl);
  if (!urls) {
    console.log('No scale data yet: loading it now, as `npm run seed:scale` does (a minute or two)…');
    urls = (await refreshScaleDatabase(adminUrl)).urls;
  }
  const [largest, small] = await pickCompanies(urls.ownerUrl);
  const authSecret = randomBytes(32).toString('base64url');
  const api = await startChildServer('api-server.ts', { BENCH_APP_URL: urls.appUrl, BENCH_AUTH_SECRET: authSecret });
  stops.push(api.stop);
  const cookies = {
    largest: await signInCookie(api.url, largest.ownerEmail, SCALE_PASSWORD),
    small: await signInCookie(api.url, small.ownerEmail, SCALE_PASSWORD),
  };
  const headersFor = (cookie: string) => ({ cookie, 'accept-encoding': 'gzip' });
  console.log(
    `Scale data: largest company ${largest.games} games, small company ${small.games} games. ` +
      `${CONNECTIONS} connections, ${SECONDS} s per run, median of ${RUNS} run(s).`,
  );

  // (a) API against its own SQL, at the largest company.
  const endpoints = endpointsFor(largest);
  const captured = await captureStatements(
    urls.appUrl,
    authSecret,
    endpoints.map((e) => ({ path: e.path, cookie: cookies.largest })),
  );
  const pool = new pg.Pool({ connectionString: urls.appUrl, max: CONNECTIONS });
  stops.push(() => pool.end());
  const apiLargest = new Map<string, LoadFigures>();
  const rowsA: Record<string, string>[] = [];
  for (const e of endpoints) {
    const c = captured.get(e.path)!;
    const http = await measureHttp(api.url + e.path, headersFor(cookies.largest));
    await sqlLoad(pool, c.transactions, { seconds: WARM_UP_SECONDS, connections: CONNECTIONS });
    const sql = await medianOf(RUNS, () => sqlLoad(pool, c.transactions, { seconds: SECONDS, connections: CONNECTIONS }));
    apiLargest.set(e.name, http);
    const ratio = http.p50 / sql.p50;
    rowsA.push({
      endpoint: e.name,
      statements: `${c.total} (${c.transactions.reduce((n, t) => n + t.length, 0)} in tx)`,
      'API p50 / req/s': `${ms(http.p50)} / ${rps(http.rps)}${failed(http)}`,
      'SQL p50 / req/s': `${ms(sql.p50)} / ${rps(sql.rps)}${failed(sql)}`,
      'ratio p50 (req/s)': `${ratio.toFixed(1)}× (${(sql.rps / http.rps).toFixed(1)}×)`,
      [`≤ ${TARGET.ratio}×`]: mark(ratio <= TARGET.ratio),
    });
  }
  console.log('\n(a) Each endpoint against the same SQL straight through pg (largest company, app role, tenant-scoped transaction)');
  console.table(rowsA);

  // (b) Percentiles at the largest and at a small company.
  const endpointsSmall = endpointsFor(small);
  const rowsB: Record<string, string>[] = [];
  for (const [i, e] of endpoints.entries()) {
    const big = apiLargest.get(e.name)!;
    const smallEndpoint = endpointsSmall[i]!;
    const little = await measureHttp(api.url + smallEndpoint.path, headersFor(cookies.small));
    const target = e.kind === 'list' ? TARGET.listP95 : e.kind === 'summary' ? TARGET.summaryP95 : undefined;
    rowsB.push({
      endpoint: e.name,
      kind: e.kind,
      'largest p50 / p95 / p99': `${ms(big.p50)} / ${ms(big.p95)} / ${ms(big.p99)}`,
      'target p95 (largest)': target === undefined ? '(none set)' : `< ${target} ms ${mark(big.p95 < target)}`,
      'small p50 / p95 / p99': `${ms(little.p50)} / ${ms(little.p95)} / ${ms(little.p99)}${failed(little)}${smallEndpoint.name === e.name ? '' : ` (${smallEndpoint.name.replace(/^bench: /, '')})`}`,
    });
  }
  console.log(`\n(b) Latency per endpoint: largest company (${largest.games} games) and a small one (${small.games} games)`);
  console.table(rowsB);

  // (c) Floors.
  const nodeHello = await startChildServer('node-hello.ts');
  stops.push(nodeHello.stop);
  const expressHello = await startChildServer('express-hello.ts');
  stops.push(expressHello.stop);
  const floors = {
    'Node http hello-world': await measureHttp(nodeHello.url, {}),
    'Express 5 hello-world': await measureHttp(expressHello.url, {}),
    '/api/health, no session': await measureHttp(`${api.url}/api/health`, { 'accept-encoding': 'gzip' }),
    '/api/health, signed in': await measureHttp(`${api.url}/api/health`, headersFor(cookies.largest)),
  };
  const healthRatio = floors['/api/health, no session'].rps / floors['/api/health, signed in'].rps;
  console.log('\n(c) Floors at the same 10 connections');
  console.table(
    Object.entries(floors).map(([server, f]) => ({
      server,
      'p50 / p95 / p99': `${ms(f.p50)} / ${ms(f.p95)} / ${ms(f.p99)}`,
      'req/s': `${rps(f.rps)}${failed(f)}`,
      target:
        server === '/api/health, signed in'
          ? `within ${TARGET.healthRatio}× of no session: ${healthRatio.toFixed(1)}× ${mark(healthRatio <= TARGET.healthRatio)}`
          : '',
    })),
  );
} finally {
  for (const stop of stops.reverse()) await stop().catch(() => {});
  cluster?.stop();
}
