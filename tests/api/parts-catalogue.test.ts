// The parts catalogue through the API: add, read with where it is kept and what it fits, edit at a version (stale →
// 409 with the part as it is), retire, search/filter/sort/page, link and unlink parts-list entries, the catalogue
// parts fitting a board with the van's quantity, roles, bad input and another company's ids.
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boardCatalogueFitList, cataloguePage, cataloguePart, cataloguePartDetail } from '@bumperline/contracts/parts-catalogue';
import { catalogueParts } from '@bumperline/db/schema/index';
import { JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import { createCompany } from '../support/factories.ts';
import { auditCount } from '../support/two-companies.ts';
import { appWithFullCompany, type FullCompany } from '../support/full-company.ts';

let t: TestApp;
let company: FullCompany;
let owner: Agent;
let dispatcher: Agent;
let technician: Agent;
let close: () => Promise<void>;
let foreignPartId: string;

const body = (over: Record<string, unknown> = {}) => ({
  partNumber: 'CAP-4700-25',
  description: 'Electrolytic 4700 µF 25 V 105 °C',
  kind: 'electrolytic',
  unitCostCents: 120,
  supplier: 'Cap Corner',
  ...over,
});

beforeAll(async () => {
  const full = await appWithFullCompany('Catalogue Coin');
  ({ t, company, close } = full);
  owner = full.agents.owner;
  dispatcher = full.agents.dispatcher;
  technician = full.agents.technician;
  const other = await createCompany(t.db.owner, 'Elsewhere Amusements', 1);
  const [row] = await t.db.owner
    .insert(catalogueParts)
    .values({ tenantId: other.tenantId, partNumber: 'THEIRS-1', description: 'Theirs', kind: 'fuse', unitCostCents: 1 })
    .returning({ id: catalogueParts.id });
  foreignPartId = row!.id;
});
afterAll(() => close());

describe('catalogue parts', () => {
  it('add, read, edit and retire, each in the audit log; a stale version is refused with the part as it is', async () => {
    const created = await dispatcher.post('/api/parts').set(JSON_HEADERS).send(body()).expect(201);
    const part = cataloguePart.parse(created.body);
    expect(part).toMatchObject({ partNumber: 'CAP-4700-25', unit: 'each', version: 1, totalQuantity: 0 });
    const edited = await dispatcher.patch(`/api/parts/${part.id}`).set(JSON_HEADERS).send({ version: 1, unitCostCents: 135 }).expect(200);
    expect(edited.body).toMatchObject({ unitCostCents: 135, version: 2 });
    const stale = await owner.patch(`/api/parts/${part.id}`).set(JSON_HEADERS).send({ version: 1, unitCostCents: 99 }).expect(409);
    expect(stale.body.current).toMatchObject({ unitCostCents: 135, version: 2 });
    const retired = await owner.post(`/api/parts/${part.id}/retire`).set(JSON_HEADERS).expect(200);
    expect(retired.body.retiredAt).not.toBeNull();
    const list = cataloguePage.parse((await owner.get('/api/parts?limit=200').expect(200)).body);
    expect(list.items.some((p) => p.id === part.id)).toBe(false);
    expect(await auditCount(t.db.owner, part.id)).toBe(3);
  });

  it('refuses a part number already used (any case), bad fields by name, and technicians', async () => {
    await dispatcher
      .post('/api/parts')
      .set(JSON_HEADERS)
      .send(body({ partNumber: 'DUP-1' }))
      .expect(201);
    const dup = await dispatcher
      .post('/api/parts')
      .set(JSON_HEADERS)
      .send(body({ partNumber: 'dup-1' }))
      .expect(400);
    expect(dup.body.errors).toEqual([{ field: 'partNumber', message: 'is already in the catalogue' }]);
    const bad = await dispatcher
      .post('/api/parts')
      .set(JSON_HEADERS)
      .send(body({ partNumber: '', kind: 'flux', unitCostCents: -5, unit: 'kg' }))
      .expect(400);
    expect(bad.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['kind', 'partNumber', 'unit', 'unitCostCents']);
    await technician
      .post('/api/parts')
      .set(JSON_HEADERS)
      .send(body({ partNumber: 'TECH-1' }))
      .expect(403);
  });

  it('searches, filters by kind and pages by part number', async () => {
    for (const n of ['R-100', 'R-220', 'R-470']) {
      await dispatcher
        .post('/api/parts')
        .set(JSON_HEADERS)
        .send(body({ partNumber: n, description: `Resistor ${n}`, kind: 'resistor' }))
        .expect(201);
    }
    const first = cataloguePage.parse((await technician.get('/api/parts?kind=resistor&limit=2').expect(200)).body);
    expect(first.items.map((p) => p.partNumber)).toEqual(['R-100', 'R-220']);
    const second = cataloguePage.parse(
      (await technician.get(`/api/parts?kind=resistor&limit=2&cursor=${first.nextCursor}`).expect(200)).body,
    );
    expect(second.items.map((p) => p.partNumber)).toEqual(['R-470']);
    expect(second.nextCursor).toBeNull();
    const found = cataloguePage.parse((await technician.get('/api/parts?q=resistor%20R-22').expect(200)).body);
    expect(found.items.map((p) => p.partNumber)).toEqual(['R-220']);
    const desc = cataloguePage.parse((await technician.get('/api/parts?kind=resistor&order=desc&limit=1').expect(200)).body);
    expect(desc.items.map((p) => p.partNumber)).toEqual(['R-470']);
    const atVan = cataloguePage.parse(
      (await technician.get(`/api/parts?inStockAt=${company.care.vanId}&locationId=${company.care.vanId}`).expect(200)).body,
    );
    expect(atVan.items.map((p) => [p.partNumber, p.quantityAt])).toEqual([['F-T2.5A', 4]]);
    await technician.get('/api/parts?kind=flux').expect(400);
    await technician.get('/api/parts?cursor=nonsense').expect(400);
  });

  it('a part’s page: where it is kept and what it fits', async () => {
    const res = await technician.get(`/api/parts/${company.care.cataloguePartId}`).expect(200);
    const detail = cataloguePartDetail.parse(res.body);
    expect(detail.part.totalQuantity).toBe(24);
    expect(detail.holdings.map((h) => [h.locationName, h.quantity])).toEqual([
      ['Shop shelves', 20],
      ['Technician van', 4],
    ]);
    expect(detail.fits).toHaveLength(1);
    expect(detail.fits[0]).toMatchObject({ designator: 'F1', boardName: 'Power supply', boardPartId: company.bench.fusePartId });
  });

  it('links and unlinks parts-list entries; the board lists its catalogue fits with the van’s quantity', async () => {
    const { body: part } = await dispatcher
      .post('/api/parts')
      .set(JSON_HEADERS)
      .send(body({ partNumber: 'RES-600', kind: 'resistor' }))
      .expect(201);
    const linked = await dispatcher
      .post(`/api/parts/${part.id}/fits`)
      .set(JSON_HEADERS)
      .send({ boardPartId: company.bench.resistorPartId })
      .expect(201);
    expect(linked.body.items.map((f: { designator: string }) => f.designator)).toEqual(['R1']);
    await technician.post(`/api/parts/${part.id}/fits`).set(JSON_HEADERS).send({ boardPartId: company.bench.resistorPartId }).expect(403);

    const fits = boardCatalogueFitList.parse(
      (await technician.get(`/api/boards/${company.bench.modelBoardId}/catalogue-fits`).expect(200)).body,
    );
    expect(fits.items.map((f) => [f.designator, f.partNumber, f.vanQuantity])).toEqual([
      ['R1', 'RES-600', 0],
      ['F1', 'F-T2.5A', 4],
    ]);
    await dispatcher.delete(`/api/parts/${part.id}/fits/${company.bench.resistorPartId}`).set(JSON_HEADERS).expect(200);
    await dispatcher.delete(`/api/parts/${part.id}/fits/${company.bench.resistorPartId}`).set(JSON_HEADERS).expect(404);
    const after = boardCatalogueFitList.parse(
      (await technician.get(`/api/boards/${company.bench.modelBoardId}/catalogue-fits`).expect(200)).body,
    );
    expect(after.items.map((f) => f.designator)).toEqual(['F1']);
    // The dispatcher has no van: the quantity is unknown, not zero.
    const office = boardCatalogueFitList.parse(
      (await dispatcher.get(`/api/boards/${company.bench.modelBoardId}/catalogue-fits`).expect(200)).body,
    );
    expect(office.items[0]?.vanQuantity).toBeNull();
  });

  it('another company’s part is not found, and its board entries cannot be linked', async () => {
    await owner.get(`/api/parts/${foreignPartId}`).expect(404);
    await owner.patch(`/api/parts/${foreignPartId}`).set(JSON_HEADERS).send({ version: 1, description: 'mine now' }).expect(404);
    await owner.post(`/api/parts/${foreignPartId}/retire`).set(JSON_HEADERS).expect(404);
    const r = await t.db.owner.execute(sql`select description from catalogue_parts where id = ${foreignPartId}`);
    expect((r.rows[0] as { description: string }).description).toBe('Theirs');
    const wrongEntry = await owner
      .post(`/api/parts/${company.care.cataloguePartId}/fits`)
      .set(JSON_HEADERS)
      .send({ boardPartId: '00000000-0000-4000-8000-000000000000' })
      .expect(400);
    expect(wrongEntry.body.errors[0].field).toBe('boardPartId');
    await owner.get('/api/boards/00000000-0000-4000-8000-000000000000/catalogue-fits').expect(404);
  });
});
