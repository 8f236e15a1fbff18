// Boards fitted in games through the API: date codes as printed (refused when impossible, flagged when they read
// two ways), cabinet profiles, the recap list's order and advice, a board's reading history, and another company's
// rows out of reach.
import { randomUUID } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boardInstances, boardParts, modelBoards, partReadings } from '@bumperline/db/schema/index';
import { buildTestApp, JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import { addGame } from '../support/call-factories.ts';
import type { CompanyFixture } from '../support/factories.ts';
import { auditCount, twoCompanies } from '../support/two-companies.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
let owner: Agent;
/** Alpha's power supply: R1 600 Ω ±10 %, C1 85 °C 2,000 h (the short-lived one), C2 105 °C 5,000 h. */
let boardId: string;
let r1: string;
/** A board of Beta's, fitted in Beta's first game. */
let foreignBoardId: string;
let foreignInstanceId: string;

async function addBoard(tenantId: string, modelId: string, name: string) {
  const [board] = await t.db.owner.insert(modelBoards).values({ tenantId, modelId, name, partNumber: 'PS-7' }).returning();
  const parts = await t.db.owner
    .insert(boardParts)
    .values([
      { tenantId, boardId: board!.id, position: 1, designator: 'R1', kind: 'resistor', value: '600', tolerance: '10%', rating: '1/2 W' },
      {
        tenantId,
        boardId: board!.id,
        position: 2,
        designator: 'C1',
        kind: 'electrolytic',
        value: '4700µF',
        tolerance: '20%',
        rating: '25 V',
        ratedTemperatureC: 85,
        ratedLifeHours: 2000,
      },
      {
        tenantId,
        boardId: board!.id,
        position: 3,
        designator: 'C2',
        kind: 'electrolytic',
        value: '100µF',
        tolerance: '20%',
        rating: '50 V',
        ratedTemperatureC: 105,
        ratedLifeHours: 5000,
      },
    ])
    .returning();
  return { id: board!.id, r1: parts.find((p) => p.designator === 'R1')!.id };
}

const instanceCount = async (tenantId: string) => {
  const r = await t.db.owner.execute(sql`select count(*)::int as n from board_instances where tenant_id = ${tenantId}`);
  return (r.rows[0] as { n: number }).n;
};

const fit = (gameId: string, body: Record<string, unknown>) =>
  owner
    .post(`/api/games/${gameId}/boards`)
    .set(JSON_HEADERS)
    .send({ boardId, ...body });

/** A date `days` from today as the test machine sees it (the company is in Chicago: margins here are weeks). */
const daysFromNow = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

beforeAll(async () => {
  t = await buildTestApp();
  ({ a, b, owner } = await twoCompanies(t));
  ({ id: boardId, r1 } = await addBoard(a.tenantId, a.modelId, 'Power supply'));
  const foreign = await addBoard(b.tenantId, b.modelId, 'Power supply');
  foreignBoardId = foreign.id;
  const [instance] = await t.db.owner
    .insert(boardInstances)
    .values({ tenantId: b.tenantId, boardId: foreign.id, gameId: b.gameIds[0]!, serial: 'B-1', dateCode: '9001', madeOn: '1990-01-01' })
    .returning();
  foreignInstanceId = instance!.id;
});
afterAll(() => t.close());

describe('fitting a board', () => {
  it('reads a year-week date code as printed and lists the board on its game', async () => {
    const res = await fit(a.gameIds[0]!, { serial: 'PS-0001', dateCode: '8934' }).expect(201);
    // ISO week 34 of 1989 starts on Monday 21 August 1989.
    expect(res.body).toMatchObject({
      serial: 'PS-0001',
      dateCode: '8934',
      madeOn: '1989-08-21',
      dateCodeFlag: null,
      boardName: 'Power supply',
    });
    const list = await owner.get(`/api/games/${a.gameIds[0]}/boards`).expect(200);
    expect(list.body.items.map((i: { id: string }) => i.id)).toContain(res.body.id);
    expect(list.body.modelBoards).toEqual([{ id: boardId, name: 'Power supply', partNumber: 'PS-7' }]);
  });

  it('refuses a date code in the future or an impossible week, naming dateCode, and saves nothing', async () => {
    const before = await instanceCount(a.tenantId);
    const future = await fit(a.gameIds[0]!, { serial: 'F-1', dateCode: '2099-03-01' }).expect(400);
    expect(future.body.errors).toEqual([{ field: 'dateCode', message: expect.stringMatching(/cannot be made in the future/) }]);
    const week54 = await fit(a.gameIds[0]!, { serial: 'F-2', dateCode: '8954' }).expect(400);
    expect(week54.body.errors).toEqual([{ field: 'dateCode', message: expect.stringMatching(/weeks run 01–53/) }]);
    // 1989 has 52 ISO weeks.
    const week53 = await fit(a.gameIds[0]!, { serial: 'F-3', dateCode: '1989-W53' }).expect(400);
    expect(week53.body.errors).toEqual([{ field: 'dateCode', message: expect.stringMatching(/no ISO week 53/) }]);
    const recapLater = await fit(a.gameIds[0]!, { serial: 'F-4', dateCode: '8934', lastRecapOn: daysFromNow(30) }).expect(400);
    expect(recapLater.body.errors.map((e: { field: string }) => e.field)).toEqual(['lastRecapOn']);
    expect(await instanceCount(a.tenantId)).toBe(before);
  });

  it('saves a code that reads two ways with no date and a flag saying both readings, and judges no recap date', async () => {
    const res = await fit(a.gameIds[0]!, { serial: 'AMB-1', dateCode: '2012' }).expect(201);
    expect(res.body.madeOn).toBeNull();
    expect(res.body.dateCodeFlag).toMatch(/year 2012 or week 12/);
    expect(res.body.dateCodeFlag).toMatch(/2012-01 or 20W12/);
    expect(res.body.recap).toMatchObject({ status: 'unknown', dueDate: null, recommendation: 'settle the date code' });

    // Settled by writing it the unambiguous way: week 12 of 2020 starts on Monday 16 March 2020.
    const settled = await owner
      .patch(`/api/board-instances/${res.body.id}`)
      .set(JSON_HEADERS)
      .send({ version: res.body.version, dateCode: '20W12' })
      .expect(200);
    expect(settled.body).toMatchObject({ dateCode: '20W12', madeOn: '2020-03-16', dateCodeFlag: null });
    expect(await auditCount(t.db.owner, res.body.id)).toBe(2);
    // The version moved on: an edit from the old one is refused, not merged.
    await owner
      .patch(`/api/board-instances/${res.body.id}`)
      .set(JSON_HEADERS)
      .send({ version: res.body.version, serial: 'AMB-2' })
      .expect(409);
  });

  it('fits only a board of the game’s own model', async () => {
    const res = await fit(a.gameIds[0]!, { boardId: foreignBoardId, serial: 'X' }).expect(400);
    expect(res.body.errors.map((e: { field: string }) => e.field)).toEqual(['boardId']);
  });
});

describe('cabinet profiles', () => {
  it('says when the assumed day is used, saves a profile, and refuses more than 24 hours or an implausible temperature', async () => {
    const gameId = await addGame(t.db, a);
    const assumed = await owner.get(`/api/games/${gameId}/cabinet-profile`).expect(200);
    expect(assumed.body).toMatchObject({ isDefault: true, hoursPerDay: 10 });

    const tooLong = await owner
      .put(`/api/games/${gameId}/cabinet-profile`)
      .set(JSON_HEADERS)
      .send({
        slices: [
          { hours: 14, temperatureC: 35 },
          { hours: 11, temperatureC: 45 },
        ],
      })
      .expect(400);
    expect(tooLong.body.errors).toEqual([{ field: 'slices', message: 'add up to 25 h powered a day: a day has 24 hours' }]);
    const tooHot = await owner
      .put(`/api/games/${gameId}/cabinet-profile`)
      .set(JSON_HEADERS)
      .send({ slices: [{ hours: 4, temperatureC: 150 }] })
      .expect(400);
    expect(tooHot.body.errors.map((e: { field: string }) => e.field)).toEqual(['slices.0.temperatureC']);
    expect((await owner.get(`/api/games/${gameId}/cabinet-profile`).expect(200)).body.isDefault).toBe(true);

    const saved = await owner
      .put(`/api/games/${gameId}/cabinet-profile`)
      .set(JSON_HEADERS)
      .send({
        slices: [
          { hours: 6, temperatureC: 30 },
          { hours: 6, temperatureC: 50 },
        ],
      })
      .expect(200);
    expect(saved.body).toMatchObject({ isDefault: false, hoursPerDay: 12 });
  });
});

describe('the recap list', () => {
  it('ranks overdue first, then by the date due, undated last; an overdue board’s advice matches the hand-worked date', async () => {
    const gameId = await addGame(t.db, a);
    const made1989 = (await fit(gameId, { serial: 'RANK-1989', dateCode: '8934' }).expect(201)).body;
    const recapped2010 = (await fit(gameId, { serial: 'RANK-2010', dateCode: '8934', lastRecapOn: '2010-01-01' }).expect(201)).body;
    // Recapped 3,940 days ago: due in about 60 days (life 4,000 days, below).
    const dueSoon = (await fit(gameId, { serial: 'RANK-SOON', dateCode: '8934', lastRecapOn: daysFromNow(-3940) }).expect(201)).body;
    const fresh = (await fit(gameId, { serial: 'RANK-FRESH', dateCode: '8934', lastRecapOn: daysFromNow(-365) }).expect(201)).body;
    const undated = (await fit(gameId, { serial: 'RANK-UNDATED', dateCode: '2012' }).expect(201)).body;

    // Hand-worked, with the assumed day (the game has no profile): 4 h at 35 °C and 6 h at 45 °C.
    // C1 (85 °C, 2,000 h) lasts 2,000 × 2^((85−35)/10) = 64,000 h at 35 °C and 2,000 × 2^4 = 32,000 h at 45 °C
    // (the 10 °C rule, Nippon Chemi-Con's life-estimation note); a day uses 4/64,000 + 6/32,000 = 1/4,000 of it,
    // so it lasts 4,000 days (10.95 years, under the 15-year cap). C2 (105 °C, 5,000 h) uses 1/40,000 a day, so
    // the 15-year cap sets its life: C1 sets the date. 1989-08-21 + 4,000 days = 2000-08-03 (11 years from
    // 1989-08-21 is 4,018 days with 1992, 1996 and 2000's leap days; 18 days earlier). 2010-01-01 + 4,000 days
    // = 2020-12-14.
    const list = await owner.get('/api/recap-due').expect(200);
    const rows = list.body.items as {
      boardInstanceId: string;
      recap: {
        status: string;
        dueDate: string | null;
        recommendation: string | null;
        defaultProfile: boolean;
        lifeYears: number;
        limitingDesignator: string;
      };
    }[];
    const mine = [made1989, recapped2010, dueSoon, fresh, undated].map((i) => i.id);
    expect(rows.map((r) => r.boardInstanceId).filter((id) => mine.includes(id))).toEqual(mine);

    const oldest = rows.find((r) => r.boardInstanceId === made1989.id)!.recap;
    expect(oldest).toMatchObject({
      status: 'overdue',
      dueDate: '2000-08-03',
      limitingDesignator: 'C1',
      defaultProfile: true,
      recommendation: 'recap now: overdue since 2000-08-03 — C1 (85 °C, 2,000 h) sets the date',
    });
    expect(oldest.lifeYears).toBeCloseTo(4000 / 365.25, 9);
    expect(rows.find((r) => r.boardInstanceId === recapped2010.id)!.recap.dueDate).toBe('2020-12-14');
    expect(rows.find((r) => r.boardInstanceId === dueSoon.id)!.recap.status).toBe('due-soon');
    expect(rows.find((r) => r.boardInstanceId === fresh.id)!.recap).toMatchObject({ status: 'ok', recommendation: null });
    expect(rows.find((r) => r.boardInstanceId === undated.id)!.recap.status).toBe('unknown');

    // Overdue boards come first across the whole company, and the filter keeps one status.
    const statuses = rows.map((r) => r.recap.status);
    expect(statuses.lastIndexOf('overdue')).toBeLessThan(statuses.findIndex((s) => s !== 'overdue'));
    const overdue = await owner.get('/api/recap-due').query({ status: 'overdue' }).expect(200);
    expect(overdue.body.items.length).toBe(list.body.counts.overdue);
    expect(overdue.body.items.every((r: { recap: { status: string } }) => r.recap.status === 'overdue')).toBe(true);
  });

  it('sends the ranking a page at a time: the pages joined are the whole ranking, the counts cover every board', async () => {
    const gameId = await addGame(t.db, a);
    for (const serial of ['PAGE-1', 'PAGE-2', 'PAGE-3']) await fit(gameId, { serial, dateCode: '8934' }).expect(201);
    type Row = { boardInstanceId: string; recap: { status: string } };
    const whole = await owner.get('/api/recap-due').query({ limit: 200 }).expect(200);
    const everyRow = whole.body.items as Row[];
    expect(whole.body.nextCursor).toBeNull();
    expect(everyRow.length).toBeGreaterThan(5);

    const joined: Row[] = [];
    const pageCounts: unknown[] = [];
    let cursor: string | undefined;
    do {
      const page = await owner
        .get('/api/recap-due')
        .query({ limit: 2, ...(cursor ? { cursor } : {}) })
        .expect(200);
      expect(page.body.items.length).toBeLessThanOrEqual(2);
      joined.push(...(page.body.items as Row[]));
      pageCounts.push(page.body.counts);
      cursor = page.body.nextCursor ?? undefined;
    } while (cursor && joined.length <= everyRow.length);
    expect(joined.map((r) => r.boardInstanceId)).toEqual(everyRow.map((r) => r.boardInstanceId));
    // Every page answers the whole company's counts, one per status (0 included), however far down it is.
    for (const c of pageCounts) expect(c).toEqual(whole.body.counts);
    const counts = whole.body.counts as Record<string, number>;
    expect(Object.keys(counts).sort()).toEqual(['due-soon', 'no-electrolytics', 'ok', 'overdue', 'unknown']);
    expect(Object.values(counts).reduce((x, y) => x + y, 0)).toBe(await instanceCount(a.tenantId));
    expect(everyRow.length).toBe((await instanceCount(a.tenantId)) - counts['no-electrolytics']!);
    for (const status of ['overdue', 'unknown'] as const) {
      expect(everyRow.filter((r) => r.recap.status === status).length).toBe(counts[status]);
    }

    // Without a limit: 50 a page.
    const first = await owner.get('/api/recap-due').expect(200);
    expect(first.body.items.length).toBe(Math.min(50, everyRow.length));

    // A filtered list pages too, and stays on its status.
    const overdue = await owner.get('/api/recap-due').query({ status: 'overdue', limit: 1 }).expect(200);
    const second = await owner.get('/api/recap-due').query({ status: 'overdue', limit: 1, cursor: overdue.body.nextCursor }).expect(200);
    expect(second.body.items[0].boardInstanceId).toBe(everyRow.filter((r) => r.recap.status === 'overdue')[1]!.boardInstanceId);
  });

  it('refuses a page size out of range and a cursor it did not give, naming the field', async () => {
    for (const limit of ['0', '201', 'ten', '2.5']) {
      const res = await owner.get('/api/recap-due').query({ limit }).expect(400);
      expect(res.body.errors.map((e: { field: string }) => e.field)).toEqual(['limit']);
    }
    const wrongShape = Buffer.from(JSON.stringify(['["x"]', randomUUID()])).toString('base64url');
    const wrongGroup = Buffer.from(JSON.stringify(['[9,"","",""]', randomUUID()])).toString('base64url');
    for (const cursor of ['not-a-cursor', wrongShape, wrongGroup, 'x'.repeat(501)]) {
      const res = await owner.get('/api/recap-due').query({ cursor }).expect(400);
      expect(res.body.errors.map((e: { field: string }) => e.field)).toEqual(['cursor']);
    }
  });

  it('uses the game’s own profile once saved', async () => {
    const gameId = await addGame(t.db, a);
    const board = (await fit(gameId, { serial: 'PROFILED', dateCode: '8934' }).expect(201)).body;
    await owner
      .put(`/api/games/${gameId}/cabinet-profile`)
      .set(JSON_HEADERS)
      .send({ slices: [{ hours: 8, temperatureC: 55 }] })
      .expect(200);
    const page = await owner.get(`/api/board-instances/${board.id}`).expect(200);
    // At 55 °C: 2,000 × 2^3 = 16,000 h ÷ 8 h a day = 2,000 days; 1989-08-21 + 2,000 days = 1995-02-11.
    expect(page.body.instance.recap).toMatchObject({ defaultProfile: false, dueDate: '1995-02-11', status: 'overdue' });
  });
});

describe('a board’s page', () => {
  it('returns each part’s readings oldest first, whatever order they were recorded in', async () => {
    const instance = (await fit(a.gameIds[1]!, { serial: 'HIST-1', dateCode: '9203' }).expect(201)).body;
    const taken = ['2019-05-02T15:00:00.000Z', '2004-11-20T15:00:00.000Z', '2012-07-09T15:00:00.000Z'];
    const measured = [655, 602, 631];
    await t.db.owner.insert(partReadings).values(
      taken.map((at, i) => ({
        tenantId: a.tenantId,
        boardInstanceId: instance.id,
        partId: r1,
        measuredText: String(measured[i]),
        measured: measured[i]!,
        unit: 'Ω',
        verdict: 'pass' as const,
        min: 540,
        max: 660,
        deviationPercent: ((measured[i]! - 600) / 600) * 100,
        takenAt: new Date(at),
      })),
    );
    const page = await owner.get(`/api/board-instances/${instance.id}`).expect(200);
    const r1History = page.body.parts.find((p: { designator: string }) => p.designator === 'R1');
    expect(r1History.readings.map((r: { takenAt: string }) => r.takenAt)).toEqual([...taken].sort());
    expect(r1History.readings.map((r: { measured: number }) => r.measured)).toEqual([602, 631, 655]);
    expect(page.body.parts.map((p: { designator: string }) => p.designator)).toEqual(['R1', 'C1', 'C2']);
    expect(page.body.benchJobs).toEqual([]);
  });
});

describe('another company', () => {
  it('cannot reach Beta’s boards or games: 404, and nothing changes', async () => {
    await owner.get(`/api/board-instances/${foreignInstanceId}`).expect(404);
    await owner.patch(`/api/board-instances/${foreignInstanceId}`).set(JSON_HEADERS).send({ version: 1, serial: 'MINE' }).expect(404);
    await owner.get(`/api/games/${b.gameIds[0]}/boards`).expect(404);
    await owner.post(`/api/games/${b.gameIds[0]}/boards`).set(JSON_HEADERS).send({ boardId: foreignBoardId }).expect(404);
    await owner.get(`/api/games/${b.gameIds[0]}/cabinet-profile`).expect(404);
    await owner
      .put(`/api/games/${b.gameIds[0]}/cabinet-profile`)
      .set(JSON_HEADERS)
      .send({ slices: [{ hours: 4, temperatureC: 40 }] })
      .expect(404);
    await owner.get(`/api/board-instances/${randomUUID()}`).expect(404);
    const [row] = await t.db.owner
      .select({ serial: boardInstances.serial })
      .from(boardInstances)
      .where(and(eq(boardInstances.tenantId, b.tenantId), eq(boardInstances.id, foreignInstanceId)));
    expect(row!.serial).toBe('B-1');
    const fleet = await owner.get('/api/recap-due').query({ status: 'overdue' }).expect(200);
    expect(fleet.body.items.map((r: { boardInstanceId: string }) => r.boardInstanceId)).not.toContain(foreignInstanceId);
  });
});
