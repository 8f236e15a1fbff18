// `npm run seed:scale`: (re)makes the scale database (bumperline_scale) on DATABASE_URL's server, or in
// this checkout's private cluster (the one `npm start` uses, started for the purpose and stopped
// afterwards), and loads the scale data into it. The demo database is not touched.
//   npm run seed:scale -- --companies=50 --games=1000 --venues=300 --years=2 --seed=7
import { parseArgs } from 'node:util';
import cliProgress from 'cli-progress';
import { startCluster } from '../lifecycle/cluster.ts';
import { refreshScaleDatabase } from '../scale/scale-database.ts';
import { SCALE_DATABASE, SCALE_PASSWORD } from '../scale/scale-seed.ts';

const { values } = parseArgs({
  options: {
    companies: { type: 'string' },
    games: { type: 'string' },
    venues: { type: 'string' },
    years: { type: 'string' },
    seed: { type: 'string' },
  },
});
const number = (v: string | undefined) => (v === undefined ? undefined : Number(v));

const cluster = process.env.DATABASE_URL ? undefined : await startCluster({ mode: 'persistent' });
const bar = new cliProgress.SingleBar(
  { format: ' {bar} {percentage}% | games {value}/{total} | companies {companies} | {rows} rows | {phase}', hideCursor: true },
  cliProgress.Presets.shades_classic,
);
try {
  console.log(`Loading the scale data into "${SCALE_DATABASE}" (the demo database stays as it is)…`);
  let started = false;
  const result = await refreshScaleDatabase(process.env.DATABASE_URL ?? cluster!.adminUrl, {
    companies: number(values.companies),
    largest: { games: number(values.games), venues: number(values.venues), years: number(values.years) },
    seed: number(values.seed),
    onProgress(p) {
      const payload = { companies: `${p.companiesDone}/${p.companies}`, rows: p.rowsWritten.toLocaleString('en-US'), phase: p.phase };
      if (!started) bar.start(p.games, 0, payload);
      started = true;
      bar.update(p.gamesDone, payload);
    },
  });
  bar.stop();
  const total = Object.values(result.rows).reduce((a, b) => a + b, 0);
  console.table(Object.fromEntries(Object.entries(result.rows).map(([table, n]) => [table, { rows: n }])));
  console.log(
    `${total.toLocaleString('en-US')} rows in ${(result.elapsedMs / 1000).toFixed(1)} s. Sign in as owner@c001.scale.example ` +
      `(the largest company) or owner@c002.scale.example with the password "${SCALE_PASSWORD}".`,
  );
} finally {
  bar.stop();
  cluster?.stop();
}
