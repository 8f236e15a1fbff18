// Searching the calls list: a word matches the call's note, its game's title or serial, or its venue's
// name, within the signed-in company only. (The list picks its page from the calls table first and
// looks the game and venue up per call, so the search is written as lookups too.)
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, JSON_HEADERS, type Agent, type TestApp } from '../support/app.ts';
import type { CompanyFixture } from '../support/factories.ts';
import { twoCompanies } from '../support/two-companies.ts';
import { openServiceCall } from '../support/call-factories.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
let owner: Agent;
const ids: Record<string, string> = {};

beforeAll(async () => {
  t = await buildTestApp();
  ({ a, b, owner } = await twoCompanies(t));
  // Alpha's three games are "Alpha Amusements Flipper" SN-1, SN-2, SN-3 at "Alpha Amusements Venue 1…3".
  const open = async (gameId: string, note: string) =>
    (await owner.post('/api/calls').set(JSON_HEADERS).send({ gameId, problem: 'no_sound', note }).expect(201)).body.id as string;
  ids.first = await open(a.gameIds[0]!, 'Speaker crackles under the backbox');
  ids.second = await open(a.gameIds[1]!, '');
  ids.third = await open(a.gameIds[2]!, '');
  // Beta's call, on "Beta Games Flipper" SN-1 at "Beta Games Venue 1".
  ids.beta = await openServiceCall(t.db, b, { gameId: b.gameIds[0]! });
});
afterAll(() => t.close());

async function found(q: string): Promise<string[]> {
  const res = await owner.get('/api/calls').query({ state: 'all', q }).expect(200);
  return (res.body.items as { id: string }[]).map((c) => c.id).sort();
}

describe('call search', () => {
  it('matches the note, the game title, the serial and the venue name, case-insensitively', async () => {
    expect(await found('BACKBOX')).toEqual([ids.first]);
    expect(await found('sn-2')).toEqual([ids.second]);
    expect(await found('venue 3')).toEqual([ids.third]);
    expect(await found('flipper')).toEqual([ids.first, ids.second, ids.third].sort());
    expect(await found('no such words')).toEqual([]);
  });

  it("never finds another company's calls, even by their words", async () => {
    expect(ids.beta).toBeTruthy();
    expect(await found('Beta Games')).toEqual([]);
    expect(await found('SN-1')).toEqual([ids.first]);
  });

  it('takes % and _ as plain characters', async () => {
    expect(await found('%')).toEqual([]);
    expect(await found('SN_1')).toEqual([]);
  });
});
