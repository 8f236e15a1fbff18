// People in several companies: switching the active company, and only to one they belong to.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberships } from '@bumperline/db/schema/index';
import { buildTestApp, JSON_HEADERS, signedInAgent, type TestApp } from '../support/app.ts';
import { createCompany, createUser, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let company: CompanyFixture;

beforeAll(async () => {
  t = await buildTestApp();
  company = await createCompany(t.db.owner, 'Gamma Coin', 2);
});
afterAll(() => t.close());

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
