// Stocks through the API: warehouses and vans (one per technician, made on demand), receiving, transfers and counts
// (each one level change and its movement), a technician limited to their own van, stock never below zero (refused
// with the quantity held, nothing written; two uses of the last part: exactly one wins), reorder points and what to
// order, movements paged, another company's ids.
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { myVan, reorderList, stockChange, stockLevelPage, stockLocation, stockMovementPage } from '@bumperline/contracts/stock';
import { catalogueParts, stockLevels, stockLocations } from '@bumperline/db/schema/index';
import { JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import { createCompany } from '../support/factories.ts';
import { appWithFullCompany, type FullCompany } from '../support/full-company.ts';

let t: TestApp;
let company: FullCompany;
let owner: Agent;
let dispatcher: Agent;
let technician: Agent;
let close: () => Promise<void>;
/** Another company's part and warehouse. */
let foreign: { partId: string; warehouseId: string };

async function levelOf(locationId: string, partId: string): Promise<number | null> {
  const r = await t.db.owner.execute(
    sql`select quantity::float8 as q from stock_levels where location_id = ${locationId} and catalogue_part_id = ${partId}`,
  );
  return (r.rows[0] as { q: number } | undefined)?.q ?? null;
}
async function movementCount(partId: string): Promise<number> {
  const r = await t.db.owner.execute(sql`select count(*)::int as n from stock_movements where catalogue_part_id = ${partId}`);
  return (r.rows[0] as { n: number }).n;
}

/** A fresh catalogue part of the full company (so each test counts its own movements). */
async function newPart(over: Partial<typeof catalogueParts.$inferInsert> = {}): Promise<string> {
  const [row] = await t.db.owner
    .insert(catalogueParts)
    .values({
      tenantId: company.tenantId,
      partNumber: `P-${Math.random().toString(36).slice(2, 10)}`,
      description: 'Test part',
      kind: 'fuse',
      unitCostCents: 100,
      supplier: 'Parts house',
      ...over,
    })
    .returning({ id: catalogueParts.id });
  return row!.id;
}

beforeAll(async () => {
  const full = await appWithFullCompany('Stockton Coin');
  ({ t, company, close } = full);
  owner = full.agents.owner;
  dispatcher = full.agents.dispatcher;
  technician = full.agents.technician;
  const other = await createCompany(t.db.owner, 'Far Away Games', 1);
  const [part] = await t.db.owner
    .insert(catalogueParts)
    .values({ tenantId: other.tenantId, partNumber: 'X-1', description: 'Theirs', kind: 'fuse', unitCostCents: 10 })
    .returning({ id: catalogueParts.id });
  const [warehouse] = await t.db.owner
    .insert(stockLocations)
    .values({ tenantId: other.tenantId, kind: 'warehouse', name: 'Their shelves' })
    .returning({ id: stockLocations.id });
  await t.db.owner
    .insert(stockLevels)
    .values({ tenantId: other.tenantId, locationId: warehouse!.id, cataloguePartId: part!.id, quantity: 9 });
  foreign = { partId: part!.id, warehouseId: warehouse!.id };
});
afterAll(() => close());

describe('stock locations', () => {
  it('lists warehouses and vans with their counts, and the office adds a warehouse and a van', async () => {
    const list = await dispatcher.get('/api/stock/locations').expect(200);
    expect(list.body.items).toHaveLength(2);
    const shelves = stockLocation.parse(list.body.items.find((l: { id: string }) => l.id === company.care.warehouseId));
    expect(shelves).toMatchObject({ kind: 'warehouse', name: 'Shop shelves', partCount: 1, lowCount: 0 });

    const added = await dispatcher
      .post('/api/stock/locations')
      .set(JSON_HEADERS)
      .send({ kind: 'warehouse', name: 'Back room' })
      .expect(201);
    expect(added.body).toMatchObject({ kind: 'warehouse', name: 'Back room', technicianId: null });
    const van = await owner
      .post('/api/stock/locations')
      .set(JSON_HEADERS)
      .send({ kind: 'van', technicianId: company.dispatcher.id })
      .expect(201);
    expect(van.body.name).toBe(`${'Stockton Coin'} Dispatcher's van`);
    // One van each.
    const again = await owner
      .post('/api/stock/locations')
      .set(JSON_HEADERS)
      .send({ kind: 'van', technicianId: company.dispatcher.id })
      .expect(400);
    expect(again.body.errors).toEqual([{ field: 'technicianId', message: 'already has a van' }]);
    const noName = await owner.post('/api/stock/locations').set(JSON_HEADERS).send({ kind: 'warehouse' }).expect(400);
    expect(noName.body.errors).toEqual([{ field: 'name', message: 'is required' }]);
    await technician.post('/api/stock/locations').set(JSON_HEADERS).send({ kind: 'warehouse', name: 'Mine' }).expect(403);
  });

  it('a stock of another company is not found', async () => {
    await owner.get(`/api/stock/locations/${foreign.warehouseId}`).expect(404);
    await owner.get(`/api/stock/locations/${foreign.warehouseId}/levels`).expect(404);
  });

  it('the technician reads their van with what is on it', async () => {
    const res = await technician.get('/api/stock/my-van').expect(200);
    const van = myVan.parse(res.body);
    expect(van.location?.id).toBe(company.care.vanId);
    expect(van.levels.map((l) => [l.partNumber, l.quantity])).toEqual([['F-T2.5A', 4]]);
  });
});

describe('receive, transfer, count', () => {
  it('receiving adds to the stock with a movement at the price paid', async () => {
    const partId = await newPart();
    const res = await dispatcher
      .post('/api/stock/receive')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, locationId: company.care.warehouseId, quantity: 30, unitCostCents: 80 })
      .expect(201);
    const change = stockChange.parse(res.body);
    expect(change.movement).toMatchObject({ reason: 'received', quantity: 30, unitCostCents: 80, toLocationName: 'Shop shelves' });
    expect(change.levels.map((l) => l.quantity)).toEqual([30]);
    expect(await levelOf(company.care.warehouseId, partId)).toBe(30);
    await technician
      .post('/api/stock/receive')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, locationId: company.care.vanId, quantity: 1 })
      .expect(403);
  });

  it('a fraction of a part counted each is refused naming quantity, and nothing is written', async () => {
    const partId = await newPart();
    const res = await dispatcher
      .post('/api/stock/receive')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, locationId: company.care.warehouseId, quantity: 2.5 })
      .expect(400);
    expect(res.body.errors).toEqual([{ field: 'quantity', message: 'whole numbers only: this part is counted each' }]);
    expect(await levelOf(company.care.warehouseId, partId)).toBeNull();
    expect(await movementCount(partId)).toBe(0);
    // Wire by the metre takes decimals.
    const wire = await newPart({ kind: 'other', unit: 'm' });
    await dispatcher
      .post('/api/stock/receive')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: wire, locationId: company.care.warehouseId, quantity: 2.5 })
      .expect(201);
    expect(await levelOf(company.care.warehouseId, wire)).toBe(2.5);
  });

  it('transfers move stock between stocks; a technician only to or from their own van', async () => {
    const partId = await newPart();
    await t.db.owner
      .insert(stockLevels)
      .values({ tenantId: company.tenantId, locationId: company.care.warehouseId, cataloguePartId: partId, quantity: 10 });
    const res = await technician
      .post('/api/stock/transfer')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, fromLocationId: company.care.warehouseId, toLocationId: company.care.vanId, quantity: 3 })
      .expect(201);
    const change = stockChange.parse(res.body);
    expect(change.movement).toMatchObject({
      reason: 'transfer',
      quantity: 3,
      fromLocationName: 'Shop shelves',
      toLocationName: 'Technician van',
    });
    expect(await levelOf(company.care.warehouseId, partId)).toBe(7);
    expect(await levelOf(company.care.vanId, partId)).toBe(3);

    // Between two stocks that are not the technician's van: refused, nothing moves.
    const [backRoom] = await t.db.owner
      .insert(stockLocations)
      .values({ tenantId: company.tenantId, kind: 'warehouse', name: 'Overflow' })
      .returning({ id: stockLocations.id });
    await technician
      .post('/api/stock/transfer')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, fromLocationId: company.care.warehouseId, toLocationId: backRoom!.id, quantity: 1 })
      .expect(403);
    expect(await levelOf(company.care.warehouseId, partId)).toBe(7);
    expect(await movementCount(partId)).toBe(1);
  });

  it('more than the stock holds is refused with what it holds, naming quantity, and nothing changes', async () => {
    const partId = await newPart();
    await t.db.owner
      .insert(stockLevels)
      .values({ tenantId: company.tenantId, locationId: company.care.vanId, cataloguePartId: partId, quantity: 3 });
    const res = await technician
      .post('/api/stock/transfer')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, fromLocationId: company.care.vanId, toLocationId: company.care.warehouseId, quantity: 5 })
      .expect(409);
    expect(res.body.errors).toEqual([{ field: 'quantity', message: 'only 3 on the van' }]);
    expect(await levelOf(company.care.vanId, partId)).toBe(3);
    expect(await levelOf(company.care.warehouseId, partId)).toBeNull();
    expect(await movementCount(partId)).toBe(0);
  });

  it('a count sets the stock and keeps the difference; a technician counts only their own van', async () => {
    const partId = await newPart();
    await t.db.owner
      .insert(stockLevels)
      .values({ tenantId: company.tenantId, locationId: company.care.vanId, cataloguePartId: partId, quantity: 6 });
    const res = await technician
      .post('/api/stock/count')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, locationId: company.care.vanId, countedQuantity: 4 })
      .expect(201);
    const change = stockChange.parse(res.body);
    expect(change.movement).toMatchObject({ reason: 'counted', expectedQuantity: 6, countedQuantity: 4, difference: -2, quantity: 2 });
    expect(change.levels[0]?.countedAt).not.toBeNull();
    expect(await levelOf(company.care.vanId, partId)).toBe(4);
    await technician
      .post('/api/stock/count')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, locationId: company.care.warehouseId, countedQuantity: 1 })
      .expect(403);
    const negative = await technician
      .post('/api/stock/count')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: partId, locationId: company.care.vanId, countedQuantity: -1 })
      .expect(400);
    expect(negative.body.errors[0].field).toBe('countedQuantity');
    expect(await levelOf(company.care.vanId, partId)).toBe(4);
  });

  it('two transfers of the last part at once: exactly one wins, the stock ends at zero', async () => {
    const partId = await newPart();
    await t.db.owner
      .insert(stockLevels)
      .values({ tenantId: company.tenantId, locationId: company.care.vanId, cataloguePartId: partId, quantity: 1 });
    const send = () =>
      technician
        .post('/api/stock/transfer')
        .set(JSON_HEADERS)
        .send({ cataloguePartId: partId, fromLocationId: company.care.vanId, toLocationId: company.care.warehouseId, quantity: 1 });
    const answers = await Promise.all([send(), send(), send()]);
    expect(answers.map((a) => a.status).sort()).toEqual([201, 409, 409]);
    expect(await levelOf(company.care.vanId, partId)).toBe(0);
    expect(await levelOf(company.care.warehouseId, partId)).toBe(1);
    expect(await movementCount(partId)).toBe(1);
  });

  it('another company’s part or stock is refused naming the field, and nothing is written', async () => {
    const res = await dispatcher
      .post('/api/stock/receive')
      .set(JSON_HEADERS)
      .send({ cataloguePartId: foreign.partId, locationId: company.care.warehouseId, quantity: 1 })
      .expect(400);
    expect(res.body.errors).toEqual([{ field: 'cataloguePartId', message: 'is not a part in the catalogue' }]);
    const into = await dispatcher
      .post('/api/stock/transfer')
      .set(JSON_HEADERS)
      .send({
        cataloguePartId: company.care.cataloguePartId,
        fromLocationId: company.care.warehouseId,
        toLocationId: foreign.warehouseId,
        quantity: 1,
      })
      .expect(400);
    expect(into.body.errors).toEqual([{ field: 'toLocationId', message: 'is not one of the company’s stocks' }]);
    expect(await movementCount(foreign.partId)).toBe(0);
  });
});

