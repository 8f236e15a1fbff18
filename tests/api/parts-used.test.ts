// Parts used on jobs through the API: recording one takes it off the technician's van in the same transaction (the
// row, a 'used' movement, the level down), the office names a stock, a technician only their own van, closed jobs
// refused naming `state`, too few refused naming `quantity` with nothing written, two uses of the last part at once
// (exactly one wins), fractions of parts counted each refused, another company's ids; and a finished bench job's
// catalogue parts coming off the finisher's van.
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { partUsed, partsUsedList } from '@bumperline/contracts/parts-used';
import type { BenchStep } from '@bumperline/contracts/bench-vocabulary';
import { catalogueParts, serviceCalls, stockLevels } from '@bumperline/db/schema/index';
import { JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import { createCompany } from '../support/factories.ts';
import { appWithFullCompany, type FullCompany } from '../support/full-company.ts';

let t: TestApp;
let company: FullCompany;
let owner: Agent;
let dispatcher: Agent;
let technician: Agent;
let close: () => Promise<void>;
let foreignPartId: string;

async function n(query: ReturnType<typeof sql>): Promise<number> {
  const r = await t.db.owner.execute(query);
  return Number((r.rows[0] as { n: number | string }).n);
}
const vanLevel = (partId: string) =>
  n(
    sql`select coalesce((select quantity from stock_levels where location_id = ${company.care.vanId} and catalogue_part_id = ${partId}), -1)::float8 as n`,
  );
const usedRows = (partId: string) => n(sql`select count(*)::int as n from parts_used where catalogue_part_id = ${partId}`);
const usedMovements = (partId: string) =>
  n(sql`select count(*)::int as n from stock_movements where catalogue_part_id = ${partId} and reason = 'used'`);

/** A new part with `onVan` of it on the technician's van. */
async function partOnVan(onVan: number, unit: 'each' | 'm' = 'each'): Promise<string> {
  const [row] = await t.db.owner
    .insert(catalogueParts)
    .values({
      tenantId: company.tenantId,
      partNumber: `U-${Math.random().toString(36).slice(2, 10)}`,
      description: 'Used part',
      kind: 'fuse',
      unit,
      unitCostCents: 45,
    })
    .returning({ id: catalogueParts.id });
  await t.db.owner
    .insert(stockLevels)
    .values({ tenantId: company.tenantId, locationId: company.care.vanId, cataloguePartId: row!.id, quantity: onVan });
  return row!.id;
}

beforeAll(async () => {
  const full = await appWithFullCompany('Fixit Coin');
  ({ t, company, close } = full);
  owner = full.agents.owner;
  dispatcher = full.agents.dispatcher;
  technician = full.agents.technician;
  const other = await createCompany(t.db.owner, 'Yonder Games', 1);
  const [row] = await t.db.owner
    .insert(catalogueParts)
    .values({ tenantId: other.tenantId, partNumber: 'Y-1', description: 'Theirs', kind: 'fuse', unitCostCents: 1 })
    .returning({ id: catalogueParts.id });
  foreignPartId = row!.id;
});
afterAll(() => close());

describe('parts used on a work order or a call', () => {
  it('takes the part off the technician’s van with its movement, and lists it on the job', async () => {
    const partId = await partOnVan(5);
    const res = await technician
      .post(`/api/work-orders/${company.care.workOrderId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, quantity: 2 })
      .expect(201);
    const used = partUsed.parse(res.body);
    expect(used).toMatchObject({
      workOrderId: company.care.workOrderId,
      serviceCallId: null,
      quantity: 2,
      unitCostCents: 45,
      locationId: company.care.vanId,
    });
    expect(await vanLevel(partId)).toBe(3);
    expect(await usedMovements(partId)).toBe(1);
    const list = partsUsedList.parse((await dispatcher.get(`/api/work-orders/${company.care.workOrderId}/parts-used`).expect(200)).body);
    expect(list.items.some((u) => u.id === used.id)).toBe(true);

    const onCall = await technician
      .post(`/api/calls/${company.assignedCallId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, quantity: 1 })
      .expect(201);
    expect(onCall.body).toMatchObject({ serviceCallId: company.assignedCallId, workOrderId: null });
    const callList = partsUsedList.parse((await technician.get(`/api/calls/${company.assignedCallId}/parts-used`).expect(200)).body);
    expect(callList.items.map((u) => u.id)).toEqual([onCall.body.id]);
    expect(await vanLevel(partId)).toBe(2);
  });

  it('too few on the van: 409 naming quantity with what it holds, and nothing written', async () => {
    const partId = await partOnVan(3);
    const res = await technician
      .post(`/api/work-orders/${company.care.workOrderId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, quantity: 4 })
      .expect(409);
    expect(res.body.errors).toEqual([{ field: 'quantity', message: 'only 3 on the van' }]);
    expect(await vanLevel(partId)).toBe(3);
    expect(await usedRows(partId)).toBe(0);
    expect(await usedMovements(partId)).toBe(0);
  });

  it('a fraction of a part counted each, or a negative quantity, is refused naming quantity', async () => {
    const partId = await partOnVan(3);
    const half = await technician
      .post(`/api/work-orders/${company.care.workOrderId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, quantity: 0.5 })
      .expect(400);
    expect(half.body.errors).toEqual([{ field: 'quantity', message: 'whole numbers only: this part is counted each' }]);
    const negative = await technician
      .post(`/api/work-orders/${company.care.workOrderId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, quantity: -1 })
      .expect(400);
    expect(negative.body.errors[0].field).toBe('quantity');
    expect(await vanLevel(partId)).toBe(3);
    expect(await usedRows(partId)).toBe(0);
  });

  it('two uses of the last part at once: exactly one wins and the van ends at zero', async () => {
    const partId = await partOnVan(1);
    const send = () =>
      technician
        .post(`/api/work-orders/${company.care.workOrderId}/parts-used`)
        .set(JSON_HEADERS)
        .send({ cataloguePartId: partId, quantity: 1 });
    const answers = await Promise.all([send(), send(), send(), send()]);
    expect(answers.map((a) => a.status).sort()).toEqual([201, 409, 409, 409]);
    expect(await vanLevel(partId)).toBe(0);
    expect(await usedRows(partId)).toBe(1);
    expect(await usedMovements(partId)).toBe(1);
  });

  it('the office names the stock; a technician may not take from the warehouse', async () => {
    const partId = await partOnVan(0);
    await t.db.owner
      .insert(stockLevels)
      .values({ tenantId: company.tenantId, locationId: company.care.warehouseId, cataloguePartId: partId, quantity: 10 });
    const office = await dispatcher
      .post(`/api/calls/${company.downCallId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, quantity: 2, locationId: company.care.warehouseId })
      .expect(201);
    expect(office.body).toMatchObject({ locationName: 'Shop shelves' });
    await technician
      .post(`/api/calls/${company.downCallId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, quantity: 1, locationId: company.care.warehouseId })
      .expect(403);
    expect(
      await n(
        sql`select quantity::float8 as n from stock_levels where location_id = ${company.care.warehouseId} and catalogue_part_id = ${partId}`,
      ),
    ).toBe(8);
  });

  it('a closed call or a done work order takes no more parts (409 naming state)', async () => {
    const partId = await partOnVan(5);
    await t.db.owner.execute(sql`update service_calls set state = 'closed' where id = ${company.downCallId}`);
    const closed = await technician
      .post(`/api/calls/${company.downCallId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, quantity: 1 })
      .expect(409);
    expect(closed.body.errors).toEqual([{ field: 'state', message: 'is closed' }]);
    await t.db.owner.execute(sql`update service_calls set state = 'reported' where id = ${company.downCallId}`);
    await t.db.owner.execute(sql`update work_orders set state = 'skipped' where id = ${company.care.workOrderId}`);
    const skipped = await technician
      .post(`/api/work-orders/${company.care.workOrderId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, quantity: 1 })
      .expect(409);
    expect(skipped.body.errors[0].field).toBe('state');
    await t.db.owner.execute(sql`update work_orders set state = 'open' where id = ${company.care.workOrderId}`);
    expect(await vanLevel(partId)).toBe(5);
    expect(await usedRows(partId)).toBe(0);
  });

  it('another company’s part or job: refused or not found, nothing written', async () => {
    const res = await technician
      .post(`/api/work-orders/${company.care.workOrderId}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: foreignPartId, quantity: 1 })
      .expect(400);
    expect(res.body.errors).toEqual([{ field: 'cataloguePartId', message: 'is not a part in the catalogue' }]);
    const [foreignCall] = await t.db.owner
      .select({ id: serviceCalls.id })
      .from(serviceCalls)
      .where(sql`tenant_id <> ${company.tenantId}`)
      .limit(1);
    const missing = foreignCall?.id ?? '00000000-0000-4000-8000-000000000000';
    await technician.get(`/api/calls/${missing}/parts-used`).expect(404);
    await technician
      .post(`/api/calls/${missing}/parts-used`)
      .set(JSON_HEADERS)
      .send({ cataloguePartId: company.care.cataloguePartId, quantity: 1 })
      .expect(404);
    await owner.get('/api/work-orders/00000000-0000-4000-8000-000000000000/parts-used').expect(404);
  });
});

