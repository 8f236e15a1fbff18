// prints the SQL statements a service sends, with explain analyze summary
import pg from 'pg';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import { readyScaleDatabase } from '@bumperline/db/scale/scale-database';
import { createDb, withScope } from '@bumperline/db/client';
import { recordStatements } from '../support/statement-log.ts';
import { boardPage, recapFleet, gameBoards } from '../../apps/api/src/services/boards.ts';
import { benchJobView } from '../../apps/api/src/services/bench-job-view.ts';
import { getPartsList } from '../../apps/api/src/services/parts-lists.ts';
import { listModels } from '@bumperline/db/queries/games';
import { listAllModelBoards } from '@bumperline/db/queries/model-boards';
const which = process.argv[2]!;
const cluster = await startCluster({ mode: 'persistent', log: () => {} });
try {
  const urls = (await readyScaleDatabase(cluster.adminUrl))!;
  const o = new pg.Client({ connectionString: urls.ownerUrl });
  await o.connect();
  const top = (await o.query(`select tenant_id from games group by tenant_id order by count(*) desc limit 1`)).rows[0].tenant_id;
  const user = (await o.query(`select user_id from memberships where tenant_id=$1 and role='owner'`, [top])).rows[0].user_id;
  const inst = (await o.query(`select i.id, i.game_id from board_instances i join part_readings r on r.tenant_id=i.tenant_id and r.board_instance_id=i.id where i.tenant_id=$1 and i.game_id is not null group by 1,2 order by count(*) desc limit 1`, [top])).rows[0];
  const job = (await o.query(`select bench_job_id id from part_readings where tenant_id=$1 and bench_job_id is not null group by 1 order by count(*) desc limit 1`, [top])).rows[0].id;
  const board = (await o.query(`select board_id id from board_parts where tenant_id=$1 group by 1 order by count(*) desc limit 1`, [top])).rows[0].id;
  await o.end();
  const db = createDb(urls.appUrl, { max: 1 });
  const scope = { tenantId: top, userId: user };
  const fns: Record<string, (tx: any) => Promise<unknown>> = {
    boardPage: (tx) => boardPage(tx, inst.id, '2026-12-03'),
    job: (tx) => benchJobView(tx, job),
    recap: (tx) => recapFleet(tx, '2026-12-03', undefined),
    gameBoards: (tx) => gameBoards(tx, inst.game_id, '2026-12-03'),
    partsList: (tx) => getPartsList(tx, board),
    partsLists: async (tx) => Promise.all([listModels(tx), listAllModelBoards(tx)]),
  };
  const log = recordStatements();
  await withScope(db, scope, fns[which]!);
  const sent = log.take();
  log.stop();
  const c = new pg.Client({ connectionString: urls.appUrl });
  await c.connect();
  for (const st of sent) {
    if (!/^\s*(select|with)/i.test(st.text)) continue;
    await c.query('begin');
    await c.query(`select set_config('app.tenant_id', $1, true)`, [top]);
    let plan: any;
    for (let i = 0; i < 3; i++) plan = (await c.query(`explain (analyze, format json) ${st.text}`, st.values)).rows[0]['QUERY PLAN'][0];
    await c.query('commit');
    console.log(`plan ${plan['Planning Time'].toFixed(2)} ms, exec ${plan['Execution Time'].toFixed(2)} ms, rows ${plan.Plan['Actual Rows']}: ${st.text.slice(0, 150)}`);
  }
  await c.end();
  await db.$client.end();
} finally { cluster.stop(); }
