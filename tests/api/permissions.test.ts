// Every route of the app, found by walking its router, against a table written here by hand: the
// permission that guards it, or that it needs only a signed-in person, or nobody. Each route is then
// called as every role and signed out, with real ids, and must answer exactly as the table says: 403
// for a role without the permission, 401 signed out, and the handler's own answer for the others.
// A new route fails this file until it is added to the table below.
import type { Response } from 'supertest';
import twilio from 'twilio';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { permissions, roles, type Permission, type Role } from '@bumperline/contracts/roles';
import { JSON_HEADERS, ORIGIN, SMS_AUTH_TOKEN, type Agent, type TestApp } from '../support/app.ts';
import { addGame, addMember } from '../support/call-factories.ts';
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
import { listRoutes, type ListedRoute } from '../support/route-list.ts';
import { freshPlannedStop, freshRouteDay } from '../support/route-day-rows.ts';
import { freshWorkOrder } from '../support/stock-rows.ts';
import { carePlans } from '@bumperline/db/schema/index';

/** Who may do what, as agreed; the app's own table (packages/contracts/src/roles.ts) must equal it. */
const whoMay: Record<Permission, readonly Role[]> = {
  'venues:read': ['owner', 'dispatcher', 'technician'],
  'venues:write': ['owner', 'dispatcher'],
  'games:read': ['owner', 'dispatcher', 'technician'],
  'games:write': ['owner', 'dispatcher'],
  'models:write': ['owner', 'dispatcher'],
  'team:read': ['owner', 'dispatcher'],
  'team:manage': ['owner'],
  'company:read': ['owner', 'dispatcher', 'technician'],
  'company:manage': ['owner'],
  'audit:read': ['owner'],
  'calls:read': ['owner', 'dispatcher', 'technician'],
  'calls:open': ['owner', 'dispatcher', 'technician'],
  'calls:dispatch': ['owner', 'dispatcher'],
  'calls:work': ['owner', 'dispatcher', 'technician'],
  'calls:contacts': ['owner', 'dispatcher'],
  'settings:manage': ['owner'],
  'bench:read': ['owner', 'dispatcher', 'technician'],
  'parts-lists:write': ['owner', 'dispatcher', 'technician'],
  'boards:write': ['owner', 'dispatcher', 'technician'],
  'bench:work': ['owner', 'dispatcher', 'technician'],
  'bench-templates:write': ['owner', 'technician'],
  'venue-view': ['venue_contact'],
  'route-days:read': ['owner', 'dispatcher', 'technician'],
  'route-days:plan': ['owner', 'dispatcher'],
  'stock:read': ['owner', 'dispatcher', 'technician'],
  'stock:manage': ['owner', 'dispatcher'],
  'stock:move': ['owner', 'dispatcher', 'technician'],
  'care-plans:read': ['owner', 'dispatcher', 'technician'],
  'care-plans:write': ['owner', 'dispatcher'],
  'work-orders:plan': ['owner', 'dispatcher'],
  'work-orders:work': ['owner', 'dispatcher', 'technician'],
  'meters:write': ['owner', 'dispatcher', 'technician'],
};

/**
 * - a permission: `scoped(permission, …)` guards the route;
 * - 'signed-in': any signed-in person (requireActor), whatever their role;
 * - 'public': no sign-in (health, game-tag pages, invitation links, password reset, signed provider webhooks);
 * - 'dev-only': the demo's loopback-only pages, mounted only while fakes stand in for mail and SMS.
 */
type Access = Permission | 'signed-in' | 'public' | 'dev-only';

interface Caller {
  who: Role | 'signed-out';
  agent: Agent;
}

interface RouteCase {
  access: Access;
  /** The request, with real ids; rows it changes are made fresh for each call. */
  probe: (c: Caller) => PromiseLike<Response>;
  /** What a caller the guard lets through gets (signed out, for a public route). */
  ok: number;
  /** Roles the guard lets through whose request the handler itself answers otherwise, and how. */
  handler?: Partial<Record<Role, number>>;
}

let t: TestApp;
let company: FullCompany;
let agents: Record<Role | 'signed-out', Agent>;
let close: () => Promise<void>;
/** A report with a photo sent through the game-tag page, so that the app's own photo store holds the file. */
let reported: TagReport;

/** Posts a form to an SMS webhook, signed with our key for our public URL as the provider does. */
function webhook(agent: Agent, route: string, params: Record<string, string>) {
  const signature = twilio.getExpectedTwilioSignature(SMS_AUTH_TOKEN, `${ORIGIN}${route}`, params);
  return agent.post(route).set('X-Twilio-Signature', signature).type('form').send(params);
}

