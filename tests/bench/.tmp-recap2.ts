import pg from 'pg';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import { readyScaleDatabase } from '@bumperline/db/scale/scale-database';
import { createDb, withScope } from '@bumperline/db/client';
import { listFleetBoardInstances, listElectrolyticsOfBoards } from '@bumperline/db/queries/board-instances';
import { listCabinetProfiles } from '@bumperline/db/queries/cabinet-profiles';
import { recapFleet } from '../../apps/api/src/services/boards.ts';
const cluster = await startCluster({ mode: 'persistent', log: () => {} });
try {
  const urls = (await readyScaleDatabase(cluster.adminUrl))!;
  const o = new pg.Client({ connectionString: urls.ownerUrl });
  await o.connect();
  const top = (await o.query(`select tenant_id from games group by tenant_id order by count(*) desc limit 1`)).rows[0].tenant_id;
  const user = (await o.query(`select user_id from memberships where tenant_id=$1 and role='owner'`, [top])).rows[0].user_id;
  await o.end();
  const db = createDb(urls.appUrl, { max: 2 });
  const scope = { tenantId: top, userId: user };
  const time = async (label: string, fn: () => Promise<unknown>) => {
    for (let i = 0; i < 5; i++) await fn();
    const t: number[] = [];
    for (let i = 0; i < 15; i++) { const s = performance.now(); await fn(); t.push(performance.now() - s); }
    t.sort((a, b) => a - b);
    console.log(label, 'median', t[7]!.toFixed(1), 'ms');
  };
  let ids: string[] = [];
  await time('fleet query', () => withScope(db, scope, async (tx) => { const r = await listFleetBoardInstances(tx); ids = r.map((x) => x.boardId); }));
  await time('electrolytics', () => withScope(db, scope, (tx) => listElectrolyticsOfBoards(tx, ids)));
  await time('profiles', () => withScope(db, scope, (tx) => listCabinetProfiles(tx)));
  await time('empty tx', () => withScope(db, scope, async () => 1));
  const { Session } = await import('node:inspector/promises');
  const session = new Session(); session.connect();
  await session.post('Profiler.enable'); await session.post('Profiler.start');
  for (let i = 0; i < 10; i++) await withScope(db, scope, (tx) => recapFleet(tx, '2026-12-03', undefined));
  const { profile } = await session.post('Profiler.stop');
  const self = new Map<string, number>();
  const byId = new Map(profile.nodes.map((n: any) => [n.id, n]));
  const counts = new Map<number, number>();
  for (const s of profile.samples) counts.set(s, (counts.get(s) ?? 0) + 1);
  for (const [id, c] of counts) { const n: any = byId.get(id); const k = `${n.callFrame.functionName || '(anon)'} ${n.callFrame.url.split('/').slice(-2).join('/')}:${n.callFrame.lineNumber}`; self.set(k, (self.get(k) ?? 0) + c); }
  const total = profile.samples.length;
  console.log([...self].sort((a, b) => b[1] - a[1]).slice(0, 25).map(([k, v]) => `${(100 * v / total).toFixed(1)}% ${k}`).join('\n'));
  await db.$client.end();
} finally { cluster.stop(); }
