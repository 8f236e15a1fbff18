// Photos a technician adds to a service call from the stop screen (often queued on a phone without signal): stored
// and listed on the call, applied once per Idempotency-Key, refused for a bad file or a finished call.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { buildTestApp, JSON_HEADERS, signedInAgent, type Agent, type TestApp } from '../support/app.ts';
import { createCompany, createMember, type CompanyFixture } from '../support/factories.ts';
import { samplePng } from '../support/bench-rows.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
let dispatcher: Agent;
let tech: { id: string; agent: Agent };
let otherOwner: Agent;

beforeAll(async () => {
  t = await buildTestApp();
  a = await createCompany(t.db.owner, 'Alpha Amusements', 3);
  b = await createCompany(t.db.owner, 'Beta Games', 1);
  dispatcher = await signedInAgent(t, (await createMember(t.db.owner, a.tenantId, 'dispatcher')).email);
  const member = await createMember(t.db.owner, a.tenantId, 'technician', { name: 'Photo Tech' });
  tech = { id: member.id, agent: await signedInAgent(t, member.email) };
  otherOwner = await signedInAgent(t, b.ownerEmail);
});
afterAll(() => t.close());

async function openCall(gameId: string): Promise<string> {
  const res = await dispatcher.post('/api/calls').set(JSON_HEADERS).send({ gameId, problem: 'dead' }).expect(201);
  return (res.body as { id: string }).id;
}

function sendPhoto(agent: Agent, callId: string, bytes: Buffer, key?: string, filename = 'game.png') {
  const req = agent.post(`/api/calls/${callId}/photos`).set(JSON_HEADERS);
  if (key) req.set('Idempotency-Key', key);
  return req.attach('photo', bytes, { filename, contentType: 'image/png' });
}

async function photoRows(callId: string) {
  const rows = await t.db.owner.execute(sql`select id, uploaded_by, storage_key from call_photos where call_id = ${callId}`);
  return rows.rows as { id: string; uploaded_by: string; storage_key: string }[];
}

describe('POST /api/calls/:id/photos', () => {
  let callId: string;
  beforeAll(async () => {
    callId = await openCall(a.gameIds[0]!);
  });

  it('stores the photo, lists it on the call and puts the technician on the timeline', async () => {
    const res = await sendPhoto(tech.agent, callId, await samplePng()).expect(201);
    expect(res.body.photo).toMatchObject({ id: res.body.photoId, width: 40, height: 30, uploadedBy: 'staff' });
    const detail = (await dispatcher.get(`/api/calls/${callId}`).expect(200)).body;
    expect(detail.photos.map((p: { id: string }) => p.id)).toEqual([res.body.photoId]);
    const events = detail.events.filter((e: { kind: string }) => e.kind === 'photo');
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ actorLabel: 'Photo Tech' });
    const [event] = (await t.db.owner.execute(sql`select actor_user_id from call_events where call_id = ${callId} and kind = 'photo'`))
      .rows as { actor_user_id: string }[];
    expect(event!.actor_user_id).toBe(tech.id);
    const file = await tech.agent.get(`/api/calls/${callId}/photos/${res.body.photoId}`).expect(200);
    expect(file.headers['content-type']).toMatch(/^image\/jpeg/);
  });

  it('the same Idempotency-Key twice makes one photo row, and the repeat gets the first answer', async () => {
    const other = await openCall(a.gameIds[1]!);
    const first = await sendPhoto(tech.agent, other, await samplePng(), 'photo-key-0001').expect(201);
    const again = await sendPhoto(tech.agent, other, await samplePng(), 'photo-key-0001').expect(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    const rows = await photoRows(other);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ id: first.body.photoId, uploaded_by: 'staff' });
  });

  it('refuses a file that is not a picture with 400 naming photo, storing nothing', async () => {
    const other = await openCall(a.gameIds[2]!);
    const res = await sendPhoto(tech.agent, other, Buffer.from('not a picture at all'), undefined, 'game.png').expect(400);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'photo' })]);
    expect(await photoRows(other)).toHaveLength(0);
    const events = await t.db.owner.execute(sql`select 1 from call_events where call_id = ${other} and kind = 'photo'`);
    expect(events.rows).toHaveLength(0);
  });

  it('refuses a closed call with 409 naming state, storing nothing', async () => {
    await t.db.owner.execute(sql`update service_calls set state = 'cancelled' where id = ${callId}`);
    try {
      const before = (await photoRows(callId)).length;
      const res = await sendPhoto(tech.agent, callId, await samplePng()).expect(409);
      expect(res.body.errors).toEqual([expect.objectContaining({ field: 'state' })]);
      expect(await photoRows(callId)).toHaveLength(before);
    } finally {
      await t.db.owner.execute(sql`update service_calls set state = 'reported' where id = ${callId}`);
    }
  });

  it("another company's call is 404", async () => {
    await sendPhoto(otherOwner, callId, await samplePng()).expect(404);
    expect(await photoRows(callId)).toHaveLength(1);
  });
});
