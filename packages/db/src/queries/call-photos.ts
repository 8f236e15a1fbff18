// Photos attached to a call (the files themselves are in the photo store; these rows say where).
import { and, asc, eq, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { callPhotos } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export async function insertPhoto(tx: Tx, p: Omit<typeof callPhotos.$inferInsert, 'tenantId'>) {
  const [row] = await tx
    .insert(callPhotos)
    .values({ ...p, tenantId: sql`${currentTenant}` })
    .returning({ id: callPhotos.id });
  return row!.id;
}

export async function listPhotos(tx: Tx, callId: string) {
  return tx
    .select({
      id: callPhotos.id,
      width: callPhotos.width,
      height: callPhotos.height,
      createdAt: callPhotos.createdAt,
      uploadedBy: callPhotos.uploadedBy,
    })
    .from(callPhotos)
    .where(and(eq(callPhotos.tenantId, currentTenant), eq(callPhotos.callId, callId)))
    .orderBy(asc(callPhotos.createdAt));
}

export async function getPhoto(tx: Tx, id: string) {
  const [p] = await tx
    .select()
    .from(callPhotos)
    .where(and(eq(callPhotos.tenantId, currentTenant), eq(callPhotos.id, id)));
  return p;
}
