// Route days through the API: a technician's calls, work orders and bench jobs for a date grouped into one stop per
// venue and planned into an order; the order the dispatcher keeps; a stop moved to another technician; a stale
// version refused with the day as it is now; who may read whose day; bad input named.
import { randomBytes } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RouteDay, RouteDayBoard, StopMoved } from '@bumperline/contracts/route-days';
import { benchJobs, games, outbox, serviceCalls, venues, workOrders } from '@bumperline/db/schema/index';
import { JSON_HEADERS, signedInAgent, type Agent } from '../support/app.ts';
import { addTechnician, assignServiceCall, openServiceCall } from '../support/call-factories.ts';
import { freshBenchJob } from '../support/bench-rows.ts';
import { createCompany, createMember } from '../support/factories.ts';
import { freshVenue } from '../support/fresh-rows.ts';
import { appWithFullCompany, type FullCompanyApp } from '../support/full-company.ts';
import { recordStatements } from '../support/statement-log.ts';

// A Thursday (ISO weekday 4) well away from the fixture's own planned day and from the real today.
const DAY = '2027-03-04';
let f: FullCompanyApp;
let other: Agent;
let secondTechnician: { id: string; phone: string };
let closedVenueId: string;
let callId: string;
let orderOnSecondVenue: string;
let benchJobId: string;

const dayPath = (technicianId: string, day = DAY) => `/api/route-days/${technicianId}/${day}`;

beforeAll(async () => {
  f = await appWithFullCompany('Route Coin-Op');
  const { company, t } = f;
  const { tenantId } = company;
  const phone = `+1312555${String(randomBytes(2).readUInt16BE() % 10000).padStart(4, '0')}`;
  secondTechnician = { id: (await addTechnician(t.db.owner, tenantId, phone, 'Zed Second Technician')).id, phone };

  // First venue: a dead game's call and a bench job on the fixture's board (game 0). Second venue: a work order.
  callId = await openServiceCall(t.db, company, { gameId: company.gameIds[0]!, problem: 'dead' });
  await assignServiceCall(t.db, company, callId, company.technician.id);
  await t.db.owner.update(serviceCalls).set({ plannedOn: DAY }).where(eq(serviceCalls.id, callId));
  benchJobId = await freshBenchJob(t.db, company);
  await t.db.owner.update(benchJobs).set({ technicianId: company.technician.id, plannedOn: DAY }).where(eq(benchJobs.id, benchJobId));
  const [order] = await t.db.owner
    .insert(workOrders)
    .values({
      tenantId,
      carePlanId: company.care.carePlanId,
      gameId: company.gameIds[1]!,
      dueAt: new Date('2027-03-01T15:00:00Z'),
      dueReason: 'plays',
      title: 'Monthly clean and check',
      onSiteMinutes: 45,
      technicianId: company.technician.id,
      plannedOn: DAY,
    })
    .returning({ id: workOrders.id });
  orderOnSecondVenue = order!.id;

  // Third venue: open Mondays only, so closed on the day; a work order there.
  closedVenueId = await freshVenue(t.db, company);
  await t.db.owner
    .update(venues)
    .set({ openingHours: { '1': [{ open: '10:00', close: '22:00' }] } })
    .where(eq(venues.id, closedVenueId));
  const [game] = await t.db.owner
    .insert(games)
    .values({
      tenantId,
      modelId: company.modelId,
      venueId: closedVenueId,
      serial: 'SN-CLOSED',
      tagToken: randomBytes(16).toString('base64url'),
    })
    .returning({ id: games.id });
  await t.db.owner.insert(workOrders).values({
    tenantId,
    carePlanId: company.care.carePlanId,
    gameId: game!.id,
    dueAt: new Date('2027-03-01T15:00:00Z'),
    dueReason: 'plays',
    title: 'Monthly clean and check',
    onSiteMinutes: 45,
    technicianId: company.technician.id,
    plannedOn: DAY,
  });

  const stranger = await createCompany(t.db.owner, 'Elsewhere Amusements', 1);
  const dispatcher = await createMember(t.db.owner, stranger.tenantId, 'dispatcher');
  other = await signedInAgent(t, dispatcher.email);
});
afterAll(() => f?.close());

async function dayOf(agent: Agent, technicianId: string, day = DAY): Promise<RouteDay> {
  const res = await agent.get(dayPath(technicianId, day));
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as RouteDay;
}

