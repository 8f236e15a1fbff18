/**
 * How long a 25-stop route day takes to plan: the domain alone (venues' opening hours to windows, haversine travel,
 * the planner; and the same day walked in a kept order), then the whole endpoint against its SQL sent straight
 * through pg, side by side. Figures only, never asserted. Target: well under a second.
 *   npm run bench -- route-day            (BENCH_SECONDS=5 per run, BENCH_RUNS=3, medians)
 * The API remembers plans (a day's plan is a pure function of its stops), so the load figures after the first look
 * are for days already planned; "first look" is the one request that planned them.
 *
 * The endpoint part runs on the scale data (`npm run seed:scale`, loaded first when missing) in this checkout's
 * private cluster (or DATABASE_URL's server): it adds, for one technician of the largest company, 25 open work
 * orders at 25 venues on a day in 2031, measures, and removes them again.
 */
import { randomBytes, randomUUID } from 'node:crypto';
import pg from 'pg';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import type { DatabaseUrls } from '@bumperline/db/lifecycle/provision';
import { readyScaleDatabase, refreshScaleDatabase } from '@bumperline/db/scale/scale-database';
import { SCALE_PASSWORD } from '@bumperline/db/scale/scale-seed';
import type { OpeningHours } from '@bumperline/domain/travel/opening-window';
import { planRouteDayStops, type VenueVisit } from '@bumperline/domain/travel/route-day-stops';
import { seededRandom } from '@bumperline/domain/travel/seeded-random';
import { startChildServer } from './support/child-server.ts';
import { httpLoad, medianOf, sqlLoad, type LoadFigures } from './support/load.ts';
import { signInCookie } from './support/sign-in.ts';
import { captureStatements } from './support/statement-capture.ts';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const CONNECTIONS = 10;
const STOPS = 25;
const DAY = '2031-03-06'; // a Thursday
const TARGET_MS = 1000;

const ms = (v: number) => (Number.isFinite(v) ? `${v < 10 ? v.toFixed(2) : Math.round(v)} ms` : '—');
const mark = (ok: boolean) => (ok ? '✓' : '✗');

/** Our own mix of hours: a third not recorded, a third 11:00–23:00 every day, a third lunch and a late evening. */
function hoursFor(i: number): OpeningHours {
  const days = ['1', '2', '3', '4', '5', '6', '7'] as const;
  if (i % 3 === 0) return {};
  const intervals =
    i % 3 === 1
      ? [{ open: '11:00', close: '23:00' }]
      : [
          { open: '11:00', close: '14:00' },
          { open: '17:00', close: '02:00' },
        ];
  return Object.fromEntries(days.map((d) => [d, intervals]));
}

function domainBench() {
  const random = seededRandom(25);
  const visits: VenueVisit[] = Array.from({ length: STOPS }, (_, i) => ({
    venueId: `venue-${i}`,
    point: { lat: 41.75 + random() * 0.25, lon: -87.85 + random() * 0.3 },
    openingHours: hoursFor(i),
    onSiteMinutes: 10 + Math.floor(random() * 16),
  }));
  const input = {
    day: DAY,
    dayStart: 7 * 60,
    dayEnd: 19 * 60,
    startPoint: { lat: 41.88, lon: -87.63 },
    speedKmh: 35,
    visits,
    keptOrder: [],
  };
  const timed = (run: () => ReturnType<typeof planRouteDayStops>, repeats = 21) => {
    run();
    const times: number[] = [];
    let result = run();
    for (let i = 0; i < repeats; i++) {
      const start = performance.now();
      result = run();
      times.push(performance.now() - start);
    }
    times.sort((a, b) => a - b);
    return { result, p50: times[Math.floor(times.length / 2)]!, max: times[times.length - 1]! };
  };
  const planned = timed(() => planRouteDayStops(input));
  const keptOrder = [...planned.result.visits.map((v) => v.venueId)].reverse();
  const kept = timed(() => planRouteDayStops({ ...input, keptOrder }));
  console.log(`\n(a) The domain alone: ${STOPS} venues, opening hours, haversine travel at 35 km/h, day 07:00–19:00`);
  console.table(
    [
      ['planner', planned],
      ['kept order (walked)', kept],
    ].map(([name, r]) => {
      const run = r as typeof planned;
      return {
        order: name as string,
        'p50 / max': `${ms(run.p50)} / ${ms(run.max)}`,
        visited: `${run.result.visits.length} of ${STOPS}`,
        'travel / km': `${run.result.totals.travelMinutes} min / ${run.result.totals.km} km`,
        [`< ${TARGET_MS} ms`]: mark(run.max < TARGET_MS),
      };
    }),
  );
}

interface Arranged {
  tenantId: string;
  technicianId: string;
  ownerEmail: string;
  carePlanId: string;
}

