import pg from 'pg';
import { readFileSync } from 'node:fs';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import { readyScaleDatabase } from '@bumperline/db/scale/scale-database';
const cluster = await startCluster({ mode: 'persistent', log: () => {} });
try {
  const urls = (await readyScaleDatabase(cluster.adminUrl))!;
  const o = new pg.Client({ connectionString: urls.ownerUrl });
  await o.connect();
  const top = (await o.query(`select tenant_id from games group by tenant_id order by count(*) desc limit 1`)).rows[0].tenant_id;
  await o.end();
  const c = new pg.Client({ connectionString: urls.appUrl });
  await c.connect();
  const queries = readFileSync(process.argv[2]!, 'utf8').split(/^----$/m);
  for (const q of queries) {
    await c.query('begin');
    await c.query(`select set_config('app.tenant_id', $1, true)`, [top]);
    const r = await c.query(`explain (analyze, costs on) ${q}`);
    console.log(q.trim().slice(0, 200));
    console.log(r.rows.map((x) => x['QUERY PLAN']).join('\n'));
    // timing of plain execution
    const t0 = performance.now();
    for (let i = 0; i < 20; i++) await c.query(q);
    const t1 = performance.now(); for (let i = 0; i < 20; i++) await c.query(`explain (analyze, timing off, summary on) ${q}`); console.log(`exec only: ${((performance.now() - t1) / 20).toFixed(2)} ms`);
    console.log(`plain: ${((performance.now() - t0) / 20).toFixed(2)} ms per run\n`);
    await c.query('commit');
  }
  await c.end();
} finally { cluster.stop(); }
