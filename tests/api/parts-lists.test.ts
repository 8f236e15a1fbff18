// Models' boards and their parts lists through the API: boards added and renamed, a whole list saved at the
// version it was opened at, every bad row answered at once with nothing saved, parts taken off the list kept
// with their readings, and the CSV export read back by the import's own code.
import Papa from 'papaparse';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cellFromCsv } from '@bumperline/contracts/parts-list-csv';
import type { PartRowInput } from '@bumperline/contracts/parts-lists';
import { rowsFromRecords } from '@bumperline/domain/components/parts-list-columns';
import { boardInstances, boardParts, partReadings } from '@bumperline/db/schema/index';
import { buildTestApp, JSON_HEADERS, signedInAgent, type Agent, type TestApp } from '../support/app.ts';
import type { CompanyFixture } from '../support/factories.ts';
import { twoCompanies } from '../support/two-companies.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
let owner: Agent;

beforeAll(async () => {
  t = await buildTestApp();
  ({ a, b, owner } = await twoCompanies(t));
});
afterAll(() => t.close());

const row = (designator: string, kind: PartRowInput['kind'], value: string, more: Partial<PartRowInput> = {}): PartRowInput => ({
  designator,
  kind,
  value,
  tolerance: '',
  rating: '',
  ratedTemperatureC: null,
  ratedLifeHours: null,
  notes: '',
  ...more,
});

const powerSupply: PartRowInput[] = [
  row('F1', 'fuse', 'T2.5A 250V', { notes: 'mains primary' }),
  row('BR1', 'bridge_rectifier', 'KBPC3506', { rating: '35 A 600 V', notes: 'mount raised off the board' }),
  row('C1', 'electrolytic', '15000µF', { tolerance: '+80/-20%', rating: '25 V', ratedTemperatureC: 85, ratedLifeHours: 2000 }),
  row('R1', 'resistor', '600', { tolerance: '±10 %', rating: '5 W', notes: '=bleeder, runs warm' }),
  row('R2', 'resistor', 'brown black red gold', { rating: '1/4 W' }),
  row('D1', 'diode', '1N4004', { rating: '1 A 400 V' }),
  row('J1', 'connector', '.156 in header, 9 pins'),
];

async function newBoard(name: string, modelId = a.modelId): Promise<{ id: string; version: number }> {
  const res = await owner.post(`/api/models/${modelId}/boards`).set(JSON_HEADERS).send({ name }).expect(201);
  return res.body;
}

const withoutIds = (parts: { id?: string }[]) => parts.map(({ id: _id, ...rest }) => rest);

describe('boards of a model', () => {
  it('are added, listed with their part counts, renamed, and named once per model', async () => {
    const created = await owner
      .post(`/api/models/${a.modelId}/boards`)
      .set(JSON_HEADERS)
      .send({ name: 'Power supply', partNumber: 'PS-520', notes: 'Under the playfield' })
      .expect(201);
    expect(created.body).toMatchObject({ name: 'Power supply', partNumber: 'PS-520', version: 1, partCount: 0 });
    const taken = await owner.post(`/api/models/${a.modelId}/boards`).set(JSON_HEADERS).send({ name: 'Power supply' }).expect(400);
    expect(taken.body.errors).toEqual([{ field: 'name', message: 'is already the name of a board of this model' }]);
    const blank = await owner.post(`/api/models/${a.modelId}/boards`).set(JSON_HEADERS).send({ name: ' ' }).expect(400);
    expect(blank.body.errors.map((e: { field: string }) => e.field)).toEqual(['name']);

    const sound = await newBoard('Sound board');
    await owner
      .put(`/api/boards/${sound.id}/parts`)
      .set(JSON_HEADERS)
      .send({ version: 1, parts: powerSupply.slice(0, 3) })
      .expect(200);
    const listed = await owner.get(`/api/models/${a.modelId}/boards`).expect(200);
    expect(listed.body.items.map((x: { name: string; partCount: number }) => [x.name, x.partCount])).toEqual([
      ['Power supply', 0],
      ['Sound board', 3],
    ]);

    const renamed = await owner.patch(`/api/boards/${sound.id}`).set(JSON_HEADERS).send({ name: 'Audio board' }).expect(200);
    // A rename leaves the parts list's version alone: an open editor can still save.
    expect(renamed.body).toMatchObject({ name: 'Audio board', version: 2, partCount: 3 });
    await owner.patch(`/api/boards/${sound.id}`).set(JSON_HEADERS).send({ name: 'Power supply' }).expect(400);

    const overview = await owner.get('/api/parts-lists').expect(200);
    const mine = overview.body.items.find((m: { model: { id: string } }) => m.model.id === a.modelId);
    expect(mine.boards.map((x: { name: string }) => x.name)).toEqual(['Audio board', 'Power supply']);
  });
});

