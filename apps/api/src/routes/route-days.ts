// Route days: the office's board of every technician's day, one technician's day, the signed-in technician's own
// (My day), and the office's changes: keep an order, go back to the planner's, move a stop. Thin: parse, call the
// service, record the audit, return.
import { Router, type Request } from 'express';
import { can } from '@bumperline/contracts/roles';
import {
  routeDayDateQuery,
  routeDayOrderInput,
  routeDayPathDay,
  routeDayResetInput,
  stopMoveInput,
} from '@bumperline/contracts/route-days';
import { recordAudit } from '@bumperline/db/queries/audit';
import type { makeScoped, TenantActor } from '../http/guards.ts';
import { NotFoundError } from '../http/errors.ts';
import { idParam } from '../http/params.ts';
import { parse } from '../http/validate.ts';
import { keepStopOrder, moveStop, resetStopOrder, routeDayBoard, routeDayOf } from '../services/route-days.ts';

/** :technicianId and :day; a technician without route-days:plan reaches only their own day (others' are not found). */
function dayOf(req: Request, actor: TenantActor): { technicianId: string; day: string } {
  const technicianId = idParam(req, 'technicianId');
  const { day } = parse(routeDayPathDay, { day: req.params.day });
  if (technicianId !== actor.userId && !can(actor.role, 'route-days:plan')) throw new NotFoundError();
  return { technicianId, day };
}

export function routeDaysRouter(deps: { scoped: ReturnType<typeof makeScoped>; appOrigin: string }): Router {
  const { scoped, appOrigin } = deps;
  const r = Router();

  r.get(
    '/route-days',
    scoped('route-days:read', async ({ tx, req, actor }) => {
      const { day } = parse(routeDayDateQuery, req.query);
      return routeDayBoard(tx, { day, onlyTechnicianId: can(actor.role, 'route-days:plan') ? undefined : actor.userId });
    }),
  );

  r.get(
    '/my-day',
    scoped('route-days:read', async ({ tx, req, actor }) => {
      const { day } = parse(routeDayDateQuery, req.query);
      return routeDayOf(tx, { technicianId: actor.userId, day });
    }),
  );

  r.get(
    '/route-days/:technicianId/:day',
    scoped('route-days:read', ({ tx, req, actor }) => routeDayOf(tx, dayOf(req, actor))),
  );

  r.put(
    '/route-days/:technicianId/:day/order',
    scoped('route-days:plan', async ({ tx, req, actor }) => {
      const where = dayOf(req, actor);
      const input = parse(routeDayOrderInput, req.body);
      const day = await keepStopOrder(tx, { ...where, ...input, userId: actor.userId });
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'route_day.order_kept',
        entity: 'route_day',
        entityId: where.technicianId,
        after: { day: where.day, venueIds: day.stops.map((s) => s.venue.id) },
      });
      return day;
    }),
  );

  r.post(
    '/route-days/:technicianId/:day/reset-order',
    scoped('route-days:plan', async ({ tx, req, actor }) => {
      const where = dayOf(req, actor);
      const input = parse(routeDayResetInput, req.body);
      const day = await resetStopOrder(tx, { ...where, ...input, userId: actor.userId });
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'route_day.order_reset',
        entity: 'route_day',
        entityId: where.technicianId,
        after: { day: where.day },
      });
      return day;
    }),
  );

  r.post(
    '/route-days/:technicianId/:day/stops/:venueId/move',
    scoped('route-days:plan', async ({ tx, req, actor }) => {
      const where = dayOf(req, actor);
      const venueId = idParam(req, 'venueId');
      const input = parse(stopMoveInput, req.body);
      const { from, to, moved } = await moveStop(tx, {
        ...where,
        venueId,
        ...input,
        actor: { userId: actor.userId, role: actor.role, label: actor.name },
        appOrigin,
      });
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'route_day.stop_moved',
        entity: 'venue',
        entityId: venueId,
        before: { technicianId: where.technicianId, day: where.day },
        after: { technicianId: input.toTechnicianId, day: input.toDay, items: moved },
      });
      return { from, to };
    }),
  );

  return r;
}
