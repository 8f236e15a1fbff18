// Work orders through the API: the list of open work by due state and filters, one order; moving (a technician
// only the day of their own), skipping (a reason required), done (time, note, meters read then, keep cost; twice →
// 409 naming `state`), each at a version (409 with the order as it is when stale) and audited; bad input refused
// naming the field with nothing changed; another company's order.
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { problemDetails } from '@bumperline/contracts/common';
import { workOrder, workOrderPage } from '@bumperline/contracts/work-orders';
import { carePlans, workOrders } from '@bumperline/db/schema/index';
import { JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import { createCompany, type CompanyFixture } from '../support/factories.ts';
import { appWithFullCompany, type FullCompany } from '../support/full-company.ts';

let t: TestApp;
let company: FullCompany;
let owner: Agent;
let dispatcher: Agent;
let technician: Agent;
let close: () => Promise<void>;
let other: CompanyFixture;

const fieldsOf = (body: unknown) => problemDetails.parse(body).errors?.map((e) => e.field) ?? [];
const DAY = 86_400_000;

/** A new plan on the company's model with an open work order on game `gameIndex`, due `dueInDays` from now. */
async function openOrder(p: {
  dueInDays: number;
  gameIndex?: number;
  technicianId?: string | null;
  tenantId?: string;
  modelId?: string;
  gameId?: string;
}) {
  const tenantId = p.tenantId ?? company.tenantId;
  const [plan] = await t.db.owner
    .insert(carePlans)
    .values({
      tenantId,
      name: `Plan ${Math.random().toString(36).slice(2, 8)}`,
      scope: 'model',
      modelId: p.modelId ?? company.modelId,
      tasks: ['Clean the glass'],
      onSiteMinutes: 30,
      playsEvery: 5000,
      leadDays: 7,
    })
    .returning({ id: carePlans.id });
  const [order] = await t.db.owner
    .insert(workOrders)
    .values({
      tenantId,
      carePlanId: plan!.id,
      gameId: p.gameId ?? company.gameIds[p.gameIndex ?? 0]!,
      dueAt: new Date(Date.now() + p.dueInDays * DAY),
      dueReason: 'plays',
      title: 'Clean the glass',
      tasks: ['Clean the glass'],
      onSiteMinutes: 30,
      technicianId: p.technicianId === undefined ? company.technician.id : p.technicianId,
    })
    .returning({ id: workOrders.id });
  return order!.id;
}

const stateOf = async (id: string) =>
  (await t.db.owner.execute<{ state: string; version: number }>(sql`select state, version from work_orders where id = ${id}`)).rows[0]!;

beforeAll(async () => {
  const full = await appWithFullCompany('Orderly Coin');
  ({ t, company, close } = full);
  owner = full.agents.owner;
  dispatcher = full.agents.dispatcher;
  technician = full.agents.technician;
  other = await createCompany(t.db.owner, 'Faraway Fun', 1);
});
afterAll(() => close());

describe('the list', () => {
  it('shows open work by due date with its due state, and filters by due state, technician, game and venue', async () => {
    const soon = await openOrder({ dueInDays: 3, gameIndex: 1 });
    const later = await openOrder({ dueInDays: 30, gameIndex: 1, technicianId: null });
    const all = workOrderPage.parse((await dispatcher.get('/api/work-orders').expect(200)).body);
    const byId = new Map(all.items.map((o) => [o.id, o]));
    expect(byId.get(company.care.workOrderId)).toMatchObject({
      dueState: 'overdue',
      state: 'open',
      carePlanName: 'Monthly clean and check',
    });
    expect(byId.get(soon)?.dueState).toBe('due_soon');
    expect(byId.get(later)?.dueState).toBe('later');
    const dueTimes = all.items.map((o) => o.dueAt);
    expect(dueTimes).toEqual([...dueTimes].sort());

    const overdue = workOrderPage.parse((await dispatcher.get('/api/work-orders').query({ due: 'overdue' }).expect(200)).body);
    expect(overdue.items.map((o) => o.id)).toEqual([company.care.workOrderId]);
    const dueSoon = workOrderPage.parse((await dispatcher.get('/api/work-orders').query({ due: 'due_soon' }).expect(200)).body);
    expect(dueSoon.items.map((o) => o.id)).toEqual([soon]);
    const unassigned = workOrderPage.parse((await dispatcher.get('/api/work-orders').query({ technicianId: 'none' }).expect(200)).body);
    expect(unassigned.items.map((o) => o.id)).toEqual([later]);
    const mine = workOrderPage.parse((await technician.get('/api/work-orders').query({ technicianId: 'me' }).expect(200)).body);
    expect(mine.items.map((o) => o.id).sort()).toEqual([company.care.workOrderId, soon].sort());
    const atVenue = workOrderPage.parse(
      (await dispatcher.get('/api/work-orders').query({ venueId: company.venueIds[1] }).expect(200)).body,
    );
    expect(atVenue.items.map((o) => o.id).sort()).toEqual([soon, later].sort());
    const ofGame = workOrderPage.parse((await dispatcher.get('/api/work-orders').query({ gameId: company.gameIds[0] }).expect(200)).body);
    expect(ofGame.items.map((o) => o.id)).toEqual([company.care.workOrderId]);
    const onDay = workOrderPage.parse((await technician.get('/api/work-orders').query({ plannedOn: '2026-12-03' }).expect(200)).body);
    expect(onDay.items.map((o) => o.id)).toEqual([company.care.workOrderId]);
  });

  it('pages with a cursor', async () => {
    const first = workOrderPage.parse((await dispatcher.get('/api/work-orders').query({ limit: 1 }).expect(200)).body);
    expect(first.items).toHaveLength(1);
    expect(first.nextCursor).not.toBeNull();
    const second = workOrderPage.parse(
      (await dispatcher.get('/api/work-orders').query({ limit: 1, cursor: first.nextCursor }).expect(200)).body,
    );
    expect(second.items).toHaveLength(1);
    expect(second.items[0]!.dueAt >= first.items[0]!.dueAt).toBe(true);
    expect(second.items[0]!.id).not.toBe(first.items[0]!.id);
  });

  it('refuses a filter it does not know, naming it', async () => {
    const res = await dispatcher.get('/api/work-orders').query({ due: 'someday' }).expect(400);
    expect(fieldsOf(res.body)).toEqual(['due']);
  });
});

describe('moving', () => {
  it('lets a technician move the day of their own work, not hand it to someone else', async () => {
    const id = await openOrder({ dueInDays: 2 });
    const moved = workOrder.parse(
      (await technician.post(`/api/work-orders/${id}/move`).set(JSON_HEADERS).send({ version: 1, plannedOn: '2099-01-05' }).expect(200))
        .body,
    );
    expect(moved).toMatchObject({ plannedOn: '2099-01-05', version: 2 });
    await technician.post(`/api/work-orders/${id}/move`).set(JSON_HEADERS).send({ version: 2, technicianId: null }).expect(403);
    const reassigned = workOrder.parse(
      (await dispatcher.post(`/api/work-orders/${id}/move`).set(JSON_HEADERS).send({ version: 2, technicianId: null }).expect(200)).body,
    );
    expect(reassigned.technician).toBeNull();
    const audit = await t.db.owner.execute<{ n: number }>(
      sql`select count(*)::int as n from audit_log where entity = 'work_order' and entity_id = ${id} and action = 'move'`,
    );
    expect(audit.rows[0]!.n).toBe(2);
  });

  it('answers 409 with the order as it is when the version is stale, and refuses a day in the past', async () => {
    const id = await openOrder({ dueInDays: 2 });
    await dispatcher.post(`/api/work-orders/${id}/move`).set(JSON_HEADERS).send({ version: 1, plannedOn: '2099-02-01' }).expect(200);
    const stale = await dispatcher
      .post(`/api/work-orders/${id}/move`)
      .set(JSON_HEADERS)
      .send({ version: 1, plannedOn: '2099-03-01' })
      .expect(409);
    expect(stale.body.current).toMatchObject({ id, version: 2, plannedOn: '2099-02-01' });
    const past = await dispatcher
      .post(`/api/work-orders/${id}/move`)
      .set(JSON_HEADERS)
      .send({ version: 2, plannedOn: '2001-01-01' })
      .expect(400);
    expect(fieldsOf(past.body)).toEqual(['plannedOn']);
    const empty = await dispatcher.post(`/api/work-orders/${id}/move`).set(JSON_HEADERS).send({ version: 2 }).expect(400);
    expect(fieldsOf(empty.body)).toEqual(['plannedOn']);
    expect(await stateOf(id)).toEqual({ state: 'open', version: 2 });
  });
});

describe('skipping', () => {
  it('requires a reason, naming it, and changes nothing without one', async () => {
    const id = await openOrder({ dueInDays: 1 });
    const res = await technician.post(`/api/work-orders/${id}/skip`).set(JSON_HEADERS).send({ version: 1, reason: '   ' }).expect(400);
    expect(fieldsOf(res.body)).toEqual(['reason']);
    expect(await stateOf(id)).toEqual({ state: 'open', version: 1 });
    const skipped = workOrder.parse(
      (
        await technician
          .post(`/api/work-orders/${id}/skip`)
          .set(JSON_HEADERS)
          .send({ version: 1, reason: 'Venue closed for a private party' })
          .expect(200)
      ).body,
    );
    expect(skipped).toMatchObject({ state: 'skipped', skipReason: 'Venue closed for a private party', dueState: null });
    expect(skipped.closedAt).not.toBeNull();
  });
});

describe('done', () => {
  it('records time, note and the meters read then, writes the keep cost, and refuses a second done naming `state`', async () => {
    const id = company.care.workOrderId;
    const done = workOrder.parse(
      (
        await technician
          .post(`/api/work-orders/${id}/done`)
          .set(JSON_HEADERS)
          .send({
            version: 1,
            labourMinutes: 45,
            note: 'Flipper stops worn; replaced one fuse',
            readings: [{ meter: 'plays', reading: 15_900 }],
          })
          .expect(200)
      ).body,
    );
    expect(done).toMatchObject({ state: 'done', labourMinutes: 45, playsAtDone: 15_900, note: 'Flipper stops worn; replaced one fuse' });
    const reading = await t.db.owner.execute<{ source: string; reading: number }>(
      sql`select source, reading::int as reading from meter_readings where work_order_id = ${id} order by read_at desc limit 1`,
    );
    expect(reading.rows).toEqual([{ source: 'work_order', reading: 15_900 }]);
    // The fixture's one fuse at 45 ¢ on this order; 45 minutes at the default $45.00 an hour = 3,375 ¢.
    const cost = await t.db.owner.execute<{ parts: number; labour: number; minutes: number }>(
      sql`select parts_cents::int as parts, labour_cents::int as labour, labour_minutes as minutes from keep_cost_entries where source = 'work_order' and source_id = ${id}`,
    );
    expect(cost.rows).toEqual([{ parts: 45, labour: 3375, minutes: 45 }]);

    const again = await technician
      .post(`/api/work-orders/${id}/done`)
      .set(JSON_HEADERS)
      .send({ version: 2, labourMinutes: 10 })
      .expect(409);
    expect(fieldsOf(again.body)).toEqual(['state']);
    expect(again.body.current).toMatchObject({ id, state: 'done' });
  });

  it('refuses a meter lower than the last (no rollover said), naming the reading, and leaves the order open', async () => {
    const id = await openOrder({ dueInDays: 1 });
    const res = await technician
      .post(`/api/work-orders/${id}/done`)
      .set(JSON_HEADERS)
      .send({ version: 1, labourMinutes: 20, readings: [{ meter: 'plays', reading: 100 }] })
      .expect(400);
    expect(fieldsOf(res.body)).toEqual(['readings.0.reading']);
    expect(await stateOf(id)).toEqual({ state: 'open', version: 1 });
    const negative = await technician
      .post(`/api/work-orders/${id}/done`)
      .set(JSON_HEADERS)
      .send({ version: 1, labourMinutes: -5 })
      .expect(400);
    expect(fieldsOf(negative.body)).toEqual(['labourMinutes']);
    const noCost = await t.db.owner.execute<{ n: number }>(sql`select count(*)::int as n from keep_cost_entries where source_id = ${id}`);
    expect(noCost.rows[0]!.n).toBe(0);
  });

  it('keeps technicians off another technician’s work', async () => {
    const [someone] = (
      await t.db.owner.execute<{ user_id: string }>(
        sql`select user_id from memberships where tenant_id = ${company.tenantId} and role = 'owner' limit 1`,
      )
    ).rows;
    const id = await openOrder({ dueInDays: 1, technicianId: someone!.user_id });
    await technician.post(`/api/work-orders/${id}/done`).set(JSON_HEADERS).send({ version: 1, labourMinutes: 5 }).expect(403);
    expect(await stateOf(id)).toEqual({ state: 'open', version: 1 });
  });
});

describe('other companies and roles', () => {
  it('answers 404 for another company’s work order, and the venue contact may not read work orders', async () => {
    const theirs = await openOrder({
      dueInDays: 1,
      tenantId: other.tenantId,
      modelId: other.modelId,
      gameId: other.gameIds[0]!,
      technicianId: null,
    });
    await owner.get(`/api/work-orders/${theirs}`).expect(404);
    await owner.post(`/api/work-orders/${theirs}/skip`).set(JSON_HEADERS).send({ version: 1, reason: 'x' }).expect(404);
    await owner.post(`/api/work-orders/${theirs}/done`).set(JSON_HEADERS).send({ version: 1, labourMinutes: 1 }).expect(404);
    expect(await stateOf(theirs)).toEqual({ state: 'open', version: 1 });
  });
});
