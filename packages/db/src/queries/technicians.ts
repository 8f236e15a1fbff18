// The company's technicians: skills, home base and open load for dispatch, and the narrow lookup that
// finds a technician from the phone number an SMS reply came from.
import { and, eq, inArray, sql } from 'drizzle-orm';
import { callStateGroups } from '@bumperline/contracts/calls';
import type { Db, Tx } from '../client.ts';
import { memberships, serviceCalls, technicianProfiles, users } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

/** Technicians of the company with their skills, home base, phone and open load. */
export async function listTechnicians(tx: Tx) {
  // The load is counted in one pass over the company's calls in those states (the state index), not
  // once per technician: a per-technician count read every call they ever had.
  const load = tx
    .select({ technicianId: serviceCalls.technicianId, n: sql<number>`count(*)::int`.as('n') })
    .from(serviceCalls)
    .where(and(eq(serviceCalls.tenantId, currentTenant), inArray(serviceCalls.state, [...callStateGroups.technicianLoad])))
    .groupBy(serviceCalls.technicianId)
    .as('load');
  return tx
    .select({
      userId: users.id,
      name: users.name,
      phone: users.phone,
      skills: sql<string[]>`coalesce(${technicianProfiles.skills}, '{}'::text[])`,
      homeLatitude: technicianProfiles.homeLatitude,
      homeLongitude: technicianProfiles.homeLongitude,
      openCalls: sql<number>`coalesce(${load.n}, 0)`,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(technicianProfiles, and(eq(technicianProfiles.tenantId, memberships.tenantId), eq(technicianProfiles.userId, users.id)))
    .leftJoin(load, eq(load.technicianId, users.id))
    .where(and(eq(memberships.tenantId, currentTenant), eq(memberships.role, 'technician')))
    .orderBy(users.name);
}

export async function isTechnician(tx: Tx, userId: string) {
  const [m] = await tx
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.tenantId, currentTenant), eq(memberships.userId, userId)));
  return m?.role === 'technician';
}

/**
 * The technician memberships of whoever has this phone number, in every company: an SMS reply names no
 * company, so a narrow SECURITY DEFINER function (drizzle/0003_…) finds them.
 */
export async function findTechniciansByPhone(db: Db, phone: string): Promise<{ tenantId: string; userId: string }[]> {
  const r = await db.execute<{ tenant_id: string; user_id: string }>(sql`select tenant_id, user_id from technicians_by_phone(${phone})`);
  return r.rows.map((row) => ({ tenantId: row.tenant_id, userId: row.user_id }));
}
