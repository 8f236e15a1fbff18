// A company with rows in every tenant-owned table: people of every role, a technician's profile, a venue
// contact, an open invitation, settings, calls (one down, one assigned) with their timeline, downtime,
// outbox messages and a photo, and audit entries. Rows are arranged as the owner role or through the real
// query and service functions inside the company's row-level-security scope.
import { randomBytes } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import type { Role } from '@bumperline/contracts/roles';
import { withScope } from '@bumperline/db/client';
import { getSettings } from '@bumperline/db/queries/settings';
import { recordAudit } from '@bumperline/db/queries/audit';
import { insertInvitation } from '@bumperline/db/queries/team';
import { linkVenueContact } from '@bumperline/db/queries/venue-contacts';
import { technicianProfiles } from '@bumperline/db/schema/index';
import { newToken } from '@bumperline/api/auth/tokens';
import { preparePhoto, savePhoto } from '@bumperline/api/services/photo-intake';
import { folderPhotoStore, type PhotoStore } from '@bumperline/api/services/photo-store';
import { buildTestApp, signedInAgent, type Agent, type TestApp } from './app.ts';
import { addMember, addTechnician, assignServiceCall, openServiceCall } from './call-factories.ts';
import { createCompany, type CompanyFixture } from './factories.ts';
import type { TestDatabase } from './database.ts';

export interface Person {
  id: string;
  email: string;
}

export interface FullCompany extends CompanyFixture {
  dispatcher: Person;
  /** Has a mobile number, a profile (skills, home base) and the assigned call. */
  technician: Person & { phone: string };
  /** Speaks for the first venue (venueIds[0]). */
  venueContact: Person;
  /** An open invitation and the raw token of its link. */
  invitation: { id: string; token: string; email: string };
  /** A "dead" report on the first game: severity down, so the game has an open downtime interval. */
  downCallId: string;
  /** A call on the second game, assigned to the technician (their SMS waits in the outbox). */
  assignedCallId: string;
  /** A photo on the down call, stored in the given photo store. */
  photoId: string;
}

const randomPhone = () => `+1312555${String(1000 + (randomBytes(2).readUInt16BE() % 9000))}`;

/** A small JPEG, made the way a phone's picture is taken in: through the real photo preparation. */
async function samplePhoto() {
  const bytes = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#7a9' } })
    .jpeg()
    .toBuffer();
  return preparePhoto(bytes);
}

export async function createFullCompany(db: TestDatabase, name: string, photos: PhotoStore): Promise<FullCompany> {
  const company = await createCompany(db.owner, name, 2);
  const { tenantId } = company;
  const asOwner = { tenantId, userId: company.ownerId };

  const dispatcher = await addMember(db.owner, tenantId, 'dispatcher', null, `${name} Dispatcher`);
  const phone = randomPhone();
  const technician = await addTechnician(db.owner, tenantId, phone, `${name} Technician`);
  const venueContact = await addMember(db.owner, tenantId, 'venue_contact', null, `${name} Venue Contact`);
  await db.owner.insert(technicianProfiles).values({
    tenantId,
    userId: technician.id,
    skills: ['pinball'],
    homeLatitude: 41.9,
    homeLongitude: -87.65,
  });

  const invitation = await withScope(db.app, asOwner, async (tx) => {
    await getSettings(tx); // creates the company's settings row
    await linkVenueContact(tx, company.venueIds[0]!, venueContact.id);
    const email = `invited-${randomBytes(4).toString('hex')}@example.test`;
    const { token, hash } = newToken();
    const id = await insertInvitation(tx, {
      email,
      role: 'technician',
      tokenHash: hash,
      invitedBy: company.ownerId,
      expiresAt: new Date(Date.now() + 7 * 24 * 3600_000),
    });
    await recordAudit(tx, { actorUserId: company.ownerId, action: 'invite', entity: 'invitation', entityId: id, after: { email } });
    return { id, token, email };
  });

  // The venue contact of the first venue is e-mailed about this call (an outbox row).
  const downCallId = await openServiceCall(db, company, { gameId: company.gameIds[0]!, problem: 'dead' });
  const assignedCallId = await openServiceCall(db, company, { gameId: company.gameIds[1]!, problem: 'no_sound' });
  await assignServiceCall(db, company, assignedCallId, technician.id);

  const photo = await samplePhoto();
  const photoId = await withScope(db.app, asOwner, (tx) =>
    savePhoto(tx, photos, { callId: downCallId, photo, uploadedBy: 'reporter', actorLabel: 'reporter' }),
  );

  return {
    ...company,
    dispatcher: { id: dispatcher.id, email: dispatcher.email },
    technician: { id: technician.id, email: technician.email, phone },
    venueContact: { id: venueContact.id, email: venueContact.email },
    invitation,
    downCallId,
    assignedCallId,
    photoId,
  };
}

export interface FullCompanyApp {
  t: TestApp;
  company: FullCompany;
  /** An agent signed in as the company's person of each role, and one signed out. */
  agents: Record<Role | 'signed-out', Agent>;
  /** Closes the app and removes the company's photos. */
  close(): Promise<void>;
}

/** The test app (buildTestApp) with a full company in it, its photos in a folder of their own. */
export async function appWithFullCompany(name: string): Promise<FullCompanyApp> {
  const t = await buildTestApp();
  const photoDir = await mkdtemp(path.join(os.tmpdir(), 'bumperline-full-company-photos-'));
  const close = async () => {
    await t.close();
    await rm(photoDir, { recursive: true, force: true });
  };
  try {
    const company = await createFullCompany(t.db, name, folderPhotoStore(photoDir));
    const agents = {
      owner: await signedInAgent(t, company.ownerEmail),
      dispatcher: await signedInAgent(t, company.dispatcher.email),
      technician: await signedInAgent(t, company.technician.email),
      venue_contact: await signedInAgent(t, company.venueContact.email),
      'signed-out': request.agent(t.app),
    };
    return { t, company, agents, close };
  } catch (err) {
    await close();
    throw err;
  }
}