describe('saving a parts list', () => {
  it('saves the whole list in order at its version, and turns away a save from an older version', async () => {
    const board = await newBoard('Driver board');
    const saved = await owner
      .put(`/api/boards/${board.id}/parts`)
      .set(JSON_HEADERS)
      .send({ version: 1, parts: [...powerSupply, row('q7', 'transistor', 'TIP102')] })
      .expect(200);
    expect(saved.body.version).toBe(2);
    expect(saved.body.parts.map((p: { designator: string }) => p.designator)).toEqual(['F1', 'BR1', 'C1', 'R1', 'R2', 'D1', 'J1', 'Q7']);
    const opened = await owner.get(`/api/boards/${board.id}`).expect(200);
    expect(opened.body.parts).toEqual(saved.body.parts);
    expect(opened.body).toMatchObject({ version: 2, board: { name: 'Driver board', partCount: 8 }, model: { id: a.modelId } });

    // Someone who opened it at version 1 saves later.
    const stale = await owner.put(`/api/boards/${board.id}/parts`).set(JSON_HEADERS).send({ version: 1, parts: powerSupply }).expect(409);
    expect(stale.body.errors).toEqual([{ field: 'version', message: 'someone else saved this parts list since you opened it' }]);
    expect(stale.body.detail).toBe('Someone else saved this parts list since you opened it.');
    expect(stale.body.current).toMatchObject({ version: 2 });
    expect(stale.body.current.parts).toHaveLength(8);
    expect((await owner.get(`/api/boards/${board.id}`)).body.version).toBe(2);
  });

  it('answers every bad row at once, naming row and column, and saves nothing', async () => {
    const board = await newBoard('Lamp driver');
    await owner.put(`/api/boards/${board.id}/parts`).set(JSON_HEADERS).send({ version: 1, parts: powerSupply }).expect(200);
    const bad = [
      row('R10', 'resistor', '100µF', { tolerance: '5%', rating: '1/4 W' }),
      row('R11', 'resistor', '4k7', { tolerance: '150%', rating: '1/4 W' }),
      row('R12', 'resistor', '1k', { tolerance: '5%' }),
      row('r12', 'resistor', '2k2', { tolerance: '5%' }),
      row('C20', 'capacitor', '', { tolerance: '10%' }),
    ];
    const res = await owner.put(`/api/boards/${board.id}/parts`).set(JSON_HEADERS).send({ version: 2, parts: bad }).expect(400);
    const fields = res.body.errors.map((e: { field: string }) => e.field);
    expect(fields).toEqual(['parts.0.value', 'parts.1.tolerance', 'parts.3.designator', 'parts.4.value']);
    const messages = Object.fromEntries(res.body.errors.map((e: { field: string; message: string }) => [e.field, e.message]));
    expect(messages['parts.0.value']).toMatch(/µF.*resistor.*Ω/);
    expect(messages['parts.1.tolerance']).toMatch(/over 100 %/);
    expect(messages['parts.3.designator']).toMatch(/R12 is already on row 3/);
    expect(messages['parts.4.value']).toMatch(/give its value/);
    const after = await owner.get(`/api/boards/${board.id}`).expect(200);
    expect(after.body.version).toBe(2);
    expect(withoutIds(after.body.parts)).toEqual(withoutIds(powerSupply.map((p) => ({ ...p }))));
  });

  it('refuses a kind that is not a part kind, naming the cell', async () => {
    const board = await newBoard('Coin board');
    const res = await owner
      .put(`/api/boards/${board.id}/parts`)
      .set(JSON_HEADERS)
      .send({ version: 1, parts: [{ ...row('X1', 'other', 'crystal'), kind: 'crystal' }] })
      .expect(400);
    expect(res.body.errors).toEqual([{ field: 'parts.0.kind', message: 'must be one of the part kinds' }]);
  });

  it('takes a part off the list without deleting it, so its readings keep their part; listing it again brings it back', async () => {
    const board = await newBoard('Power supply B');
    const first = await owner.put(`/api/boards/${board.id}/parts`).set(JSON_HEADERS).send({ version: 1, parts: powerSupply }).expect(200);
    const r1 = first.body.parts.find((p: { designator: string }) => p.designator === 'R1');
    const [instance] = await t.db.owner
      .insert(boardInstances)
      .values({ tenantId: a.tenantId, boardId: board.id, gameId: a.gameIds[0]!, serial: 'PS-1' })
      .returning({ id: boardInstances.id });
    await t.db.owner.insert(partReadings).values({
      tenantId: a.tenantId,
      boardInstanceId: instance!.id,
      partId: r1.id,
      measuredText: '570',
      measured: 570,
      unit: 'Ω',
      verdict: 'pass',
    });

    const withoutR1 = powerSupply.filter((p) => p.designator !== 'R1');
    const second = await owner.put(`/api/boards/${board.id}/parts`).set(JSON_HEADERS).send({ version: 2, parts: withoutR1 }).expect(200);
    expect(second.body.parts.map((p: { designator: string }) => p.designator)).not.toContain('R1');
    const [kept] = await t.db.owner.select().from(boardParts).where(eq(boardParts.id, r1.id));
    expect(kept?.removedAt).toBeInstanceOf(Date);
    const readings = await t.db.owner.select().from(partReadings).where(eq(partReadings.partId, r1.id));
    expect(readings.map((r) => r.measuredText)).toEqual(['570']);

    const third = await owner.put(`/api/boards/${board.id}/parts`).set(JSON_HEADERS).send({ version: 3, parts: powerSupply }).expect(200);
    expect(third.body.parts.find((p: { designator: string }) => p.designator === 'R1').id).toBe(r1.id);
    // The others kept their rows (and ids) through both saves.
    expect(third.body.parts.map((p: { id: string }) => p.id)).toEqual(first.body.parts.map((p: { id: string }) => p.id));
  });
});

