// Members of the current company and invitations to join it.
import { and, eq, gt, inArray, isNotNull, isNull, sql } from 'drizzle-orm';
import { withScope, type Db, type Tx } from '../client.ts';
import { invitations, memberships, users } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

type Role = (typeof memberships.$inferSelect)['role'];

export async function listMembers(tx: Tx) {
  return tx
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role, since: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.tenantId, currentTenant))
    .orderBy(users.name);
}

export async function getMember(tx: Tx, userId: string) {
  const [m] = await tx
    .select({ userId: memberships.userId, role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.tenantId, currentTenant), eq(memberships.userId, userId)));
  return m;
}

export async function countOwners(tx: Tx): Promise<number> {
  const [r] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(memberships)
    .where(and(eq(memberships.tenantId, currentTenant), eq(memberships.role, 'owner')));
  return r?.n ?? 0;
}

export async function setMemberRole(tx: Tx, userId: string, role: Role) {
  await tx
    .update(memberships)
    .set({ role })
    .where(and(eq(memberships.tenantId, currentTenant), eq(memberships.userId, userId)));
}

export async function removeMember(tx: Tx, userId: string) {
  await tx.delete(memberships).where(and(eq(memberships.tenantId, currentTenant), eq(memberships.userId, userId)));
}

export async function addMember(tx: Tx, userId: string, role: Role) {
  await tx
    .insert(memberships)
    .values({ tenantId: sql`${currentTenant}`, userId, role })
    .onConflictDoUpdate({ target: [memberships.tenantId, memberships.userId], set: { role } });
}

export async function listOpenInvitations(tx: Tx) {
  return tx
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      createdAt: invitations.createdAt,
    })
    .from(invitations)
    .where(and(eq(invitations.tenantId, currentTenant), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
    .orderBy(invitations.createdAt);
}

export async function insertInvitation(tx: Tx, v: { email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date }) {
  const [i] = await tx
    .insert(invitations)
    .values({ ...v, tenantId: sql`${currentTenant}` })
    .returning({ id: invitations.id });
  return i!.id;
}

export async function revokeInvitation(tx: Tx, id: string) {
  const r = await tx
    .update(invitations)
    .set({ revokedAt: new Date() })
    .where(and(eq(invitations.tenantId, currentTenant), eq(invitations.id, id), isNull(invitations.acceptedAt)))
    .returning({ id: invitations.id });
  return r.length > 0;
}

/**
 * Marks the invitation accepted if it is still open; false if not. The update takes the row's lock, so
 * of several simultaneous accepts one wins and the others, once it commits, find it taken.
 */
export async function claimInvitation(tx: Tx, id: string): Promise<boolean> {
  const claimed = await tx
    .update(invitations)
    .set({ acceptedAt: new Date() })
    .where(
      and(
        eq(invitations.tenantId, currentTenant),
        eq(invitations.id, id),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, sql`now()`),
      ),
    )
    .returning({ id: invitations.id });
  return claimed.length > 0;
}

export interface InvitationByToken {
  tenantId: string;
  id: string;
  email: string;
  role: Role;
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
  tenantName: string;
}

/**
 * Finds an invitation from its link alone: no company is known yet, so a narrow SECURITY DEFINER
 * function (drizzle/0001_…) looks it up by the token's hash.
 */
export async function findInvitationByTokenHash(db: Db, tokenHash: string): Promise<InvitationByToken | undefined> {
  const r = await withScope(db, {}, (tx) =>
    tx.execute<{
      tenant_id: string;
      id: string;
      email: string;
      role: Role;
      expires_at: string | Date;
      accepted_at: string | Date | null;
      revoked_at: string | Date | null;
      tenant_name: string;
    }>(sql`select * from invitation_by_token_hash(${tokenHash})`),
  );
  const row = r.rows[0];
  const at = (v: string | Date | null) => (v === null ? null : new Date(v));
  return (
    row && {
      tenantId: row.tenant_id,
      id: row.id,
      email: row.email,
      role: row.role,
      expiresAt: new Date(row.expires_at),
      acceptedAt: at(row.accepted_at),
      revokedAt: at(row.revoked_at),
      tenantName: row.tenant_name,
    }
  );
}

/** The mobile numbers of the company's members in these roles (those who gave one). */
export async function listMemberPhones(tx: Tx, roles: Role[]): Promise<string[]> {
  const rows = await tx
    .select({ phone: users.phone })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.tenantId, currentTenant), inArray(memberships.role, roles), isNotNull(users.phone)));
  return rows.map((r) => r.phone ?? '');
}
