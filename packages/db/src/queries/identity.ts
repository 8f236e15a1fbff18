// Sign-in state: people, their sessions, and the companies they belong to.
import { and, eq, isNull, sql } from 'drizzle-orm';
import type { Db, Tx } from '../client.ts';
import { withScope } from '../client.ts';
import { memberships, tenants, userSessions, users } from '../schema/index.ts';

export async function findUserByEmail(db: Db | Tx, email: string) {
  const [u] = await db
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = lower(${email})`);
  return u;
}

export async function findUserById(db: Db | Tx, id: string) {
  const [u] = await db.select().from(users).where(eq(users.id, id));
  return u;
}

/** A new account; undefined, with nothing written, when the address already has one. */
export async function insertUserIfNew(tx: Tx, u: { email: string; name: string; passwordHash: string }): Promise<string | undefined> {
  const [user] = await tx.insert(users).values(u).onConflictDoNothing().returning({ id: users.id });
  return user?.id;
}

export async function insertUser(
  tx: Tx,
  u: { email: string; name: string; passwordHash: string | null; emailVerifiedAt: Date },
): Promise<string> {
  const [user] = await tx.insert(users).values(u).returning({ id: users.id });
  return user!.id;
}

/** Changes the person's name or password; their id and address, or undefined for no such person. */
export async function updateUser(db: Db | Tx, id: string, patch: { name?: string; passwordHash?: string | null }) {
  const [u] = await db.update(users).set(patch).where(eq(users.id, id)).returning({ id: users.id, email: users.email });
  return u;
}

export async function createSession(db: Db, userId: string): Promise<string> {
  const companies = await listCompaniesOf(db, userId);
  const [s] = await db
    .insert(userSessions)
    .values({ userId, activeTenantId: companies[0]?.id ?? null })
    .returning({ id: userSessions.id });
  return s!.id;
}

export async function revokeSession(db: Db, sessionId: string): Promise<void> {
  await db.update(userSessions).set({ revokedAt: new Date() }).where(eq(userSessions.id, sessionId));
}

export async function revokeAllSessionsOf(db: Db | Tx, userId: string): Promise<void> {
  await db
    .update(userSessions)
    .set({ revokedAt: new Date() })
    .where(and(eq(userSessions.userId, userId), isNull(userSessions.revokedAt)));
}

/** The companies a person belongs to, read under their own user scope (RLS lets them see their memberships). */
export async function listCompaniesOf(db: Db, userId: string) {
  return withScope(db, { userId }, (tx) => listCompaniesIn(tx, userId));
}

/** The same, inside a transaction whose scope already names the person (app.user_id). */
export async function listCompaniesIn(tx: Tx, userId: string) {
  return tx
    .select({ id: tenants.id, name: tenants.name, role: memberships.role })
    .from(memberships)
    .innerJoin(tenants, eq(tenants.id, memberships.tenantId))
    .where(eq(memberships.userId, userId))
    .orderBy(tenants.name);
}

export interface SessionActor {
  sessionId: string;
  userId: string;
  email: string;
  name: string;
  /** The company the session works in: the one it chose while still a member, else the first by name. */
  tenantId: string | null;
  role: (typeof memberships.$inferSelect)['role'] | null;
  isPlatformAdmin: boolean;
}

/**
 * A live session with its person, company and role, in one statement (the SECURITY DEFINER function
 * session_actor, drizzle/0007_…); undefined when the session is revoked or unknown.
 */
export async function loadSessionActor(db: Db, sessionId: string): Promise<SessionActor | undefined> {
  const r = await db.execute<{
    session_id: string;
    user_id: string;
    email: string;
    name: string;
    tenant_id: string | null;
    role: SessionActor['role'];
    is_platform_admin: boolean;
  }>(sql`select * from session_actor(${sessionId}::uuid)`);
  const row = r.rows[0];
  return (
    row && {
      sessionId: row.session_id,
      userId: row.user_id,
      email: row.email,
      name: row.name,
      tenantId: row.tenant_id,
      role: row.role,
      isPlatformAdmin: row.is_platform_admin,
    }
  );
}

export async function setActiveCompany(db: Db, sessionId: string, tenantId: string | null): Promise<void> {
  await db.update(userSessions).set({ activeTenantId: tenantId, lastSeenAt: new Date() }).where(eq(userSessions.id, sessionId));
}
