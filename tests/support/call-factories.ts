// Service-call fixtures: staff with mobile numbers (arranged as the owner role), and calls opened and
// assigned through the real service functions inside the company's row-level-security scope.
import { randomBytes } from 'node:crypto';
import { and, asc, eq } from 'drizzle-orm';
import { withScope, type Db } from '@bumperline/db/client';
import { getCallRow } from '@bumperline/db/queries/calls';
import { callEvents, games, outbox, serviceCalls } from '@bumperline/db/schema/index';
import { assignCall, openCall } from '@bumperline/api/services/service-calls';
import type { ProblemKind, Severity } from '@bumperline/contracts/calls';
import { createMember, type CompanyFixture, type MemberRole } from './factories.ts';
import { ORIGIN } from './app.ts';
import type { TestDatabase } from './database.ts';

/** A person in the company with this role and (optionally) a mobile number. */
export function addMember(owner: Db, tenantId: string, role: MemberRole, phone: string | null = null, name = `Test ${role}`) {
  return createMember(owner, tenantId, role, { name, phone });
}

export function addTechnician(owner: Db, tenantId: string, phone: string | null, name = 'Test Technician') {
  return addMember(owner, tenantId, 'technician', phone, name);
}

/** A new game on one of the company's venues: a call opened on it stands alone (no earlier call to join). */
export async function addGame(db: TestDatabase, company: CompanyFixture, venueIndex = 0): Promise<string> {
  const [game] = await db.owner
    .insert(games)
    .values({
      tenantId: company.tenantId,
      modelId: company.modelId,
      venueId: company.venueIds[venueIndex]!,
      serial: `SN-${randomBytes(4).toString('hex')}`,
      tagToken: randomBytes(16).toString('base64url'),
    })
    .returning({ id: games.id });
  return game!.id;
}

/** Opens a call (on a new game unless one is given) as the company's owner, through the service and RLS. */
export async function openServiceCall(
  db: TestDatabase,
  company: CompanyFixture,
  opts: { gameId?: string; problem?: ProblemKind; severity?: Severity; now?: Date } = {},
): Promise<string> {
  const gameId = opts.gameId ?? (await addGame(db, company));
  const opened = await withScope(db.app, { tenantId: company.tenantId, userId: company.ownerId }, (tx) =>
    openCall(tx, {
      gameId,
      problem: opts.problem ?? 'dead',
      severity: opts.severity,
      note: '',
      source: 'staff',
      actor: { userId: company.ownerId, role: 'owner', label: 'Test owner' },
      appOrigin: ORIGIN,
      now: opts.now,
    }),
  );
  return opened.callId;
}

/** Assigns the call (at its current version) as the company's owner; the technician's SMS lands in the outbox. */
export async function assignServiceCall(db: TestDatabase, company: CompanyFixture, callId: string, technicianId: string | null) {
  return withScope(db.app, { tenantId: company.tenantId, userId: company.ownerId }, async (tx) => {
    const call = (await getCallRow(tx, callId))!;
    return assignCall(tx, {
      callId,
      technicianId,
      version: call.version,
      actor: { userId: company.ownerId, role: 'owner', label: 'Test owner' },
      appOrigin: ORIGIN,
    });
  });
}

/** Outbox rows of one company, oldest first (read as the owner role, across row-level security). */
export function outboxRows(owner: Db, tenantId: string) {
  return owner.select().from(outbox).where(eq(outbox.tenantId, tenantId)).orderBy(asc(outbox.createdAt), asc(outbox.id));
}

export async function callRow(owner: Db, tenantId: string, callId: string) {
  const [row] = await owner
    .select()
    .from(serviceCalls)
    .where(and(eq(serviceCalls.tenantId, tenantId), eq(serviceCalls.id, callId)));
  return row!;
}

export function callEventKinds(owner: Db, tenantId: string, callId: string) {
  return owner
    .select({ kind: callEvents.kind, actorLabel: callEvents.actorLabel, detail: callEvents.detail })
    .from(callEvents)
    .where(and(eq(callEvents.tenantId, tenantId), eq(callEvents.callId, callId)))
    .orderBy(asc(callEvents.at), asc(callEvents.id));
}
