// Care plans: the list by name, a plan's page (its games and when each is next due), saving one (checked against
// the company's models, games, templates and technicians, its calendar rule against the calendar), retiring one.
import { Router } from 'express';
import { carePlanInput, carePlanListQuery, carePlanRetire, carePlanUpdate } from '@bumperline/contracts/care-plans';
import { recordAudit } from '@bumperline/db/queries/audit';
import { insertCarePlan, listCarePlans, updateCarePlan } from '@bumperline/db/queries/care-plans';
import { ConflictError } from '../http/errors.ts';
import { idParam } from '../http/params.ts';
import { parse } from '../http/validate.ts';
import type { makeScoped } from '../http/guards.ts';
import { carePlanDetail, carePlanOrThrow, carePlanView, checkCarePlan, companyZone } from '../services/care-plans.ts';

export function carePlansRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/',
    scoped('care-plans:read', async ({ tx, req }) => {
      const page = await listCarePlans(tx, parse(carePlanListQuery, req.query));
      return { items: page.items.map(carePlanView), nextCursor: page.nextCursor };
    }),
  );

  r.post(
    '/',
    scoped(
      'care-plans:write',
      async ({ tx, req, actor }) => {
        const input = parse(carePlanInput, req.body);
        await checkCarePlan(tx, input, await companyZone(tx, actor.tenantId));
        const id = await insertCarePlan(tx, input);
        const plan = carePlanView(await carePlanOrThrow(tx, id));
        await recordAudit(tx, { actorUserId: actor.userId, action: 'create', entity: 'care_plan', entityId: id, after: plan });
        return plan;
      },
      201,
    ),
  );

  r.get(
    '/:id',
    scoped('care-plans:read', ({ tx, req, actor }) => carePlanDetail(tx, idParam(req), actor.tenantId)),
  );

  r.put(
    '/:id',
    scoped('care-plans:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const before = carePlanView(await carePlanOrThrow(tx, id));
      const { version, ...fields } = parse(carePlanUpdate, req.body);
      await checkCarePlan(tx, fields, await companyZone(tx, actor.tenantId));
      if (!(await updateCarePlan(tx, id, version, fields))) {
        throw new ConflictError('Someone else changed this care plan since you opened it. Review it and save again.', before, [
          { field: 'version', message: `is ${version}, but the plan is now at version ${before.version}` },
        ]);
      }
      const after = carePlanView(await carePlanOrThrow(tx, id));
      await recordAudit(tx, { actorUserId: actor.userId, action: 'update', entity: 'care_plan', entityId: id, before, after });
      return after;
    }),
  );

  // Retired: no new work orders; its open ones stay until done or skipped.
  r.post(
    '/:id/retire',
    scoped('care-plans:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const before = carePlanView(await carePlanOrThrow(tx, id));
      const { version } = parse(carePlanRetire, req.body);
      if (before.retiredAt) return before;
      if (!(await updateCarePlan(tx, id, version, { retiredAt: new Date() }))) {
        throw new ConflictError('Someone else changed this care plan since you opened it.', before, [
          { field: 'version', message: `is ${version}, but the plan is now at version ${before.version}` },
        ]);
      }
      const after = carePlanView(await carePlanOrThrow(tx, id));
      await recordAudit(tx, { actorUserId: actor.userId, action: 'retire', entity: 'care_plan', entityId: id, before, after });
      return after;
    }),
  );

  return r;
}
