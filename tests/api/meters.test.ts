// A game's meters through the API: which it has (and where each rolls over), readings (never lower than the last
// unless the meter rolls over and the person says so; negative, fractional and past-the-meter readings refused naming
// `reading`, nothing written), the newest of each meter, care plans looking again after a reading, the keep cost of
// the last 12 months; who may; another company's game.
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { problemDetails } from '@bumperline/contracts/common';
import { gameKeepCost, gameMeterList, latestMeterReadings, meterReading } from '@bumperline/contracts/meters';
import { JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import { createCompany, type CompanyFixture } from '../support/factories.ts';
import { appWithFullCompany, type FullCompany } from '../support/full-company.ts';

let t: TestApp;
let company: FullCompany;
let owner: Agent;
let technician: Agent;
let venueContact: Agent;
let close: () => Promise<void>;
let other: CompanyFixture;
let gameId: string;

const fieldsOf = (body: unknown) => problemDetails.parse(body).errors?.map((e) => e.field) ?? [];
const readingCount = async () =>
  Number(
    (await t.db.owner.execute<{ n: number }>(sql`select count(*)::int as n from meter_readings where game_id = ${gameId}`)).rows[0]!.n,
  );

beforeAll(async () => {
  const full = await appWithFullCompany('Metered Coin');
  ({ t, company, close } = full);
  owner = full.agents.owner;
  technician = full.agents.technician;
  venueContact = full.agents.venue_contact;
  gameId = company.gameIds[0]!;
  other = await createCompany(t.db.owner, 'Distant Arcade', 1);
});
afterAll(() => close());

describe('a game’s meters', () => {
  it('lists them and saves the whole set (the office only)', async () => {
    const before = gameMeterList.parse((await technician.get(`/api/games/${gameId}/meters`).expect(200)).body);
    expect(before.items).toEqual([{ meter: 'plays', rollsOverAt: 1_000_000 }]);
    await technician.put(`/api/games/${gameId}/meters`).set(JSON_HEADERS).send({ items: [] }).expect(403);
    const saved = gameMeterList.parse(
      (
        await owner
          .put(`/api/games/${gameId}/meters`)
          .set(JSON_HEADERS)
          .send({
            items: [
              { meter: 'plays', rollsOverAt: 1_000_000 },
              { meter: 'hours', rollsOverAt: null },
            ],
          })
          .expect(200)
      ).body,
    );
    expect(saved.items.map((m) => m.meter).sort()).toEqual(['hours', 'plays']);
    const twice = await owner
      .put(`/api/games/${gameId}/meters`)
      .set(JSON_HEADERS)
      .send({
        items: [
          { meter: 'plays', rollsOverAt: null },
          { meter: 'plays', rollsOverAt: 10 },
        ],
      })
      .expect(400);
    expect(fieldsOf(twice.body)).toEqual(['items']);
  });
});

describe('readings', () => {
  it('records a reading and makes the game’s care plans look again', async () => {
    await t.db.owner.execute(sql`update care_plans set next_check_at = now() + interval '30 days' where id = ${company.care.carePlanId}`);
    const res = await technician
      .post(`/api/games/${gameId}/meter-readings`)
      .set(JSON_HEADERS)
      .send({ meter: 'plays', reading: 15_400 })
      .expect(201);
    expect(meterReading.parse(res.body)).toMatchObject({
      meter: 'plays',
      reading: 15_400,
      rolledOver: false,
      source: 'visit',
      readBy: { id: company.technician.id },
    });
    const plan = await t.db.owner.execute<{ soon: boolean }>(
      sql`select next_check_at <= now() as soon from care_plans where id = ${company.care.carePlanId}`,
    );
    expect(plan.rows[0]!.soon).toBe(true);
  });

  it('refuses a lower reading unless the meter rolled over and the person says so', async () => {
    const before = await readingCount();
    const lower = await technician
      .post(`/api/games/${gameId}/meter-readings`)
      .set(JSON_HEADERS)
      .send({ meter: 'plays', reading: 120 })
      .expect(400);
    expect(problemDetails.parse(lower.body).errors).toEqual([
      { field: 'reading', message: expect.stringContaining('lower than the last reading (15,400)') },
    ]);
    expect(await readingCount()).toBe(before);
    const rolled = await technician
      .post(`/api/games/${gameId}/meter-readings`)
      .set(JSON_HEADERS)
      .send({ meter: 'plays', reading: 120, rolledOver: true })
      .expect(201);
    expect(meterReading.parse(rolled.body)).toMatchObject({ reading: 120, rolledOver: true });
    // The hours meter has no rollover point: lower is refused even when "rolled over" is ticked.
    await technician.post(`/api/games/${gameId}/meter-readings`).set(JSON_HEADERS).send({ meter: 'hours', reading: 500 }).expect(201);
    const hours = await technician
      .post(`/api/games/${gameId}/meter-readings`)
      .set(JSON_HEADERS)
      .send({ meter: 'hours', reading: 400, rolledOver: true })
      .expect(400);
    expect(fieldsOf(hours.body)).toEqual(['reading']);
  });

  it('refuses negative, fractional and past-the-meter readings and an unknown meter, naming each', async () => {
    const before = await readingCount();
    for (const [body, field] of [
      [{ meter: 'plays', reading: -1 }, 'reading'],
      [{ meter: 'plays', reading: 12.5 }, 'reading'],
      [{ meter: 'plays', reading: 1_000_000 }, 'reading'],
      [{ meter: 'plays', reading: '12' }, 'reading'],
      [{ meter: 'tokens', reading: 12 }, 'meter'],
      [{ meter: 'coins_in', reading: 12 }, 'meter'],
    ] as const) {
      const res = await technician.post(`/api/games/${gameId}/meter-readings`).set(JSON_HEADERS).send(body).expect(400);
      expect(fieldsOf(res.body)).toEqual([field]);
    }
    expect(await readingCount()).toBe(before);
  });

  it('gives the newest reading of each meter', async () => {
    const latest = latestMeterReadings.parse((await technician.get(`/api/games/${gameId}/meter-readings/latest`).expect(200)).body);
    expect(latest.items.map((r) => [r.meter, r.reading]).sort()).toEqual([
      ['hours', 500],
      ['plays', 120],
    ]);
  });
});

describe('keep cost', () => {
  it('sums the game’s last 12 months of parts and labour', async () => {
    const cost = gameKeepCost.parse((await owner.get(`/api/games/${gameId}/keep-cost`).expect(200)).body);
    // The fixture's finished bench job: 45 ¢ of parts and 90 minutes at $45.00 an hour.
    expect(cost).toMatchObject({
      gameId,
      currency: 'USD',
      jobs: 1,
      partsCents: 45,
      labourMinutes: 90,
      labourCents: 6750,
      totalCents: 6795,
    });
  });
});

describe('keep cost of a fixed service call', () => {
  it('is written when the call is fixed: labour from arrival on site to the fix, parts at cost', async () => {
    const id = company.assignedCallId;
    const move = async (to: string) => {
      const current = (await technician.get(`/api/calls/${id}`).expect(200)).body.call as { version: number };
      await technician.post(`/api/calls/${id}/transition`).set(JSON_HEADERS).send({ to, version: current.version }).expect(200);
    };
    await move('on_the_way');
    await move('on_site');
    // Arrived 50 minutes ago, as the timeline will say.
    await t.db.owner.execute(sql`update call_events set at = now() - interval '50 minutes' where call_id = ${id} and to_state = 'on_site'`);
    await move('fixed');
    const row = await t.db.owner.execute<{ minutes: number; labour: number; parts: number }>(
      sql`select labour_minutes as minutes, labour_cents::int as labour, parts_cents::int as parts from keep_cost_entries where source = 'service_call' and source_id = ${id}`,
    );
    expect(row.rows).toHaveLength(1);
    // 50 minutes at the default $45.00 an hour = 3,750 ¢; no parts recorded on this call.
    expect(row.rows[0]).toEqual({ minutes: 50, labour: 3750, parts: 0 });
  });
});

describe('who may, and other companies', () => {
  it('keeps the venue contact out and answers 404 for another company’s game', async () => {
    await venueContact.post(`/api/games/${gameId}/meter-readings`).set(JSON_HEADERS).send({ meter: 'plays', reading: 200 }).expect(403);
    const theirs = other.gameIds[0]!;
    await owner.get(`/api/games/${theirs}/meters`).expect(404);
    await owner.post(`/api/games/${theirs}/meter-readings`).set(JSON_HEADERS).send({ meter: 'plays', reading: 1 }).expect(404);
    await owner.get(`/api/games/${theirs}/meter-readings/latest`).expect(404);
    await owner.get(`/api/games/${theirs}/keep-cost`).expect(404);
    const written = await t.db.owner.execute<{ n: number }>(sql`select count(*)::int as n from meter_readings where game_id = ${theirs}`);
    expect(written.rows[0]!.n).toBe(0);
  });
});
