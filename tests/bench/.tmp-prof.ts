import pg from 'pg';
import { gzipSync, constants } from 'node:zlib';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import { readyScaleDatabase } from '@bumperline/db/scale/scale-database';
import { createDb, withScope, type Tx } from '@bumperline/db/client';
import { listModels } from '@bumperline/db/queries/games';
import { listAllModelBoards } from '@bumperline/db/queries/model-boards';
import { listBenchJobs } from '@bumperline/db/queries/bench-jobs';
import { boardPage, gameBoards, recapFleet } from '../../apps/api/src/services/boards.ts';
import { benchJobView } from '../../apps/api/src/services/bench-job-view.ts';
import { getPartsList } from '../../apps/api/src/services/parts-lists.ts';
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
  const db = createDb(urls.appUrl, { max: 2 });
  const fns: Record<string, (tx: Tx) => Promise<unknown>> = {
    partsLists: async (tx) => { const [models, boards] = await Promise.all([listModels(tx), listAllModelBoards(tx)]); return { items: models.map((model) => ({ model, boards: boards.filter((b) => b.modelId === model.id) })) }; },
    boardPage: (tx) => boardPage(tx, inst.id, '2026-12-03'),
    job: (tx) => benchJobView(tx, job),
    gameBoards: (tx) => gameBoards(tx, inst.game_id, '2026-12-03'),
    partsList: (tx) => getPartsList(tx, board),
    jobs100: (tx) => listBenchJobs(tx, { state: 'in_progress', limit: 100 }),
    recap: (tx) => recapFleet(tx, '2026-12-03', undefined),
  };
  const fn = fns[which]!;
  const scope = { tenantId: top, userId: user };
  const run = async () => { const out = await withScope(db, scope, fn); const json = JSON.stringify(out); gzipSync(json, { level: constants.Z_BEST_SPEED }); return json.length; };
  for (let i = 0; i < 10; i++) await run();
  const N = 40;
  const s0 = performance.now(); let size = 0;
  for (let i = 0; i < N; i++) size = await run();
  console.log(which, 'per request', ((performance.now() - s0) / N).toFixed(1), 'ms; JSON', (size / 1024).toFixed(0), 'KiB');
  const { Session } = await import('node:inspector/promises');
  const session = new Session(); session.connect();
  await session.post('Profiler.enable'); await session.post('Profiler.start');
  for (let i = 0; i < N; i++) await run();
  const { profile } = await session.post('Profiler.stop');
  const self = new Map<string, number>();
  const byId = new Map(profile.nodes.map((n: any) => [n.id, n]));
  const counts = new Map<number, number>();
  for (const s of profile.samples) counts.set(s, (counts.get(s) ?? 0) + 1);
  for (const [id, c] of counts) { const n: any = byId.get(id); const k = `${n.callFrame.functionName || '(anon)'} ${n.callFrame.url.split('/').slice(-2).join('/')}:${n.callFrame.lineNumber}`; self.set(k, (self.get(k) ?? 0) + c); }
  const total = profile.samples.length;
  console.log([...self].sort((a, b) => b[1] - a[1]).slice(0, 18).map(([k, v]) => `${(100 * v / total).toFixed(1)}% ${k}`).join('\n'));
  await db.$client.end();
} finally { cluster.stop(); }
