// Care plans through the API: creating one in the editor's words (an RRULE it wrote), the list by name with paging,
// a plan's page with its games' due states, saving at a version (409 when stale), retiring; who may write; bad input
// refused naming each field with nothing written (a rule that never falls on a date names `rule`); another
// company's ids.
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { carePlan, carePlanDetail, carePlanPage, type CarePlanInput } from '@bumperline/contracts/care-plans';
import { problemDetails } from '@bumperline/contracts/common';
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

const planCount = async () =>
  Number(
    (await t.db.owner.execute<{ n: number }>(sql`select count(*)::int as n from care_plans where tenant_id = ${company.tenantId}`)).rows[0]!
      .n,
  );

const lastTuesday = (): CarePlanInput => ({
  name: 'Flipper rebuild check',
  scope: 'model',
  modelId: company.modelId,
  tasks: ['Check flipper bushings', 'Clean the coin mech'],
  skills: ['pinball'],
  onSiteMinutes: 90,
  rule: 'FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1',
  ruleStart: '2027-01-26T09:00',
  leadDays: 7,
  technicianId: company.technician.id,
});

const fieldsOf = (body: unknown) => problemDetails.parse(body).errors?.map((e) => e.field) ?? [];

beforeAll(async () => {
  const full = await appWithFullCompany('Careful Coin');
  ({ t, company, close } = full);
  owner = full.agents.owner;
  dispatcher = full.agents.dispatcher;
  technician = full.agents.technician;
  other = await createCompany(t.db.owner, 'Elsewhere Amusements', 1);
});
afterAll(() => close());

describe('saving a care plan', () => {
  it('creates a plan from the editor’s rule and says it in plain words', async () => {
    const res = await dispatcher.post('/api/care-plans').set(JSON_HEADERS).send(lastTuesday()).expect(201);
    const plan = carePlan.parse(res.body);
    expect(plan).toMatchObject({
      name: 'Flipper rebuild check',
      scope: 'model',
      model: { id: company.modelId },
      game: null,
      rule: 'FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1',
      ruleWording: 'Every month on the last Tuesday at 9:00',
      technician: { id: company.technician.id },
      version: 1,
    });
    const detail = carePlanDetail.parse((await technician.get(`/api/care-plans/${plan.id}`).expect(200)).body);
    expect(detail.gamesTotal).toBe(company.gameIds.length);
    expect(detail.games).toHaveLength(company.gameIds.length);
    // The first last-Tuesday is 2027-01-26 09:00 Chicago (CST, UTC−6): far off, so "later".
    expect(detail.games[0]).toMatchObject({ dueAt: '2027-01-26T15:00:00.000Z', dueReason: 'calendar', dueState: 'later' });
  });

  it('refuses a rule that never falls on a date, naming `rule`, and writes nothing', async () => {
    const before = await planCount();
    const feb31 = await dispatcher
      .post('/api/care-plans')
      .set(JSON_HEADERS)
      .send({ ...lastTuesday(), rule: 'FREQ=YEARLY;BYMONTH=2;BYMONTHDAY=31' })
      .expect(400);
    expect(problemDetails.parse(feb31.body).errors).toEqual([{ field: 'rule', message: expect.stringContaining('never falls on a date') }]);
    const endedBefore = await dispatcher
      .post('/api/care-plans')
      .set(JSON_HEADERS)
      .send({ ...lastTuesday(), rule: 'FREQ=MONTHLY;BYMONTHDAY=1;UNTIL=20261231' })
      .expect(400);
    expect(fieldsOf(endedBefore.body)).toEqual(['rule']);
    const unreadable = await dispatcher
      .post('/api/care-plans')
      .set(JSON_HEADERS)
      .send({ ...lastTuesday(), rule: 'EVERY TUESDAY' })
      .expect(400);
    expect(fieldsOf(unreadable.body)).toEqual(['rule']);
    expect(await planCount()).toBe(before);
  });

  it('names each bad field at once: scope without its target, no tasks, no trigger, bad numbers', async () => {
    const before = await planCount();
    const res = await dispatcher
      .post('/api/care-plans')
      .set(JSON_HEADERS)
      .send({ ...lastTuesday(), modelId: null, tasks: [], rule: null, ruleStart: null, onSiteMinutes: 0, leadDays: -1 })
      .expect(400);
    expect(fieldsOf(res.body).sort()).toEqual(['leadDays', 'modelId', 'onSiteMinutes', 'rule', 'tasks'].sort());
    expect(await planCount()).toBe(before);
  });

  it('refuses another company’s model and a person who is not a technician, naming them', async () => {
    const res = await dispatcher
      .post('/api/care-plans')
      .set(JSON_HEADERS)
      .send({ ...lastTuesday(), modelId: other.modelId, technicianId: company.dispatcher.id })
      .expect(400);
    expect(fieldsOf(res.body).sort()).toEqual(['modelId', 'technicianId']);
  });

  it('saves at the version it was loaded at, and answers 409 with the plan as it is when stale', async () => {
    const created = carePlan.parse(
      (
        await owner
          .post('/api/care-plans')
          .set(JSON_HEADERS)
          .send({ ...lastTuesday(), name: 'Versioned' })
          .expect(201)
      ).body,
    );
    const saved = carePlan.parse(
      (
        await dispatcher
          .put(`/api/care-plans/${created.id}`)
          .set(JSON_HEADERS)
          .send({ ...lastTuesday(), name: 'Versioned', onSiteMinutes: 60, playsEvery: 2500, version: 1 })
          .expect(200)
      ).body,
    );
    expect(saved).toMatchObject({ version: 2, onSiteMinutes: 60, playsEvery: 2500 });
    const stale = await owner
      .put(`/api/care-plans/${created.id}`)
      .set(JSON_HEADERS)
      .send({ ...lastTuesday(), name: 'Versioned again', version: 1 })
      .expect(409);
    expect(stale.body.current).toMatchObject({ id: created.id, version: 2, name: 'Versioned' });
    expect(fieldsOf(stale.body)).toEqual(['version']);
  });

  it('retires a plan: it leaves the list but its page stays', async () => {
    const created = carePlan.parse(
      (
        await owner
          .post('/api/care-plans')
          .set(JSON_HEADERS)
          .send({ ...lastTuesday(), name: 'Zz retired' })
          .expect(201)
      ).body,
    );
    const retired = carePlan.parse(
      (await owner.post(`/api/care-plans/${created.id}/retire`).set(JSON_HEADERS).send({ version: 1 }).expect(200)).body,
    );
    expect(retired.retiredAt).not.toBeNull();
    const list = carePlanPage.parse((await owner.get('/api/care-plans').query({ q: 'Zz retired' }).expect(200)).body);
    expect(list.items).toHaveLength(0);
    const withRetired = carePlanPage.parse(
      (await owner.get('/api/care-plans').query({ q: 'Zz retired', includeRetired: 'true' }).expect(200)).body,
    );
    expect(withRetired.items.map((p) => p.id)).toEqual([created.id]);
  });
});

