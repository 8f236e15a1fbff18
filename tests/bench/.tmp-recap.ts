import pg from 'pg';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import { readyScaleDatabase } from '@bumperline/db/scale/scale-database';
import { createDb, withScope } from '@bumperline/db/client';
import { recapFleet } from '../../apps/api/src/services/boards.ts';
import { boardPage } from '../../apps/api/src/services/boards.ts';
import { benchJobView } from '../../apps/api/src/services/bench-job-view.ts';
import { getPartsList } from '../../apps/api/src/services/parts-lists.ts';
const cluster = await startCluster({ mode: 'persistent', log: () => {} });
try {
  const urls = (await readyScaleDatabase(cluster.adminUrl))!;
  const o = new pg.Client({ connectionString: urls.ownerUrl });
  await o.connect();
  const top = (await o.query(`select tenant_id from games group by tenant_id order by count(*) desc limit 1`)).rows[0].tenant_id;
  const user = (await o.query(`select user_id from memberships where tenant_id=$1 and role='owner'`, [top])).rows[0].user_id;
  const inst = (await o.query(`select board_instance_id id from part_readings where tenant_id=$1 group by 1 order by count(*) desc limit 1`, [top])).rows[0].id;
  const job = (await o.query(`select bench_job_id id from part_readings where tenant_id=$1 and bench_job_id is not null group by 1 order by count(*) desc limit 1`, [top])).rows[0].id;
  const board = (await o.query(`select board_id id from board_parts where tenant_id=$1 group by 1 order by count(*) desc limit 1`, [top])).rows[0].id;
  await o.end();
  const db = createDb(urls.appUrl, { max: 2 });
  const time = async (label: string, fn: () => Promise<unknown>) => {
    for (let i = 0; i < 5; i++) await fn();
    const t: number[] = [];
    let out: unknown;
    for (let i = 0; i < 20; i++) { const s = performance.now(); out = await fn(); t.push(performance.now() - s); }
    t.sort((a, b) => a - b);
    const s = performance.now(); const json = JSON.stringify(out); const j = performance.now() - s;
    console.log(label, 'median', t[10]!.toFixed(1), 'ms; JSON', (json.length / 1024).toFixed(0), 'KiB in', j.toFixed(1), 'ms');
  };
  const scope = { tenantId: top, userId: user };
  await time('recapFleet', () => withScope(db, scope, (tx) => recapFleet(tx, '2026-12-03', undefined)));
  await time('boardPage', () => withScope(db, scope, (tx) => boardPage(tx, inst, '2026-12-03')));
  await time('benchJobView', () => withScope(db, scope, (tx) => benchJobView(tx, job)));
  await time('getPartsList', () => withScope(db, scope, (tx) => getPartsList(tx, board)));
  await db.$client.end();
} finally { cluster.stop(); }
