// Every endpoint under /api against the contract the web app is typed from (packages/contracts): each is
// called once with real rows, and its actual answer must parse with its response schema. The schemas are
// strict objects, so a field the contract does not name (a new column, a leaked secret) fails here as
// surely as a missing or mistyped one. Endpoints that answer no JSON say so in the table.
// A new /api route fails this file until it is added to the table below.
import type { Response } from 'supertest';
import { z } from 'zod';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { activityPage } from '@bumperline/contracts/activity';
import { mailSentIfKnown, me, signUpAnswered } from '@bumperline/contracts/auth';
import {
  callDetail,
  callPage,
  callPhotoAdded,
  noteAdded,
  openedCall,
  rankedTechnicianList,
  serviceCall,
  technicianList,
} from '@bumperline/contracts/calls';
import { problemDetails } from '@bumperline/contracts/common';
import { company as companyResponse } from '@bumperline/contracts/company';
import {
  downtimeList,
  game,
  gameDetail,
  gameModel,
  gameModelList,
  gamePage,
  gameSummary,
  tagRegenerated,
} from '@bumperline/contracts/games';
import { health } from '@bumperline/contracts/health';
import { boardPartsList, modelBoard, modelBoardList, partsListsOverview } from '@bumperline/contracts/parts-lists';
import { boardInstance, boardPage, cabinetProfile, gameBoards, recapFleet } from '@bumperline/contracts/boards';
import {
  benchDraftSaved,
  benchJob,
  benchJobPage,
  benchPhotoUploaded,
  benchTemplate,
  benchTemplateList,
} from '@bumperline/contracts/bench-jobs';
import { companySettings } from '@bumperline/contracts/settings';
import { invitationAccepted, invitationInfo, invitationSent, memberRoleChanged, team } from '@bumperline/contracts/team';
import { venueReportOpened, venueView } from '@bumperline/contracts/venue-view';
import { venue, venueContactList, venueContactsLinked, venuePage } from '@bumperline/contracts/venues';
import { issueEmailToken } from '@bumperline/db/queries/email-tokens';
import { JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import { addGame, addMember } from '../support/call-factories.ts';
import { createUser, TEST_PASSWORD } from '../support/factories.ts';
import {
  freshAssignedCall,
  freshCall,
  freshContactVenue,
  freshInvitation,
  freshVenue,
  reportThroughTag,
  unique,
  type TagReport,
} from '../support/fresh-rows.ts';
import { benchPhotoOnce, emptyBenchDraft, freshBenchJob, samplePng, sendBenchPhoto } from '../support/bench-rows.ts';
import { appWithFullCompany, type FullCompany } from '../support/full-company.ts';
import { listRoutes } from '../support/route-list.ts';
import { freshPlannedStop, freshRouteDay } from '../support/route-day-rows.ts';
import { routeDay, routeDayBoard, stopMoved } from '@bumperline/contracts/route-days';
import {
  boardCatalogueFitList,
  cataloguePage,
  cataloguePart,
  cataloguePartDetail,
  partFitList,
} from '@bumperline/contracts/parts-catalogue';
import {
  myVan,
  reorderList,
  stockChange,
  stockLevel,
  stockLevelPage,
  stockLocation,
  stockLocationList,
  stockMovementPage,
} from '@bumperline/contracts/stock';
import { partUsed, partsUsedList } from '@bumperline/contracts/parts-used';
import { freshWorkOrder } from '../support/stock-rows.ts';
import { carePlan, carePlanDetail, carePlanPage } from '@bumperline/contracts/care-plans';
import { workOrder, workOrderPage } from '@bumperline/contracts/work-orders';
import { gameKeepCost, gameMeterList, latestMeterReadings, meterReading } from '@bumperline/contracts/meters';
import { carePlans, workOrders } from '@bumperline/db/schema/index';

type Caller = 'owner' | 'technician' | 'venue_contact' | 'signed-out';

interface Endpoint {
  /** Who calls it: the owner may do everything staff can; the others own what only they can do. */
  as: Caller;
  /** The request, with real ids; rows it changes are made fresh for it. */
  probe: (agent: Agent) => PromiseLike<Response>;
  status: number;
  /** The response schema from the contracts; or no body (204), or a page or a file rather than JSON. */
  answer: z.ZodType | 'no-content' | 'html' | 'image' | 'csv' | 'pdf';
}

let t: TestApp;
let company: FullCompany;
let agents: Record<Caller, Agent>;
let close: () => Promise<void>;
/** A report with a photo sent through the game-tag page, so that the app's own photo store holds the file. */
let reported: TagReport;

const DAY_MS = 24 * 3600_000;

/** The token of a link we would have mailed to a new person (whose address nobody has confirmed yet). */
async function freshEmailToken(purpose: 'verify-email' | 'password-reset'): Promise<string> {
  const user = await createUser(t.db.owner, { emailVerifiedAt: null });
  return issueEmailToken(t.db.app, user.id, purpose, DAY_MS);
}

const endpoints: Record<string, Endpoint> = {
  // No sign-in.
  'GET /api/health': { as: 'signed-out', status: 200, answer: health, probe: (a) => a.get('/api/health') },
  'POST /api/account/sign-up': {
    as: 'signed-out',
    status: 202,
    answer: signUpAnswered,
    probe: (a) =>
      a
        .post('/api/account/sign-up')
        .set(JSON_HEADERS)
        .send({
          companyName: unique('Company'),
          name: 'New Owner',
          email: `${unique('owner')}@example.test`,
          password: 'a long enough passphrase',
        }),
  },
  'POST /api/account/verify-email': {
    as: 'signed-out',
    status: 204,
    answer: 'no-content',
    probe: async (a) =>
      a
        .post('/api/account/verify-email')
        .set(JSON_HEADERS)
        .send({ token: await freshEmailToken('verify-email'), password: TEST_PASSWORD }),
  },
  'POST /api/account/verify-email/resend': {
    as: 'signed-out',
    status: 202,
    answer: mailSentIfKnown,
    probe: (a) => a.post('/api/account/verify-email/resend').set(JSON_HEADERS).send({ email: company.dispatcher.email }),
  },
  'POST /api/account/password-reset': {
    as: 'signed-out',
    status: 202,
    answer: mailSentIfKnown,
    probe: (a) => a.post('/api/account/password-reset').set(JSON_HEADERS).send({ email: company.dispatcher.email }),
  },
  'POST /api/account/password-reset/confirm': {
    as: 'signed-out',
    status: 204,
    answer: 'no-content',
    probe: async (a) =>
      a
        .post('/api/account/password-reset/confirm')
        .set(JSON_HEADERS)
        .send({ token: await freshEmailToken('password-reset'), password: 'a long enough passphrase' }),
  },
  'POST /api/account/sign-in-link': {
    as: 'signed-out',
    status: 202,
    answer: mailSentIfKnown,
    probe: (a) => a.post('/api/account/sign-in-link').set(JSON_HEADERS).send({ email: company.venueContact.email }),
  },
  'GET /api/invitations/:token': {
    as: 'signed-out',
    status: 200,
    answer: invitationInfo,
    probe: (a) => a.get(`/api/invitations/${company.invitation.token}`),
  },
  'POST /api/invitations/:token/accept': {
    as: 'signed-out',
    status: 201,
    answer: invitationAccepted,
    probe: async (a) =>
      a
        .post(`/api/invitations/${(await freshInvitation(t.db, company)).token}/accept`)
        .set(JSON_HEADERS)
        .send({ name: 'New Person', password: 'a long enough passphrase' }),
  },

  // The signed-in person and their company.
  'GET /api/account/me': { as: 'owner', status: 200, answer: me, probe: (a) => a.get('/api/account/me') },
  'POST /api/account/me/company': {
    as: 'owner',
    status: 204,
    answer: 'no-content',
    probe: (a) => a.post('/api/account/me/company').set(JSON_HEADERS).send({ tenantId: company.tenantId }),
  },
  'GET /api/company': { as: 'owner', status: 200, answer: companyResponse, probe: (a) => a.get('/api/company') },
  'PATCH /api/company': {
    as: 'owner',
    status: 200,
    answer: companyResponse,
    probe: (a) => a.patch('/api/company').set(JSON_HEADERS).send({ locale: 'en-US' }),
  },
  'GET /api/activity': { as: 'owner', status: 200, answer: activityPage, probe: (a) => a.get('/api/activity') },
  'GET /api/settings': { as: 'owner', status: 200, answer: companySettings, probe: (a) => a.get('/api/settings') },
  'PATCH /api/settings': {
    as: 'owner',
    status: 200,
    answer: companySettings,
    probe: (a) => a.patch('/api/settings').set(JSON_HEADERS).send({ warnBeforeMinutes: 30 }),
  },

  // The team.
  'GET /api/team': { as: 'owner', status: 200, answer: team, probe: (a) => a.get('/api/team') },
  'POST /api/team/invitations': {
    as: 'owner',
    status: 201,
    answer: invitationSent,
    probe: (a) =>
      a
        .post('/api/team/invitations')
        .set(JSON_HEADERS)
        .send({ email: `${unique('invite')}@example.test`, role: 'technician' }),
  },
  'DELETE /api/team/invitations/:id': {
    as: 'owner',
    status: 204,
    answer: 'no-content',
    probe: async (a) => a.delete(`/api/team/invitations/${(await freshInvitation(t.db, company)).id}`).set(JSON_HEADERS),
  },
  'PATCH /api/team/members/:id': {
    as: 'owner',
    status: 200,
    answer: memberRoleChanged,
    probe: async (a) => {
      const member = await addMember(t.db.owner, company.tenantId, 'technician');
      return a.patch(`/api/team/members/${member.id}`).set(JSON_HEADERS).send({ role: 'dispatcher' });
    },
  },
  'DELETE /api/team/members/:id': {
    as: 'owner',
    status: 204,
    answer: 'no-content',
    probe: async (a) => {
      const member = await addMember(t.db.owner, company.tenantId, 'technician');
      return a.delete(`/api/team/members/${member.id}`).set(JSON_HEADERS);
    },
  },

  // Venues.
  'GET /api/venues': { as: 'owner', status: 200, answer: venuePage, probe: (a) => a.get('/api/venues') },
  'GET /api/venues/:id': { as: 'owner', status: 200, answer: venue, probe: (a) => a.get(`/api/venues/${company.venueIds[0]}`) },
  'POST /api/venues': {
    as: 'owner',
    status: 201,
    answer: venue,
    probe: (a) =>
      a
        .post('/api/venues')
        .set(JSON_HEADERS)
        .send({
          name: unique('New venue'),
          addressLine: '1 Probe Street',
          city: 'Testville',
          latitude: 41.9,
          longitude: -87.6,
          openingHours: { '5': [{ open: '16:00', close: '02:00' }] },
        }),
  },
  'PATCH /api/venues/:id': {
    as: 'owner',
    status: 200,
    answer: venue,
    probe: async (a) =>
      a
        .patch(`/api/venues/${await freshVenue(t.db, company)}`)
        .set(JSON_HEADERS)
        .send({ version: 1, notes: 'Back door' }),
  },
  'POST /api/venues/:id/retire': {
    as: 'owner',
    status: 200,
    answer: venue,
    probe: async (a) => a.post(`/api/venues/${await freshVenue(t.db, company)}/retire`).set(JSON_HEADERS),
  },
  'GET /api/venues/:id/contacts': {
    as: 'owner',
    status: 200,
    answer: venueContactList,
    probe: (a) => a.get(`/api/venues/${company.venueIds[0]}/contacts`),
  },
  'POST /api/venues/:id/contacts': {
    as: 'owner',
    status: 201,
    answer: venueContactsLinked,
    probe: async (a) =>
      a
        .post(`/api/venues/${await freshVenue(t.db, company)}/contacts`)
        .set(JSON_HEADERS)
        .send({ userId: company.venueContact.id }),
  },
  'DELETE /api/venues/:id/contacts/:userId': {
    as: 'owner',
    status: 204,
    answer: 'no-content',
    probe: async (a) => {
      const venueId = await freshContactVenue(t.db, company);
      return a.delete(`/api/venues/${venueId}/contacts/${company.venueContact.id}`).set(JSON_HEADERS);
    },
  },
  'GET /api/venues/:id/tag-sheet': {
    as: 'owner',
    status: 200,
    answer: 'html',
    probe: (a) => a.get(`/api/venues/${company.venueIds[0]}/tag-sheet`),
  },

  // Games and models.
  'GET /api/games': { as: 'owner', status: 200, answer: gamePage, probe: (a) => a.get('/api/games') },
  'GET /api/games/summary': { as: 'owner', status: 200, answer: gameSummary, probe: (a) => a.get('/api/games/summary') },
  'GET /api/games/:id': { as: 'owner', status: 200, answer: gameDetail, probe: (a) => a.get(`/api/games/${company.gameIds[0]}`) },
  'GET /api/games/:id/downtime': {
    as: 'owner',
    status: 200,
    answer: downtimeList,
    probe: (a) => a.get(`/api/games/${company.gameIds[0]}/downtime`),
  },
  'POST /api/games': {
    as: 'owner',
    status: 201,
    answer: game,
    probe: (a) =>
      a
        .post('/api/games')
        .set(JSON_HEADERS)
        .send({ modelId: company.modelId, venueId: company.venueIds[1], serial: unique('SN'), installedOn: '2024-03-01' }),
  },
  'PATCH /api/games/:id': {
    as: 'owner',
    status: 200,
    answer: game,
    probe: async (a) =>
      a
        .patch(`/api/games/${await addGame(t.db, company)}`)
        .set(JSON_HEADERS)
        .send({ version: 1, notes: 'Coin door sticks' }),
  },
  'POST /api/games/:id/retire': {
    as: 'owner',
    status: 200,
    answer: game,
    probe: async (a) => a.post(`/api/games/${await addGame(t.db, company)}/retire`).set(JSON_HEADERS),
  },
  'POST /api/games/:id/regenerate-tag': {
    as: 'owner',
    status: 200,
    answer: tagRegenerated,
    probe: async (a) => a.post(`/api/games/${await addGame(t.db, company)}/regenerate-tag`).set(JSON_HEADERS),
  },
  'GET /api/models': { as: 'owner', status: 200, answer: gameModelList, probe: (a) => a.get('/api/models') },
  'POST /api/models': {
    as: 'owner',
    status: 201,
    answer: gameModel,
    probe: (a) =>
      a
        .post('/api/models')
        .set(JSON_HEADERS)
        .send({ maker: 'Probeworks', title: unique('Model'), kind: 'darts' }),
  },

  // Models' boards and their parts lists.
  'GET /api/parts-lists': { as: 'owner', status: 200, answer: partsListsOverview, probe: (a) => a.get('/api/parts-lists') },
  'GET /api/models/:modelId/boards': {
    as: 'owner',
    status: 200,
    answer: modelBoardList,
    probe: (a) => a.get(`/api/models/${company.modelId}/boards`),
  },
  'POST /api/models/:modelId/boards': {
    as: 'owner',
    status: 201,
    answer: modelBoard,
    probe: (a) =>
      a
        .post(`/api/models/${company.modelId}/boards`)
        .set(JSON_HEADERS)
        .send({ name: unique('Sound board'), partNumber: 'SB-2' }),
  },
  'GET /api/boards/:boardId': {
    as: 'owner',
    status: 200,
    answer: boardPartsList,
    probe: (a) => a.get(`/api/boards/${company.bench.modelBoardId}`),
  },
  'PATCH /api/boards/:boardId': {
    as: 'owner',
    status: 200,
    answer: modelBoard,
    probe: (a) => a.patch(`/api/boards/${company.bench.modelBoardId}`).set(JSON_HEADERS).send({ partNumber: 'PS-100A' }),
  },
  'PUT /api/boards/:boardId/parts': {
    as: 'owner',
    status: 200,
    answer: boardPartsList,
    probe: async (a) => {
      const { body } = await a.get(`/api/boards/${company.bench.modelBoardId}`);
      return a.put(`/api/boards/${company.bench.modelBoardId}/parts`).set(JSON_HEADERS).send({ version: body.version, parts: body.parts });
    },
  },
  'GET /api/boards/:boardId/parts.csv': {
    as: 'owner',
    status: 200,
    answer: 'csv',
    probe: (a) => a.get(`/api/boards/${company.bench.modelBoardId}/parts.csv`),
  },

  // Boards fitted in games, cabinet profiles, the recap list.
  'GET /api/games/:gameId/boards': {
    as: 'owner',
    status: 200,
    answer: gameBoards,
    probe: (a) => a.get(`/api/games/${company.gameIds[0]}/boards`),
  },
  'POST /api/games/:gameId/boards': {
    as: 'owner',
    status: 201,
    answer: boardInstance,
    probe: (a) =>
      a
        .post(`/api/games/${company.gameIds[0]}/boards`)
        .set(JSON_HEADERS)
        .send({ boardId: company.bench.modelBoardId, serial: unique('PS'), dateCode: '2012' }),
  },
  'GET /api/board-instances/:id': {
    as: 'owner',
    status: 200,
    answer: boardPage,
    probe: (a) => a.get(`/api/board-instances/${company.bench.boardInstanceId}`),
  },
  'PATCH /api/board-instances/:id': {
    as: 'owner',
    status: 200,
    answer: boardInstance,
    probe: async (a) => {
      const { body } = await a.get(`/api/board-instances/${company.bench.boardInstanceId}`);
      return a
        .patch(`/api/board-instances/${company.bench.boardInstanceId}`)
        .set(JSON_HEADERS)
        .send({ version: body.instance.version, lastRecapOn: '2015-06-01' });
    },
  },
  'GET /api/games/:gameId/cabinet-profile': {
    as: 'owner',
    status: 200,
    answer: cabinetProfile,
    probe: (a) => a.get(`/api/games/${company.gameIds[1]}/cabinet-profile`),
  },
  'PUT /api/games/:gameId/cabinet-profile': {
    as: 'owner',
    status: 200,
    answer: cabinetProfile,
    probe: (a) =>
      a
        .put(`/api/games/${company.gameIds[0]}/cabinet-profile`)
        .set(JSON_HEADERS)
        .send({ slices: [{ hours: 12, temperatureC: 40 }] }),
  },
  // A page of one, so the answer carries a next cursor too.
  'GET /api/recap-due': { as: 'owner', status: 200, answer: recapFleet, probe: (a) => a.get('/api/recap-due?limit=1') },

  // Bench-job templates and bench jobs.
  'GET /api/bench-templates': { as: 'owner', status: 200, answer: benchTemplateList, probe: (a) => a.get('/api/bench-templates') },
  'POST /api/bench-templates': {
    as: 'owner',
    status: 201,
    answer: benchTemplate,
    probe: (a) =>
      a
        .post('/api/bench-templates')
        .set(JSON_HEADERS)
        .send({
          name: unique('Template'),
          steps: [{ key: 'measure', title: 'Measure', record: 'readings', partKinds: ['resistor'], cautions: [] }],
        }),
  },
  'GET /api/bench-templates/:id': {
    as: 'owner',
    status: 200,
    answer: benchTemplate,
    probe: (a) => a.get(`/api/bench-templates/${company.bench.templateId}`),
  },
  'PUT /api/bench-templates/:id': {
    as: 'owner',
    status: 200,
    answer: benchTemplate,
    probe: async (a) => {
      const { body } = await a.get(`/api/bench-templates/${company.bench.templateId}`);
      return a
        .put(`/api/bench-templates/${company.bench.templateId}`)
        .set(JSON_HEADERS)
        .send({ version: body.version, name: body.name, description: 'Edited', steps: body.steps });
    },
  },
  'GET /api/bench-templates/:id/sheet.pdf': {
    as: 'owner',
    status: 200,
    answer: 'pdf',
    probe: (a) => a.get(`/api/bench-templates/${company.bench.templateId}/sheet.pdf`).query({ boardId: company.bench.modelBoardId }),
  },
  // Parts catalogue, stocks, parts used.
  'GET /api/parts': { as: 'owner', status: 200, answer: cataloguePage, probe: (a) => a.get(`/api/parts?locationId=${company.care.vanId}`) },
  'GET /api/parts/:id': {
    as: 'owner',
    status: 200,
    answer: cataloguePartDetail,
    probe: (a) => a.get(`/api/parts/${company.care.cataloguePartId}`),
  },
  'POST /api/parts': {
    as: 'owner',
    status: 201,
    answer: cataloguePart,
    probe: (a) =>
      a
        .post('/api/parts')
        .set(JSON_HEADERS)
        .send({ partNumber: unique('P'), description: 'Fuse F1A', kind: 'fuse', unitCostCents: 30 }),
  },
  'PATCH /api/parts/:id': {
    as: 'owner',
    status: 200,
    answer: cataloguePart,
    probe: async (a) => {
      const { body } = await a
        .post('/api/parts')
        .set(JSON_HEADERS)
        .send({ partNumber: unique('P'), description: 'Fuse', kind: 'fuse', unitCostCents: 30 });
      return a.patch(`/api/parts/${body.id}`).set(JSON_HEADERS).send({ version: 1, unitCostCents: 35 });
    },
  },
  'POST /api/parts/:id/retire': {
    as: 'owner',
    status: 200,
    answer: cataloguePart,
    probe: async (a) => {
      const { body } = await a
        .post('/api/parts')
        .set(JSON_HEADERS)
        .send({ partNumber: unique('P'), description: 'Old', kind: 'other', unitCostCents: 1 });
      return a.post(`/api/parts/${body.id}/retire`).set(JSON_HEADERS);
    },
  },
  'POST /api/parts/:id/fits': {
    as: 'owner',
    status: 201,
    answer: partFitList,
    probe: (a) =>
      a.post(`/api/parts/${company.care.cataloguePartId}/fits`).set(JSON_HEADERS).send({ boardPartId: company.bench.resistorPartId }),
  },
  'DELETE /api/parts/:id/fits/:boardPartId': {
    as: 'owner',
    status: 200,
    answer: partFitList,
    probe: async (a) => {
      await a.post(`/api/parts/${company.care.cataloguePartId}/fits`).set(JSON_HEADERS).send({ boardPartId: company.bench.resistorPartId });
      return a.delete(`/api/parts/${company.care.cataloguePartId}/fits/${company.bench.resistorPartId}`).set(JSON_HEADERS);
    },
  },
  'GET /api/boards/:boardId/catalogue-fits': {
    as: 'technician',
    status: 200,
    answer: boardCatalogueFitList,
    probe: (a) => a.get(`/api/boards/${company.bench.modelBoardId}/catalogue-fits`),
  },
  'GET /api/stock/locations': { as: 'owner', status: 200, answer: stockLocationList, probe: (a) => a.get('/api/stock/locations') },
  'POST /api/stock/locations': {
    as: 'owner',
    status: 201,
    answer: stockLocation,
    probe: (a) =>
      a
        .post('/api/stock/locations')
        .set(JSON_HEADERS)
        .send({ kind: 'warehouse', name: unique('Shelves') }),
  },
  'GET /api/stock/locations/:id': {
    as: 'owner',
    status: 200,
    answer: stockLocation,
    probe: (a) => a.get(`/api/stock/locations/${company.care.vanId}`),
  },
  'PATCH /api/stock/locations/:id': {
    as: 'owner',
    status: 200,
    answer: stockLocation,
    probe: (a) => a.patch(`/api/stock/locations/${company.care.warehouseId}`).set(JSON_HEADERS).send({ name: 'Shop shelves' }),
  },
  'POST /api/stock/locations/:id/retire': {
    as: 'owner',
    status: 200,
    answer: stockLocation,
    probe: async (a) => {
      const { body } = await a
        .post('/api/stock/locations')
        .set(JSON_HEADERS)
        .send({ kind: 'warehouse', name: unique('Old') });
      return a.post(`/api/stock/locations/${body.id}/retire`).set(JSON_HEADERS);
    },
  },
  'GET /api/stock/locations/:id/levels': {
    as: 'owner',
    status: 200,
    answer: stockLevelPage,
    probe: (a) => a.get(`/api/stock/locations/${company.care.warehouseId}/levels`),
  },
  'PUT /api/stock/locations/:id/levels/:partId': {
    as: 'owner',
    status: 200,
    answer: stockLevel,
    probe: async (a) => {
      const { body } = await a
        .post('/api/parts')
        .set(JSON_HEADERS)
        .send({ partNumber: unique('P'), description: 'New', kind: 'fuse', unitCostCents: 5 });
      return a
        .put(`/api/stock/locations/${company.care.warehouseId}/levels/${body.id}`)
        .set(JSON_HEADERS)
        .send({ reorderPoint: 2, reorderQuantity: 10 });
    },
  },
  'POST /api/stock/receive': {
    as: 'owner',
    status: 201,
    answer: stockChange,
    probe: (a) =>
      a
        .post('/api/stock/receive')
        .set(JSON_HEADERS)
        .send({ cataloguePartId: company.care.cataloguePartId, locationId: company.care.warehouseId, quantity: 10 }),
  },
  'POST /api/stock/transfer': {
    as: 'technician',
    status: 201,
    answer: stockChange,
    probe: (a) =>
      a.post('/api/stock/transfer').set(JSON_HEADERS).send({
        cataloguePartId: company.care.cataloguePartId,
        fromLocationId: company.care.warehouseId,
        toLocationId: company.care.vanId,
        quantity: 1,
      }),
  },
  'POST /api/stock/count': {
    as: 'technician',
    status: 201,
    answer: stockChange,
    probe: (a) =>
      a
        .post('/api/stock/count')
        .set(JSON_HEADERS)
        .send({ cataloguePartId: company.care.cataloguePartId, locationId: company.care.vanId, countedQuantity: 5 }),
  },
  'GET /api/stock/movements': {
    as: 'owner',
    status: 200,
    answer: stockMovementPage,
    probe: (a) => a.get(`/api/stock/movements?cataloguePartId=${company.care.cataloguePartId}`),
  },
  'GET /api/stock/my-van': { as: 'technician', status: 200, answer: myVan, probe: (a) => a.get('/api/stock/my-van') },
  'POST /api/stock/my-van': { as: 'owner', status: 200, answer: myVan, probe: (a) => a.post('/api/stock/my-van').set(JSON_HEADERS) },
  'GET /api/stock/reorder': { as: 'owner', status: 200, answer: reorderList, probe: (a) => a.get('/api/stock/reorder') },
  'GET /api/calls/:id/parts-used': {
    as: 'owner',
    status: 200,
    answer: partsUsedList,
    probe: (a) => a.get(`/api/calls/${company.assignedCallId}/parts-used`),
  },
  'POST /api/calls/:id/parts-used': {
    as: 'technician',
    status: 201,
    answer: partUsed,
    probe: (a) =>
      a
        .post(`/api/calls/${company.assignedCallId}/parts-used`)
        .set(JSON_HEADERS)
        .send({ cataloguePartId: company.care.cataloguePartId, quantity: 1 }),
  },
  'GET /api/work-orders/:id/parts-used': {
    as: 'technician',
    status: 200,
    answer: partsUsedList,
    probe: (a) => a.get(`/api/work-orders/${company.care.workOrderId}/parts-used`),
  },
  'POST /api/work-orders/:id/parts-used': {
    as: 'owner',
    status: 201,
    answer: partUsed,
    probe: async (a) =>
      a
        .post(`/api/work-orders/${await freshWorkOrder(t.db, company)}/parts-used`)
        .set(JSON_HEADERS)
        .send({ cataloguePartId: company.care.cataloguePartId, quantity: 1, locationId: company.care.warehouseId }),
  },
  // Route days (2026-12-03: the fixture's work order is planned into the technician's day).
  'GET /api/route-days': { as: 'owner', status: 200, answer: routeDayBoard, probe: (a) => a.get('/api/route-days?day=2026-12-03') },
  'GET /api/my-day': { as: 'technician', status: 200, answer: routeDay, probe: (a) => a.get('/api/my-day?day=2026-12-03') },
  'GET /api/route-days/:technicianId/:day': {
    as: 'owner',
    status: 200,
    answer: routeDay,
    probe: (a) => a.get(`/api/route-days/${company.technician.id}/2026-12-03`),
  },
  'PUT /api/route-days/:technicianId/:day/order': {
    as: 'owner',
    status: 200,
    answer: routeDay,
    probe: async (a) => {
      const day = freshRouteDay();
      const { venueId } = await freshPlannedStop(t.db, company, day);
      return a
        .put(`/api/route-days/${company.technician.id}/${day}/order`)
        .set(JSON_HEADERS)
        .send({ venueIds: [venueId], version: 0 });
    },
  },
  'POST /api/route-days/:technicianId/:day/reset-order': {
    as: 'owner',
    status: 200,
    answer: routeDay,
    probe: (a) => a.post(`/api/route-days/${company.technician.id}/${freshRouteDay()}/reset-order`).set(JSON_HEADERS).send({ version: 0 }),
  },
  'POST /api/route-days/:technicianId/:day/stops/:venueId/move': {
    as: 'owner',
    status: 200,
    answer: stopMoved,
    probe: async (a) => {
      const day = freshRouteDay();
      const { venueId } = await freshPlannedStop(t.db, company, day);
      return a
        .post(`/api/route-days/${company.technician.id}/${day}/stops/${venueId}/move`)
        .set(JSON_HEADERS)
        .send({ toTechnicianId: company.technician.id, toDay: freshRouteDay(), version: 0 });
    },
  },
  'GET /api/bench-jobs': { as: 'owner', status: 200, answer: benchJobPage, probe: (a) => a.get('/api/bench-jobs') },
  'POST /api/bench-jobs': {
    as: 'owner',
    status: 201,
    answer: benchJob,
    probe: (a) =>
      a
        .post('/api/bench-jobs')
        .set(JSON_HEADERS)
        .send({ boardInstanceId: company.bench.boardInstanceId, templateId: company.bench.templateId, serviceCallId: company.downCallId }),
  },
  'GET /api/bench-jobs/:id': {
    as: 'owner',
    status: 200,
    answer: benchJob,
    probe: (a) => a.get(`/api/bench-jobs/${company.bench.benchJobId}`),
  },
  'PUT /api/bench-jobs/:id/draft': {
    as: 'owner',
    status: 200,
    answer: benchDraftSaved,
    probe: async (a) =>
      a
        .put(`/api/bench-jobs/${await freshBenchJob(t.db, company)}/draft`)
        .set(JSON_HEADERS)
        .send({ version: 1, draft: emptyBenchDraft() }),
  },
  // Finished with a reading, so the answer carries what it recorded.
  'POST /api/bench-jobs/:id/finish': {
    as: 'owner',
    status: 200,
    answer: benchJob,
    probe: async (a) => {
      const id = await freshBenchJob(t.db, company);
      const draft = emptyBenchDraft();
      draft.steps.measure = {
        ...draft.steps.measure,
        done: true,
        readings: { [company.bench.resistorPartId]: { text: '570', inCircuit: false } },
      };
      await a.put(`/api/bench-jobs/${id}/draft`).set(JSON_HEADERS).send({ version: 1, draft });
      return a.post(`/api/bench-jobs/${id}/finish`).set(JSON_HEADERS).send({ version: 2 });
    },
  },
  'POST /api/bench-jobs/:id/photos': { as: 'owner', status: 201, answer: benchPhotoUploaded, probe: (a) => sendBenchPhoto(a, company) },
  'GET /api/bench-jobs/:id/photos/:photoId': {
    as: 'owner',
    status: 200,
    answer: 'image',
    probe: async (a) => {
      const { jobId, photoId } = await benchPhotoOnce(a, company);
      return a.get(`/api/bench-jobs/${jobId}/photos/${photoId}`);
    },
  },
  'GET /api/bench-jobs/:id/photos/:photoId/thumb': {
    as: 'owner',
    status: 200,
    answer: 'image',
    probe: async (a) => {
      const { jobId, photoId } = await benchPhotoOnce(a, company);
      return a.get(`/api/bench-jobs/${jobId}/photos/${photoId}/thumb`);
    },
  },
  'GET /api/bench-jobs/:id/sheet.pdf': {
    as: 'owner',
    status: 200,
    answer: 'pdf',
    probe: (a) => a.get(`/api/bench-jobs/${company.bench.benchJobId}/sheet.pdf`),
  },

  // Service calls.
  'GET /api/calls': { as: 'owner', status: 200, answer: callPage, probe: (a) => a.get('/api/calls') },
  'POST /api/calls': {
    as: 'owner',
    status: 201,
    answer: openedCall,
    probe: async (a) =>
      a
        .post('/api/calls')
        .set(JSON_HEADERS)
        .send({ gameId: await addGame(t.db, company), problem: 'dead', note: 'No lights at all' }),
  },
  // The game-tag report: a timeline, messages in the outbox, a photo.
  'GET /api/calls/:id': { as: 'owner', status: 200, answer: callDetail, probe: (a) => a.get(`/api/calls/${reported.callId}`) },
  'GET /api/calls/:id/technicians': {
    as: 'owner',
    status: 200,
    answer: rankedTechnicianList,
    probe: (a) => a.get(`/api/calls/${company.downCallId}/technicians`),
  },
  'POST /api/calls/:id/assign': {
    as: 'owner',
    status: 200,
    answer: serviceCall,
    probe: async (a) =>
      a
        .post(`/api/calls/${await freshCall(t.db, company)}/assign`)
        .set(JSON_HEADERS)
        .send({ technicianId: company.technician.id, version: 1 }),
  },
  'POST /api/calls/:id/transition': {
    as: 'owner',
    status: 200,
    answer: serviceCall,
    probe: async (a) => {
      const call = await freshAssignedCall(t.db, company);
      return a.post(`/api/calls/${call.id}/transition`).set(JSON_HEADERS).send({ to: 'on_the_way', version: call.version });
    },
  },
  // Only the assigned technician has an assignment to answer.
  'POST /api/calls/:id/answer': {
    as: 'technician',
    status: 200,
    answer: serviceCall,
    probe: async (a) =>
      a
        .post(`/api/calls/${(await freshAssignedCall(t.db, company)).id}/answer`)
        .set(JSON_HEADERS)
        .send({ accept: true }),
  },
  'POST /api/calls/:id/severity': {
    as: 'owner',
    status: 200,
    answer: serviceCall,
    probe: async (a) =>
      a
        .post(`/api/calls/${await freshCall(t.db, company)}/severity`)
        .set(JSON_HEADERS)
        .send({ severity: 'cosmetic', version: 1 }),
  },
  'POST /api/calls/:id/notes': {
    as: 'owner',
    status: 201,
    answer: noteAdded,
    probe: (a) => a.post(`/api/calls/${company.downCallId}/notes`).set(JSON_HEADERS).send({ note: 'Checked the fuses' }),
  },
  'POST /api/calls/:id/photos': {
    as: 'owner',
    status: 201,
    answer: callPhotoAdded,
    probe: async (a) =>
      a
        .post(`/api/calls/${company.downCallId}/photos`)
        .set(JSON_HEADERS)
        .attach('photo', await samplePng(), { filename: 'game.png', contentType: 'image/png' }),
  },
  'GET /api/calls/:id/photos/:photoId': {
    as: 'owner',
    status: 200,
    answer: 'image',
    probe: (a) => a.get(`/api/calls/${reported.callId}/photos/${reported.photoId}`),
  },
  'GET /api/technicians': { as: 'owner', status: 200, answer: technicianList, probe: (a) => a.get('/api/technicians') },

  // The venue contact's view.
  'GET /api/venue-view': { as: 'venue_contact', status: 200, answer: venueView, probe: (a) => a.get('/api/venue-view') },
  'POST /api/venue-view/calls': {
    as: 'venue_contact',
    status: 201,
    answer: venueReportOpened,
    // A new game at the venue the contact speaks for (venueIds[0]).
    probe: async (a) =>
      a
        .post('/api/venue-view/calls')
        .set(JSON_HEADERS)
        .send({ gameId: await addGame(t.db, company, 0), problem: 'no_credit' }),
  },

  // Care plans, work orders, meters, keep cost.
  'GET /api/care-plans': { as: 'owner', status: 200, answer: carePlanPage, probe: (a) => a.get('/api/care-plans') },
  'POST /api/care-plans': {
    as: 'owner',
    status: 201,
    answer: carePlan,
    probe: (a) =>
      a
        .post('/api/care-plans')
        .set(JSON_HEADERS)
        .send(carePlanBody(unique('Plan'))),
  },
  'GET /api/care-plans/:id': {
    as: 'owner',
    status: 200,
    answer: carePlanDetail,
    probe: (a) => a.get(`/api/care-plans/${company.care.carePlanId}`),
  },
  'PUT /api/care-plans/:id': {
    as: 'owner',
    status: 200,
    answer: carePlan,
    probe: async (a) => {
      const created = await a
        .post('/api/care-plans')
        .set(JSON_HEADERS)
        .send(carePlanBody(unique('Plan')));
      return a
        .put(`/api/care-plans/${created.body.id}`)
        .set(JSON_HEADERS)
        .send({ ...carePlanBody(unique('Plan')), version: 1 });
    },
  },
  'POST /api/care-plans/:id/retire': {
    as: 'owner',
    status: 200,
    answer: carePlan,
    probe: async (a) => {
      const created = await a
        .post('/api/care-plans')
        .set(JSON_HEADERS)
        .send(carePlanBody(unique('Plan')));
      return a.post(`/api/care-plans/${created.body.id}/retire`).set(JSON_HEADERS).send({ version: 1 });
    },
  },
  'GET /api/work-orders': {
    as: 'technician',
    status: 200,
    answer: workOrderPage,
    probe: (a) => a.get('/api/work-orders').query({ technicianId: 'me' }),
  },
  'GET /api/work-orders/:id': {
    as: 'owner',
    status: 200,
    answer: workOrder,
    probe: (a) => a.get(`/api/work-orders/${company.care.workOrderId}`),
  },
  'POST /api/work-orders/:id/move': {
    as: 'owner',
    status: 200,
    answer: workOrder,
    probe: async (a) =>
      a
        .post(`/api/work-orders/${await freshWorkOrder(t.db, company)}/move`)
        .set(JSON_HEADERS)
        .send({ version: 1, plannedOn: '2099-01-04', technicianId: company.technician.id }),
  },
  'POST /api/work-orders/:id/skip': {
    as: 'technician',
    status: 200,
    answer: workOrder,
    probe: async (a) =>
      a
        .post(`/api/work-orders/${await freshWorkOrder(t.db, company)}/skip`)
        .set(JSON_HEADERS)
        .send({ version: 1, reason: 'Venue closed' }),
  },
  'POST /api/work-orders/:id/done': {
    as: 'technician',
    status: 200,
    answer: workOrder,
    probe: async (a) =>
      a
        .post(`/api/work-orders/${await freshWorkOrder(t.db, company)}/done`)
        .set(JSON_HEADERS)
        .send({ version: 1, labourMinutes: 40, note: 'All good', readings: [{ meter: 'plays', reading: 999_000 }] }),
  },
  'POST /api/work-orders/:id/bench-job': {
    as: 'technician',
    status: 200,
    answer: workOrder,
    probe: async (a) =>
      a
        .post(`/api/work-orders/${await freshBenchWorkOrder()}/bench-job`)
        .set(JSON_HEADERS)
        .send({ version: 1, boardInstanceId: company.bench.boardInstanceId }),
  },
  'GET /api/games/:id/meters': {
    as: 'owner',
    status: 200,
    answer: gameMeterList,
    probe: (a) => a.get(`/api/games/${company.gameIds[0]}/meters`),
  },
  'PUT /api/games/:id/meters': {
    as: 'owner',
    status: 200,
    answer: gameMeterList,
    probe: (a) =>
      a
        .put(`/api/games/${company.gameIds[0]}/meters`)
        .set(JSON_HEADERS)
        .send({
          items: [
            { meter: 'plays', rollsOverAt: 1_000_000 },
            { meter: 'hours', rollsOverAt: null },
          ],
        }),
  },
  'POST /api/games/:id/meter-readings': {
    as: 'technician',
    status: 201,
    answer: meterReading,
    probe: async (a) =>
      a
        .post(`/api/games/${await addGame(t.db, company, 0)}/meter-readings`)
        .set(JSON_HEADERS)
        .send({ meter: 'plays', reading: 4321 }),
  },
  'GET /api/games/:id/meter-readings/latest': {
    as: 'owner',
    status: 200,
    answer: latestMeterReadings,
    probe: (a) => a.get(`/api/games/${company.gameIds[0]}/meter-readings/latest`),
  },
  'GET /api/games/:id/keep-cost': {
    as: 'owner',
    status: 200,
    answer: gameKeepCost,
    probe: (a) => a.get(`/api/games/${company.gameIds[0]}/keep-cost`),
  },
};

/** A care plan's whole body, as the editor sends it. */
function carePlanBody(name: string) {
  return {
    name,
    scope: 'model',
    modelId: company.modelId,
    tasks: ['Clean the playfield'],
    onSiteMinutes: 45,
    rule: 'FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1',
    ruleStart: '2027-01-26T09:00',
    technicianId: company.technician.id,
  };
}

/** An open work order whose plan names the bench-job template, on the game with the fixture's board. */
async function freshBenchWorkOrder(): Promise<string> {
  const [plan] = await t.db.owner
    .insert(carePlans)
    .values({
      tenantId: company.tenantId,
      name: unique('Recap plan'),
      scope: 'game',
      gameId: company.gameIds[0]!,
      benchTemplateId: company.bench.templateId,
      onSiteMinutes: 120,
      byCapacitorLife: true,
    })
    .returning({ id: carePlans.id });
  const [order] = await t.db.owner
    .insert(workOrders)
    .values({
      tenantId: company.tenantId,
      carePlanId: plan!.id,
      gameId: company.gameIds[0]!,
      dueAt: new Date(),
      dueReason: 'capacitor_life',
      title: 'Recap',
      benchTemplateId: company.bench.templateId,
      onSiteMinutes: 120,
    })
    .returning({ id: workOrders.id });
  return order!.id;
}

/** What is wrong with the answer, or 'as agreed'. */
function check(res: Response, e: Endpoint): string {
  if (res.status !== e.status) return `status ${res.status}, not ${e.status}: ${res.text}`;
  const type = String(res.headers['content-type'] ?? '');
  if (e.answer === 'no-content') return res.text ? `a body where none was agreed: ${res.text}` : 'as agreed';
  if (e.answer === 'html') return type.startsWith('text/html') ? 'as agreed' : `content type ${type}, not HTML`;
  if (e.answer === 'image') return type.startsWith('image/') ? 'as agreed' : `content type ${type}, not an image`;
  if (e.answer === 'csv') return type.startsWith('text/csv') ? 'as agreed' : `content type ${type}, not CSV`;
  if (e.answer === 'pdf') return type.startsWith('application/pdf') ? 'as agreed' : `content type ${type}, not PDF`;
  if (!type.startsWith('application/json')) return `content type ${type}, not JSON`;
  return conformance(e.answer, res.body);
}

function conformance(schema: z.ZodType, body: unknown): string {
  const parsed = schema.safeParse(body);
  return parsed.success ? 'as agreed' : z.prettifyError(parsed.error);
}

beforeAll(async () => {
  ({ t, company, agents, close } = await appWithFullCompany('Delta Arcade'));
  // A report with a note, a phone and a photo through the game-tag page, on a game of its own: the
  // call then has a timeline, messages in the outbox and a photo the app's own store can serve.
  reported = await reportThroughTag(t, company, { note: 'Smells of smoke', phone: '(312) 555-0142', smsConsent: 'on' });
});
afterAll(() => close?.());

describe('the contract table', () => {
  it('names every /api route of the app, and only routes of the app', () => {
    const apiRoutes = listRoutes(t.app)
      .map((r) => r.key)
      .filter((key) => key.split(' ')[1]!.startsWith('/api/'));
    expect(apiRoutes.filter((key) => !(key in endpoints))).toEqual([]);
    expect(Object.keys(endpoints).filter((key) => !apiRoutes.includes(key))).toEqual([]);
  });
});

describe('refused requests answer problem details', () => {
  it('bad input, naming the bad fields', async () => {
    const res = await agents.owner.post('/api/venues').set(JSON_HEADERS).send({ latitude: 'north' });
    expect(res.status).toBe(400);
    expect(conformance(problemDetails, res.body)).toBe('as agreed');
  });

  it('a conflict carries the row as it now is', async () => {
    const res = await agents.owner
      .patch(`/api/venues/${await freshVenue(t.db, company)}`)
      .set(JSON_HEADERS)
      .send({ version: 7, notes: 'Too late' });
    expect(res.status).toBe(409);
    expect(conformance(problemDetails.extend({ current: venue }), res.body)).toBe('as agreed');
  });
});

describe('every /api endpoint answers what its contract says', () => {
  for (const [key, e] of Object.entries(endpoints)) {
    it(key, async () => {
      expect(check(await e.probe(agents[e.as]), e)).toBe('as agreed');
    });
  }
});