describe('a technician’s route day', () => {
  it('groups the day’s items into one stop per venue, plans the order, and lists a closed venue with its reason', async () => {
    const { company } = f;
    const day = await dayOf(f.agents.dispatcher, company.technician.id);
    expect(day).toMatchObject({ day: DAY, version: 0, orderKind: 'planner', timeZone: 'America/Chicago' });
    expect(day.stops).toHaveLength(2);
    const first = day.stops.find((s) => s.venue.id === company.venueIds[0]);
    expect(first?.items.map((i) => [i.kind, i.id])).toEqual([
      ['service_call', callId],
      ['bench_job', benchJobId],
    ]);
    // A dead game's call (60 min, our estimate by severity) and a bench job (90 min).
    expect(first?.onSiteMinutes).toBe(150);
    const second = day.stops.find((s) => s.venue.id === company.venueIds[1]);
    expect(second?.items.map((i) => i.id)).toEqual([orderOnSecondVenue]);
    expect(day.unscheduled).toHaveLength(1);
    expect(day.unscheduled[0]).toMatchObject({ venue: { id: closedVenueId, openingHours: 'Closed' }, reason: 'closed that day' });

    // Times follow one another: leave home at the day's start (or later, for a first venue that opens later), each
    // departure = service start + time on site.
    expect(day.technician.dayStart).toBe('08:00');
    expect(Date.parse(day.leaveAt)).toBeGreaterThanOrEqual(Date.parse(`${DAY}T14:00:00Z`)); // 08:00 in Chicago (CST, UTC−6)
    let clock = Date.parse(day.leaveAt);
    for (const stop of day.stops) {
      expect(Date.parse(stop.arrivalAt)).toBe(clock + stop.travelMinutesFromPrevious * 60_000);
      expect(Date.parse(stop.departureAt) - Date.parse(stop.serviceStartAt)).toBe(stop.onSiteMinutes * 60_000);
      expect(stop.mapsUrl).toBe(
        `https://www.google.com/maps/dir/?api=1&destination=${encodeURIComponent(`${stop.venue.lat.toFixed(6)},${stop.venue.lng.toFixed(6)}`)}&travelmode=driving`,
      );
      clock = Date.parse(stop.departureAt);
    }
    expect(day.totals.onSiteMinutes).toBe(150 + 45);
  });

  it('keeps the order the dispatcher sets, re-plans the times around it, and refuses a stale version with the day as it is', async () => {
    const { company } = f;
    const before = await dayOf(f.agents.dispatcher, company.technician.id);
    const reversed = before.stops.map((s) => s.venue.id).reverse();
    const res = await f.agents.dispatcher
      .put(`${dayPath(company.technician.id)}/order`)
      .set(JSON_HEADERS)
      .send({ venueIds: reversed, version: 0 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ orderKind: 'kept', version: 1 });
    expect((res.body as RouteDay).stops.map((s) => s.venue.id)).toEqual(reversed);
    // The first stop in the new order is reached straight from home.
    expect((res.body as RouteDay).stops[0]!.arrivalAt).not.toBe(before.stops.find((s) => s.venue.id === reversed[0])!.arrivalAt);

    // Stops it does not name stay on the day after the named ones (the closed venue is still reported, not dropped).
    expect((res.body as RouteDay).unscheduled.map((s) => s.venue.id)).toEqual([closedVenueId]);

    const again = await dayOf(f.agents.technician, company.technician.id);
    expect(again.orderKind).toBe('kept');
    expect(again.stops.map((s) => s.venue.id)).toEqual(reversed);

    const stale = await f.agents.dispatcher
      .put(`${dayPath(company.technician.id)}/order`)
      .set(JSON_HEADERS)
      .send({ venueIds: [...reversed].reverse(), version: 0 });
    expect(stale.status).toBe(409);
    expect(stale.body.current).toMatchObject({ version: 1, orderKind: 'kept' });
    expect((await dayOf(f.agents.dispatcher, company.technician.id)).stops.map((s) => s.venue.id)).toEqual(reversed);

    const reset = await f.agents.dispatcher
      .post(`${dayPath(company.technician.id)}/reset-order`)
      .set(JSON_HEADERS)
      .send({ version: 1 });
    expect(reset.status, JSON.stringify(reset.body)).toBe(200);
    expect(reset.body).toMatchObject({ orderKind: 'planner', version: 2 });
  });

  it('moves every item of a stop to another technician in one go, with the call’s assignment SMS', async () => {
    const { company, t } = f;
    const before = await dayOf(f.agents.dispatcher, company.technician.id);
    const res = await f.agents.dispatcher
      .post(`${dayPath(company.technician.id)}/stops/${company.venueIds[0]}/move`)
      .set(JSON_HEADERS)
      .send({ toTechnicianId: secondTechnician.id, toDay: DAY, version: before.version });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const { from, to } = res.body as StopMoved;
    expect(from.stops.map((s) => s.venue.id)).toEqual([company.venueIds[1]]);
    expect(from.version).toBe(before.version + 1);
    expect(to.technician.id).toBe(secondTechnician.id);
    expect(to.stops.map((s) => s.venue.id)).toEqual([company.venueIds[0]]);
    expect(to.stops[0]!.items.map((i) => i.id)).toEqual([callId, benchJobId]);

    const [call] = await t.db.owner.select().from(serviceCalls).where(eq(serviceCalls.id, callId));
    expect(call).toMatchObject({ technicianId: secondTechnician.id, plannedOn: DAY, state: 'assigned' });
    const [job] = await t.db.owner.select().from(benchJobs).where(eq(benchJobs.id, benchJobId));
    expect(job).toMatchObject({ technicianId: secondTechnician.id, plannedOn: DAY });
    const texts = await t.db.owner
      .select({ to: outbox.toAddress })
      .from(outbox)
      .where(and(eq(outbox.tenantId, company.tenantId), eq(outbox.callId, callId), eq(outbox.channel, 'sms')));
    expect(texts.map((m) => m.to)).toContain(secondTechnician.phone);

    // The same move again from the old version: refused, nothing moves back.
    const stale = await f.agents.dispatcher
      .post(`${dayPath(company.technician.id)}/stops/${company.venueIds[1]}/move`)
      .set(JSON_HEADERS)
      .send({ toTechnicianId: secondTechnician.id, toDay: DAY, version: before.version });
    expect(stale.status).toBe(409);
    const [order] = await t.db.owner.select().from(workOrders).where(eq(workOrders.id, orderOnSecondVenue));
    expect(order?.technicianId).toBe(company.technician.id);
  });

  it('shows the office every active technician’s day, and a technician only their own', async () => {
    const { company } = f;
    const board = await f.agents.dispatcher.get('/api/route-days').query({ day: DAY }).expect(200);
    const ids = (board.body as RouteDayBoard).days.map((d) => d.technician.id);
    expect(ids).toHaveLength(2);
    expect(ids).toEqual(expect.arrayContaining([company.technician.id, secondTechnician.id]));

    const own = await f.agents.technician.get('/api/route-days').query({ day: DAY }).expect(200);
    expect((own.body as RouteDayBoard).days.map((d) => d.technician.id)).toEqual([company.technician.id]);
    const mine = await f.agents.technician.get('/api/my-day').query({ day: DAY }).expect(200);
    expect((mine.body as RouteDay).technician.id).toBe(company.technician.id);

    await f.agents.technician.get(dayPath(secondTechnician.id)).expect(404);
    const put = await f.agents.technician
      .put(`${dayPath(company.technician.id)}/order`)
      .set(JSON_HEADERS)
      .send({ venueIds: [], version: 0 });
    expect(put.status).toBe(403);
  });

  it('costs the office the same statements however many technicians there are (one query per kind of work)', async () => {
    const statements = recordStatements();
    try {
      await f.agents.dispatcher.get('/api/route-days').query({ day: DAY }).expect(200);
      const before = statements.take().length;
      for (let i = 0; i < 3; i++) await addTechnician(f.t.db.owner, f.company.tenantId, null, `Extra Technician ${i}`);
      statements.take();
      const board = await f.agents.dispatcher.get('/api/route-days').query({ day: DAY }).expect(200);
      expect((board.body as RouteDayBoard).days).toHaveLength(5);
      expect(statements.take().length).toBe(before);
    } finally {
      statements.stop();
    }
  });

  it('answers 404 for another company’s technician, and 400 naming `day` for a date that is not one', async () => {
    const { company } = f;
    await other.get(dayPath(company.technician.id)).expect(404);
    const moved = await other
      .post(`${dayPath(company.technician.id)}/stops/${company.venueIds[1]}/move`)
      .set(JSON_HEADERS)
      .send({ toTechnicianId: secondTechnician.id, toDay: DAY, version: 0 });
    expect(moved.status).toBe(404);

    const bad = await f.agents.dispatcher.get(dayPath(company.technician.id, '2027-13-45'));
    expect(bad.status).toBe(400);
    expect(bad.body.errors.map((e: { field: string }) => e.field)).toEqual(['day']);
    const badQuery = await f.agents.dispatcher.get('/api/route-days').query({ day: 'next tuesday' });
    expect(badQuery.status).toBe(400);
    expect(badQuery.body.errors.map((e: { field: string }) => e.field)).toEqual(['day']);
    const badBody = await f.agents.dispatcher
      .put(`${dayPath(company.technician.id)}/order`)
      .set(JSON_HEADERS)
      .send({ venueIds: ['not-an-id'], version: 0 });
    expect(badBody.status).toBe(400);
    expect(badBody.body.errors.map((e: { field: string }) => e.field)).toEqual(['venueIds.0']);
  });
});
