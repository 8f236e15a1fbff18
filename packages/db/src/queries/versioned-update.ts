// Optimistic concurrency, in one place: a change applies only while the row is still at the version its
// editor started from, and moves the version on, so of two editors the second is turned away instead of
// silently overwriting the first.
import { and, eq, sql } from 'drizzle-orm';
import type { PgColumn, PgTable, PgUpdateSetSource } from 'drizzle-orm/pg-core';
import type { Tx } from '../client.ts';
import { currentTenant } from '../schema/rls.ts';

type VersionedTable = PgTable & { tenantId: PgColumn; id: PgColumn; version: PgColumn; updatedAt: PgColumn };

/** Applies `patch` only at `version`; the row's id and new version, or undefined when it moved on (or is gone). */
export async function updateAtVersion<T extends VersionedTable>(
  tx: Tx,
  table: T,
  id: string,
  version: number,
  patch: PgUpdateSetSource<T>,
): Promise<{ id: string; version: number } | undefined> {
  const [row] = await tx
    .update(table)
    .set({ ...patch, version: sql`${table.version} + 1`, updatedAt: new Date() } as PgUpdateSetSource<T>)
    .where(and(eq(table.tenantId, currentTenant), eq(table.id, id), eq(table.version, version)))
    .returning({ id: table.id, version: table.version });
  return row as { id: string; version: number } | undefined;
}
