import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { permissions, roles, type Permission, type Role } from '@bumperline/contracts/roles';
import { sql } from 'drizzle-orm';
import { memberships } from '@bumperline/db/schema/index';
import { buildTestApp, JSON_HEADERS, signIn, signInWithLink, signedInAgent, type TestApp } from '../support/app.ts';
import { createCompany, createUser, TEST_PASSWORD, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let company: CompanyFixture;
const people = {} as Record<Role, string>;

beforeAll(async () => {
  t = await buildTestApp({ signInLimit: 5 });
  company = await createCompany(t.db.owner, 'Gamma Coin', 2);
  people.owner = company.ownerEmail;
  for (const role of roles.filter((r) => r !== 'owner')) {
    const u = await createUser(t.db.owner, { email: `${role}@gamma.test` });
    await t.db.owner.insert(memberships).values({ tenantId: company.tenantId, userId: u.id, role });
    people[role] = u.email;
  }
});
afterAll(() => t.close());

describe('sign-up and sign-in', () => {
  it('creates a company and its owner, who confirms the address by e-mail and can then sign in and see them', async () => {
    const res = await request(t.app)
      .post('/api/account/sign-up')
      .set(JSON_HEADERS)
      .send({ companyName: 'Delta Darts', name: 'Dee Owner', email: 'Dee@Delta.test', password: 'a long enough passphrase' })
      .expect(202);
    expect(res.body).toEqual({ status: 'check-your-email' });
    const token = /token=([\w-]+)/.exec(t.mail.lastTo('dee@delta.test')?.text ?? '')?.[1];
    await request(t.app).post('/api/account/verify-email').set(JSON_HEADERS).send({ token }).expect(204);
    const agent = request.agent(t.app);
    expect(await signIn(agent, 'dee@delta.test', 'a long enough passphrase')).toBe(200);
    const me = await agent.get('/api/account/me').expect(200);
    expect(me.body).toMatchObject({ role: 'owner', company: { name: 'Delta Darts', timeZone: 'America/Chicago', currency: 'USD' } });
  });

  it('answers a second sign-up with the same e-mail as any other, and mails the address instead', async () => {
    const res = await request(t.app)
      .post('/api/account/sign-up')
      .set(JSON_HEADERS)
      .send({ companyName: 'Again', name: 'X', email: company.ownerEmail, password: 'another passphrase' })
      .expect(202);
    expect(res.body).toEqual({ status: 'check-your-email' });
    const notice = t.mail.lastTo(company.ownerEmail);
    expect(notice?.text).toMatch(/tried to sign up/);
    expect(await signIn(request.agent(t.app), company.ownerEmail, 'another passphrase')).toBe(401);
  });

  it('refuses a wrong password and rate-limits repeated attempts', async () => {
    const u = await createUser(t.db.owner, { email: 'limited@gamma.test' });
    const agent = request.agent(t.app);
    for (let i = 0; i < 5; i++) expect(await signIn(agent, u.email, 'wrong password!')).toBe(401);
    // The sixth attempt is refused even with the right password.
    expect(await signIn(agent, u.email, TEST_PASSWORD)).toBe(401);
    await agent.get('/api/account/me').expect(401);
  });

  it('signing out revokes the session at once, even if the old cookie is replayed', async () => {
    const agent = await signedInAgent(t, company.ownerEmail);
    const cookie = (await agent.get('/auth/session')).request.cookies;
    await agent.get('/api/account/me').expect(200);
    const csrf = await agent.get('/auth/csrf');
    await agent.post('/auth/signout').type('form').set('X-Auth-Return-Redirect', '1').send({ csrfToken: csrf.body.csrfToken });
    await agent.get('/api/account/me').expect(401);
    await request(t.app).get('/api/account/me').set('Cookie', cookie).expect(401);
  });
});

describe('roles', () => {
  it('follow the one permission table on every guarded route', async () => {
    // Each permission has a route that needs it; every role must get 2xx exactly when the table allows.
    const ownerAgent = await signedInAgent(t, people.owner);
    const call = await ownerAgent.post('/api/calls').set(JSON_HEADERS).send({ gameId: company.gameIds[1], problem: 'other' }).expect(201);
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
      'company:manage': (a) => a.patch('/api/company').set(JSON_HEADERS).send({ locale: 'en-US' }),
      'audit:read': (a) => a.get('/api/activity'),
      'calls:read': (a) => a.get('/api/calls'),
      'calls:open': (a) => a.post('/api/calls').set(JSON_HEADERS).send({ gameId: company.gameIds[1], problem: 'no_sound' }),
      'calls:dispatch': (a) => a.get('/api/technicians'),
      'calls:work': (a) => a.post(`/api/calls/${call.body.id}/notes`).set(JSON_HEADERS).send({ note: 'probe' }),
      'settings:manage': (a) => a.patch('/api/settings').set(JSON_HEADERS).send({ warnBeforeMinutes: 30 }),
      'venue-view': (a) => a.get('/api/venue-view'),
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

  it('removing a member takes effect on their very next request', async () => {
    const tech = await createUser(t.db.owner, { email: 'leaving@gamma.test' });
    await t.db.owner.insert(memberships).values({ tenantId: company.tenantId, userId: tech.id, role: 'technician' });
    const techAgent = await signedInAgent(t, tech.email);
    await techAgent.get('/api/venues').expect(200);
    const owner = await signedInAgent(t, company.ownerEmail);
    await owner.delete(`/api/team/members/${tech.id}`).set(JSON_HEADERS).expect(204);
    await techAgent.get('/api/venues').expect(403);
  });
});

describe('several companies', () => {
  it('a freelance technician switches company and sees only the active one', async () => {
    const other = await createCompany(t.db.owner, 'Epsilon Amusements', 1);
    const free = await createUser(t.db.owner, { email: 'freelance@x.test' });
    await t.db.owner.insert(memberships).values([
      { tenantId: company.tenantId, userId: free.id, role: 'technician' },
      { tenantId: other.tenantId, userId: free.id, role: 'technician' },
    ]);
    const agent = await signedInAgent(t, free.email);
    const me = await agent.get('/api/account/me').expect(200);
    expect(me.body.companies.map((c: { name: string }) => c.name).sort()).toEqual(['Epsilon Amusements', 'Gamma Coin']);
    await agent.post('/api/account/me/company').set(JSON_HEADERS).send({ tenantId: other.tenantId }).expect(204);
    const venues = await agent.get('/api/venues').expect(200);
    expect(venues.body.items.map((v: { id: string }) => v.id)).toEqual(other.venueIds);
    await agent.post('/api/account/me/company').set(JSON_HEADERS).send({ tenantId: company.tenantId }).expect(204);
    const back = await agent.get('/api/venues').expect(200);
    const backIds: string[] = back.body.items.map((v: { id: string }) => v.id);
    expect(backIds).toEqual(expect.arrayContaining(company.venueIds));
    expect(backIds.some((id) => other.venueIds.includes(id))).toBe(false);
  });

  it('cannot switch to a company one does not belong to', async () => {
    const other = await createCompany(t.db.owner, 'Zeta Pins', 1);
    const agent = await signedInAgent(t, company.ownerEmail);
    const res = await agent.post('/api/account/me/company').set(JSON_HEADERS).send({ tenantId: other.tenantId }).expect(400);
    expect(res.body.errors[0].field).toBe('tenantId');
  });
});

describe('password reset by e-mail', () => {
  it('mails a one-time link that sets a new password and signs out other sessions', async () => {
    const u = await createUser(t.db.owner, { email: 'forgetful@gamma.test' });
    const old = await signedInAgent(t, u.email);
    await request(t.app).post('/api/account/password-reset').set(JSON_HEADERS).send({ email: u.email }).expect(202);
    // Unknown addresses get the same answer and no mail.
    await request(t.app).post('/api/account/password-reset').set(JSON_HEADERS).send({ email: 'nobody@x.test' }).expect(202);
    expect(t.mail.lastTo('nobody@x.test')).toBeUndefined();
    const mail = t.mail.lastTo(u.email);
    const token = /token=([\w-]+)/.exec(mail?.text ?? '')?.[1];
    expect(token).toBeTruthy();
    await request(t.app)
      .post('/api/account/password-reset/confirm')
      .set(JSON_HEADERS)
      .send({ token, password: 'brand new passphrase' })
      .expect(204);
    await old.get('/api/account/me').expect(401);
    expect(await signIn(request.agent(t.app), u.email, TEST_PASSWORD)).toBe(401);
    expect(await signIn(request.agent(t.app), u.email, 'brand new passphrase')).toBe(200);
    // The link works once.
    const again = await request(t.app)
      .post('/api/account/password-reset/confirm')
      .set(JSON_HEADERS)
      .send({ token, password: 'yet another passphrase' })
      .expect(400);
    expect(again.body.errors[0].field).toBe('token');
  });
});

describe('e-mailed tokens', () => {
  it('a password reset ends every other link mailed to that person', async () => {
    const u = await createUser(t.db.owner, { email: 'many-links@gamma.test' });
    const tokenFor = async (path: string) => {
      await request(t.app).post(path).set(JSON_HEADERS).send({ email: u.email }).expect(202);
      return /token=([\w-]+)/.exec(t.mail.lastTo(u.email)?.text ?? '')?.[1];
    };
    const signInLink = await tokenFor('/api/account/sign-in-link');
    const firstReset = await tokenFor('/api/account/password-reset');
    const secondReset = await tokenFor('/api/account/password-reset');
    await request(t.app)
      .post('/api/account/password-reset/confirm')
      .set(JSON_HEADERS)
      .send({ token: secondReset, password: 'the newest passphrase' })
      .expect(204);
    const stale = await request(t.app)
      .post('/api/account/password-reset/confirm')
      .set(JSON_HEADERS)
      .send({ token: firstReset, password: 'an older reset link' })
      .expect(400);
    expect(stale.body.errors[0].field).toBe('token');
    const link = await signInWithLink(request.agent(t.app), signInLink);
    expect(link.body.url).toMatch(/error=/);
    expect(await signIn(request.agent(t.app), u.email, 'the newest passphrase')).toBe(200);
  });
});

describe('invitations', () => {
  it('accepted three times at once joins once; the others get a problem naming the token', async () => {
    const owner = await signedInAgent(t, company.ownerEmail);
    await owner.post('/api/team/invitations').set(JSON_HEADERS).send({ email: 'racer@gamma.test', role: 'technician' }).expect(201);
    const token = /token=([\w-]+)/.exec(t.mail.lastTo('racer@gamma.test')?.text ?? '')?.[1];
    const accept = () =>
      request(t.app).post(`/api/invitations/${token}/accept`).set(JSON_HEADERS).send({ name: 'Racer', password: 'racer passphrase' });
    const results = await Promise.all([accept(), accept(), accept()]);
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([201, 409, 409]);
    for (const r of results.filter((x) => x.status === 409)) {
      expect(r.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(r.body.errors).toEqual([{ field: 'token', message: expect.any(String) }]);
    }
    const users = await t.db.owner.execute(sql`select id from users where lower(email) = 'racer@gamma.test'`);
    expect(users.rows).toHaveLength(1);
    const joined = await t.db.owner.execute(
      sql`select count(*)::int as n from memberships m join users u on u.id = m.user_id where lower(u.email) = 'racer@gamma.test'`,
    );
    expect(joined.rows[0]).toEqual({ n: 1 });
    const audit = await t.db.owner.execute(
      sql`select count(*)::int as n from audit_log where action = 'join' and entity_id = ${users.rows[0]!.id}`,
    );
    expect(audit.rows[0]).toEqual({ n: 1 });
  });

  it('an invited person with no account joins with the role they were invited with', async () => {
    const owner = await signedInAgent(t, company.ownerEmail);
    await owner.post('/api/team/invitations').set(JSON_HEADERS).send({ email: 'newtech@gamma.test', role: 'technician' }).expect(201);
    const token = /token=([\w-]+)/.exec(t.mail.lastTo('newtech@gamma.test')?.text ?? '')?.[1];
    const info = await request(t.app).get(`/api/invitations/${token}`).expect(200);
    expect(info.body).toEqual({ companyName: 'Gamma Coin', email: 'newtech@gamma.test', role: 'technician', hasAccount: false });
    await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .set(JSON_HEADERS)
      .send({ name: 'New Tech', password: 'new tech passphrase' })
      .expect(201);
    const agent = await signedInAgent(t, 'newtech@gamma.test', 'new tech passphrase');
    const me = await agent.get('/api/account/me').expect(200);
    expect(me.body).toMatchObject({ role: 'technician', company: { name: 'Gamma Coin' } });
    await request(t.app).post(`/api/invitations/${token}/accept`).set(JSON_HEADERS).send({}).expect(410);
  });

  it('an existing account must be signed in to accept', async () => {
    const other = await createCompany(t.db.owner, 'Eta Games', 1);
    const owner = await signedInAgent(t, company.ownerEmail);
    await owner.post('/api/team/invitations').set(JSON_HEADERS).send({ email: other.ownerEmail, role: 'dispatcher' }).expect(201);
    const token = /token=([\w-]+)/.exec(t.mail.lastTo(other.ownerEmail)?.text ?? '')?.[1];
    await request(t.app).post(`/api/invitations/${token}/accept`).set(JSON_HEADERS).send({}).expect(409);
    const agent = await signedInAgent(t, other.ownerEmail);
    await agent.post(`/api/invitations/${token}/accept`).set(JSON_HEADERS).send({}).expect(201);
    const me = await agent.get('/api/account/me').expect(200);
    expect(me.body).toMatchObject({ role: 'dispatcher', company: { name: 'Gamma Coin' } });
    expect(me.body.companies).toHaveLength(2);
  });

  it('a venue contact signs in with an e-mailed link, once', async () => {
    const link = await request(t.app).post('/api/account/sign-in-link').set(JSON_HEADERS).send({ email: people.venue_contact });
    expect(link.status).toBe(202);
    const token = /token=([\w-]+)/.exec(t.mail.lastTo(people.venue_contact)?.text ?? '')?.[1];
    const agent = request.agent(t.app);
    const res = await signInWithLink(agent, token);
    expect(res.body.url).not.toMatch(/error=/);
    const me = await agent.get('/api/account/me').expect(200);
    expect(me.body.role).toBe('venue_contact');
    const replay = await signInWithLink(request.agent(t.app), token);
    expect(replay.body.url).toMatch(/error=/);
  });
});
