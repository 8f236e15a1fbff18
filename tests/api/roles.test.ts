// Each role against the permission table, one probe per permission (tests/api/permissions.test.ts walks
// every route the same way).
import request from 'supertest';
import { sql } from 'drizzle-orm';
import { carePlans, workOrders } from '@bumperline/db/schema/index';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { permissions, roles, type Permission, type Role } from '@bumperline/contracts/roles';
import { buildTestApp, JSON_HEADERS, signedInAgent, type TestApp } from '../support/app.ts';
import { companyWithEveryRole, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let company: CompanyFixture;
let people: Record<Role, string>;

beforeAll(async () => {
  t = await buildTestApp();
  ({ company, people } = await companyWithEveryRole(t.db.owner, 'Gamma Coin'));
});
afterAll(() => t.close());

describe('roles', () => {
  it('follow the one permission table on every guarded route', async () => {
    // Each permission has a route that needs it; every role must get 2xx exactly when the table allows.
    const ownerAgent = await signedInAgent(t, people.owner);
    const call = await ownerAgent.post('/api/calls').set(JSON_HEADERS).send({ gameId: company.gameIds[1], problem: 'other' }).expect(201);
    // A board fitted in a game and a bench-job template, to open bench jobs on.
    const modelBoard = await ownerAgent
      .post(`/api/models/${company.modelId}/boards`)
      .set(JSON_HEADERS)
      .send({ name: 'Probe power supply' })
      .expect(201);
    const fitted = await ownerAgent
      .post(`/api/games/${company.gameIds[1]}/boards`)
      .set(JSON_HEADERS)
      .send({ boardId: modelBoard.body.id, serial: 'PS-PROBE' })
      .expect(201);
    const benchStep = { key: 'inspect', title: 'Inspect the board', record: 'check' };
    const template = await ownerAgent
      .post('/api/bench-templates')
      .set(JSON_HEADERS)
      .send({ name: 'Probe template', steps: [benchStep] })
      .expect(201);
    // A technician whose route day the office re-plans, and dates no other probe has changed.
    const board = await ownerAgent.get('/api/route-days').expect(200);
    const technicianId = (board.body as { days: { technician: { id: string } }[] }).days[0]!.technician.id;
    let probeDays = 0;
    const probeDay = () => `2030-02-${String(++probeDays).padStart(2, '0')}`;
    // Open work orders, fresh for each probe that closes or re-plans one, and rising meter readings.
    const technicianUser = await t.db.owner.execute<{ id: string }>(sql`select id from users where email = ${people.technician}`);
    const careTechnicianId = technicianUser.rows[0]!.id;
    const freshOrder = async () => {
      const [plan] = await t.db.owner
        .insert(carePlans)
        .values({
          tenantId: company.tenantId,
          name: `Probe plan ${Math.random()}`,
          scope: 'model',
          modelId: company.modelId,
          tasks: ['Probe'],
          onSiteMinutes: 30,
          playsEvery: 1000,
        })
        .returning({ id: carePlans.id });
      const [order] = await t.db.owner
        .insert(workOrders)
        .values({
          tenantId: company.tenantId,
          carePlanId: plan!.id,
          gameId: company.gameIds[0]!,
          dueAt: new Date(),
          dueReason: 'plays',
          title: 'Probe',
          onSiteMinutes: 30,
        })
        .returning({ id: workOrders.id });
      return order!.id;
    };
    let probeReading = 0;
    // calls:contacts guards no route: it decides whether a call's message recipients show in full
    // (tests/api/call-contacts.test.ts walks it per role).
    const probes: Record<Exclude<Permission, 'calls:contacts'>, (a: ReturnType<typeof request.agent>) => PromiseLike<request.Response>> = {
      'venues:read': (a) => a.get('/api/venues'),
      'venues:write': (a) =>
        a.post('/api/venues').set(JSON_HEADERS).send({ name: 'Probe', addressLine: '1 Probe St', city: 'X', latitude: 1, longitude: 1 }),
      'games:read': (a) => a.get('/api/games'),
      'games:write': (a) => a.post(`/api/games/${company.gameIds[0]}/retire`).set(JSON_HEADERS),
      'models:write': (a) =>
        a
          .post('/api/models')
          .set(JSON_HEADERS)
          .send({ maker: 'Probe', title: `P${Math.random()}`, kind: 'darts' }),
      'team:read': (a) => a.get('/api/team'),
      'team:manage': (a) =>
        a
          .post('/api/team/invitations')
          .set(JSON_HEADERS)
          .send({ email: `inv${Math.random()}@x.test`, role: 'technician' }),
      'company:read': (a) => a.get('/api/company'),
      'company:manage': (a) => a.patch('/api/company').set(JSON_HEADERS).send({ locale: 'en-US' }),
      'audit:read': (a) => a.get('/api/activity'),
      'calls:read': (a) => a.get('/api/calls'),
      'calls:open': (a) => a.post('/api/calls').set(JSON_HEADERS).send({ gameId: company.gameIds[1], problem: 'no_sound' }),
      'calls:dispatch': (a) => a.get('/api/technicians'),
      'calls:work': (a) => a.post(`/api/calls/${call.body.id}/notes`).set(JSON_HEADERS).send({ note: 'probe' }),
      'settings:manage': (a) => a.patch('/api/settings').set(JSON_HEADERS).send({ warnBeforeMinutes: 30 }),
      'venue-view': (a) => a.get('/api/venue-view'),
      'bench:read': (a) => a.get('/api/parts-lists'),
      'parts-lists:write': (a) =>
        a
          .post(`/api/models/${company.modelId}/boards`)
          .set(JSON_HEADERS)
          .send({ name: `Probe board ${Math.random()}` }),
      'bench:work': (a) =>
        a.post('/api/bench-jobs').set(JSON_HEADERS).send({ boardInstanceId: fitted.body.id, templateId: template.body.id }),
      'bench-templates:write': (a) =>
        a
          .post('/api/bench-templates')
          .set(JSON_HEADERS)
          .send({ name: `Probe template ${Math.random()}`, steps: [benchStep] }),
      'route-days:read': (a) => a.get('/api/route-days'),
      'route-days:plan': (a) => a.post(`/api/route-days/${technicianId}/${probeDay()}/reset-order`).set(JSON_HEADERS).send({ version: 0 }),
      'stock:read': (a) => a.get('/api/stock/locations'),
      'stock:manage': (a) =>
        a
          .post('/api/stock/locations')
          .set(JSON_HEADERS)
          .send({ kind: 'warehouse', name: `Probe shelves ${Math.random()}` }),
      // Makes the person's van on first use; answers it again after.
      'stock:move': (a) => a.post('/api/stock/my-van').set(JSON_HEADERS),
      'care-plans:read': (a) => a.get('/api/care-plans'),
      'care-plans:write': (a) =>
        a
          .post('/api/care-plans')
          .set(JSON_HEADERS)
          .send({
            name: `Probe plan ${Math.random()}`,
            scope: 'model',
            modelId: company.modelId,
            tasks: ['Probe'],
            onSiteMinutes: 30,
            playsEvery: 1000,
          }),
      // Giving work to a technician is planning; a technician may move only the day of their own.
      'work-orders:plan': async (a) =>
        a
          .post(`/api/work-orders/${await freshOrder()}/move`)
          .set(JSON_HEADERS)
          .send({ version: 1, technicianId: careTechnicianId }),
      'work-orders:work': async (a) =>
        a
          .post(`/api/work-orders/${await freshOrder()}/skip`)
          .set(JSON_HEADERS)
          .send({ version: 1, reason: 'Probe' }),
      'meters:write': (a) =>
        a
          .post(`/api/games/${company.gameIds[0]}/meter-readings`)
          .set(JSON_HEADERS)
          .send({ meter: 'plays', reading: (probeReading += 10) }),
      'boards:write': (a) =>
        a
          .put(`/api/games/${company.gameIds[0]}/cabinet-profile`)
          .set(JSON_HEADERS)
          .send({ slices: [{ hours: 8, temperatureC: 40 }] }),
    };
    for (const role of roles) {
      const agent = await signedInAgent(t, people[role]);
      for (const [permission, probe] of Object.entries(probes) as [keyof typeof probes, (typeof probes)[keyof typeof probes]][]) {
        const res = await probe(agent);
        const allowed = (permissions[permission] as readonly Role[]).includes(role);
        expect(res.status < 300, `${role} ${permission} → ${res.status}`).toBe(allowed);
        if (!allowed) expect(res.status).toBe(403);
      }
    }
  });
});
