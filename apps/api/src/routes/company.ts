// The current operator company's own settings, and its activity (audit) log.
import { Router } from 'express';
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { companyUpdate } from '@bumperline/contracts/auth';
import { tenants } from '@bumperline/db/schema/index';
import { listAudit, recordAudit } from '@bumperline/db/queries/audit';
import type { makeScoped } from '../http/guards.ts';
import { parse } from '../http/validate.ts';

const activityQuery = z.strictObject({
  entity: z.string().max(40).optional(),
  entityId: z.string().max(60).optional(),
  before: z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

export function companyRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/',
    scoped('venues:read', async ({ tx, actor }) => {
      const [t] = await tx.select().from(tenants).where(eq(tenants.id, actor.tenantId));
      return t;
    }),
  );

  r.patch(
    '/',
    scoped('company:manage', async ({ tx, req, actor }) => {
      const patch = parse(companyUpdate, req.body);
      const [before] = await tx.select().from(tenants).where(eq(tenants.id, actor.tenantId));
      const [after] = await tx.update(tenants).set(patch).where(eq(tenants.id, actor.tenantId)).returning();
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
