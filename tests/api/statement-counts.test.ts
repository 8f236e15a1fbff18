// Statements each main read sends to PostgreSQL, counted on the API's own connection pool. A ceiling per
// endpoint holds the line against N+1 queries and extra round trips (issue: a one-query read cost 9
// statements, /api/account/me 13): sign-in check 1, the tenant transaction's BEGIN, scope and COMMIT 3,
// then the endpoint's own reads.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appWithFullCompany, type FullCompanyApp } from '../support/full-company.ts';
import type { Agent } from '../support/app.ts';
import { addGame, openServiceCall } from '../support/call-factories.ts';
import { recordStatements, type StatementLog } from '../support/statement-log.ts';

let f: FullCompanyApp;
let statements: StatementLog;

beforeAll(async () => {
  f = await appWithFullCompany('Counted Coin-Op');
  statements = recordStatements();
});
afterAll(async () => {
  statements?.stop();
  await f?.close();
});

async function count(agent: Agent, url: string): Promise<string[]> {
  statements.take();
  await agent.get(url).expect(200);
  return statements.take().map((s) => s.text);
}

describe('statements per request', () => {
  // [who, what, ceiling]; `:call`, `:game` and `:venue` stand for the full company's rows.
  const cases: [role: 'owner' | 'dispatcher' | 'technician' | 'venue_contact', path: string, ceiling: number][] = [
    ['owner', '/api/health', 2],
    ['owner', '/api/account/me', 6],
    ['dispatcher', '/api/calls?state=open', 5],
    ['dispatcher', '/api/calls?state=all&sort=openedAt&order=desc', 5],
    ['dispatcher', '/api/calls/:call', 8],
    ['dispatcher', '/api/calls/:call/technicians', 6],
    ['owner', '/api/games', 5],
    ['owner', '/api/games/summary', 5],
    ['owner', '/api/games/:game', 6],
    ['owner', '/api/venues', 5],
    ['owner', '/api/venues/:venue', 6],
    ['owner', '/api/team', 6],
    ['dispatcher', '/api/technicians', 5],
    ['owner', '/api/settings', 5],
    ['technician', '/api/calls?state=open', 5],
    ['venue_contact', '/api/venue-view', 9],
    ['technician', '/api/bench-templates', 5],
    ['technician', '/api/bench-jobs?state=in_progress', 5],
    // The job, its board's parts list, its photos.
    ['technician', '/api/bench-jobs/:benchJob', 7],
    // The company's today; the game, its boards, their electrolytics, its cabinet profile, the model's boards.
    ['technician', '/api/games/:game/boards', 10],
    // The company's today; the board, its parts list, its cabinet profile, its readings, its bench jobs.
    ['technician', '/api/board-instances/:boardInstance', 10],
    // The company's today; every board, their electrolytics, every cabinet profile.
    ['technician', '/api/recap-due', 8],
    ['technician', '/api/parts?locationId=:van', 5],
    // The part, where it is kept, what it fits.
    ['owner', '/api/parts/:part', 7],
    ['owner', '/api/stock/locations', 5],
    // The stock, its page of levels.
    ['owner', '/api/stock/locations/:warehouse/levels', 6],
    // The newest from the stock and the newest to it, then the page's names.
    ['owner', '/api/stock/movements?locationId=:van', 7],
    ['owner', '/api/stock/movements?cataloguePartId=:part', 6],
    // The van, what is on it.
    ['technician', '/api/stock/my-van', 6],
    ['owner', '/api/stock/reorder', 5],
    // The work order, its parts.
    ['technician', '/api/work-orders/:workOrder/parts-used', 6],
    // The board, the person's van, the fits.
    ['technician', '/api/boards/:modelBoard/catalogue-fits', 7],
    // The company's clock and speed; the technicians with their day's kept order; calls, work orders, bench jobs.
    ['dispatcher', '/api/route-days?day=2026-12-03', 9],
    ['technician', '/api/my-day?day=2026-12-03', 9],
    // Care plans: the page of plans.
    ['dispatcher', '/api/care-plans', 5],
    // The plan, the company's zone, its games and their count, their open orders; for due dates the last closed
    // orders, the newest and earliest meter readings and the games' meters.
    ['dispatcher', '/api/care-plans/:carePlan', 13],
    // The company's zone, the page.
    ['dispatcher', '/api/work-orders', 6],
    ['technician', '/api/work-orders/:workOrder', 6],
    // The game, then its meters / newest readings; the keep cost also the company's currency.
    ['technician', '/api/games/:game/meters', 6],
    ['technician', '/api/games/:game/meter-readings/latest', 6],
    ['owner', '/api/games/:game/keep-cost', 7],
  ];
  const resolve = (path: string) =>
    path
      .replace(':benchJob', f.company.bench.benchJobId)
      .replace(':part', f.company.care.cataloguePartId)
      .replace(':warehouse', f.company.care.warehouseId)
      .replace(':van', f.company.care.vanId)
      .replace(':workOrder', f.company.care.workOrderId)
      .replace(':carePlan', f.company.care.carePlanId)
      .replace(':modelBoard', f.company.bench.modelBoardId)
      .replace(':boardInstance', f.company.bench.boardInstanceId)
      .replace(':call', f.company.downCallId)
      .replace(':game', f.company.gameIds[0]!)
      .replace(':venue', f.company.venueIds[0]!);

  it.each(cases)('%s GET %s sends at most %i statements', async (role, path, ceiling) => {
    const sent = await count(f.agents[role], resolve(path));
    // The statements are the failure message, so a rise is easy to read.
    expect(sent.length, sent.join('\n')).toBeLessThanOrEqual(ceiling);
    expect(sent[0]).toMatch(/session_actor/);
  });

  it('a list costs the same statements for many rows as for few (no query per row)', async () => {
    const before = (await count(f.agents.dispatcher, '/api/calls?state=all')).length;
    // New games: a report on a game with an unfixed call joins that call instead of opening another.
    for (let i = 0; i < 5; i++) {
      const gameId = await addGame(f.t.db, f.company);
      await openServiceCall(f.t.db, f.company, { gameId, problem: 'no_credit' });
    }
    const after = (await count(f.agents.dispatcher, '/api/calls?state=all')).length;
    expect(after).toBe(before);
    const listed = await f.agents.dispatcher.get('/api/calls?state=all').expect(200);
    expect(listed.body.items.length).toBeGreaterThanOrEqual(2 + 5);
  });
});
