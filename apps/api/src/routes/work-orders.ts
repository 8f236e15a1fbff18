// Work orders: the list (open work by due date, filtered by due state, game, venue, plan, technician, day), one
// order, and its actions — move, skip, done, open its bench job. Thin: parse, call the workflow, return.
import { Router } from 'express';
import { workOrderDone, workOrderListQuery, workOrderMove, workOrderOpenBenchJob, workOrderSkip } from '@bumperline/contracts/work-orders';
import { listWorkOrders } from '@bumperline/db/queries/work-orders';
import { idParam } from '../http/params.ts';
import { parse } from '../http/validate.ts';
import type { makeScoped, TenantActor } from '../http/guards.ts';
import { companyZone } from '../services/care-plans.ts';
import {
  completeWorkOrder,
  moveWorkOrder,
  openWorkOrderBenchJob,
  skipWorkOrder,
  workOrderOrThrow,
  workOrderView,
  type WorkOrderActor,
} from '../services/work-orders.ts';

const actorOf = (a: TenantActor): WorkOrderActor => ({ userId: a.userId, tenantId: a.tenantId, role: a.role });

export function workOrdersRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/',
    scoped('care-plans:read', async ({ tx, req, actor }) => {
      const q = parse(workOrderListQuery, req.query);
      const page = await listWorkOrders(tx, {
        ...q,
        technicianId: q.technicianId === 'me' ? actor.userId : q.technicianId,
        now: new Date(),
        timeZone: await companyZone(tx, actor.tenantId),
      });
      return { items: page.items.map(workOrderView), nextCursor: page.nextCursor };
    }),
  );

  r.get(
    '/:id',
    scoped('care-plans:read', async ({ tx, req, actor }) => workOrderView(await workOrderOrThrow(tx, idParam(req), actor.tenantId))),
  );

  r.post(
    '/:id/move',
    scoped('work-orders:work', ({ tx, req, actor }) =>
      moveWorkOrder(tx, { id: idParam(req), ...parse(workOrderMove, req.body), actor: actorOf(actor) }),
    ),
  );

  r.post(
    '/:id/skip',
    scoped('work-orders:work', ({ tx, req, actor }) =>
      skipWorkOrder(tx, { id: idParam(req), ...parse(workOrderSkip, req.body), actor: actorOf(actor) }),
    ),
  );

  r.post(
    '/:id/done',
    scoped('work-orders:work', ({ tx, req, actor }) =>
      completeWorkOrder(tx, { id: idParam(req), input: parse(workOrderDone, req.body), actor: actorOf(actor) }),
    ),
  );

  r.post(
    '/:id/bench-job',
    scoped('bench:work', ({ tx, req, actor }) =>
      openWorkOrderBenchJob(tx, { id: idParam(req), ...parse(workOrderOpenBenchJob, req.body), actor: actorOf(actor) }),
    ),
  );

  return r;
}
