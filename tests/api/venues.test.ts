// Venues through the API: create, update and retire with the audit log, concurrent edits, search and
// paging, another company's ids; and how bad input and unsigned or cross-site requests are refused.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { buildTestApp, JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import type { CompanyFixture } from '../support/factories.ts';
import { auditCount, twoCompanies } from '../support/two-companies.ts';

let t: TestApp;
let b: CompanyFixture;
let owner: Agent;

const venueBody = (over: Record<string, unknown> = {}) => ({
  name: 'Juniper Lanes',
  addressLine: '12 Quill Ct',
  city: 'Chicago',
  latitude: 41.9,
  longitude: -87.65,
  ...over,
});

beforeAll(async () => {
  t = await buildTestApp();
  ({ b, owner } = await twoCompanies(t));
});
afterAll(() => t.close());

describe('venues', () => {
  it('create, read, update and retire, each written to the audit log', async () => {
    const created = await owner.post('/api/venues').set(JSON_HEADERS).send(venueBody()).expect(201);
    const id = created.body.id;
    expect(created.body).toMatchObject({ name: 'Juniper Lanes', version: 1, gameCount: 0, retiredAt: null });
    await owner.get(`/api/venues/${id}`).expect(200);
    const updated = await owner
      .patch(`/api/venues/${id}`)
      .set(JSON_HEADERS)
      .send({ version: 1, name: 'Juniper Lanes & Grill' })
      .expect(200);
    expect(updated.body).toMatchObject({ name: 'Juniper Lanes & Grill', version: 2 });
    const retired = await owner.post(`/api/venues/${id}/retire`).set(JSON_HEADERS).expect(200);
    expect(retired.body.retiredAt).not.toBeNull();
    const list = await owner.get('/api/venues?limit=200').expect(200);
    expect(list.body.items.some((v: { id: string }) => v.id === id)).toBe(false);
    const withRetired = await owner.get('/api/venues?limit=200&includeRetired=true').expect(200);
    expect(withRetired.body.items.some((v: { id: string }) => v.id === id)).toBe(true);
    expect(await auditCount(t.db.owner, id)).toBe(3);
    const activity = await owner.get(`/api/activity?entityId=${id}`).expect(200);
    expect(activity.body.items.map((e: { action: string }) => e.action)).toEqual(['retire', 'update', 'create']);
    expect(activity.body.items[1].changes.name).toEqual({ from: 'Juniper Lanes', to: 'Juniper Lanes & Grill' });
  });

  it('two people editing at once: the second is told and shown the current values (no lost update)', async () => {
    const { body: v } = await owner
      .post('/api/venues')
      .set(JSON_HEADERS)
      .send(venueBody({ name: 'Race Tavern' }))
      .expect(201);
    await owner.patch(`/api/venues/${v.id}`).set(JSON_HEADERS).send({ version: 1, notes: 'first' }).expect(200);
    const late = await owner.patch(`/api/venues/${v.id}`).set(JSON_HEADERS).send({ version: 1, notes: 'second' }).expect(409);
    expect(late.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(late.body.current).toMatchObject({ notes: 'first', version: 2 });
  });

  it('searches, sorts both ways and pages with a cursor without gaps or repeats', async () => {
    for (let i = 0; i < 7; i++) {
      await owner
        .post('/api/venues')
        .set(JSON_HEADERS)
        .send(venueBody({ name: `Paging Pub ${String.fromCharCode(71 - i)}`, city: 'Pagetown' }))
        .expect(201);
    }
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const res: request.Response = await owner
        .get('/api/venues')
        .query({ q: 'paging', sort: 'name', order: 'desc', limit: 3, ...(cursor ? { cursor } : {}) })
        .expect(200);
      seen.push(...res.body.items.map((v: { name: string }) => v.name));
      cursor = res.body.nextCursor;
    } while (cursor);
    expect(seen).toEqual(['G', 'F', 'E', 'D', 'C', 'B', 'A'].map((c) => `Paging Pub ${c}`));
    const byCity = await owner.get('/api/venues').query({ q: 'Pagetown', sort: 'city', limit: 50 }).expect(200);
    expect(byCity.body.items).toHaveLength(7);
  });

  it('an id from another company is 404 and never its data', async () => {
    const res = await owner.get(`/api/venues/${b.venueIds[0]}`).expect(404);
    expect(JSON.stringify(res.body)).not.toContain('Beta');
    await owner.patch(`/api/venues/${b.venueIds[0]}`).set(JSON_HEADERS).send({ version: 1, name: 'Hijack' }).expect(404);
    await owner.post(`/api/venues/${b.venueIds[0]}/retire`).set(JSON_HEADERS).expect(404);
    const r = await t.db.owner.execute(sql`select name, retired_at from venues where id = ${b.venueIds[0]}`);
    expect(r.rows[0]).toEqual({ name: 'Beta Games Venue 1', retired_at: null });
  });
});

describe('bad input', () => {
  it('unknown routes are 404 problem details', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(404);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(res.body).toMatchObject({ status: 404, title: 'Not found' });
  });

  it('malformed JSON, wrong types, unknown fields and over-long strings are 400 naming the field, and nothing is written', async () => {
    const before = await t.db.owner.execute(sql`select count(*)::int as n from venues`);
    const malformed = await owner
      .post('/api/venues')
      .set(JSON_HEADERS)
      .set('Content-Type', 'application/json')
      .send('{"name": ')
      .expect(400);
    expect(malformed.body.errors[0].field).toBe('(body)');
    const wrongType = await owner
      .post('/api/venues')
      .set(JSON_HEADERS)
      .send(venueBody({ latitude: 'north' }))
      .expect(400);
    expect(wrongType.body.errors.map((e: { field: string }) => e.field)).toEqual(['latitude']);
    const unknown = await owner
      .post('/api/venues')
      .set(JSON_HEADERS)
      .send(venueBody({ owner: 'me' }))
      .expect(400);
    expect(unknown.body.errors).toEqual([{ field: 'owner', message: 'is not a known field' }]);
    const long = await owner
      .post('/api/venues')
      .set(JSON_HEADERS)
      .send(venueBody({ name: 'x'.repeat(500) }))
      .expect(400);
    expect(long.body.errors[0]).toMatchObject({ field: 'name', message: expect.stringMatching(/at most 120/) });
    const badQuery = await owner.get('/api/venues').query({ limit: 'lots', cursor: 'garbage' }).expect(400);
    expect(badQuery.body.errors.map((e: { field: string }) => e.field)).toContain('limit');
    const badCursor = await owner.get('/api/venues').query({ cursor: 'garbage' }).expect(400);
    expect(badCursor.body.errors[0].field).toBe('cursor');
    const after = await t.db.owner.execute(sql`select count(*)::int as n from venues`);
    expect(after.rows[0]).toEqual(before.rows[0]);
  });

  it('state-changing requests without our header or from another origin are refused', async () => {
    await owner.post('/api/venues').send(venueBody()).expect(403);
    await owner
      .post('/api/venues')
      .set({ ...JSON_HEADERS, Origin: 'https://evil.example' })
      .send(venueBody())
      .expect(403);
  });

  it('unsigned requests are 401', async () => {
    const res = await request(t.app).get('/api/venues').expect(401);
    expect(res.body.title).toBe('Not signed in');
  });
});