const routes: Record<string, RouteCase> = {
  // Public: no sign-in.
  'GET /api/health': { access: 'public', ok: 200, probe: (c) => c.agent.get('/api/health') },
  'POST /api/account/sign-up': { access: 'public', ok: 400, probe: (c) => c.agent.post('/api/account/sign-up').set(JSON_HEADERS).send({}) },
  'POST /api/account/verify-email': {
    access: 'public',
    ok: 400,
    probe: (c) =>
      c.agent
        .post('/api/account/verify-email')
        .set(JSON_HEADERS)
        .send({ token: 'x'.repeat(40) }),
  },
  'POST /api/account/verify-email/resend': {
    access: 'public',
    ok: 202,
    probe: (c) => c.agent.post('/api/account/verify-email/resend').set(JSON_HEADERS).send({ email: company.dispatcher.email }),
  },
  'POST /api/account/password-reset': {
    access: 'public',
    ok: 202,
    probe: (c) => c.agent.post('/api/account/password-reset').set(JSON_HEADERS).send({ email: company.dispatcher.email }),
  },
  'POST /api/account/password-reset/confirm': {
    access: 'public',
    ok: 400,
    probe: (c) =>
      c.agent
        .post('/api/account/password-reset/confirm')
        .set(JSON_HEADERS)
        .send({ token: 'x'.repeat(40), password: 'a long enough passphrase' }),
  },
  'POST /api/account/sign-in-link': {
    access: 'public',
    ok: 202,
    probe: (c) => c.agent.post('/api/account/sign-in-link').set(JSON_HEADERS).send({ email: company.venueContact.email }),
  },
  'GET /api/invitations/:token': { access: 'public', ok: 200, probe: (c) => c.agent.get(`/api/invitations/${company.invitation.token}`) },
  'POST /api/invitations/:token/accept': {
    access: 'public',
    ok: 201,
    probe: async (c) => {
      const { token } = await freshInvitation(t.db, company);
      return c.agent
        .post(`/api/invitations/${token}/accept`)
        .set(JSON_HEADERS)
        .send({ name: 'New Person', password: 'a long enough passphrase' });
    },
  },
  'POST /webhooks/sms/inbound': {
    access: 'public',
    ok: 200,
    probe: (c) => webhook(c.agent, '/webhooks/sms/inbound', { From: '+13125550177', Body: 'HELP' }),
  },
  'POST /webhooks/sms/status': {
    access: 'public',
    ok: 204,
    probe: (c) => webhook(c.agent, '/webhooks/sms/status', { MessageSid: unique('SM'), MessageStatus: 'delivered' }),
  },
  'GET /t-assets/report.js': { access: 'public', ok: 200, probe: (c) => c.agent.get('/t-assets/report.js') },
  'GET /t/:token': { access: 'public', ok: 200, probe: (c) => c.agent.get(`/t/${reported.tagToken}`) },
  'POST /t/:token': {
    access: 'public',
    ok: 303,
    probe: (c) => c.agent.post(`/t/${reported.tagToken}`).field('problem', 'other').field('note', 'still broken'),
  },
  'GET /t/:token/thanks': {
    access: 'public',
    ok: 200,
    probe: (c) => c.agent.get(`/t/${reported.tagToken}/thanks`).query({ call: reported.statusToken, sms: 'none' }),
  },
  'GET /status/:token': { access: 'public', ok: 200, probe: (c) => c.agent.get(`/status/${reported.statusToken}`) },

  // Demo pages (loopback only).
  'GET /dev/outbox.json': { access: 'dev-only', ok: 200, probe: (c) => c.agent.get('/dev/outbox.json') },
  'GET /dev/outbox': { access: 'dev-only', ok: 200, probe: (c) => c.agent.get('/dev/outbox') },
  'GET /dev/phone.json': { access: 'dev-only', ok: 200, probe: (c) => c.agent.get('/dev/phone.json') },
  'GET /dev/phone': { access: 'dev-only', ok: 200, probe: (c) => c.agent.get('/dev/phone') },
  'POST /dev/phone/reply': {
    access: 'dev-only',
    ok: 400,
    probe: (c) => c.agent.post('/dev/phone/reply').type('form').send({ from: 'nobody', body: 'hi' }),
  },
  'GET /dev/care-plans': { access: 'dev-only', ok: 200, probe: (c) => c.agent.get('/dev/care-plans') },
  'POST /dev/care-plans/run': { access: 'dev-only', ok: 400, probe: (c) => c.agent.post('/dev/care-plans/run').send({}) },

  // Any signed-in person.
  'GET /api/account/me': { access: 'signed-in', ok: 200, probe: (c) => c.agent.get('/api/account/me') },
  'POST /api/account/me/company': {
    access: 'signed-in',
    ok: 204,
    probe: (c) => c.agent.post('/api/account/me/company').set(JSON_HEADERS).send({ tenantId: company.tenantId }),
  },

  // The company.
  'GET /api/company': { access: 'company:read', ok: 200, probe: (c) => c.agent.get('/api/company') },
  'PATCH /api/company': {
    access: 'company:manage',
    ok: 200,
    probe: (c) => c.agent.patch('/api/company').set(JSON_HEADERS).send({ locale: 'en-US' }),
  },
  'GET /api/activity': { access: 'audit:read', ok: 200, probe: (c) => c.agent.get('/api/activity') },
  'GET /api/settings': { access: 'calls:read', ok: 200, probe: (c) => c.agent.get('/api/settings') },
  'PATCH /api/settings': {
    access: 'settings:manage',
    ok: 200,
    probe: (c) => c.agent.patch('/api/settings').set(JSON_HEADERS).send({ warnBeforeMinutes: 30 }),
  },

  // The team.
  'GET /api/team': { access: 'team:read', ok: 200, probe: (c) => c.agent.get('/api/team') },
  'POST /api/team/invitations': {
    access: 'team:manage',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/team/invitations')
        .set(JSON_HEADERS)
        .send({ email: `${unique('invite')}@example.test`, role: 'technician' }),
  },
  'DELETE /api/team/invitations/:id': {
    access: 'team:manage',
    ok: 204,
    probe: async (c) => c.agent.delete(`/api/team/invitations/${(await freshInvitation(t.db, company)).id}`).set(JSON_HEADERS),
  },
  'PATCH /api/team/members/:id': {
    access: 'team:manage',
    ok: 200,
    probe: async (c) => {
      const member = await addMember(t.db.owner, company.tenantId, 'technician');
      return c.agent.patch(`/api/team/members/${member.id}`).set(JSON_HEADERS).send({ role: 'dispatcher' });
    },
  },
  'DELETE /api/team/members/:id': {
    access: 'team:manage',
    ok: 204,
    probe: async (c) => {
      const member = await addMember(t.db.owner, company.tenantId, 'technician');
      return c.agent.delete(`/api/team/members/${member.id}`).set(JSON_HEADERS);
    },
  },

  // Venues.
  'GET /api/venues': { access: 'venues:read', ok: 200, probe: (c) => c.agent.get('/api/venues') },
  'GET /api/venues/:id': { access: 'venues:read', ok: 200, probe: (c) => c.agent.get(`/api/venues/${company.venueIds[0]}`) },
  'POST /api/venues': {
    access: 'venues:write',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/venues')
        .set(JSON_HEADERS)
        .send({ name: unique('New venue'), addressLine: '1 Probe Street', city: 'Testville', latitude: 41.9, longitude: -87.6 }),
  },
  'PATCH /api/venues/:id': {
    access: 'venues:write',
    ok: 200,
    probe: async (c) =>
      c.agent
        .patch(`/api/venues/${await freshVenue(t.db, company)}`)
        .set(JSON_HEADERS)
        .send({ version: 1, notes: 'Back door' }),
  },
  'POST /api/venues/:id/retire': {
    access: 'venues:write',
    ok: 200,
    probe: async (c) => c.agent.post(`/api/venues/${await freshVenue(t.db, company)}/retire`).set(JSON_HEADERS),
  },
  'GET /api/venues/:id/contacts': {
    access: 'venues:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/venues/${company.venueIds[0]}/contacts`),
  },
  'POST /api/venues/:id/contacts': {
    access: 'venues:write',
    ok: 201,
    probe: async (c) =>
      c.agent
        .post(`/api/venues/${await freshVenue(t.db, company)}/contacts`)
        .set(JSON_HEADERS)
        .send({ userId: company.venueContact.id }),
  },
  'DELETE /api/venues/:id/contacts/:userId': {
    access: 'venues:write',
    ok: 204,
    probe: async (c) => {
      const venueId = await freshContactVenue(t.db, company);
      return c.agent.delete(`/api/venues/${venueId}/contacts/${company.venueContact.id}`).set(JSON_HEADERS);
    },
  },
  'GET /api/venues/:id/tag-sheet': {
    access: 'venues:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/venues/${company.venueIds[0]}/tag-sheet`),
  },

  // Games and models.
  'GET /api/games': { access: 'games:read', ok: 200, probe: (c) => c.agent.get('/api/games') },
  'GET /api/games/summary': { access: 'games:read', ok: 200, probe: (c) => c.agent.get('/api/games/summary') },
  'GET /api/games/:id': { access: 'games:read', ok: 200, probe: (c) => c.agent.get(`/api/games/${company.gameIds[0]}`) },
  'GET /api/games/:id/downtime': {
    access: 'games:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/games/${company.gameIds[0]}/downtime`),
  },
  'POST /api/games': {
    access: 'games:write',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/games')
        .set(JSON_HEADERS)
        .send({ modelId: company.modelId, venueId: company.venueIds[1], serial: unique('SN') }),
  },
  'PATCH /api/games/:id': {
    access: 'games:write',
    ok: 200,
    probe: async (c) =>
      c.agent
        .patch(`/api/games/${await addGame(t.db, company)}`)
        .set(JSON_HEADERS)
        .send({ version: 1, notes: 'Coin door sticks' }),
  },
  'POST /api/games/:id/retire': {
    access: 'games:write',
    ok: 200,
    probe: async (c) => c.agent.post(`/api/games/${await addGame(t.db, company)}/retire`).set(JSON_HEADERS),
  },
  'POST /api/games/:id/regenerate-tag': {
    access: 'games:write',
    ok: 200,
    probe: async (c) => c.agent.post(`/api/games/${await addGame(t.db, company)}/regenerate-tag`).set(JSON_HEADERS),
  },
  'GET /api/models': { access: 'games:read', ok: 200, probe: (c) => c.agent.get('/api/models') },
  'POST /api/models': {
    access: 'models:write',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/models')
        .set(JSON_HEADERS)
        .send({ maker: 'Probeworks', title: unique('Model'), kind: 'darts' }),
  },

  // Models' boards and their parts lists.
  'GET /api/parts-lists': { access: 'bench:read', ok: 200, probe: (c) => c.agent.get('/api/parts-lists') },
  'GET /api/models/:modelId/boards': {
    access: 'bench:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/models/${company.modelId}/boards`),
  },
  'POST /api/models/:modelId/boards': {
    access: 'parts-lists:write',
    ok: 201,
    probe: (c) =>
      c.agent
        .post(`/api/models/${company.modelId}/boards`)
        .set(JSON_HEADERS)
        .send({ name: unique('Board') }),
  },
  'GET /api/boards/:boardId': { access: 'bench:read', ok: 200, probe: (c) => c.agent.get(`/api/boards/${company.bench.modelBoardId}`) },
  'PATCH /api/boards/:boardId': {
    access: 'parts-lists:write',
    ok: 200,
    probe: (c) => c.agent.patch(`/api/boards/${company.bench.modelBoardId}`).set(JSON_HEADERS).send({ notes: 'Check the bridge' }),
  },
  'PUT /api/boards/:boardId/parts': {
    access: 'parts-lists:write',
    ok: 200,
    // The list as it stands, saved again at its current version.
    probe: async (c) => {
      const { body } = await agents.owner.get(`/api/boards/${company.bench.modelBoardId}`);
      return c.agent
        .put(`/api/boards/${company.bench.modelBoardId}/parts`)
        .set(JSON_HEADERS)
        .send({ version: body.version, parts: body.parts });
    },
  },
  'GET /api/boards/:boardId/parts.csv': {
    access: 'bench:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/boards/${company.bench.modelBoardId}/parts.csv`),
  },

  // Boards fitted in games, cabinet profiles, the recap list.
  'GET /api/games/:gameId/boards': { access: 'bench:read', ok: 200, probe: (c) => c.agent.get(`/api/games/${company.gameIds[0]}/boards`) },
  'POST /api/games/:gameId/boards': {
    access: 'boards:write',
    ok: 201,
    probe: (c) =>
      c.agent
        .post(`/api/games/${company.gameIds[0]}/boards`)
        .set(JSON_HEADERS)
        .send({ boardId: company.bench.modelBoardId, serial: unique('PS'), dateCode: '9112' }),
  },
  'GET /api/board-instances/:id': {
    access: 'bench:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/board-instances/${company.bench.boardInstanceId}`),
  },
  'PATCH /api/board-instances/:id': {
    access: 'boards:write',
    ok: 200,
    probe: async (c) => {
      const { body } = await agents.owner.get(`/api/board-instances/${company.bench.boardInstanceId}`);
      return c.agent
        .patch(`/api/board-instances/${company.bench.boardInstanceId}`)
        .set(JSON_HEADERS)
        .send({ version: body.instance.version, notes: unique('Reflowed') });
    },
  },
  'GET /api/games/:gameId/cabinet-profile': {
    access: 'bench:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/games/${company.gameIds[0]}/cabinet-profile`),
  },
  'PUT /api/games/:gameId/cabinet-profile': {
    access: 'boards:write',
    ok: 200,
    probe: (c) =>
      c.agent
        .put(`/api/games/${company.gameIds[0]}/cabinet-profile`)
        .set(JSON_HEADERS)
        .send({
          slices: [
            { hours: 4, temperatureC: 35 },
            { hours: 6, temperatureC: 45 },
          ],
        }),
  },
  'GET /api/recap-due': { access: 'bench:read', ok: 200, probe: (c) => c.agent.get('/api/recap-due') },

  // Bench-job templates and bench jobs.
  'GET /api/bench-templates': { access: 'bench:read', ok: 200, probe: (c) => c.agent.get('/api/bench-templates') },
  'POST /api/bench-templates': {
    access: 'bench-templates:write',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/bench-templates')
        .set(JSON_HEADERS)
        .send({ name: unique('Template'), steps: [{ key: 'inspect', title: 'Inspect', record: 'check' }] }),
  },
  'GET /api/bench-templates/:id': {
    access: 'bench:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/bench-templates/${company.bench.templateId}`),
  },
  'PUT /api/bench-templates/:id': {
    access: 'bench-templates:write',
    ok: 200,
    // The template as it stands, saved again at its current version.
    probe: async (c) => {
      const { body } = await agents.owner.get(`/api/bench-templates/${company.bench.templateId}`);
      return c.agent
        .put(`/api/bench-templates/${company.bench.templateId}`)
        .set(JSON_HEADERS)
        .send({ version: body.version, name: body.name, description: body.description, steps: body.steps });
    },
  },
  'GET /api/bench-templates/:id/sheet.pdf': {
    access: 'bench:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/bench-templates/${company.bench.templateId}/sheet.pdf`),
  },
  'GET /api/bench-jobs': { access: 'bench:read', ok: 200, probe: (c) => c.agent.get('/api/bench-jobs') },
  'POST /api/bench-jobs': {
    access: 'bench:work',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/bench-jobs')
        .set(JSON_HEADERS)
        .send({ boardInstanceId: company.bench.boardInstanceId, templateId: company.bench.templateId }),
  },
  'GET /api/bench-jobs/:id': { access: 'bench:read', ok: 200, probe: (c) => c.agent.get(`/api/bench-jobs/${company.bench.benchJobId}`) },
  'PUT /api/bench-jobs/:id/draft': {
    access: 'bench:work',
    ok: 200,
    probe: async (c) =>
      c.agent
        .put(`/api/bench-jobs/${await freshBenchJob(t.db, company)}/draft`)
        .set(JSON_HEADERS)
        .send({ version: 1, draft: emptyBenchDraft() }),
  },
  'POST /api/bench-jobs/:id/finish': {
    access: 'bench:work',
    ok: 200,
    probe: async (c) =>
      c.agent
        .post(`/api/bench-jobs/${await freshBenchJob(t.db, company)}/finish`)
        .set(JSON_HEADERS)
        .send({ version: 1 }),
  },
  'POST /api/bench-jobs/:id/photos': { access: 'bench:work', ok: 201, probe: (c) => sendBenchPhoto(c.agent, company) },
  'GET /api/bench-jobs/:id/photos/:photoId': {
    access: 'bench:read',
    ok: 200,
    probe: async (c) => {
      const { jobId, photoId } = await benchPhotoOnce(agents.owner, company);
      return c.agent.get(`/api/bench-jobs/${jobId}/photos/${photoId}`);
    },
  },
  'GET /api/bench-jobs/:id/photos/:photoId/thumb': {
    access: 'bench:read',
    ok: 200,
    probe: async (c) => {
      const { jobId, photoId } = await benchPhotoOnce(agents.owner, company);
      return c.agent.get(`/api/bench-jobs/${jobId}/photos/${photoId}/thumb`);
    },
  },
  'GET /api/bench-jobs/:id/sheet.pdf': {
    access: 'bench:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/bench-jobs/${company.bench.benchJobId}/sheet.pdf`),
  },

  // Parts catalogue, stocks, parts used.
  'GET /api/parts': { access: 'stock:read', ok: 200, probe: (c) => c.agent.get('/api/parts') },
  'GET /api/parts/:id': { access: 'stock:read', ok: 200, probe: (c) => c.agent.get(`/api/parts/${company.care.cataloguePartId}`) },
  'POST /api/parts': {
    access: 'stock:manage',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/parts')
        .set(JSON_HEADERS)
        .send({ partNumber: unique('P'), description: 'Probe fuse', kind: 'fuse', unitCostCents: 10 }),
  },
  'PATCH /api/parts/:id': {
    access: 'stock:manage',
    ok: 200,
    probe: async (c) => {
      const { body } = await agents.owner.get(`/api/parts/${company.care.cataloguePartId}`);
      return c.agent
        .patch(`/api/parts/${company.care.cataloguePartId}`)
        .set(JSON_HEADERS)
        .send({ version: body.part.version, notes: unique('n') });
    },
  },
  'POST /api/parts/:id/retire': {
    access: 'stock:manage',
    ok: 200,
    probe: async (c) => {
      const { body } = await agents.owner
        .post('/api/parts')
        .set(JSON_HEADERS)
        .send({ partNumber: unique('R'), description: 'To retire', kind: 'other', unitCostCents: 1 });
      return c.agent.post(`/api/parts/${body.id}/retire`).set(JSON_HEADERS);
    },
  },
  'POST /api/parts/:id/fits': {
    access: 'stock:manage',
    ok: 201,
    probe: (c) =>
      c.agent.post(`/api/parts/${company.care.cataloguePartId}/fits`).set(JSON_HEADERS).send({ boardPartId: company.bench.resistorPartId }),
  },
  'DELETE /api/parts/:id/fits/:boardPartId': {
    access: 'stock:manage',
    ok: 200,
    probe: async (c) => {
      await agents.owner
        .post(`/api/parts/${company.care.cataloguePartId}/fits`)
        .set(JSON_HEADERS)
        .send({ boardPartId: company.bench.resistorPartId });
      return c.agent.delete(`/api/parts/${company.care.cataloguePartId}/fits/${company.bench.resistorPartId}`).set(JSON_HEADERS);
    },
  },
  'GET /api/boards/:boardId/catalogue-fits': {
    access: 'stock:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/boards/${company.bench.modelBoardId}/catalogue-fits`),
  },
  'GET /api/stock/locations': { access: 'stock:read', ok: 200, probe: (c) => c.agent.get('/api/stock/locations') },
  'POST /api/stock/locations': {
    access: 'stock:manage',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/stock/locations')
        .set(JSON_HEADERS)
        .send({ kind: 'warehouse', name: unique('Shelves') }),
  },
  'GET /api/stock/locations/:id': {
    access: 'stock:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/stock/locations/${company.care.warehouseId}`),
  },
  'PATCH /api/stock/locations/:id': {
    access: 'stock:manage',
    ok: 200,
    probe: (c) => c.agent.patch(`/api/stock/locations/${company.care.warehouseId}`).set(JSON_HEADERS).send({ name: 'Shop shelves' }),
  },
  'POST /api/stock/locations/:id/retire': {
    access: 'stock:manage',
    ok: 200,
    probe: async (c) => {
      const { body } = await agents.owner
        .post('/api/stock/locations')
        .set(JSON_HEADERS)
        .send({ kind: 'warehouse', name: unique('Old shelves') });
      return c.agent.post(`/api/stock/locations/${body.id}/retire`).set(JSON_HEADERS);
    },
  },
  'GET /api/stock/locations/:id/levels': {
    access: 'stock:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/stock/locations/${company.care.warehouseId}/levels`),
  },
  'PUT /api/stock/locations/:id/levels/:partId': {
    access: 'stock:manage',
    ok: 200,
    probe: async (c) => {
      const { body } = await agents.owner.get(`/api/parts/${company.care.cataloguePartId}`);
      const level = body.holdings.find((h: { locationId: string }) => h.locationId === company.care.warehouseId);
      return c.agent
        .put(`/api/stock/locations/${company.care.warehouseId}/levels/${company.care.cataloguePartId}`)
        .set(JSON_HEADERS)
        .send({ reorderPoint: 10, reorderQuantity: 50, version: level.version });
    },
  },
  'POST /api/stock/receive': {
    access: 'stock:manage',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/stock/receive')
        .set(JSON_HEADERS)
        .send({ cataloguePartId: company.care.cataloguePartId, locationId: company.care.warehouseId, quantity: 1 }),
  },
  'POST /api/stock/transfer': {
    access: 'stock:move',
    ok: 201,
    // Warehouse → the technician's van: the one move every role with the permission may make.
    probe: (c) =>
      c.agent.post('/api/stock/transfer').set(JSON_HEADERS).send({
        cataloguePartId: company.care.cataloguePartId,
        fromLocationId: company.care.warehouseId,
        toLocationId: company.care.vanId,
        quantity: 1,
      }),
  },
  'POST /api/stock/count': {
    access: 'stock:move',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/stock/count')
        .set(JSON_HEADERS)
        .send({ cataloguePartId: company.care.cataloguePartId, locationId: company.care.vanId, countedQuantity: 4 }),
  },
  'GET /api/stock/movements': {
    access: 'stock:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/stock/movements?locationId=${company.care.vanId}`),
  },
  'GET /api/stock/my-van': { access: 'stock:read', ok: 200, probe: (c) => c.agent.get('/api/stock/my-van') },
  'POST /api/stock/my-van': { access: 'stock:move', ok: 200, probe: (c) => c.agent.post('/api/stock/my-van').set(JSON_HEADERS) },
  'GET /api/stock/reorder': { access: 'stock:manage', ok: 200, probe: (c) => c.agent.get('/api/stock/reorder') },
  'GET /api/calls/:id/parts-used': {
    access: 'stock:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/calls/${company.assignedCallId}/parts-used`),
  },
  'POST /api/calls/:id/parts-used': {
    access: 'stock:move',
    ok: 201,
    // The technician takes it off their van; the office names the warehouse.
    probe: async (c) =>
      c.agent
        .post(`/api/calls/${await freshCall(t.db, company)}/parts-used`)
        .set(JSON_HEADERS)
        .send({
          cataloguePartId: company.care.cataloguePartId,
          quantity: 1,
          ...(c.who === 'technician' ? {} : { locationId: company.care.warehouseId }),
        }),
  },
  'GET /api/work-orders/:id/parts-used': {
    access: 'stock:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/work-orders/${company.care.workOrderId}/parts-used`),
  },
  'POST /api/work-orders/:id/parts-used': {
    access: 'stock:move',
    ok: 201,
    probe: async (c) =>
      c.agent
        .post(`/api/work-orders/${await freshWorkOrder(t.db, company)}/parts-used`)
        .set(JSON_HEADERS)
        .send({
          cataloguePartId: company.care.cataloguePartId,
          quantity: 1,
          ...(c.who === 'technician' ? {} : { locationId: company.care.warehouseId }),
        }),
  },

  // Route days.
  'GET /api/route-days': { access: 'route-days:read', ok: 200, probe: (c) => c.agent.get('/api/route-days') },
  'GET /api/my-day': {
    access: 'route-days:read',
    ok: 200,
    // Only a technician has a day of their own.
    handler: { owner: 404, dispatcher: 404 },
    probe: (c) => c.agent.get('/api/my-day'),
  },
  'GET /api/route-days/:technicianId/:day': {
    access: 'route-days:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/route-days/${company.technician.id}/2026-12-03`),
  },
  'PUT /api/route-days/:technicianId/:day/order': {
    access: 'route-days:plan',
    ok: 200,
    probe: (c) =>
      c.agent.put(`/api/route-days/${company.technician.id}/${freshRouteDay()}/order`).set(JSON_HEADERS).send({ venueIds: [], version: 0 }),
  },
  'POST /api/route-days/:technicianId/:day/reset-order': {
    access: 'route-days:plan',
    ok: 200,
    probe: (c) =>
      c.agent.post(`/api/route-days/${company.technician.id}/${freshRouteDay()}/reset-order`).set(JSON_HEADERS).send({ version: 0 }),
  },
  'POST /api/route-days/:technicianId/:day/stops/:venueId/move': {
    access: 'route-days:plan',
    ok: 200,
    probe: async (c) => {
      const day = freshRouteDay();
      const { venueId } = await freshPlannedStop(t.db, company, day);
      return c.agent
        .post(`/api/route-days/${company.technician.id}/${day}/stops/${venueId}/move`)
        .set(JSON_HEADERS)
        .send({ toTechnicianId: company.technician.id, toDay: freshRouteDay(), version: 0 });
    },
  },

  // Service calls.
  'GET /api/calls': { access: 'calls:read', ok: 200, probe: (c) => c.agent.get('/api/calls') },
  'POST /api/calls': {
    access: 'calls:open',
    ok: 201,
    probe: async (c) =>
      c.agent
        .post('/api/calls')
        .set(JSON_HEADERS)
        .send({ gameId: await addGame(t.db, company), problem: 'dead' }),
  },
  'GET /api/calls/:id': { access: 'calls:read', ok: 200, probe: (c) => c.agent.get(`/api/calls/${company.downCallId}`) },
  'GET /api/calls/:id/technicians': {
    access: 'calls:dispatch',
    ok: 200,
    probe: (c) => c.agent.get(`/api/calls/${company.downCallId}/technicians`),
  },
  'POST /api/calls/:id/assign': {
    access: 'calls:dispatch',
    ok: 200,
    probe: async (c) =>
      c.agent
        .post(`/api/calls/${await freshCall(t.db, company)}/assign`)
        .set(JSON_HEADERS)
        .send({ technicianId: company.technician.id, version: 1 }),
  },
  'POST /api/calls/:id/transition': {
    access: 'calls:work',
    ok: 200,
    probe: async (c) => {
      const call = await freshAssignedCall(t.db, company);
      return c.agent.post(`/api/calls/${call.id}/transition`).set(JSON_HEADERS).send({ to: 'on_the_way', version: call.version });
    },
  },
  'POST /api/calls/:id/answer': {
    access: 'calls:work',
    ok: 200,
    // Only the assigned technician has an assignment to answer.
    handler: { owner: 404, dispatcher: 404 },
    probe: async (c) =>
      c.agent
        .post(`/api/calls/${(await freshAssignedCall(t.db, company)).id}/answer`)
        .set(JSON_HEADERS)
        .send({ accept: true }),
  },
  'POST /api/calls/:id/severity': {
    access: 'calls:dispatch',
    ok: 200,
    probe: async (c) =>
      c.agent
        .post(`/api/calls/${await freshCall(t.db, company)}/severity`)
        .set(JSON_HEADERS)
        .send({ severity: 'cosmetic', version: 1 }),
  },
  'POST /api/calls/:id/notes': {
    access: 'calls:work',
    ok: 201,
    probe: (c) => c.agent.post(`/api/calls/${company.downCallId}/notes`).set(JSON_HEADERS).send({ note: 'Checked the fuses' }),
  },
  'POST /api/calls/:id/photos': {
    access: 'calls:work',
    ok: 201,
    probe: async (c) =>
      c.agent
        .post(`/api/calls/${company.downCallId}/photos`)
        .set(JSON_HEADERS)
        .attach('photo', await samplePng(), { filename: 'game.png', contentType: 'image/png' }),
  },
  'GET /api/calls/:id/photos/:photoId': {
    access: 'calls:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/calls/${reported.callId}/photos/${reported.photoId}`),
  },
  'GET /api/technicians': { access: 'calls:dispatch', ok: 200, probe: (c) => c.agent.get('/api/technicians') },

  // The venue contact's view.
  'GET /api/venue-view': { access: 'venue-view', ok: 200, probe: (c) => c.agent.get('/api/venue-view') },
  'POST /api/venue-view/calls': {
    access: 'venue-view',
    ok: 201,
    // A new game at the venue the contact speaks for (venueIds[0]).
    probe: async (c) =>
      c.agent
        .post('/api/venue-view/calls')
        .set(JSON_HEADERS)
        .send({ gameId: await addGame(t.db, company, 0), problem: 'no_credit' }),
  },

  // Care plans, work orders, meters and keep cost.
  'GET /api/care-plans': { access: 'care-plans:read', ok: 200, probe: (c) => c.agent.get('/api/care-plans') },
  'POST /api/care-plans': {
    access: 'care-plans:write',
    ok: 201,
    probe: (c) =>
      c.agent
        .post('/api/care-plans')
        .set(JSON_HEADERS)
        .send(planBody(unique('Plan'))),
  },
  'GET /api/care-plans/:id': {
    access: 'care-plans:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/care-plans/${company.care.carePlanId}`),
  },
  'PUT /api/care-plans/:id': {
    access: 'care-plans:write',
    ok: 200,
    probe: async (c) =>
      c.agent
        .put(`/api/care-plans/${await freshCarePlan()}`)
        .set(JSON_HEADERS)
        .send({ ...planBody(unique('Plan')), version: 1 }),
  },
  'POST /api/care-plans/:id/retire': {
    access: 'care-plans:write',
    ok: 200,
    probe: async (c) =>
      c.agent
        .post(`/api/care-plans/${await freshCarePlan()}/retire`)
        .set(JSON_HEADERS)
        .send({ version: 1 }),
  },
  'GET /api/work-orders': { access: 'care-plans:read', ok: 200, probe: (c) => c.agent.get('/api/work-orders') },
  'GET /api/work-orders/:id': {
    access: 'care-plans:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/work-orders/${company.care.workOrderId}`),
  },
  'POST /api/work-orders/:id/move': {
    access: 'work-orders:work',
    ok: 200,
    probe: async (c) =>
      c.agent
        .post(`/api/work-orders/${await freshWorkOrder(t.db, company)}/move`)
        .set(JSON_HEADERS)
        .send({ version: 1, plannedOn: '2099-01-04' }),
  },
  'POST /api/work-orders/:id/skip': {
    access: 'work-orders:work',
    ok: 200,
    probe: async (c) =>
      c.agent
        .post(`/api/work-orders/${await freshWorkOrder(t.db, company)}/skip`)
        .set(JSON_HEADERS)
        .send({ version: 1, reason: 'Venue closed' }),
  },
  'POST /api/work-orders/:id/done': {
    access: 'work-orders:work',
    ok: 200,
    probe: async (c) =>
      c.agent
        .post(`/api/work-orders/${await freshWorkOrder(t.db, company)}/done`)
        .set(JSON_HEADERS)
        .send({ version: 1, labourMinutes: 30 }),
  },
  // The fixture's plan has a task list, not a bench-job template: the workflow answers 409.
  'POST /api/work-orders/:id/bench-job': {
    access: 'bench:work',
    ok: 409,
    probe: async (c) =>
      c.agent
        .post(`/api/work-orders/${await freshWorkOrder(t.db, company)}/bench-job`)
        .set(JSON_HEADERS)
        .send({ version: 1, boardInstanceId: company.bench.boardInstanceId }),
  },
  'GET /api/games/:id/meters': { access: 'games:read', ok: 200, probe: (c) => c.agent.get(`/api/games/${company.gameIds[0]}/meters`) },
  'PUT /api/games/:id/meters': {
    access: 'games:write',
    ok: 200,
    probe: (c) =>
      c.agent
        .put(`/api/games/${company.gameIds[0]}/meters`)
        .set(JSON_HEADERS)
        .send({ items: [{ meter: 'plays', rollsOverAt: 1_000_000 }] }),
  },
  'POST /api/games/:id/meter-readings': {
    access: 'meters:write',
    ok: 201,
    // A new game each time, so each reading is its first.
    probe: async (c) =>
      c.agent
        .post(`/api/games/${await addGame(t.db, company, 0)}/meter-readings`)
        .set(JSON_HEADERS)
        .send({ meter: 'plays', reading: 1200 }),
  },
  'GET /api/games/:id/meter-readings/latest': {
    access: 'games:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/games/${company.gameIds[0]}/meter-readings/latest`),
  },
  'GET /api/games/:id/keep-cost': {
    access: 'games:read',
    ok: 200,
    probe: (c) => c.agent.get(`/api/games/${company.gameIds[0]}/keep-cost`),
  },
};

