import pg from 'pg';
import { gzipSync, constants } from 'node:zlib';
import { startCluster } from '@bumperline/db/lifecycle/cluster';
import { readyScaleDatabase } from '@bumperline/db/scale/scale-database';
import { createDb, withScope } from '@bumperline/db/client';
import { getBoardInstance, listPartsForBoardHistory } from '@bumperline/db/queries/board-instances';
import { listCabinetProfiles } from '@bumperline/db/queries/cabinet-profiles';
import { listReadingsOfBoardInstance } from '@bumperline/db/queries/part-readings';
import { listBenchJobsOfBoardInstance } from '@bumperline/db/queries/bench-jobs';
import { boardPage } from '../../apps/api/src/services/boards.ts';
import { companyToday } from '../../apps/api/src/services/company-today.ts';
const cluster = await startCluster({ mode: 'persistent', log: () => {} });
try {
  const urls = (await readyScaleDatabase(cluster.adminUrl))!;
  const o = new pg.Client({ connectionString: urls.ownerUrl });
  await o.connect();
  const top = (await o.query(`select tenant_id from games group by tenant_id order by count(*) desc limit 1`)).rows[0].tenant_id;
  const user = (await o.query(`select user_id from memberships where tenant_id=$1 and role='owner'`, [top])).rows[0].user_id;
  const inst = (await o.query(`select i.id, i.board_id, i.game_id from board_instances i join part_readings r on r.tenant_id=i.tenant_id and r.board_instance_id=i.id where i.tenant_id=$1 and i.game_id is not null group by 1,2,3 order by count(*) desc limit 1`, [top])).rows[0];
  await o.end();
  const db = createDb(urls.appUrl, { max: 2 });
  const scope = { tenantId: top, userId: user };
  const N = 60;
  const bench = async (label: string, fn: () => Promise<unknown> | unknown) => {
    for (let i = 0; i < 10; i++) await fn();
    const t: number[] = [];
    for (let i = 0; i < N; i++) { const s = performance.now(); await fn(); t.push(performance.now() - s); }
    t.sort((a, b) => a - b);
    console.log(label.padEnd(40), t[N >> 1]!.toFixed(2), 'ms');
  };
  await bench('empty scoped tx', () => withScope(db, scope, async () => 1));
  await bench('companyToday', () => withScope(db, scope, (tx) => companyToday(tx, top)));
  await bench('getBoardInstance', () => withScope(db, scope, (tx) => getBoardInstance(tx, inst.id)));
  await bench('listPartsForBoardHistory', () => withScope(db, scope, (tx) => listPartsForBoardHistory(tx, inst.board_id, inst.id)));
  await bench('listCabinetProfiles', () => withScope(db, scope, (tx) => listCabinetProfiles(tx, [inst.game_id])));
  await bench('listReadingsOfBoardInstance', () => withScope(db, scope, (tx) => listReadingsOfBoardInstance(tx, inst.id)));
  await bench('listBenchJobsOfBoardInstance', () => withScope(db, scope, (tx) => listBenchJobsOfBoardInstance(tx, inst.id)));
  await bench('boardPage whole', () => withScope(db, scope, (tx) => boardPage(tx, inst.id, '2026-12-03')));
  const page = await withScope(db, scope, (tx) => boardPage(tx, inst.id, '2026-12-03'));
  const json = JSON.stringify(page);
  await bench('JSON.stringify', () => JSON.stringify(page));
  await bench('gzip level 1', () => gzipSync(json, { level: constants.Z_BEST_SPEED }));
  console.log('json KiB', (json.length / 1024).toFixed(0), 'gz KiB', (gzipSync(json, { level: 1 }).length / 1024).toFixed(0));
  await db.$client.end();
} finally { cluster.stop(); }
