// The company's dispatch settings: one row per company, made with its defaults the first time it is read.
import { eq, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { tenantSettings } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export async function getSettings(tx: Tx) {
  const [s] = await tx.select().from(tenantSettings).where(eq(tenantSettings.tenantId, currentTenant));
  if (s) return s;
  const [created] = await tx
    .insert(tenantSettings)
    .values({ tenantId: sql`${currentTenant}` })
    .onConflictDoNothing()
    .returning();
  return created ?? (await tx.select().from(tenantSettings).where(eq(tenantSettings.tenantId, currentTenant)))[0]!;
}

export async function updateSettings(tx: Tx, patch: Partial<typeof tenantSettings.$inferInsert>) {
  await getSettings(tx);
  const [s] = await tx.update(tenantSettings).set(patch).where(eq(tenantSettings.tenantId, currentTenant)).returning();
  return s!;
}