describe('the CSV export', () => {
  it('is an attachment named after the model and board that the import reads back to the same rows', async () => {
    const board = await newBoard('Power supply C');
    const saved = await owner.put(`/api/boards/${board.id}/parts`).set(JSON_HEADERS).send({ version: 1, parts: powerSupply }).expect(200);
    const res = await owner.get(`/api/boards/${board.id}/parts.csv`).buffer(true).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toBe('attachment; filename=alpha-amusements-flipper-power-supply-c-parts.csv');
    expect(res.text.split('\r\n')[0]).toBe('\ufeffdesignator,kind,value,tolerance,rating,rated_temperature_c,rated_life_hours,notes');
    // A cell a spreadsheet would run as a formula is neutralised in the file.
    expect(res.text).toContain("'=bleeder, runs warm");

    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true, transform: cellFromCsv });
    expect(parsed.errors).toEqual([]);
    const { rows, problems } = rowsFromRecords(parsed.data);
    expect(problems).toEqual([]);
    expect(rows).toEqual(withoutIds(saved.body.parts));
    expect(rows).toEqual(powerSupply);
  });
});

describe("another company's board", () => {
  it('is not found, whatever is asked of it', async () => {
    const theirs = await owner.get('/api/parts-lists').expect(200);
    expect(theirs.body.items.some((m: { model: { id: string } }) => m.model.id === b.modelId)).toBe(false);
    const bOwner = await signedInAgent(t, b.ownerEmail);
    const boardOfB = (await bOwner.post(`/api/models/${b.modelId}/boards`).set(JSON_HEADERS).send({ name: 'Power supply' }).expect(201))
      .body.id as string;
    await owner.get(`/api/models/${b.modelId}/boards`).expect(404);
    await owner.post(`/api/models/${b.modelId}/boards`).set(JSON_HEADERS).send({ name: 'Sneaky' }).expect(404);
    await owner.get(`/api/boards/${boardOfB}`).expect(404);
    await owner.patch(`/api/boards/${boardOfB}`).set(JSON_HEADERS).send({ name: 'Mine now' }).expect(404);
    await owner.put(`/api/boards/${boardOfB}/parts`).set(JSON_HEADERS).send({ version: 1, parts: powerSupply }).expect(404);
    await owner.get(`/api/boards/${boardOfB}/parts.csv`).expect(404);
    expect((await bOwner.get(`/api/boards/${boardOfB}`).expect(200)).body).toMatchObject({ version: 1, parts: [] });
  });
});
