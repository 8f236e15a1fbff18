// Changes sent with an Idempotency-Key (the phone's queued changes): applied once however often they arrive,
// the same answer each time, never someone else's answer, and a malformed key refused by name.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { buildTestApp, JSON_HEADERS, signedInAgent, type Agent, type TestApp } from '../support/app.ts';
import { createCompany, createMember, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
let dispatcher: Agent;
let otherDispatcher: Agent;
let otherCompanyOwner: Agent;

async function callsOn(gameId: string): Promise<number> {
  const rows = (await t.db.owner.execute(sql`select count(*)::int as n from service_calls where game_id = ${gameId}`)).rows;
  return (rows[0] as { n: number }).n;
}

async function eventsOn(gameId: string): Promise<number> {
  const rows = (
    await t.db.owner.execute(
      sql`select count(*)::int as n from call_events e join service_calls c on c.id = e.call_id where c.game_id = ${gameId}`,
    )
  ).rows;
  return (rows[0] as { n: number }).n;
}

/** Each test opens calls on games of its own (a second call on a game with an open call joins it). */
let gamesUsed = 0;
const freshGame = () => a.gameIds[gamesUsed++]!;

async function storedKeys(key: string): Promise<{ tenant_id: string; status: number }[]> {
  return (await t.db.owner.execute(sql`select tenant_id, status from applied_changes where key = ${key}`)).rows as {
    tenant_id: string;
    status: number;
  }[];
}

const openCall = (agent: Agent, gameId: string, key?: string) => {
  const req = agent.post('/api/calls').set(JSON_HEADERS);
  if (key !== undefined) req.set('Idempotency-Key', key);
  return req.send({ gameId, problem: 'dead', note: 'No lights at all' });
};

beforeAll(async () => {
  t = await buildTestApp();
  a = await createCompany(t.db.owner, 'Alpha Amusements', 12);
  b = await createCompany(t.db.owner, 'Beta Games', 1);
  dispatcher = await signedInAgent(t, (await createMember(t.db.owner, a.tenantId, 'dispatcher')).email);
  otherDispatcher = await signedInAgent(t, (await createMember(t.db.owner, a.tenantId, 'dispatcher')).email);
  otherCompanyOwner = await signedInAgent(t, b.ownerEmail);
});
afterAll(() => t.close());

describe('Idempotency-Key', () => {
  it('applies a change sent twice with the same key once, and answers the repeat with the first answer', async () => {
    const gameId = freshGame();
    const first = await openCall(dispatcher, gameId, 'phone-change-0001').expect(201);
    const eventsAfterFirst = await eventsOn(gameId);
    const again = await openCall(dispatcher, gameId, 'phone-change-0001').expect(201);
    expect(await eventsOn(gameId)).toBe(eventsAfterFirst);
    expect(again.body).toEqual(first.body);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(first.headers['idempotent-replayed']).toBeUndefined();
    expect(await callsOn(gameId)).toBe(1);
    expect(await storedKeys('phone-change-0001')).toEqual([{ tenant_id: a.tenantId, status: 201 }]);
  });

  it('applies changes without a key, or with different keys, each time', async () => {
    const games = [freshGame(), freshGame(), freshGame()];
    await openCall(dispatcher, games[0]!).expect(201);
    await openCall(dispatcher, games[1]!, 'phone-change-0002').expect(201);
    await openCall(dispatcher, games[2]!, 'phone-change-0003').expect(201);
    expect(await Promise.all(games.map(callsOn))).toEqual([1, 1, 1]);
  });

  it("refuses another person's key with 409 naming the header, and changes nothing", async () => {
    const gameId = freshGame();
    const before = await callsOn(gameId);
    const res = await openCall(otherDispatcher, gameId, 'phone-change-0001').expect(409);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'Idempotency-Key' })]);
    expect(await callsOn(gameId)).toBe(before);
  });

  it("keeps each company's keys apart: the same key in another company is a new change there", async () => {
    const gameId = b.gameIds[0]!;
    await openCall(otherCompanyOwner, gameId, 'phone-change-0001').expect(201);
    expect(await callsOn(gameId)).toBe(1);
    expect((await storedKeys('phone-change-0001')).map((r) => r.tenant_id).sort()).toEqual([a.tenantId, b.tenantId].sort());
  });

  it.each([
    ['too short', 'abc'],
    ['spaces', 'has spaces in it'],
    ['other characters', 'key/with/slashes'],
    ['too long', 'k'.repeat(101)],
  ])('refuses a malformed key (%s) with 400 naming Idempotency-Key, and changes nothing', async (_what, key) => {
    const gameId = a.gameIds[a.gameIds.length - 1]!;
    const before = await callsOn(gameId);
    const res = await openCall(dispatcher, gameId, key).expect(400);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'Idempotency-Key' })]);
    expect(await callsOn(gameId)).toBe(before);
  });

  it('does not record a refused change, so the same key may be sent again once it is put right', async () => {
    const gameId = freshGame();
    const before = await callsOn(gameId);
    await dispatcher
      .post('/api/calls')
      .set(JSON_HEADERS)
      .set('Idempotency-Key', 'phone-change-0004')
      .send({ gameId, problem: 'not-a-problem' })
      .expect(400);
    expect(await storedKeys('phone-change-0004')).toEqual([]);
    await openCall(dispatcher, gameId, 'phone-change-0004').expect(201);
    expect(await callsOn(gameId)).toBe(before + 1);
  });

  it('applies concurrent duplicates once: the second waits for the first and replays its answer', async () => {
    const gameId = freshGame();
    const before = await callsOn(gameId);
    const answers = await Promise.all(Array.from({ length: 5 }, () => openCall(dispatcher, gameId, 'phone-change-0005')));
    expect(answers.map((r) => r.status)).toEqual([201, 201, 201, 201, 201]);
    expect(new Set(answers.map((r) => (r.body as { id: string }).id)).size).toBe(1);
    expect(answers.filter((r) => r.headers['idempotent-replayed'] === 'true')).toHaveLength(4);
    expect(await callsOn(gameId)).toBe(before + 1);
    expect(answers.every((r) => (r.body as { joined: boolean }).joined === false)).toBe(true);
  });

  it('forgets keys older than 30 days when a new change is recorded', async () => {
    await t.db.owner.execute(
      sql`insert into applied_changes (tenant_id, key, user_id, method, path, status, body, created_at)
          values (${a.tenantId}, 'old-phone-change', null, 'POST', '/api/calls', 201, '{}'::jsonb, now() - interval '31 days'),
                 (${a.tenantId}, 'recent-phone-change', null, 'POST', '/api/calls', 201, '{}'::jsonb, now() - interval '29 days')`,
    );
    await openCall(dispatcher, freshGame(), 'phone-change-0006').expect(201);
    expect(await storedKeys('old-phone-change')).toEqual([]);
    expect(await storedKeys('recent-phone-change')).toHaveLength(1);
  });
});