describe('levels, reorder points and what to order', () => {
  it('sets a reorder point (version → 409 when stale) and the level shows on the list to order, grouped by supplier', async () => {
    const partId = await newPart({ supplier: 'Fuse Barn', unitCostCents: 45 });
    await t.db.owner
      .insert(stockLevels)
      .values({ tenantId: company.tenantId, locationId: company.care.warehouseId, cataloguePartId: partId, quantity: 3 });
    const url = `/api/stock/locations/${company.care.warehouseId}/levels/${partId}`;
    const set = await dispatcher.put(url).set(JSON_HEADERS).send({ reorderPoint: 5, reorderQuantity: 20, version: 1 }).expect(200);
    expect(set.body).toMatchObject({ reorderPoint: 5, reorderQuantity: 20, low: true, version: 2 });
    const stale = await dispatcher.put(url).set(JSON_HEADERS).send({ reorderPoint: 6, reorderQuantity: 20, version: 1 }).expect(409);
    expect(stale.body.current).toMatchObject({ reorderPoint: 5 });
    await technician.put(url).set(JSON_HEADERS).send({ reorderPoint: 1, reorderQuantity: null, version: 2 }).expect(403);

    const res = await dispatcher.get('/api/stock/reorder').expect(200);
    const list = reorderList.parse(res.body);
    const group = list.groups.find((g) => g.supplier === 'Fuse Barn');
    expect(group?.lines).toHaveLength(1);
    expect(group?.lines[0]).toMatchObject({ quantity: 3, reorderPoint: 5, orderQuantity: 20, lineCostCents: 900 });
    expect(group?.totalCents).toBe(900);
    await technician.get('/api/stock/reorder').expect(403);
  });

  it('pages a stock’s levels by part number and filters the low ones', async () => {
    const first = await owner.get(`/api/stock/locations/${company.care.warehouseId}/levels?limit=2`).expect(200);
    const page = stockLevelPage.parse(first.body);
    expect(page.items).toHaveLength(2);
    expect(page.nextCursor).not.toBeNull();
    const next = stockLevelPage.parse(
      (await owner.get(`/api/stock/locations/${company.care.warehouseId}/levels?limit=2&cursor=${page.nextCursor}`).expect(200)).body,
    );
    expect(next.items.length).toBeGreaterThan(0);
    expect(next.items[0]!.partNumber >= page.items[1]!.partNumber).toBe(true);
    const low = stockLevelPage.parse(
      (await owner.get(`/api/stock/locations/${company.care.warehouseId}/levels?low=true&limit=200`).expect(200)).body,
    );
    expect(low.items.length).toBeGreaterThan(0);
    expect(low.items.every((l) => l.low)).toBe(true);
  });

  it('movements of a stock and of a part, newest first, paged without repeats', async () => {
    const partId = await newPart();
    for (const quantity of [1, 2, 3]) {
      await dispatcher
        .post('/api/stock/receive')
        .set(JSON_HEADERS)
        .send({ cataloguePartId: partId, locationId: company.care.vanId, quantity })
        .expect(201);
    }
    const byPart = stockMovementPage.parse((await owner.get(`/api/stock/movements?cataloguePartId=${partId}&limit=2`).expect(200)).body);
    expect(byPart.items.map((m) => m.quantity)).toEqual([3, 2]);
    const rest = stockMovementPage.parse(
      (await owner.get(`/api/stock/movements?cataloguePartId=${partId}&limit=2&cursor=${byPart.nextCursor}`).expect(200)).body,
    );
    expect(rest.items.map((m) => m.quantity)).toEqual([1]);
    expect(rest.nextCursor).toBeNull();

    const seen = new Set<string>();
    let cursor: string | null = null;
    let pages = 0;
    do {
      const res = await owner
        .get(`/api/stock/movements?locationId=${company.care.vanId}&limit=3${cursor ? `&cursor=${cursor}` : ''}`)
        .expect(200);
      const page = stockMovementPage.parse(res.body);
      for (const m of page.items) {
        expect(seen.has(m.id)).toBe(false);
        seen.add(m.id);
      }
      cursor = page.nextCursor;
      pages++;
    } while (cursor && pages < 50);
    const total = await t.db.owner.execute(
      sql`select count(*)::int as n from stock_movements where from_location_id = ${company.care.vanId} or to_location_id = ${company.care.vanId}`,
    );
    expect(seen.size).toBe((total.rows[0] as { n: number }).n);
    const both = await owner.get(`/api/stock/movements?cataloguePartId=${partId}&locationId=${company.care.vanId}`).expect(400);
    expect(both.body.errors[0].field).toBe('cataloguePartId');
  });

  it('a technician without a van gets one made on demand', async () => {
    const res = await owner.post('/api/stock/my-van').set(JSON_HEADERS).expect(200);
    const van = myVan.parse(res.body);
    expect(van.location).toMatchObject({ kind: 'van', technicianId: company.ownerId });
    const again = myVan.parse((await owner.post('/api/stock/my-van').set(JSON_HEADERS).expect(200)).body);
    expect(again.location?.id).toBe(van.location?.id);
  });
});
