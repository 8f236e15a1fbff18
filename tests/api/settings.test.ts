// Company settings: the owner sets the response targets, and new calls are held to them.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { buildTestApp, JSON_HEADERS, signedInAgent, type Agent, type TestApp } from '../support/app.ts';
import { createCompany, createMember, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let a: CompanyFixture;
let owner: Agent;
let dispatcher: Agent;

beforeAll(async () => {
  t = await buildTestApp();
  a = await createCompany(t.db.owner, 'Alpha Amusements', 3);
  owner = await signedInAgent(t, a.ownerEmail);
  dispatcher = await signedInAgent(t, (await createMember(t.db.owner, a.tenantId, 'dispatcher')).email);
});
afterAll(() => t.close());

describe('settings', () => {
  it('the owner sets response targets; new calls use them; bad values are refused by field', async () => {
    const bad = await owner
      .patch('/api/settings')
      .set(JSON_HEADERS)
      .send({ responseTargets: { down: 1, fault: 60, cosmetic: 60 } })
      .expect(400);
    expect(bad.body.errors[0].field).toBe('responseTargets.down');
    await dispatcher.patch('/api/settings').set(JSON_HEADERS).send({ warnBeforeMinutes: 10 }).expect(403);
    await owner
      .patch('/api/settings')
      .set(JSON_HEADERS)
      .send({ responseTargets: { down: 90, fault: 600, cosmetic: 6000 } })
      .expect(200);
    const game = await owner
      .post('/api/games')
      .set(JSON_HEADERS)
      .send({ modelId: a.modelId, venueId: a.venueIds[2], serial: 'FRESH-1' })
      .expect(201);
    const opened = await dispatcher
      .post('/api/calls')
      .set(JSON_HEADERS)
      .send({ gameId: game.body.id, problem: 'dead', note: 'No lights at all' })
      .expect(201);
    const call = opened.body as { id: string; joined: boolean };
    expect(call.joined).toBe(false);
    const [c] = (
      await t.db.owner.execute(sql`select extract(epoch from target_at - opened_at)/60 as minutes from service_calls where id = ${call.id}`)
    ).rows as { minutes: number }[];
    expect(Number(c!.minutes)).toBe(90);
  });

  it('the owner sets the labour rate and driving speed; an impossible speed is refused by field and changes nothing', async () => {
    const before = (await owner.get('/api/settings').expect(200)).body;
    const bad = await owner.patch('/api/settings').set(JSON_HEADERS).send({ labourRateCents: 6000, averageSpeedKmh: 400 }).expect(400);
    expect(bad.body.errors.map((e: { field: string }) => e.field)).toEqual(['averageSpeedKmh']);
    expect((await owner.get('/api/settings').expect(200)).body.labourRateCents).toBe(before.labourRateCents);
    await owner.patch('/api/settings').set(JSON_HEADERS).send({ labourRateCents: 6000, averageSpeedKmh: 40 }).expect(200);
    const after = (await owner.get('/api/settings').expect(200)).body;
    expect([after.labourRateCents, after.averageSpeedKmh]).toEqual([6000, 40]);
  });
});