describe('a finished bench job', () => {
  it('takes its catalogue parts off the finisher’s van in the same transaction', async () => {
    const partId = await partOnVan(3);
    const steps: BenchStep[] = [
      {
        key: 'swap',
        title: 'Replace the fuse',
        instructions: '',
        record: 'parts_used',
        partKinds: ['fuse'],
        designators: [],
        cautions: [],
      },
    ];
    const { body: template } = await owner.post('/api/bench-templates').set(JSON_HEADERS).send({ name: 'Fuse swap', steps }).expect(201);
    const { body: job } = await technician
      .post('/api/bench-jobs')
      .set(JSON_HEADERS)
      .send({ boardInstanceId: company.bench.boardInstanceId, templateId: template.id })
      .expect(201);
    const progress = { done: true, acknowledged: false, answer: null, note: '', readings: {}, diodes: {}, fuses: {}, power: {} };
    const draft = (quantity: number) => ({
      steps: { swap: progress },
      partsUsed: [{ partId: company.bench.fusePartId, description: 'F1 fuse', quantity, cataloguePartId: partId }],
    });
    // Four asked, three on the van: the finish is refused, naming the line, and nothing comes off.
    const tooMany = await technician
      .put(`/api/bench-jobs/${job.id}/draft`)
      .set(JSON_HEADERS)
      .send({ version: job.version, draft: draft(4) })
      .expect(200);
    const refused = await technician
      .post(`/api/bench-jobs/${job.id}/finish`)
      .set(JSON_HEADERS)
      .send({ version: tooMany.body.version })
      .expect(409);
    expect(refused.body.errors).toEqual([{ field: 'partsUsed.0.quantity', message: 'only 3 on the van' }]);
    expect(await vanLevel(partId)).toBe(3);

    const saved = await technician
      .put(`/api/bench-jobs/${job.id}/draft`)
      .set(JSON_HEADERS)
      .send({ version: tooMany.body.version, draft: draft(2) })
      .expect(200);
    await technician.post(`/api/bench-jobs/${job.id}/finish`).set(JSON_HEADERS).send({ version: saved.body.version }).expect(200);
    expect(await vanLevel(partId)).toBe(1);
    expect(await n(sql`select count(*)::int as n from stock_movements where bench_job_id = ${job.id} and reason = 'used'`)).toBe(1);
    expect(
      await n(sql`select count(*)::int as n from bench_job_parts_used where job_id = ${job.id} and catalogue_part_id = ${partId}`),
    ).toBe(1);
  });
});
