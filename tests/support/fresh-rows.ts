// Rows made fresh for one probe of an endpoint that changes what it touches, so that every probe (once per
// route, or once per role) meets the rows as they were made: a venue, an invitation, a call, a report
// through the game-tag page. Arranged as the owner role, or through the real query and service functions
// inside the company's row-level-security scope, or through the app itself.
import { randomBytes } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import request from 'supertest';
import { withScope } from '@bumperline/db/client';
import { insertInvitation } from '@bumperline/db/queries/team';
import { linkVenueContact } from '@bumperline/db/queries/venue-contacts';
import { callPhotos, games, serviceCalls, venues } from '@bumperline/db/schema/index';
import { newToken } from '@bumperline/api/auth/tokens';
import { ORIGIN, type TestApp } from './app.ts';
import { addGame, assignServiceCall, openServiceCall } from './call-factories.ts';
import type { CompanyFixture } from './factories.ts';
import type { FullCompany } from './full-company.ts';
import type { TestDatabase } from './database.ts';

let serial = 0;
/** A name no other probe of the run has used. */
export const unique = (prefix: string) => `${prefix}-${++serial}-${randomBytes(3).toString('hex')}`;

const asOwner = (company: CompanyFixture) => ({ tenantId: company.tenantId, userId: company.ownerId });

export async function freshVenue(db: TestDatabase, company: CompanyFixture): Promise<string> {
  const [v] = await db.owner
    .insert(venues)
    .values({
      tenantId: company.tenantId,
      name: unique('Venue'),
      addressLine: '9 Probe Street',
      city: 'Testville',
      latitude: 41.9,
      longitude: -87.6,
    })
    .returning({ id: venues.id });
  return v!.id;
}

/** A new venue the company's venue contact speaks for. */
export async function freshContactVenue(db: TestDatabase, company: FullCompany): Promise<string> {
  const venueId = await freshVenue(db, company);
  await withScope(db.app, asOwner(company), (tx) => linkVenueContact(tx, venueId, company.venueContact.id));
  return venueId;
}

/** An open invitation (for a technician, valid for a day) and the raw token of its link. */
export async function freshInvitation(db: TestDatabase, company: CompanyFixture): Promise<{ id: string; token: string }> {
  const { token, hash } = newToken();
  const id = await withScope(db.app, asOwner(company), (tx) =>
    insertInvitation(tx, {
      email: `${unique('invited')}@example.test`,
      role: 'technician',
      tokenHash: hash,
      invitedBy: company.ownerId,
      expiresAt: new Date(Date.now() + 24 * 3600_000),
    }),
  );
  return { id, token };
}

/** A new call (at version 1) on a new game of its own. */
export const freshCall = (db: TestDatabase, company: CompanyFixture) => openServiceCall(db, company, { problem: 'no_sound' });

/** A new call assigned to the company's technician, and its version after the assignment. */
export async function freshAssignedCall(db: TestDatabase, company: FullCompany): Promise<{ id: string; version: number }> {
  const id = await freshCall(db, company);
  const view = await assignServiceCall(db, company, id, company.technician.id);
  return { id, version: view.version };
}

export interface TagReport {
  gameId: string;
  tagToken: string;
  /** The token of the reporter's status link (from the page the report redirects to). */
  statusToken: string;
  callId: string;
  photoId: string;
}

/**
 * A report with a photo sent through the game-tag page, on a new game of its own (problem "dead", with the
 * other form fields given), so that the app's own photo store holds the file.
 */
export async function reportThroughTag(t: TestApp, company: CompanyFixture, fields: Record<string, string> = {}): Promise<TagReport> {
  const gameId = await addGame(t.db, company);
  const [game] = await t.db.owner
    .select({ tagToken: games.tagToken })
    .from(games)
    .where(and(eq(games.tenantId, company.tenantId), eq(games.id, gameId)));
  const photo = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#79a' } })
    .jpeg()
    .toBuffer();
  let form = request(t.app).post(`/t/${game!.tagToken}`).field('problem', 'dead');
  for (const [name, value] of Object.entries(fields)) form = form.field(name, value);
  const sent = await form.attach('photo', photo, { filename: 'cabinet.jpg', contentType: 'image/jpeg' }).expect(303);
  const statusToken = new URL(sent.headers.location as string, ORIGIN).searchParams.get('call')!;
  const [row] = await t.db.owner
    .select({ callId: serviceCalls.id, photoId: callPhotos.id })
    .from(serviceCalls)
    .innerJoin(callPhotos, and(eq(callPhotos.tenantId, serviceCalls.tenantId), eq(callPhotos.callId, serviceCalls.id)))
    .where(and(eq(serviceCalls.tenantId, company.tenantId), eq(serviceCalls.gameId, gameId)));
  return { gameId, tagToken: game!.tagToken, statusToken, callId: row!.callId, photoId: row!.photoId };
}
