// The current operator company's own settings, and its activity (audit) log.
import { Router } from 'express';
import { activityQuery } from '@bumperline/contracts/activity';
import { companyUpdate } from '@bumperline/contracts/company';
import { getCompany, updateCompany } from '@bumperline/db/queries/companies';
import { listAudit, recordAudit } from '@bumperline/db/queries/audit';
import type { makeScoped } from '../http/guards.ts';
import { parse } from '../http/validate.ts';

export function companyRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/',
    scoped('company:read', ({ tx, actor }) => getCompany(tx, actor.tenantId)),
  );

  r.patch(
    '/',
    scoped('company:manage', async ({ tx, req, actor }) => {
      const patch = parse(companyUpdate, req.body);
      const before = await getCompany(tx, actor.tenantId);
      const after = await updateCompany(tx, actor.tenantId, patch);
      await recordAudit(tx, { actorUserId: actor.userId, action: 'update', entity: 'company', entityId: actor.tenantId, before, after });
      return after;
    }),
  );

  return r;
}

export function activityRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();
  r.get(
    '/',
    scoped('audit:read', async ({ tx, req }) => {
      const q = parse(activityQuery, req.query);
      const items = await listAudit(tx, q);
      return { items, nextBefore: items.length === q.limit ? items[items.length - 1]!.id : null };
    }),
  );
  return r;
}
