// Service calls through the API: every state change per role, assignment races, the game's status
// and downtime following the call, and the messages each step queues.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { technicianProfiles, users, venueContacts } from '@bumperline/db/schema/index';
import { buildTestApp, JSON_HEADERS, signedInAgent, type Agent, type TestApp } from '../support/app.ts';
import { createCompany, createMember, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
let owner: Agent;
let dispatcher: Agent;
let dispatcher2: Agent;
let techNear: { id: string; agent: Agent };
let techFar: { id: string; agent: Agent };
let venueContact: Agent;

async function owned<T>(query: ReturnType<typeof sql>): Promise<T[]> {
  return (await t.db.owner.execute(query)).rows as T[];
}

beforeAll(async () => {
  t = await buildTestApp();
  a = await createCompany(t.db.owner, 'Alpha Amusements', 3);
  b = await createCompany(t.db.owner, 'Beta Games', 1);
  owner = await signedInAgent(t, a.ownerEmail);
  dispatcher = await signedInAgent(t, (await createMember(t.db.owner, a.tenantId, 'dispatcher')).email);
  dispatcher2 = await signedInAgent(t, (await createMember(t.db.owner, a.tenantId, 'dispatcher')).email);
  // Venue 1 of the fixture is at 41.88,-87.63. The near technician lives a few hundred metres away.
  const near = await createMember(t.db.owner, a.tenantId, 'technician', { phone: '+13125550161', name: 'Near Tech' });
  const far = await createMember(t.db.owner, a.tenantId, 'technician', { phone: '+13125550162', name: 'Far Tech' });
  await t.db.owner.insert(technicianProfiles).values([
    { tenantId: a.tenantId, userId: near.id, skills: ['pinball'], homeLatitude: 41.881, homeLongitude: -87.631 },
    { tenantId: a.tenantId, userId: far.id, skills: ['pinball'], homeLatitude: 42.05, homeLongitude: -87.68 },
  ]);
  techNear = { id: near.id, agent: await signedInAgent(t, near.email) };
  techFar = { id: far.id, agent: await signedInAgent(t, far.email) };
  const vc = await createMember(t.db.owner, a.tenantId, 'venue_contact', { email: 'contact@alpha-venue.test' });
  await t.db.owner.insert(venueContacts).values({ tenantId: a.tenantId, venueId: a.venueIds[0]!, userId: vc.id });
  venueContact = await signedInAgent(t, vc.email);
});
afterAll(() => t.close());

async function openCall(gameId = a.gameIds[0]!, problem = 'dead') {
  const res = await dispatcher.post('/api/calls').set(JSON_HEADERS).send({ gameId, problem, note: 'No lights at all' }).expect(201);
  return res.body as { id: string; version: number; state: string; joined: boolean };
}

async function move(agent: Agent, id: string, to: string, expected = 200) {
  const current = (await dispatcher.get(`/api/calls/${id}`).expect(200)).body.call;
  return agent.post(`/api/calls/${id}/transition`).set(JSON_HEADERS).send({ to, version: current.version }).expect(expected);
}

describe('opening a call', () => {
  it('puts the game down, starts its downtime, sets the response target and tells the venue contact', async () => {
    const call = await openCall();
    expect(call).toMatchObject({ state: 'reported', joined: false });
    const [game] = await owned<{ status: string }>(sql`select status from games where id = ${a.gameIds[0]}`);
    expect(game!.status).toBe('down');
    const intervals = await owned<{ ended_at: Date | null }>(sql`select ended_at from downtime_intervals where game_id = ${a.gameIds[0]}`);
    expect(intervals).toEqual([{ ended_at: null }]);
    const [c] = await owned<{ minutes: number }>(
      sql`select extract(epoch from target_at - opened_at)/60 as minutes from service_calls where id = ${call.id}`,
    );
    expect(Number(c!.minutes)).toBe(240); // default target for "game down"
    const mail = await owned<{ to_address: string; channel: string }>(
      sql`select to_address, channel from outbox where call_id = ${call.id}`,
    );
    expect(mail).toEqual([{ to_address: 'contact@alpha-venue.test', channel: 'email' }]);
  });

  it('a second report of the same game joins the open call', async () => {
    const again = await openCall(a.gameIds[0]!, 'no_credit');
    const [{ n }] = (await owned<{ n: number }>(sql`select count(*)::int as n from service_calls where game_id = ${a.gameIds[0]}`)) as [
      { n: number },
    ];
    expect(again.joined).toBe(true);
    expect(n).toBe(1);
    const detail = await dispatcher.get(`/api/calls/${again.id}`).expect(200);
    expect(detail.body.events.map((e: { kind: string }) => e.kind)).toEqual(['opened', 'report_joined']);
  });

  it("refuses another company's game and bad input, storing nothing", async () => {
    const before = await owned<{ n: number }>(sql`select count(*)::int as n from service_calls`);
    const foreign = await dispatcher.post('/api/calls').set(JSON_HEADERS).send({ gameId: b.gameIds[0], problem: 'dead' }).expect(400);
    expect(foreign.body.errors[0].field).toBe('gameId');
    const bad = await dispatcher.post('/api/calls').set(JSON_HEADERS).send({ gameId: a.gameIds[1], problem: 'on fire' }).expect(400);
    expect(bad.body.errors[0].field).toBe('problem');
    expect(await owned(sql`select count(*)::int as n from service_calls`)).toEqual(before);
  });
});

describe('dispatch', () => {
  it('ranks the nearby technician first, by the domain module', async () => {
    const call = await openCall(a.gameIds[1]!);
    const res = await dispatcher.get(`/api/calls/${call.id}/technicians`).expect(200);
    expect(res.body.items[0].name).toBe('Near Tech');
    expect(res.body.items[0].rank.distanceKm).toBeLessThan(res.body.items[1].rank.distanceKm);
  });

  it('two dispatchers assigning at once: one wins, the other gets 409 with the current state', async () => {
    const call = await openCall(a.gameIds[2]!);
    const [first, second] = await Promise.all([
      dispatcher.post(`/api/calls/${call.id}/assign`).set(JSON_HEADERS).send({ technicianId: techNear.id, version: call.version }),
      dispatcher2.post(`/api/calls/${call.id}/assign`).set(JSON_HEADERS).send({ technicianId: techFar.id, version: call.version }),
    ]);
    expect([first.status, second.status].sort()).toEqual([200, 409]);
    const loser = first.status === 409 ? first : second;
    const winnerTech = first.status === 200 ? techNear.id : techFar.id;
    expect(loser.body.current).toMatchObject({ state: 'assigned', technicianId: winnerTech });
    // Exactly one assignment SMS was queued, to the winner.
    const sms = await owned<{ to_address: string; body: string }>(
      sql`select to_address, body from outbox where call_id = ${call.id} and channel = 'sms'`,
    );
    expect(sms).toHaveLength(1);
    expect(sms[0]!.body).toMatch(/Reply YES to accept/);
  });

  it('technicians and venue contacts cannot assign', async () => {
    const call = (await dispatcher.get('/api/calls').query({ state: 'reported' }).expect(200)).body.items[0];
    await techNear.agent
      .post(`/api/calls/${call.id}/assign`)
      .set(JSON_HEADERS)
      .send({ technicianId: techNear.id, version: call.version })
      .expect(403);
    await venueContact
      .post(`/api/calls/${call.id}/assign`)
      .set(JSON_HEADERS)
      .send({ technicianId: techNear.id, version: call.version })
      .expect(403);
  });

  it('refuses assigning someone who is not a technician of this company', async () => {
    const call = (await dispatcher.get('/api/calls').query({ state: 'reported' }).expect(200)).body.items[0];
    const res = await dispatcher
      .post(`/api/calls/${call.id}/assign`)
      .set(JSON_HEADERS)
      .send({ technicianId: b.ownerId, version: call.version })
      .expect(400);
    expect(res.body.errors[0].field).toBe('technicianId');
  });
});

describe('the technician works the call', () => {
  it('moves it on the way → on site → fixed → closed; the game runs again and the downtime is closed', async () => {
    const gameId = a.gameIds[0]!;
    const call = (await dispatcher.get('/api/calls').query({ gameId }).expect(200)).body.items[0];
    await dispatcher
      .post(`/api/calls/${call.id}/assign`)
      .set(JSON_HEADERS)
      .send({ technicianId: techNear.id, version: call.version })
      .expect(200);
    // The other technician may not touch it.
    await move(techFar.agent, call.id, 'on_the_way', 403);
    await techNear.agent.post(`/api/calls/${call.id}/answer`).set(JSON_HEADERS).send({ accept: true }).expect(200);
    await move(techNear.agent, call.id, 'on_the_way');
    await move(techNear.agent, call.id, 'fixed', 409); // cannot skip being on site
    await move(techNear.agent, call.id, 'on_site');
    await move(techNear.agent, call.id, 'fixed');
    const [game] = await owned<{ status: string }>(sql`select status from games where id = ${gameId}`);
    expect(game!.status).toBe('running');
    const [interval] = await owned<{ ended_at: Date | null }>(sql`select ended_at from downtime_intervals where game_id = ${gameId}`);
    expect(interval!.ended_at).not.toBeNull();
    await move(techNear.agent, call.id, 'closed');
    const detail = (await dispatcher.get(`/api/calls/${call.id}`).expect(200)).body;
    expect(detail.events.map((e: { kind: string; toState: string | null }) => `${e.kind}:${e.toState ?? ''}`)).toEqual([
      'opened:reported',
      'report_joined:',
      'assigned:assigned',
      'accepted:',
      'state:on_the_way',
      'state:on_site',
      'state:fixed',
      'state:closed',
    ]);
    expect(detail.events.find((e: { kind: string }) => e.kind === 'state').actorName).toBe('Near Tech');
    // The venue contact is told it closed.
    const mails = await owned<{ subject: string }>(
      sql`select subject from outbox where call_id = ${call.id} and channel = 'email' order by created_at`,
    );
    expect(mails.map((m) => m.subject)).toEqual([expect.stringMatching(/opened/), expect.stringMatching(/closed/)]);
    await move(techNear.agent, call.id, 'on_site', 409); // closed is final
  });

  it('taken to the shop puts the game at the shop; waiting on parts keeps it down', async () => {
    const call = (await dispatcher.get('/api/calls').query({ gameId: a.gameIds[1] }).expect(200)).body.items[0];
    await dispatcher
      .post(`/api/calls/${call.id}/assign`)
      .set(JSON_HEADERS)
      .send({ technicianId: techFar.id, version: call.version })
      .expect(200);
    await move(techFar.agent, call.id, 'on_site');
    await move(techFar.agent, call.id, 'waiting_parts');
    expect((await owned<{ status: string }>(sql`select status from games where id = ${a.gameIds[1]}`))[0]!.status).toBe('down');
    await move(techFar.agent, call.id, 'at_shop');
    expect((await owned<{ status: string }>(sql`select status from games where id = ${a.gameIds[1]}`))[0]!.status).toBe('in_shop');
    await move(techFar.agent, call.id, 'fixed');
    expect((await owned<{ status: string }>(sql`select status from games where id = ${a.gameIds[1]}`))[0]!.status).toBe('running');
  });

  it('a dispatcher can cancel a false report; the game runs again', async () => {
    const gameId = a.gameIds[0]!;
    const call = await openCall(gameId, 'ball_stuck');
    await move(dispatcher, call.id, 'cancelled');
    expect((await owned<{ status: string }>(sql`select status from games where id = ${gameId}`))[0]!.status).toBe('running');
    const open = await owned(sql`select id from downtime_intervals where game_id = ${gameId} and ended_at is null`);
    expect(open).toEqual([]);
  });

  it('declining sends the call back to dispatch unassigned', async () => {
    const call = await openCall(a.gameIds[0]!, 'no_sound');
    const assigned = await dispatcher
      .post(`/api/calls/${call.id}/assign`)
      .set(JSON_HEADERS)
      .send({ technicianId: techNear.id, version: call.version })
      .expect(200);
    expect(assigned.body.state).toBe('assigned');
    const declined = await techNear.agent.post(`/api/calls/${call.id}/answer`).set(JSON_HEADERS).send({ accept: false }).expect(200);
    expect(declined.body).toMatchObject({ state: 'reported', technicianId: null });
  });
});

describe('who may move a call, per role', () => {
  it('owner and dispatcher may cancel; an unassigned or assigned technician and a venue contact may not', async () => {
    const game = await owner
      .post('/api/games')
      .set(JSON_HEADERS)
      .send({ modelId: a.modelId, venueId: a.venueIds[1], serial: 'ROLE-1' })
      .expect(201);
    const cases: [string, Agent, number][] = [
      ['venue contact', venueContact, 403],
      ['unassigned technician', techFar.agent, 403],
      ['dispatcher', dispatcher, 200],
    ];
    for (const [who, agent, status] of cases) {
      const call = await openCall(game.body.id, 'other');
      const res = await agent.post(`/api/calls/${call.id}/transition`).set(JSON_HEADERS).send({ to: 'cancelled', version: call.version });
      expect(res.status, who).toBe(status);
      if (status === 403)
        await dispatcher
          .post(`/api/calls/${call.id}/transition`)
          .set(JSON_HEADERS)
          .send({ to: 'cancelled', version: call.version })
          .expect(200);
    }
    const call = await openCall(game.body.id, 'other');
    const assigned = await dispatcher
      .post(`/api/calls/${call.id}/assign`)
      .set(JSON_HEADERS)
      .send({ technicianId: techFar.id, version: call.version })
      .expect(200);
    await techFar.agent
      .post(`/api/calls/${call.id}/transition`)
      .set(JSON_HEADERS)
      .send({ to: 'cancelled', version: assigned.body.version })
      .expect(403);
    await owner
      .post(`/api/calls/${call.id}/transition`)
      .set(JSON_HEADERS)
      .send({ to: 'cancelled', version: assigned.body.version })
      .expect(200);
  });

  it('the owner may work any call through every state', async () => {
    const game = await owner
      .post('/api/games')
      .set(JSON_HEADERS)
      .send({ modelId: a.modelId, venueId: a.venueIds[1], serial: 'ROLE-2' })
      .expect(201);
    const call = await openCall(game.body.id, 'dead');
    let version = (
      await owner
        .post(`/api/calls/${call.id}/assign`)
        .set(JSON_HEADERS)
        .send({ technicianId: techNear.id, version: call.version })
        .expect(200)
    ).body.version;
    for (const to of ['on_the_way', 'on_site', 'waiting_parts', 'on_site', 'at_shop', 'fixed', 'on_site', 'fixed', 'closed']) {
      const res = await owner.post(`/api/calls/${call.id}/transition`).set(JSON_HEADERS).send({ to, version }).expect(200);
      expect(res.body.state).toBe(to);
      version = res.body.version;
    }
    const [row] = await owned<{ n: number }>(sql`select count(*)::int as n from call_events where call_id = ${call.id} and kind = 'state'`);
    expect(row!.n).toBe(9);
  });

  it('a stale version is refused with the current call, and nothing changes', async () => {
    const game = await owner
      .post('/api/games')
      .set(JSON_HEADERS)
      .send({ modelId: a.modelId, venueId: a.venueIds[1], serial: 'ROLE-3' })
      .expect(201);
    const call = await openCall(game.body.id, 'dead');
    await move(dispatcher, call.id, 'cancelled');
    const stale = await owner
      .post(`/api/calls/${call.id}/transition`)
      .set(JSON_HEADERS)
      .send({ to: 'cancelled', version: call.version })
      .expect(409);
    expect(stale.body.current.state).toBe('cancelled');
  });
});

describe('venue view', () => {
  it('shows the contact their venue’s games and calls only, and lets them report', async () => {
    const view = await venueContact.get('/api/venue-view').expect(200);
    expect(view.body.venues.map((v: { id: string }) => v.id)).toEqual([a.venueIds[0]]);
    expect(view.body.games.every((g: { venueId: string }) => g.venueId === a.venueIds[0])).toBe(true);
    expect([...view.body.openCalls, ...view.body.pastCalls].every((c: { venueId: string }) => c.venueId === a.venueIds[0])).toBe(true);
    const reported = await venueContact
      .post('/api/venue-view/calls')
      .set(JSON_HEADERS)
      .send({ gameId: a.gameIds[0], problem: 'display_out' })
      .expect(201);
    expect(reported.body.id).toBeTruthy();
    const elsewhere = await venueContact
      .post('/api/venue-view/calls')
      .set(JSON_HEADERS)
      .send({ gameId: a.gameIds[2], problem: 'dead' })
      .expect(400);
    expect(elsewhere.body.errors[0].field).toBe('gameId');
    await venueContact.get('/api/calls').expect(403);
    await dispatcher.get('/api/venue-view').expect(403);
  });
});

describe('isolation', () => {
  it("another company's calls are invisible and untouchable", async () => {
    const bOwner = await signedInAgent(t, b.ownerEmail);
    const mine = (await dispatcher.get('/api/calls').query({ state: 'all' }).expect(200)).body.items;
    expect(mine.length).toBeGreaterThan(0);
    const theirs = await bOwner.get('/api/calls').query({ state: 'all' }).expect(200);
    expect(theirs.body.items).toEqual([]);
    await bOwner.get(`/api/calls/${mine[0].id}`).expect(404);
    await bOwner
      .post(`/api/calls/${mine[0].id}/transition`)
      .set(JSON_HEADERS)
      .send({ to: 'cancelled', version: mine[0].version })
      .expect(404);
  });
});

describe('users with phones', () => {
  it('stores phone numbers in E.164 only', async () => {
    const rows = await owned<{ phone: string }>(sql`select phone from ${users} where phone is not null`);
    expect(rows.every((r) => /^\+\d{8,15}$/.test(r.phone))).toBe(true);
  });
});
