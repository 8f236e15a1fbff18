// The team: invitations (accepted once, by new and existing accounts) and removing a member.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { buildTestApp, JSON_HEADERS, signedInAgent, type TestApp } from '../support/app.ts';
import { createCompany, createMember, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let company: CompanyFixture;

beforeAll(async () => {
  t = await buildTestApp();
  company = await createCompany(t.db.owner, 'Gamma Coin', 2);
});
afterAll(() => t.close());

describe('invitations', () => {
  it('accepted three times at once joins once; the others get a problem naming the token', async () => {
    const owner = await signedInAgent(t, company.ownerEmail);
    await owner.post('/api/team/invitations').set(JSON_HEADERS).send({ email: 'racer@gamma.test', role: 'technician' }).expect(201);
    const token = /token=([\w-]+)/.exec(t.mail.lastTo('racer@gamma.test')?.text ?? '')?.[1];
    const accept = () =>
      request(t.app).post(`/api/invitations/${token}/accept`).set(JSON_HEADERS).send({ name: 'Racer', password: 'racer passphrase' });
    const results = await Promise.all([accept(), accept(), accept()]);
    // One joins. The others are refused: 409 if they raced the winner inside the same moment, 410 if
    // they looked after it had finished — either way a problem naming the token, and nothing written.
    expect(results.filter((r) => r.status === 201)).toHaveLength(1);
    const refused = results.filter((r) => r.status !== 201);
    expect(refused.map((r) => r.status).every((s) => s === 409 || s === 410)).toBe(true);
    for (const r of refused) {
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
});

describe('members', () => {
  it('removing a member takes effect on their very next request', async () => {
    const tech = await createMember(t.db.owner, company.tenantId, 'technician', { email: 'leaving@gamma.test' });
    const techAgent = await signedInAgent(t, tech.email);
    await techAgent.get('/api/venues').expect(200);
    const owner = await signedInAgent(t, company.ownerEmail);
    await owner.delete(`/api/team/members/${tech.id}`).set(JSON_HEADERS).expect(204);
    await techAgent.get('/api/venues').expect(403);
  });
});