/** A care plan's whole body, as the editor sends it. */
function planBody(name: string) {
  return {
    name,
    scope: 'model',
    modelId: company.modelId,
    tasks: ['Clean the playfield'],
    onSiteMinutes: 45,
    rule: 'FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1',
    ruleStart: '2027-01-26T09:00',
  };
}

/** A new care plan at version 1 (arranged as the owner role). */
async function freshCarePlan(): Promise<string> {
  const [plan] = await t.db.owner
    .insert(carePlans)
    .values({
      tenantId: company.tenantId,
      name: unique('Plan'),
      scope: 'model',
      modelId: company.modelId,
      tasks: ['Clean'],
      onSiteMinutes: 30,
      playsEvery: 1000,
    })
    .returning({ id: carePlans.id });
  return plan!.id;
}

/** The status, or what else a 401/403/404 was when it is not the plain answer of a guard or a handler. */
function answer(res: Response): number | string {
  const body = (res.body ?? {}) as { type?: unknown; detail?: unknown };
  const code = typeof body.type === 'string' ? body.type.split('/').pop() : undefined;
  if (res.status === 404 && typeof body.detail === 'string' && body.detail.startsWith('No such route')) return '404 no such route';
  if (res.status === 401 && code !== 'unauthorized') return `401 ${code ?? 'without a problem type'}`;
  if (res.status === 403 && code !== 'forbidden') return `403 ${code ?? 'without a problem type'}`;
  return res.status;
}

