// Company settings: the owner sets the response targets, and new calls are held to them.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { memberships } from '@bumperline/db/schema/index';
import { buildTestApp, JSON_HEADERS, signedInAgent, type Agent, type TestApp } from '../support/app.ts';
import { createCompany, createUser, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let a: CompanyFixture;
let owner: Agent;
let dispatcher: Agent;

async function member(company: CompanyFixture, role: 'dispatcher' | 'technician' | 'venue_contact', over: Record<string, unknown> = {}) {
  const u = await createUser(t.db.owner, over);
  await t.db.owner.insert(memberships).values({ tenantId: company.tenantId, userId: u.id, role });
  return u;
}

async function owned<T>(query: ReturnType<typeof sql>): Promise<T[]> {
  return (await t.db.owner.execute(query)).rows as T[];
}

beforeAll(async () => {
  t = await buildTestApp();
  a = await createCompany(t.db.owner, 'Alpha Amusements', 3);
  owner = await signedInAgent(t, a.ownerEmail);
  dispatcher = await signedInAgent(t, (await member(a, 'dispatcher')).email);
});
afterAll(() => t.close());

async function openCall(gameId = a.gameIds[0]!, problem = 'dead') {
  const res = await dispatcher.post('/api/calls').set(JSON_HEADERS).send({ gameId, problem, note: 'No lights at all' }).expect(201);
  return res.body as { id: string; version: number; state: string; joined: boolean };
}

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
    const call = await openCall(game.body.id, 'dead');
    expect(call.joined).toBe(false);
    const [c] = await owned<{ minutes: number }>(
      sql`select extract(epoch from target_at - opened_at)/60 as minutes from service_calls where id = ${call.id}`,
    );
    expect(Number(c!.minutes)).toBe(90);
  });
});
