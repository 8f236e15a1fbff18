// A company with rows in every tenant-owned table: people of every role, a technician's profile, a venue
// contact, an open invitation, settings, calls (one down, one assigned) with their timeline, downtime,
// outbox messages and a photo, audit entries, and the bench: a board with its parts list, that board fitted in the
// first game with its cabinet's temperatures, a template, a job on the board with a reading, a part used and a photo;
// care and stock: a care plan with an open work order, the game's plays meter and a reading, a catalogue part fitting
// the board's fuse, a warehouse and a van with stock, a transfer and a part used, a keep-cost row, a route day and an
// applied change. Rows are arranged as the owner role or through the real query and service functions inside the
// company's row-level-security scope.
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
import {
  benchJobPartsUsed,
  benchJobPhotos,
  benchJobs,
  benchTemplates,
  boardInstances,
  boardParts,
  cabinetProfiles,
  modelBoards,
  partReadings,
  technicianProfiles,
  appliedChanges,
  carePlans,
  catalogueParts,
  gameMeters,
  keepCostEntries,
  meterReadings,
  partFits,
  partsUsed,
  routeDays,
  stockLevels,
  stockLocations,
  stockMovements,
  workOrders,
} from '@bumperline/db/schema/index';
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
  bench: BenchRows;
  care: CareRows;
}

/** The bench rows of a full company (arranged as the owner role). */
export interface BenchRows {
  /** A power-supply board of the company's model, with a parts list of one resistor (R1) and one fuse (F1). */
  modelBoardId: string;
  resistorPartId: string;
  fusePartId: string;
  /** That board fitted in the first game. */
  boardInstanceId: string;
  templateId: string;
  /** A job in progress on the board, with one reading of R1, a part used and a photo record. */
  benchJobId: string;
}

async function createBenchRows(db: TestDatabase, company: CompanyFixture, technicianId: string): Promise<BenchRows> {
  const { tenantId } = company;
  const [board] = await db.owner
    .insert(modelBoards)
    .values({ tenantId, modelId: company.modelId, name: 'Power supply', partNumber: 'PS-100' })
    .returning({ id: modelBoards.id });
  const boardId = board!.id;
  const parts = await db.owner
    .insert(boardParts)
    .values([
      { tenantId, boardId, position: 1, designator: 'R1', kind: 'resistor', value: '600', tolerance: '10%', rating: '1/2 W' },
      { tenantId, boardId, position: 2, designator: 'F1', kind: 'fuse', value: 'T2.5A 250V' },
    ])
    .returning({ id: boardParts.id, designator: boardParts.designator });
  const resistorPartId = parts.find((p) => p.designator === 'R1')!.id;
  const fusePartId = parts.find((p) => p.designator === 'F1')!.id;
  const [instance] = await db.owner
    .insert(boardInstances)
    .values({ tenantId, boardId, gameId: company.gameIds[0]!, serial: 'PS-0001', dateCode: '8934', madeOn: '1989-08-21' })
    .returning({ id: boardInstances.id });
  const boardInstanceId = instance!.id;
  await db.owner.insert(cabinetProfiles).values({
    tenantId,
    gameId: company.gameIds[0]!,
    slices: [
      { hours: 4, temperatureC: 35 },
      { hours: 6, temperatureC: 45 },
    ],
  });
  const steps = [
    {
      key: 'measure',
      title: 'Measure the resistors',
      instructions: 'Measure each resistor against the parts list.',
      record: 'readings' as const,
      partKinds: ['resistor' as const],
      designators: [],
      cautions: [],
    },
  ];
  const [template] = await db.owner
    .insert(benchTemplates)
    .values({ tenantId, name: 'Power supply check', steps })
    .returning({ id: benchTemplates.id });
  const [job] = await db.owner
    .insert(benchJobs)
    .values({
      tenantId,
      boardInstanceId,
      templateId: template!.id,
      templateName: 'Power supply check',
      steps,
      origin: 'game',
      openedBy: technicianId,
      draft: { steps: {}, partsUsed: [] },
    })
    .returning({ id: benchJobs.id });
  const benchJobId = job!.id;
  await db.owner.insert(partReadings).values({
    tenantId,
    boardInstanceId,
    partId: resistorPartId,
    benchJobId,
    measuredText: '570',
    measured: 570,
    unit: 'Ω',
    verdict: 'pass',
    min: 540,
    max: 660,
    deviationPercent: -5,
    takenBy: technicianId,
  });
  await db.owner
    .insert(benchJobPartsUsed)
    .values({ tenantId, jobId: benchJobId, partId: fusePartId, description: 'T2.5A 250V fuse', quantity: 1 });
  await db.owner.insert(benchJobPhotos).values({
    tenantId,
    jobId: benchJobId,
    stepKey: 'measure',
    storageKey: `bench/${benchJobId}/photo.jpg`,
    thumbKey: `bench/${benchJobId}/thumb.jpg`,
    contentType: 'image/jpeg',
    bytes: 1000,
    width: 40,
    height: 30,
    uploadedBy: technicianId,
  });
  return { modelBoardId: boardId, resistorPartId, fusePartId, boardInstanceId, templateId: template!.id, benchJobId };
}

