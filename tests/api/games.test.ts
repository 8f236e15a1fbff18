// Games through the API: create, filter, update and retire, with references to the company's own models
// and venues only.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import type { CompanyFixture } from '../support/factories.ts';
import { auditCount, twoCompanies } from '../support/two-companies.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
let owner: Agent;

beforeAll(async () => {
  t = await buildTestApp();
  ({ a, b, owner } = await twoCompanies(t));
});
afterAll(() => t.close());

describe('games', () => {
  it('create, filter, update, retire; references must be of the same company', async () => {
    const created = await owner
      .post('/api/games')
      .set(JSON_HEADERS)
      .send({ modelId: a.modelId, venueId: a.venueIds[0], serial: 'NEW-1', installedOn: '2024-05-01' })
      .expect(201);
    expect(created.body).toMatchObject({ serial: 'NEW-1', status: 'running', model: { title: 'Alpha Amusements Flipper' } });
    expect(created.body).not.toHaveProperty('tagToken');
    const filtered = await owner.get('/api/games').query({ venueId: a.venueIds[0], q: 'NEW' }).expect(200);
    expect(filtered.body.items.map((g: { serial: string }) => g.serial)).toEqual(['NEW-1']);
    const down = await owner.patch(`/api/games/${created.body.id}`).set(JSON_HEADERS).send({ version: 1, status: 'down' }).expect(200);
    expect(down.body.status).toBe('down');
    const onlyDown = await owner.get('/api/games').query({ status: 'down' }).expect(200);
    expect(onlyDown.body.items.every((g: { status: string }) => g.status === 'down')).toBe(true);
    const foreign = await owner
      .post('/api/games')
      .set(JSON_HEADERS)
      .send({ modelId: b.modelId, venueId: b.venueIds[0], serial: 'X' })
      .expect(400);
    expect(foreign.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['modelId', 'venueId']);
    await owner.post(`/api/games/${created.body.id}/retire`).set(JSON_HEADERS).expect(200);
    expect(await auditCount(t.db.owner, created.body.id)).toBe(3);
  });

  it('lists each game with its venue, found and sorted by the venue name', async () => {
    await owner.post('/api/games').set(JSON_HEADERS).send({ modelId: a.modelId, venueId: a.venueIds[2], serial: 'BY-VENUE-3' }).expect(201);
    await owner.post('/api/games').set(JSON_HEADERS).send({ modelId: a.modelId, serial: 'IN-STORAGE' }).expect(201);
    const found = await owner.get('/api/games').query({ q: 'Venue 3' }).expect(200);
    expect(found.body.items.map((g: { serial: string; venueName: string }) => [g.serial, g.venueName])).toContainEqual([
      'BY-VENUE-3',
      'Alpha Amusements Venue 3',
    ]);
    expect(found.body.items.every((g: { venueName: string }) => g.venueName === 'Alpha Amusements Venue 3')).toBe(true);
    const byVenue = await owner.get('/api/games').query({ sort: 'venue', order: 'desc', limit: 100 }).expect(200);
    const names = byVenue.body.items.map((g: { venueName: string | null }) => g.venueName ?? '');
    expect(names.length).toBeGreaterThan(2);
    expect(names).toEqual([...names].sort((x: string, y: string) => y.toLowerCase().localeCompare(x.toLowerCase())));
    // A game in storage has no venue: it sorts as an empty name, last when descending.
    expect(names.at(-1)).toBe('');
  });

  it("another company's game is 404", async () => {
    await owner.get(`/api/games/${b.gameIds[0]}`).expect(404);
    await owner.patch(`/api/games/${b.gameIds[0]}`).set(JSON_HEADERS).send({ version: 1, status: 'down' }).expect(404);
  });
});