describe('the list', () => {
  it('is by name, searchable and paged', async () => {
    const first = carePlanPage.parse((await technician.get('/api/care-plans').query({ limit: 1 }).expect(200)).body);
    expect(first.items).toHaveLength(1);
    expect(first.nextCursor).not.toBeNull();
    const second = carePlanPage.parse(
      (await technician.get('/api/care-plans').query({ limit: 1, cursor: first.nextCursor }).expect(200)).body,
    );
    expect(second.items).toHaveLength(1);
    expect(second.items[0]!.name.toLowerCase() >= first.items[0]!.name.toLowerCase()).toBe(true);
    expect(second.items[0]!.id).not.toBe(first.items[0]!.id);
    const found = carePlanPage.parse((await technician.get('/api/care-plans').query({ q: 'monthly clean' }).expect(200)).body);
    expect(found.items.map((p) => p.id)).toEqual([company.care.carePlanId]);
  });

  it('refuses a cursor it did not issue, naming it', async () => {
    const res = await owner.get('/api/care-plans').query({ cursor: 'not-ours' }).expect(400);
    expect(fieldsOf(res.body)).toEqual(['cursor']);
  });
});

describe('who may', () => {
  it('lets technicians read but not write, and the venue contact neither', async () => {
    await technician.get(`/api/care-plans/${company.care.carePlanId}`).expect(200);
    await technician.post('/api/care-plans').set(JSON_HEADERS).send(lastTuesday()).expect(403);
    await technician.post(`/api/care-plans/${company.care.carePlanId}/retire`).set(JSON_HEADERS).send({ version: 1 }).expect(403);
  });

  it('answers 404 for another company’s plan', async () => {
    const [row] = (
      await t.db.owner.execute<{ id: string }>(
        sql`insert into care_plans (tenant_id, name, scope, model_id, tasks, on_site_minutes, plays_every)
            values (${other.tenantId}, 'Theirs', 'model', ${other.modelId}, '["x"]'::jsonb, 30, 100) returning id`,
      )
    ).rows;
    await owner.get(`/api/care-plans/${row!.id}`).expect(404);
    await owner
      .put(`/api/care-plans/${row!.id}`)
      .set(JSON_HEADERS)
      .send({ ...lastTuesday(), version: 1 })
      .expect(404);
    await owner.post(`/api/care-plans/${row!.id}/retire`).set(JSON_HEADERS).send({ version: 1 }).expect(404);
  });
});
