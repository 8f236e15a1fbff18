// The company's technicians: skills, home base and open load for dispatch, and the narrow lookup that
// finds a technician from the phone number an SMS reply came from.
import { and, eq, sql } from 'drizzle-orm';
import { callStateGroups } from '@bumperline/contracts/calls';
import type { Db, Tx } from '../client.ts';
import { memberships, technicianProfiles, users } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

/** A Postgres array literal of the states that count towards a technician's load. */
const technicianLoadStates = `{${callStateGroups.technicianLoad.join(',')}}`;

/** Technicians of the company with their skills, home base, phone and open load. */
export async function listTechnicians(tx: Tx) {
  return tx
    .select({
      userId: users.id,
      name: users.name,
      phone: users.phone,
      skills: sql<string[]>`coalesce(${technicianProfiles.skills}, '{}'::text[])`,
      homeLatitude: technicianProfiles.homeLatitude,
      homeLongitude: technicianProfiles.homeLongitude,
      openCalls: sql<number>`(select count(*)::int from service_calls c where c.tenant_id = "memberships"."tenant_id" and c.technician_id = "users"."id" and c.state = any(${technicianLoadStates}::text[]))`,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(technicianProfiles, and(eq(technicianProfiles.tenantId, memberships.tenantId), eq(technicianProfiles.userId, users.id)))
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