/** 25 open work orders on 25 games at 25 venues for one technician of the largest company, on DAY. */
async function arrange(ownerUrl: string): Promise<Arranged> {
  const client = new pg.Client({ connectionString: ownerUrl });
  await client.connect();
  try {
    const one = async <T extends pg.QueryResultRow>(text: string, values: unknown[]) => (await client.query<T>(text, values)).rows[0]!;
    const { tenant_id: tenantId } = await one<{ tenant_id: string }>(
      'select tenant_id from games group by tenant_id order by count(*) desc, tenant_id limit 1',
      [],
    );
    const { user_id: technicianId } = await one<{ user_id: string }>(
      `select user_id from memberships where tenant_id = $1 and role = 'technician' order by user_id limit 1`,
      [tenantId],
    );
    const { email: ownerEmail } = await one<{ email: string }>(
      `select u.email from memberships m join users u on u.id = m.user_id where m.tenant_id = $1 and m.role = 'owner' order by u.email limit 1`,
      [tenantId],
    );
    const games = (
      await client.query<{ id: string; model_id: string }>(
        `select distinct on (venue_id) id, model_id from games where tenant_id = $1 and venue_id is not null order by venue_id, id limit $2`,
        [tenantId, STOPS],
      )
    ).rows;
    const carePlanId = randomUUID();
    await client.query(
      `insert into care_plans (tenant_id, id, name, scope, model_id, on_site_minutes, plays_every)
       values ($1, $2, 'Bench: route-day visit', 'model', $3, 15, 100000)`,
      [tenantId, carePlanId, games[0]!.model_id],
    );
    for (const g of games) {
      await client.query(
        `insert into work_orders (tenant_id, care_plan_id, game_id, due_at, due_reason, title, on_site_minutes, technician_id, planned_on)
         values ($1, $2, $3, now(), 'plays', 'Bench: route-day visit', 15, $4, $5)`,
        [tenantId, carePlanId, g.id, technicianId, DAY],
      );
    }
    return { tenantId, technicianId, ownerEmail, carePlanId };
  } finally {
    await client.end();
  }
}

async function tidy(ownerUrl: string, a: Arranged) {
  const client = new pg.Client({ connectionString: ownerUrl });
  await client.connect();
  try {
    await client.query('delete from work_orders where tenant_id = $1 and care_plan_id = $2', [a.tenantId, a.carePlanId]);
    await client.query('delete from care_plans where tenant_id = $1 and id = $2', [a.tenantId, a.carePlanId]);
    await client.query('delete from route_days where tenant_id = $1 and day = $2', [a.tenantId, DAY]);
  } finally {
    await client.end();
  }
}

async function endpointBench() {
  const cluster = process.env.DATABASE_URL ? undefined : await startCluster({ mode: 'persistent', log: () => {} });
  const stops: (() => Promise<void>)[] = [];
  try {
    const adminUrl = process.env.DATABASE_URL ?? cluster!.adminUrl;
    let urls: DatabaseUrls | undefined = await readyScaleDatabase(adminUrl);
    if (!urls) {
      console.log('No scale data yet: loading it now, as `npm run seed:scale` does (a minute or two)…');
      urls = (await refreshScaleDatabase(adminUrl)).urls;
    }
    const arranged = await arrange(urls.ownerUrl);
    stops.push(() => tidy(urls.ownerUrl, arranged));
    const authSecret = randomBytes(32).toString('base64url');
    const api = await startChildServer('api-server.ts', { BENCH_APP_URL: urls.appUrl, BENCH_AUTH_SECRET: authSecret });
    stops.push(api.stop);
    const cookie = await signInCookie(api.url, arranged.ownerEmail, SCALE_PASSWORD);
    const endpoints = [
      { name: `one technician's day (${STOPS} stops)`, path: `/api/route-days/${arranged.technicianId}/${DAY}` },
      { name: 'the office board (every technician)', path: `/api/route-days?day=${DAY}` },
      // Today: every technician's open calls without a day land on it, the largest days of the data.
      { name: 'the office board, today', path: '/api/route-days' },
    ];
    const captured = await captureStatements(
      urls.appUrl,
      authSecret,
      endpoints.map((e) => ({ path: e.path, cookie })),
    );
    const pool = new pg.Pool({ connectionString: urls.appUrl, max: CONNECTIONS });
    stops.push(() => pool.end());
    const headers = { cookie, 'accept-encoding': 'gzip' };
    const rows: Record<string, string>[] = [];
    for (const e of endpoints) {
      const c = captured.get(e.path)!;
      // The first look plans every day in it; looks after that find the plans remembered (services/route-day-plans.ts).
      const started = performance.now();
      const first = await fetch(api.url + e.path, { headers });
      await first.arrayBuffer();
      const cold = performance.now() - started;
      await httpLoad(api.url + e.path, { seconds: 1, connections: CONNECTIONS, headers });
      const http: LoadFigures = await medianOf(RUNS, () =>
        httpLoad(api.url + e.path, { seconds: SECONDS, connections: CONNECTIONS, headers }),
      );
      await sqlLoad(pool, c.transactions, { seconds: 1, connections: CONNECTIONS });
      const sql = await medianOf(RUNS, () => sqlLoad(pool, c.transactions, { seconds: SECONDS, connections: CONNECTIONS }));
      rows.push({
        endpoint: e.name,
        statements: String(c.total),
        'first look': ms(cold),
        'API p50 / p95': `${ms(http.p50)} / ${ms(http.p95)}${http.failures ? ` (${http.failures} failed)` : ''}`,
        'SQL p50 / p95': `${ms(sql.p50)} / ${ms(sql.p95)}`,
        'ratio p50': `${(http.p50 / sql.p50).toFixed(1)}×`,
        [`p95 < ${TARGET_MS} ms`]: mark(http.p95 < TARGET_MS),
      });
    }
    console.log(`\n(b) The endpoint against its SQL straight through pg (largest company, app role, ${CONNECTIONS} connections)`);
    console.table(rows);
  } finally {
    for (const stop of stops.reverse()) await stop().catch((err: unknown) => console.error(err));
    cluster?.stop();
  }
}

domainBench();
await endpointBench();
