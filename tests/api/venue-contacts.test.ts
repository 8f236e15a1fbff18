// Giving a venue contact access to a venue decides what their venue view shows.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberships } from '@bumperline/db/schema/index';
import { buildTestApp, JSON_HEADERS, signedInAgent, type TestApp } from '../support/app.ts';
import { createCompany, createUser, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;

beforeAll(async () => {
  t = await buildTestApp();
  a = await createCompany(t.db.owner, 'Alpha Amusements', 2);
  b = await createCompany(t.db.owner, 'Beta Games', 1);
});
afterAll(() => t.close());

describe('venue view access', () => {
  it('linking and unlinking a venue contact changes their venue view; only staff who edit venues may do it', async () => {
    const contact = await createUser(t.db.owner, { email: 'barkeep@alpha.test', name: 'Bar Keep' });
    const tech = await createUser(t.db.owner, { email: 'tech@alpha.test' });
    await t.db.owner.insert(memberships).values([
      { tenantId: a.tenantId, userId: contact.id, role: 'venue_contact' },
      { tenantId: a.tenantId, userId: tech.id, role: 'technician' },
    ]);
    const owner = await signedInAgent(t, a.ownerEmail);
    const contactAgent = await signedInAgent(t, contact.email);
    const techAgent = await signedInAgent(t, tech.email);

    expect((await contactAgent.get('/api/venue-view').expect(200)).body.venues).toEqual([]);
    const listed = await owner.get(`/api/venues/${a.venueIds[0]}/contacts`).expect(200);
    expect(listed.body).toEqual({ items: [], candidates: [{ userId: contact.id, name: 'Bar Keep', email: 'barkeep@alpha.test' }] });

    await techAgent.post(`/api/venues/${a.venueIds[0]}/contacts`).set(JSON_HEADERS).send({ userId: contact.id }).expect(403);
    const notContact = await owner.post(`/api/venues/${a.venueIds[0]}/contacts`).set(JSON_HEADERS).send({ userId: tech.id }).expect(400);
    expect(notContact.body.errors[0].field).toBe('userId');
    await owner.post(`/api/venues/${b.venueIds[0]}/contacts`).set(JSON_HEADERS).send({ userId: contact.id }).expect(404);

    await owner.post(`/api/venues/${a.venueIds[0]}/contacts`).set(JSON_HEADERS).send({ userId: contact.id }).expect(201);
    const view = await contactAgent.get('/api/venue-view').expect(200);
    expect(view.body.venues.map((v: { id: string }) => v.id)).toEqual([a.venueIds[0]]);
    expect(view.body.games.map((g: { id: string }) => g.id)).toEqual([a.gameIds[0]]);

    await owner.delete(`/api/venues/${a.venueIds[0]}/contacts/${contact.id}`).set(JSON_HEADERS).expect(204);
    expect((await contactAgent.get('/api/venue-view').expect(200)).body.venues).toEqual([]);
    await owner.delete(`/api/venues/${a.venueIds[0]}/contacts/${contact.id}`).set(JSON_HEADERS).expect(404);
  });
});
