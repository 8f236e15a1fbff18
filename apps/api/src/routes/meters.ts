// A game's meters, its readings and its keep cost: which meters it has (and where each rolls over), recording a
// reading, the newest reading of each meter, and what the game cost to keep running over the last 12 months.
import { Router } from 'express';
import { gameMeterList, meterReadingInput } from '@bumperline/contracts/meters';
import { recordAudit } from '@bumperline/db/queries/audit';
import { getCompanySummary } from '@bumperline/db/queries/companies';
import { sumKeepCostOfGame } from '@bumperline/db/queries/keep-costs';
import { listGameMeters, listLatestReadings, replaceGameMeters } from '@bumperline/db/queries/meters';
import { idParam } from '../http/params.ts';
import { parse } from '../http/validate.ts';
import type { makeScoped } from '../http/guards.ts';
import { gameOrThrow, meterReadingView, recordMeterReading } from '../services/meters.ts';

const YEAR_MS = 365 * 86_400_000;

export function metersRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/games/:id/meters',
    scoped('games:read', async ({ tx, req }) => {
      const gameId = idParam(req);
      await gameOrThrow(tx, gameId);
      return { items: await listGameMeters(tx, gameId) };
    }),
  );

  r.put(
    '/games/:id/meters',
    scoped('games:write', async ({ tx, req, actor }) => {
      const gameId = idParam(req);
      await gameOrThrow(tx, gameId);
      const { items } = parse(gameMeterList, req.body);
      const before = { meters: await listGameMeters(tx, gameId) };
      await replaceGameMeters(tx, gameId, items);
      const after = { meters: await listGameMeters(tx, gameId) };
      await recordAudit(tx, { actorUserId: actor.userId, action: 'meters', entity: 'game', entityId: gameId, before, after });
      return { items: after.meters };
    }),
  );

  r.post(
    '/games/:id/meter-readings',
    scoped(
      'meters:write',
      async ({ tx, req, actor }) =>
        recordMeterReading(tx, { gameId: idParam(req), ...parse(meterReadingInput, req.body), source: 'visit', readBy: actor.userId }),
      201,
    ),
  );

  r.get(
    '/games/:id/meter-readings/latest',
    scoped('games:read', async ({ tx, req }) => {
      const gameId = idParam(req);
      await gameOrThrow(tx, gameId);
      return { items: (await listLatestReadings(tx, [gameId])).map(meterReadingView) };
    }),
  );

  r.get(
    '/games/:id/keep-cost',
    scoped('games:read', async ({ tx, req, actor }) => {
      const gameId = idParam(req);
      await gameOrThrow(tx, gameId);
      const since = new Date(Date.now() - YEAR_MS);
      const sum = await sumKeepCostOfGame(tx, gameId, since);
      const company = await getCompanySummary(tx, actor.tenantId);
      return {
        gameId,
        since: since.toISOString(),
        currency: company?.currency ?? 'USD',
        ...sum,
        totalCents: sum.partsCents + sum.labourCents,
      };
    }),
  );

  return r;
}
