// The audit log: who changed what, with each changed field's value before and after.
import { and, desc, eq, lt, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { auditLog, users } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export interface AuditEntry {
  actorUserId: string | null;
  action: string;
  entity: string;
  entityId: string;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
}

const IGNORED = new Set(['version', 'updatedAt', 'createdAt', 'sortValue']);

/** Field-by-field difference between two snapshots of a row. */
export function diff(before: Record<string, unknown> | null | undefined, after: Record<string, unknown> | null | undefined) {
  const changes: Record<string, { from: unknown; to: unknown }> = {};
  const keys = new Set([...Object.keys(before ?? {}), ...Object.keys(after ?? {})]);
  for (const k of keys) {
    if (IGNORED.has(k)) continue;
    const from = normalise(before?.[k]);
    const to = normalise(after?.[k]);
    if (JSON.stringify(from) !== JSON.stringify(to)) changes[k] = { from: from ?? null, to: to ?? null };
  }
  return changes;
}

function normalise(v: unknown): unknown {
  return v instanceof Date ? v.toISOString() : v;
}

export async function recordAudit(tx: Tx, e: AuditEntry): Promise<void> {
  await tx.insert(auditLog).values({
    tenantId: sql`${currentTenant}`,
    actorUserId: e.actorUserId,
    action: e.action,
    entity: e.entity,
    entityId: e.entityId,
    changes: diff(e.before, e.after),
  });
}

export async function listAudit(tx: Tx, p: { entity?: string; entityId?: string; before?: number; limit: number }) {
  return tx
    .select({
      id: auditLog.id,
      at: auditLog.at,
      action: auditLog.action,
      entity: auditLog.entity,
      entityId: auditLog.entityId,
      changes: auditLog.changes,
      actorName: users.name,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorUserId))
    .where(
      and(
        eq(auditLog.tenantId, currentTenant),
        p.entity ? eq(auditLog.entity, p.entity) : undefined,
        p.entityId ? eq(auditLog.entityId, p.entityId) : undefined,
        p.before ? lt(auditLog.id, p.before) : undefined,
      ),
    )
    .orderBy(desc(auditLog.id))
    .limit(p.limit);
}
