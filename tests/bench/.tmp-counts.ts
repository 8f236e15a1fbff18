import pg from 'pg';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import { readyScaleDatabase } from '@bumperline/db/scale/scale-database';
const cluster = await startCluster({ mode: 'persistent', log: () => {} });
try {
  const urls = (await readyScaleDatabase(cluster.adminUrl))!;
  const c = new pg.Client({ connectionString: urls.ownerUrl });
  await c.connect();
  const top = (await c.query(`select tenant_id from games group by tenant_id order by count(*) desc limit 1`)).rows[0].tenant_id;
  for (const t of ['model_boards','board_parts','board_instances','cabinet_profiles','bench_templates','bench_jobs','bench_job_photos','part_readings','bench_job_parts_used','games']) {
    const r = await c.query(`select count(*)::int n from ${t} where tenant_id = $1`, [top]);
    console.log(t, r.rows[0].n);
  }
  console.log((await c.query(`select state, count(*) from bench_jobs where tenant_id=$1 group by state`, [top])).rows);
  console.log((await c.query(`select pg_size_pretty(pg_database_size(current_database())) s`)).rows);
  console.log((await c.query(`select relname, relpages from pg_class where relname in ('model_boards','board_parts','board_instances','bench_jobs','part_readings','bench_templates','cabinet_profiles','bench_job_parts_used','bench_job_photos') order by 1`)).rows);
  await c.end();
} finally { cluster.stop(); }
