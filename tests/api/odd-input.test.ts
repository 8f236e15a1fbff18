// Odd input gets a 4xx problem detail naming the field, and writes nothing — never a 500. Each case here
// once reached the database or a URL parser unchecked.
import { sql } from 'drizzle-orm';
import request from 'supertest';
import twilio from 'twilio';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { encodeCursor } from '@bumperline/db/queries/keyset';
import {
  buildTestApp,
  JSON_HEADERS,
  ORIGIN,
  SMS_AUTH_TOKEN,
  signedInAgent,
  signInOutcome,
  type Agent,
  type TestApp,
} from '../support/app.ts';
import { createCompany, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let company: CompanyFixture;
let owner: Agent;
let tagToken: string;

beforeAll(async () => {
  t = await buildTestApp({ sms: true });
  company = await createCompany(t.db.owner, 'Oddity Amusements', 1);
  owner = await signedInAgent(t, company.ownerEmail);
  const game = (await t.db.owner.execute(sql`select tag_token from games where id = ${company.gameIds[0]!}`)).rows[0] as {
    tag_token: string;
  };
  tagToken = game.tag_token;
});
afterAll(() => t.close());

const count = async (table: string) =>
  ((await t.db.owner.execute(sql`select count(*)::int as n from ${sql.identifier(table)}`)).rows[0] as { n: number }).n;

/** Expects a 400 problem detail that names `field`. */
function expectFieldError(res: request.Response, field: string) {
  expect(res.status, res.text).toBe(400);
  expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
  expect(res.body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ field })]));
}

describe('NUL characters', () => {
  it('in a search are refused, naming the field', async () => {
    expectFieldError(await owner.get('/api/venues').query({ q: 'bar\u0000' }), 'q');
    expectFieldError(await owner.get('/api/calls').query({ q: '\u0000' }), 'q');
  });

  it('in a JSON body are refused, naming the field, and nothing is written', async () => {
    const before = await count('venues');
    const res = await owner
      .post('/api/venues')
      .set(JSON_HEADERS)
      .send({ name: 'Nul\u0000 Tavern', addressLine: '1 Odd St', city: 'Testville', latitude: 41.9, longitude: -87.6 });
    expectFieldError(res, 'name');
    expect(await count('venues')).toBe(before);
  });

  it('in a field name of a JSON body are refused too', async () => {
    const res = await owner.post('/api/calls').set(JSON_HEADERS).send({ gameId: company.gameIds[0], problem: 'dead', 'x\u0000': 1 });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].message).toMatch(/NUL/);
  });

  it('in a password sign-in are a plain refusal, not a server fault', async () => {
    expect(await signInOutcome(request.agent(t.app), 'owner\u0000@oddity.test', 'whatever it is')).toBe('credentials');
  });

  it('in sign-up are refused, naming the field, and no account is made', async () => {
    const users = await count('users');
    const res = await request(t.app)
      .post('/api/account/sign-up')
      .set(JSON_HEADERS)
      .send({ companyName: 'Nul Co', name: 'Ann\u0000', email: 'ann@nul.test', password: 'a long enough passphrase' });
    expectFieldError(res, 'name');
    expect(await count('users')).toBe(users);
  });

  it('in the public report note come back beside the note, and no call is opened', async () => {
    const calls = await count('service_calls');
    const res = await request(t.app)
      .post(`/t/${tagToken}`)
      .set('X-Forwarded-For', '198.51.100.200')
      .field('problem', 'dead')
      .field('note', 'dead\u0000');
    expect(res.status).toBe(400);
    expect(res.text).toContain('id="note-error"');
    expect(res.text).toMatch(/NUL/);
    expect(await count('service_calls')).toBe(calls);
  });

  it('in a game-tag or status link are simply an unknown tag', async () => {
    expect((await request(t.app).get('/t/ab%00cd')).status).toBe(404);
    expect((await request(t.app).get('/status/ab%00cd')).status).toBe(404);
  });

  it('in a signed inbound text are refused, naming the field', async () => {
    const url = `${ORIGIN}/webhooks/sms/inbound`;
    const params = { From: '+1312555\u00000142', Body: 'YES', MessageSid: 'SM0000' };
    const signature = twilio.getExpectedTwilioSignature(SMS_AUTH_TOKEN, url, params);
    const res = await request(t.app).post('/webhooks/sms/inbound').type('form').set('X-Twilio-Signature', signature).send(params);
    expectFieldError(res, 'From');
  });
});

describe('numbers and cursors', () => {
  it('a hand-made list cursor is refused, naming the cursor', async () => {
    const cursor = encodeCursor({ v: 'yesterday', id: '6f1c2a3b-4d5e-4f60-8a7b-9c0d1e2f3a4b' });
    expectFieldError(await owner.get('/api/calls').query({ cursor }), 'cursor');
    expectFieldError(await owner.get('/api/games').query({ cursor: 'bm90IG91cnM' }), 'cursor');
  });

  it('a version beyond the database integer is refused, naming the version, and nothing changes', async () => {
    const venue = await owner.get(`/api/venues/${company.venueIds[0]}`).expect(200);
    const res = await owner.patch(`/api/venues/${company.venueIds[0]}`).set(JSON_HEADERS).send({ name: 'Renamed', version: 2_147_483_648 });
    expectFieldError(res, 'version');
    const after = await owner.get(`/api/venues/${company.venueIds[0]}`).expect(200);
    expect(after.body.name).toBe(venue.body.name);
  });

  it('an activity page beyond any id is refused, naming the field', async () => {
    expectFieldError(await owner.get('/api/activity').query({ before: '1e30' }), 'before');
  });
});

describe('addresses and settings', () => {
  it('a path with broken percent-encoding is a 400 naming the path, not a crash', async () => {
    for (const path of ['/status/%E0%A4%A', '/api/venues/%E0%A4%A', '/t/%ZZ']) {
      const res = await request(t.app).get(path);
      expect(res.status, path).toBe(400);
      expect(res.body.errors, path).toEqual([{ field: '(path)', message: 'is not a valid URL' }]);
    }
  });

  it('a company locale must be a language tag the screens can format with', async () => {
    const res = await owner.patch('/api/company').set(JSON_HEADERS).send({ locale: 'not_a-locale!!' });
    expectFieldError(res, 'locale');
    await owner.patch('/api/company').set(JSON_HEADERS).send({ locale: 'en-GB' }).expect(200);
  });
});

describe('links', () => {
  it('a map tile address must be a web address, not a script', async () => {
    const res = await owner.patch('/api/settings').set(JSON_HEADERS).send({ mapTileUrl: 'javascript:alert(1)//{z}/{x}/{y}' });
    expectFieldError(res, 'mapTileUrl');
  });
});

describe('the Origin header', () => {
  it('"null" or something that is not a URL is a refused cross-site request, not a crash', async () => {
    for (const origin of ['null', 'not a url', 'javascript:alert(1)']) {
      const res = await owner
        .post('/api/calls')
        .set({ 'X-Requested-With': 'bumperline', Origin: origin })
        .send({ gameId: company.gameIds[0], problem: 'dead' });
      expect(res.status, origin).toBe(403);
      expect(res.body.errors).toEqual([{ field: 'header:origin', message: 'is not this site' }]);
    }
    expect(await count('service_calls')).toBe(0);
  });

  it('on the developer phone form is refused the same way', async () => {
    const res = await request(t.app)
      .post('/dev/phone/reply')
      .set('Origin', 'null')
      .type('form')
      .send({ from: '+13125550142', body: 'YES' });
    expect(res.status).toBe(403);
  });
});