function expectedAnswers(c: RouteCase, mounted: boolean): Record<string, number | string> {
  if (c.access === 'dev-only') return { 'signed-out': mounted ? c.ok : '404 no such route' };
  if (c.access === 'public') return { 'signed-out': c.ok };
  const out: Record<string, number | string> = {};
  for (const role of roles) {
    const allowed = c.access === 'signed-in' || whoMay[c.access].includes(role);
    out[role] = allowed ? (c.handler?.[role] ?? c.ok) : 403;
  }
  out['signed-out'] = 401;
  return out;
}

let listed: ListedRoute[];

beforeAll(async () => {
  ({ t, company, agents, close } = await appWithFullCompany('Gamma Coin'));
  // A report with a photo through the game-tag page, on a game of its own.
  reported = await reportThroughTag(t, company);
  listed = listRoutes(t.app);
});
afterAll(() => close());

describe('the route table', () => {
  it('the permission table of the app is the one written here', () => {
    expect(permissions).toEqual(whoMay);
  });

  it('names every route of the app, and only routes of the app', () => {
    const keys = new Set(listed.map((r) => r.key));
    const notInTable = [...keys].filter((key) => !(key in routes));
    // The demo pages are mounted only while fakes stand in for mail and SMS.
    const gone = Object.entries(routes)
      .filter(([key, c]) => c.access !== 'dev-only' && !keys.has(key))
      .map(([key]) => key);
    expect(notInTable).toEqual([]);
    expect(gone).toEqual([]);
    expect(listed.length).toBe(keys.size);
  });

  it('each route is built with the permission the table names, and the others with none', () => {
    const tagged = Object.fromEntries(listed.map((r) => [r.key, r.tags]));
    const expected = Object.fromEntries(
      listed.map((r) => {
        const access = routes[r.key]?.access;
        return [r.key, access === undefined || access === 'signed-in' || access === 'public' || access === 'dev-only' ? [] : [access]];
      }),
    );
    expect(tagged).toEqual(expected);
  });
});

describe('every route answers every role as the table says', () => {
  for (const [key, c] of Object.entries(routes)) {
    it(`${key} (${c.access})`, async () => {
      const mounted = listed.some((r) => r.key === key);
      const expected = expectedAnswers(c, mounted);
      const actual: Record<string, number | string> = {};
      for (const who of Object.keys(expected) as Caller['who'][]) {
        actual[who] = answer(await c.probe({ who, agent: agents[who] }));
      }
      expect(actual).toEqual(expected);
    });
  }
});
