// Each role against the permission table, one probe per permission (tests/api/permissions.test.ts walks
// every route the same way).
import request from 'supertest';
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
    // calls:contacts guards no route: it decides whether a call's message recipients show in full
    // (tests/api/call-contacts.test.ts walks it per role).
    const probes: Record<Exclude<Permission, 'calls:contacts'>, (a: ReturnType<typeof request.agent>) => request.Test> = {
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