/** The care-plan, meter, stock and route-day rows of a full company (arranged as the owner role). */
export interface CareRows {
  /** A monthly plan ("last Tuesday") on the company's model, with a plays trigger, done by the technician. */
  carePlanId: string;
  /** Its open work order on the first game, planned into the technician's route day for 2026-12-03. */
  workOrderId: string;
  /** A fuse in the catalogue that fits F1 of the bench board. */
  cataloguePartId: string;
  warehouseId: string;
  /** The technician's van: 4 of the fuse after one was used on the work order. */
  vanId: string;
}

async function createCareRows(db: TestDatabase, company: CompanyFixture, technicianId: string, bench: BenchRows): Promise<CareRows> {
  const { tenantId } = company;
  const gameId = company.gameIds[0]!;
  const [plan] = await db.owner
    .insert(carePlans)
    .values({
      tenantId,
      name: 'Monthly clean and check',
      scope: 'model',
      modelId: company.modelId,
      tasks: ['Clean the playfield', 'Check the flipper coil stops'],
      skills: ['pinball'],
      onSiteMinutes: 45,
      rule: 'FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1',
      ruleStart: '2026-01-27T09:00',
      playsEvery: 2000,
      technicianId,
    })
    .returning({ id: carePlans.id });
  const [order] = await db.owner
    .insert(workOrders)
    .values({
      tenantId,
      carePlanId: plan!.id,
      gameId,
      dueAt: new Date('2026-11-24T15:00:00Z'),
      dueReason: 'calendar',
      title: 'Monthly clean and check',
      tasks: ['Clean the playfield', 'Check the flipper coil stops'],
      skills: ['pinball'],
      onSiteMinutes: 45,
      technicianId,
      plannedOn: '2026-12-03',
    })
    .returning({ id: workOrders.id });
  await db.owner.insert(gameMeters).values({ tenantId, gameId, meter: 'plays', rollsOverAt: 1_000_000 });
  await db.owner
    .insert(meterReadings)
    .values({ tenantId, gameId, meter: 'plays', reading: 15_230, source: 'work_order', workOrderId: order!.id });
  const [part] = await db.owner
    .insert(catalogueParts)
    .values({
      tenantId,
      partNumber: 'F-T2.5A',
      description: 'Fuse T2.5A 250V 5×20 mm',
      kind: 'fuse',
      unitCostCents: 45,
      supplier: 'Parts house',
    })
    .returning({ id: catalogueParts.id });
  await db.owner.insert(partFits).values({ tenantId, cataloguePartId: part!.id, boardPartId: bench.fusePartId });
  const [warehouse] = await db.owner
    .insert(stockLocations)
    .values({ tenantId, kind: 'warehouse', name: 'Shop shelves' })
    .returning({ id: stockLocations.id });
  const [van] = await db.owner
    .insert(stockLocations)
    .values({ tenantId, kind: 'van', name: 'Technician van', technicianId })
    .returning({ id: stockLocations.id });
  await db.owner.insert(stockLevels).values([
    { tenantId, locationId: warehouse!.id, cataloguePartId: part!.id, quantity: 20, reorderPoint: 10, reorderQuantity: 50 },
    { tenantId, locationId: van!.id, cataloguePartId: part!.id, quantity: 4, reorderPoint: 2, reorderQuantity: 5 },
  ]);
  await db.owner.insert(stockMovements).values({
    tenantId,
    cataloguePartId: part!.id,
    reason: 'transfer',
    fromLocationId: warehouse!.id,
    toLocationId: van!.id,
    quantity: 5,
    unitCostCents: 45,
  });
  const [used] = await db.owner
    .insert(stockMovements)
    .values({
      tenantId,
      cataloguePartId: part!.id,
      reason: 'used',
      fromLocationId: van!.id,
      quantity: 1,
      unitCostCents: 45,
      workOrderId: order!.id,
    })
    .returning({ id: stockMovements.id });
  await db.owner.insert(partsUsed).values({
    tenantId,
    gameId,
    workOrderId: order!.id,
    cataloguePartId: part!.id,
    locationId: van!.id,
    quantity: 1,
    unitCostCents: 45,
    movementId: used!.id,
  });
  await db.owner.insert(keepCostEntries).values({
    tenantId,
    gameId,
    source: 'bench_job',
    sourceId: bench.benchJobId,
    partsCents: 45,
    labourMinutes: 90,
    labourRateCents: 4500,
    labourCents: 6750,
    technicianId,
  });
  await db.owner.insert(routeDays).values({ tenantId, technicianId, day: '2026-12-03', stopOrder: [company.venueIds[0]!] });
  await db.owner.insert(appliedChanges).values({
    tenantId,
    key: `fixture-${randomBytes(6).toString('hex')}`,
    userId: technicianId,
    method: 'POST',
    path: `/api/work-orders/${order!.id}/done`,
    status: 200,
    body: { ok: true },
  });
  return { carePlanId: plan!.id, workOrderId: order!.id, cataloguePartId: part!.id, warehouseId: warehouse!.id, vanId: van!.id };
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

  const bench = await createBenchRows(db, company, technician.id);
  const care = await createCareRows(db, company, technician.id, bench);

  return {
    ...company,
    bench,
    care,
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
