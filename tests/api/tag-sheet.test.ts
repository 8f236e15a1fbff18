// Game tags for staff: the printable QR sheet of a venue and replacing a game's tag.
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tagQrSvg } from '@bumperline/api/public-pages/tag-sheet-page';
import { games, memberships } from '@bumperline/db/schema/index';
import { buildTestApp, JSON_HEADERS, ORIGIN, signedInAgent, type Agent, type TestApp } from '../support/app.ts';
import { createCompany, createUser, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
let owner: Agent;
let technician: Agent;
let venueContact: Agent;
/** Company A's first venue: three games on location and one retired. */
let venueId: string;
let active: { id: string; serial: string; token: string }[];
let retiredToken: string;

async function tagOf(gameId: string): Promise<string> {
  const r = await t.db.owner.execute(sql`select tag_token from games where id = ${gameId}`);
  return (r.rows[0] as { tag_token: string }).tag_token;
}

async function memberAgent(company: CompanyFixture, role: 'technician' | 'venue_contact'): Promise<Agent> {
  const user = await createUser(t.db.owner, { name: `A ${role}` });
  await t.db.owner.insert(memberships).values({ tenantId: company.tenantId, userId: user.id, role });
  return signedInAgent(t, user.email);
}

beforeAll(async () => {
  t = await buildTestApp();
  a = await createCompany(t.db.owner, 'Alpha Amusements', 2);
  b = await createCompany(t.db.owner, 'Beta Games', 1);
  venueId = a.venueIds[0]!;
  const extra = await t.db.owner
    .insert(games)
    .values(
      ['SN-20', 'SN-21', 'SN-OLD'].map((serial) => ({
        tenantId: a.tenantId,
        modelId: a.modelId,
        venueId,
        serial,
        tagToken: randomBytes(18).toString('base64url'),
        retiredAt: serial === 'SN-OLD' ? new Date() : null,
      })),
    )
    .returning();
  const rows = [{ id: a.gameIds[0]!, serial: 'SN-1' }, ...extra.filter((g) => !g.retiredAt).map((g) => ({ id: g.id, serial: g.serial }))];
  active = await Promise.all(rows.map(async (g) => ({ ...g, token: await tagOf(g.id) })));
  retiredToken = extra.find((g) => g.retiredAt)!.tagToken;
  owner = await signedInAgent(t, a.ownerEmail);
  technician = await memberAgent(a, 'technician');
  venueContact = await memberAgent(a, 'venue_contact');
});
afterAll(() => t.close());

describe('the tag sheet', () => {
  it('has one QR code per game on location, each encoding that game’s tag address, with title, serial and the short line', async () => {
    const res = await owner.get(`/api/venues/${venueId}/tag-sheet`).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text.match(/<svg /g)).toHaveLength(active.length);
    expect(res.text.match(/Game not working\? Scan to tell us\./g)).toHaveLength(active.length);
    for (const g of active) {
      const url = `${ORIGIN}/t/${g.token}`;
      expect(res.text).toContain(await tagQrSvg(url));
      expect(res.text).toContain(`<p class="url">${url}</p>`);
      expect(res.text).toContain(`Serial ${g.serial}`);
    }
    expect(res.text).not.toContain(retiredToken);
    // Another venue's game is not on this venue's sheet.
    expect(res.text).not.toContain(await tagOf(a.gameIds[1]!));
    expect(res.text).toContain('Alpha Amusements Flipper');
    expect(res.text).toContain('Game tags · Alpha Amusements Venue 1');
  });

  it('technicians may print it; venue contacts and strangers may not', async () => {
    await technician.get(`/api/venues/${venueId}/tag-sheet`).expect(200);
    await venueContact.get(`/api/venues/${venueId}/tag-sheet`).expect(403);
    await request(t.app).get(`/api/venues/${venueId}/tag-sheet`).expect(401);
  });

  it('another company’s venue is 404 and shows none of its tags', async () => {
    const res = await owner.get(`/api/venues/${b.venueIds[0]}/tag-sheet`).expect(404);
    expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(res.text).not.toContain(await tagOf(b.gameIds[0]!));
    expect(res.text).not.toContain('Beta');
  });
});

describe('regenerating a game tag', () => {
  it('issues a new unguessable tag; the old one stops working at once; the change is audited without the secret', async () => {
    const game = active[1]!;
    const old = game.token;
    await request(t.app).get(`/t/${old}`).expect(200);

    const res = await owner.post(`/api/games/${game.id}/regenerate-tag`).set(JSON_HEADERS).expect(200);
    const fresh = await tagOf(game.id);
    expect(fresh).not.toBe(old);
    expect(fresh).toMatch(/^[A-Za-z0-9_-]{24,}$/);
    expect(res.body).toEqual({ gameId: game.id, tagUrl: `${ORIGIN}/t/${fresh}` });

    const gone = await request(t.app).get(`/t/${old}`).expect(404);
    expect(gone.text).toContain('This game tag is not active');
    const callsBefore = await t.db.owner.execute(sql`select count(*)::int as n from service_calls where game_id = ${game.id}`);
    await request(t.app).post(`/t/${old}`).field('problem', 'dead').expect(404);
    const callsAfter = await t.db.owner.execute(sql`select count(*)::int as n from service_calls where game_id = ${game.id}`);
    expect(callsAfter.rows).toEqual(callsBefore.rows);
    await request(t.app).get(`/t/${fresh}`).expect(200);

    const audit = await t.db.owner.execute(sql`select action, changes from audit_log where entity = 'game' and entity_id = ${game.id}`);
    expect(audit.rows).toEqual([{ action: 'regenerate-tag', changes: { tag: { from: `…${old.slice(-4)}`, to: `…${fresh.slice(-4)}` } } }]);
    expect(JSON.stringify(audit.rows)).not.toContain(old);

    const sheet = await owner.get(`/api/venues/${venueId}/tag-sheet`).expect(200);
    expect(sheet.text).toContain(`${ORIGIN}/t/${fresh}`);
    expect(sheet.text).not.toContain(old);
  });

  it('needs the request header, the games:write permission and a game of one’s own company', async () => {
    const game = active[2]!;
    const before = await tagOf(game.id);
    await owner.post(`/api/games/${game.id}/regenerate-tag`).expect(403); // no X-Requested-With: CSRF guard
    await technician.post(`/api/games/${game.id}/regenerate-tag`).set(JSON_HEADERS).expect(403);
    expect(await tagOf(game.id)).toBe(before);

    const theirs = await tagOf(b.gameIds[0]!);
    await owner.post(`/api/games/${b.gameIds[0]}/regenerate-tag`).set(JSON_HEADERS).expect(404);
    expect(await tagOf(b.gameIds[0]!)).toBe(theirs);
  });
});
