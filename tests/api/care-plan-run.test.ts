// The scheduled care-plan run: due work becomes exactly one open work order per plan and game, whether two runs on
// separate connections race or two scheduler instances tick together; a run after a long stop catches up with one
// overdue order per game (planned for today); plays on the meter make work due; the usual technician, or else the
// nearest one with the skills, gets it; the dev clock runs it as of a chosen moment.
import pino from 'pino';
import request from 'supertest';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCarePlansOnce } from '@bumperline/api/jobs/care-plan-run';
import { startJobs } from '@bumperline/api/jobs/scheduler';
import type { Mailer } from '@bumperline/api/services/mailer';
import type { SmsSender } from '@bumperline/api/services/sms';
import { carePlanRunResult } from '@bumperline/contracts/work-orders';
import { createDb, type Db } from '@bumperline/db/client';
import { carePlans, gameMeters, meterReadings, technicianProfiles, workOrders } from '@bumperline/db/schema/index';
import { buildTestApp, type TestApp } from '../support/app.ts';
import { createCompany, createMember, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let second: Db;
let company: CompanyFixture;
const DAY = 86_400_000;

beforeAll(async () => {
  t = await buildTestApp();
  // A second pool on the same database: another API instance.
  second = createDb(t.db.appUrl, { max: 4 });
  company = await createCompany(t.db.owner, 'Routine Amusements', 3);
});
afterAll(async () => {
  await second.$client.end();
  await t.close();
});

/** A plan on the company's model: weekly on the start's weekday, due within its lead from now, to check now. */
async function weeklyPlan(name: string, extra: Partial<typeof carePlans.$inferInsert> = {}): Promise<string> {
  const [plan] = await t.db.owner
    .insert(carePlans)
    .values({
      tenantId: company.tenantId,
      name,
      scope: 'model',
      modelId: company.modelId,
      tasks: ['Clean and check'],
      skills: ['pinball'],
      onSiteMinutes: 30,
      rule: 'FREQ=WEEKLY',
      ruleStart: '2026-01-05T09:00',
      leadDays: 7,
      nextCheckAt: new Date(Date.now() - 60_000),
      ...extra,
    })
    .returning({ id: carePlans.id });
  return plan!.id;
}

async function openOrders(planId: string) {
  const r = await t.db.owner.execute<{
    game_id: string;
    due_at: Date;
    planned_on: string;
    technician_id: string | null;
    due_reason: string;
  }>(
    sql`select game_id, due_at, planned_on::text, technician_id, due_reason from work_orders where care_plan_id = ${planId} and state = 'open' order by game_id`,
  );
  return r.rows;
}

describe('exactly once', () => {
  it('two runs at once on separate connections create each work order once', async () => {
    const planId = await weeklyPlan('Race of two');
    const now = new Date();
    const results = await Promise.all([runCarePlansOnce({ db: t.db.app }, now), runCarePlansOnce({ db: second }, now)]);
    expect(results.reduce((n, r) => n + r.workOrdersCreated, 0)).toBe(3);
    expect((await openOrders(planId)).map((o) => o.game_id).sort()).toEqual([...company.gameIds].sort());
    // Again, with the plan's check forced back: still one open order per game.
    await t.db.owner.update(carePlans).set({ nextCheckAt: new Date(0) });
    const again = await Promise.all([runCarePlansOnce({ db: t.db.app }, now), runCarePlansOnce({ db: second }, now)]);
    expect(again.reduce((n, r) => n + r.workOrdersCreated, 0)).toBe(0);
    expect(await openOrders(planId)).toHaveLength(3);
  });

  it('two scheduler instances ticking together create each work order once', async () => {
    const planId = await weeklyPlan('Two schedulers');
    const deps = { sms: {} as SmsSender, mailer: {} as Mailer, logger: pino({ level: 'silent' }), appOrigin: 'http://127.0.0.1' };
    const never = '0 0 1 1 *';
    const schedules = { outbox: never, targetWarnings: never, rateLimitCleanup: never, carePlans: '* * * * * *' };
    const a = startJobs({ ...deps, db: t.db.app, schedules });
    const b = startJobs({ ...deps, db: second, schedules });
    try {
      const deadline = Date.now() + 5_000;
      while ((await openOrders(planId)).length < 3 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
      // Let both tick a few more times with the plan's check forced back.
      await t.db.owner.update(carePlans).set({ nextCheckAt: new Date(0) });
      await new Promise((r) => setTimeout(r, 2_200));
    } finally {
      a.stop();
      b.stop();
    }
    await new Promise((r) => setTimeout(r, 300));
    const rows = await t.db.owner.execute<{ n: number }>(sql`select count(*)::int as n from work_orders where care_plan_id = ${planId}`);
    expect(rows.rows[0]!.n).toBe(3);
  });
});

describe('catching up', () => {
  it('after weeks without a run, makes one overdue work order per game, planned for today', async () => {
    const longAgo = new Date(Date.now() - 60 * DAY);
    const planId = await weeklyPlan('Missed weeks', { createdAt: longAgo, nextCheckAt: longAgo, technicianId: null });
    const now = new Date();
    const ran = await runCarePlansOnce({ db: t.db.app }, now);
    expect(ran.workOrdersCreated).toBeGreaterThanOrEqual(3);
    const orders = await openOrders(planId);
    expect(orders).toHaveLength(3);
    const today = new Intl.DateTimeFormat('en-CA', { timeZone: 'America/Chicago' }).format(now);
    for (const o of orders) {
      // The first Monday 09:00 after the plan was made: about eight weeks ago.
      expect(new Date(o.due_at).getTime()).toBeLessThan(now.getTime() - 50 * DAY);
      expect(o.planned_on).toBe(today);
      expect(o.due_reason).toBe('calendar');
    }
    const plan = await t.db.owner.execute<{ next: Date }>(sql`select next_check_at as next from care_plans where id = ${planId}`);
    expect(new Date(plan.rows[0]!.next).getTime()).toBeGreaterThan(now.getTime());
  });
});

describe('by plays, and who gets the work', () => {
  it('makes work due when the plays since the last service pass the plan’s count, for the nearest technician with the skills', async () => {
    const other = await createCompany(t.db.owner, 'Counted Plays', 1);
    const gameId = other.gameIds[0]!;
    // Venue 1 of a company sits at 41.88, -87.63 (factories.ts): one technician 2 km off without the skill, one 5 km off with it.
    const near = await createMember(t.db.owner, other.tenantId, 'technician', { name: 'Near Unskilled' });
    const skilled = await createMember(t.db.owner, other.tenantId, 'technician', { name: 'Skilled Further' });
    await t.db.owner.insert(technicianProfiles).values([
      { tenantId: other.tenantId, userId: near.id, skills: ['jukebox'], homeLatitude: 41.898, homeLongitude: -87.63 },
      { tenantId: other.tenantId, userId: skilled.id, skills: ['pinball'], homeLatitude: 41.925, homeLongitude: -87.63 },
    ]);
    await t.db.owner.insert(gameMeters).values({ tenantId: other.tenantId, gameId, meter: 'plays', rollsOverAt: 1_000_000 });
    await t.db.owner.insert(meterReadings).values([
      { tenantId: other.tenantId, gameId, meter: 'plays', reading: 998_500, source: 'visit', readAt: new Date(Date.now() - 20 * DAY) },
      // Rolled over: 1,500 to the rollover and 700 after it = 2,200 plays.
      {
        tenantId: other.tenantId,
        gameId,
        meter: 'plays',
        reading: 700,
        rolledOver: true,
        source: 'visit',
        readAt: new Date(Date.now() - DAY),
      },
    ]);
    const [plan] = await t.db.owner
      .insert(carePlans)
      .values({
        tenantId: other.tenantId,
        name: 'Every 2,000 plays',
        scope: 'game',
        gameId,
        tasks: ['Clean the playfield'],
        skills: ['pinball'],
        onSiteMinutes: 30,
        playsEvery: 2000,
        nextCheckAt: new Date(Date.now() - 1000),
      })
      .returning({ id: carePlans.id });
    await runCarePlansOnce({ db: t.db.app });
    const orders = await t.db.owner
      .select({ dueReason: workOrders.dueReason, technicianId: workOrders.technicianId })
      .from(workOrders)
      .where(sql`care_plan_id = ${plan!.id}`);
    expect(orders).toEqual([{ dueReason: 'plays', technicianId: skilled.id }]);
  });
});

describe('the dev clock', () => {
  it('runs the care-plan run as of the moment given, and refuses a moment that is not one', async () => {
    const planId = await weeklyPlan('Clock', {
      rule: 'FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1',
      ruleStart: '2027-06-29T09:00',
      nextCheckAt: new Date('2027-06-01T00:00:00Z'),
    });
    const agent = request(t.app);
    const early = carePlanRunResult.parse((await agent.post('/dev/care-plans/run').send({ at: '2027-06-01T12:00:00Z' }).expect(200)).body);
    expect(early.workOrdersCreated).toBe(0);
    const late = carePlanRunResult.parse((await agent.post('/dev/care-plans/run').send({ at: '2027-06-25T12:00:00Z' }).expect(200)).body);
    expect(late.workOrdersCreated).toBeGreaterThanOrEqual(3);
    const orders = await openOrders(planId);
    expect(orders).toHaveLength(3);
    // The last Tuesday of June 2027, 09:00 in Chicago (CDT, UTC−5); planned for that day.
    expect(orders.map((o) => new Date(o.due_at).toISOString())).toEqual(Array(3).fill('2027-06-29T14:00:00.000Z'));
    expect(orders.map((o) => o.planned_on)).toEqual(Array(3).fill('2027-06-29'));
    const bad = await agent.post('/dev/care-plans/run').send({ at: 'next Tuesday' }).expect(400);
    expect(bad.body.errors.map((e: { field: string }) => e.field)).toEqual(['at']);
  });
});
