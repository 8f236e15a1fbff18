// Operator companies (tenants): the current company's own row and a new company at sign-up. (Scheduled jobs
// find the companies with due work through due-work.ts.)
import { eq } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { memberships, tenants } from '../schema/index.ts';

/** A new company with its first owner; run in the new company's scope. */
export async function createCompany(
  tx: Tx,
  c: { id: string; name: string; timeZone: string; currency: string; ownerId: string },
): Promise<void> {
  await tx.insert(tenants).values({ id: c.id, name: c.name, timeZone: c.timeZone, currency: c.currency });
  await tx.insert(memberships).values({ tenantId: c.id, userId: c.ownerId, role: 'owner' });
}

export async function getCompany(tx: Tx, id: string) {
  const [t] = await tx.select().from(tenants).where(eq(tenants.id, id));
  return t;
}

/** What the signed-in person's screens show of their current company. */
export async function getCompanySummary(tx: Tx, id: string) {
  const [t] = await tx
    .select({ id: tenants.id, name: tenants.name, timeZone: tenants.timeZone, currency: tenants.currency, locale: tenants.locale })
    .from(tenants)
    .where(eq(tenants.id, id));
  return t;
}

/** The time zone and locale the company's times are shown in. */
export async function getCompanyLocale(tx: Tx, id: string) {
  const [t] = await tx.select({ timeZone: tenants.timeZone, locale: tenants.locale }).from(tenants).where(eq(tenants.id, id));
  return t;
}

export async function updateCompany(tx: Tx, id: string, patch: Partial<Omit<typeof tenants.$inferInsert, 'id'>>) {
  const [t] = await tx.update(tenants).set(patch).where(eq(tenants.id, id)).returning();
  return t;
}
