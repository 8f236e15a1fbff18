// The public game-tag report page, its receipt and the status page, driven as a phone with JavaScript off
// would: plain multipart form posts against the real app and PostgreSQL. What was stored is read back
// through the owner connection (which bypasses row-level security) or the staff API.
import { mkdtemp, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import pino from 'pino';
import request from 'supertest';
import sharp from 'sharp';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { problemKinds, problemLabels } from '@bumperline/contracts/calls';
import { createApp } from '@bumperline/api/app';
import { createMailer } from '@bumperline/api/services/mailer';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
import { publicTagsRouter } from '@bumperline/api/routes/public-tags';
import { buildTestApp, JSON_HEADERS, ORIGIN, signIn, signedInAgent, type TestApp } from '../support/app.ts';
import { createCompany, createUser, type CompanyFixture } from '../support/factories.ts';
import { memberships } from '@bumperline/db/schema/index';

let t: TestApp;
let app: express.Express;
let photoDir: string;
let a: CompanyFixture;
let b: CompanyFixture;
/** Tag tokens of company A's games, in the order of a.gameIds. */
let tokens: string[];

const TITLE = 'Starlight Voyager';
const venueName = (i: number) => `Juniper Lanes ${i + 1}`;

// Every report comes from its own address (the app trusts X-Forwarded-For from loopback), so the
// per-address limit only bites in the test that is about it.
let nextHost = 1;
const freshAddress = () => `198.51.100.${nextHost++}`;

type Fields = Record<string, string>;
function report(token: string, fields: Fields, photo?: { bytes: Buffer; name: string; type: string }, target: express.Express = app) {
  let req = request(target).post(`/t/${token}`).set('X-Forwarded-For', freshAddress());
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  if (photo) req = req.attach('photo', photo.bytes, { filename: photo.name, contentType: photo.type });
  return req;
}

async function count(query: ReturnType<typeof sql>): Promise<number> {
  const r = await t.db.owner.execute(query);
  return (r.rows[0] as { n: number }).n;
}
const callsOf = (tenantId: string) => count(sql`select count(*)::int as n from service_calls where tenant_id = ${tenantId}`);

async function filesOnDisk(): Promise<number> {
  const entries = await readdir(photoDir, { recursive: true, withFileTypes: true });
  return entries.filter((e) => e.isFile()).length;
}

function statusTokenFrom(location: string): string {
  return new URL(location, ORIGIN).searchParams.get('call')!;
}

/** Whether an EXIF block (as sharp returns it, "Exif\0\0" + TIFF) points to a GPS directory (tag 0x8825 in IFD0). */
function hasGpsDirectory(exif: Buffer | undefined): boolean {
  if (!exif) return false;
  const tiff = exif.subarray(exif.subarray(0, 6).toString('latin1') === 'Exif\0\0' ? 6 : 0);
  const le = tiff.subarray(0, 2).toString('latin1') === 'II';
  const u16 = (o: number) => (le ? tiff.readUInt16LE(o) : tiff.readUInt16BE(o));
  const u32 = (o: number) => (le ? tiff.readUInt32LE(o) : tiff.readUInt32BE(o));
  const ifd0 = u32(4);
  for (let i = 0; i < u16(ifd0); i++) if (u16(ifd0 + 2 + i * 12) === 0x8825) return true;
  return false;
}

beforeAll(async () => {
  t = await buildTestApp();
  // The same app as buildTestApp's, but with a photo folder of its own, so files on disk can be counted.
  photoDir = await mkdtemp(path.join(os.tmpdir(), 'bumperline-report-photos-'));
  app = createApp({
    db: t.db.app,
    mailer: createMailer({ fakePort: t.mail.port, from: 'Bumperline test <test@bumperline.example>' }),
    logger: pino({ level: 'silent' }),
    authSecret: 'test-secret-that-is-at-least-32-characters-long',
    smsAuthToken: 'test-twilio-auth-token',
    photos: folderPhotoStore(photoDir),
    appOrigin: ORIGIN,
  });
  a = await createCompany(t.db.owner, 'Alpha Amusements', 12);
  b = await createCompany(t.db.owner, 'Beta Games', 1);
  // Names that do not repeat the company's name, so "shows nothing of the operator" can be checked.
  await t.db.owner.execute(sql`update game_models set title = ${TITLE} where tenant_id = ${a.tenantId}`);
  for (const [i, id] of a.venueIds.entries()) {
    await t.db.owner.execute(sql`update venues set name = ${venueName(i)}, contact_phone = '+13125550100' where id = ${id}`);
  }
  const r = await t.db.owner.execute(sql`select id, tag_token from games where tenant_id = ${a.tenantId}`);
  const byId = new Map((r.rows as { id: string; tag_token: string }[]).map((g) => [g.id, g.tag_token]));
  tokens = a.gameIds.map((id) => byId.get(id)!);
});

afterAll(async () => {
  await t.close();
  await rm(photoDir, { recursive: true, force: true });
});

describe('the report page', () => {
  it('shows the game and its venue, a form that works without JavaScript, and nothing else of the operator', async () => {
    const res = await request(app).get(`/t/${tokens[0]}`).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain(`<h1>${TITLE}</h1>`);
    expect(res.text).toContain(venueName(0));
    expect(res.text).not.toContain('Alpha');
    expect(res.text).not.toContain('5550100');
    expect(res.text).toMatch(/<form[^>]*method="post"[^>]*enctype="multipart\/form-data"/);
    for (const kind of problemKinds) {
      expect(res.text).toContain(`value="${kind}"`);
      expect(res.text).toContain(problemLabels[kind]);
    }
    expect(res.text).toMatch(/<input type="checkbox" name="smsConsent" id="sms-consent" value="yes">/);
    expect(res.text).not.toMatch(/<script(?![^>]*\bsrc=)/); // no inline script: the CSP forbids it
    expect(res.headers['content-security-policy']).toContain("script-src 'self'");
    expect(Buffer.byteLength(res.text)).toBeLessThan(12_000);
    const script = await request(app).get('/t-assets/report.js').expect(200);
    expect(script.headers['content-type']).toMatch(/javascript/);
  });

  it('a report sent as a plain form opens a call, puts the game down and leads to a receipt with a status link', async () => {
    const gameId = a.gameIds[0]!;
    const res = await report(tokens[0]!, { problem: 'dead', note: 'No lights at all since the storm' }).expect(303);
    expect(res.headers.location).toMatch(new RegExp(`^/t/${tokens[0]}/thanks\\?call=`));

    const calls = await t.db.owner.execute(
      sql`select id, state, source, problem, note, status_token from service_calls where game_id = ${gameId}`,
    );
    expect(calls.rows).toHaveLength(1);
    const call = calls.rows[0] as { id: string; state: string; source: string; problem: string; note: string; status_token: string };
    expect(call).toMatchObject({ state: 'reported', source: 'game_tag', problem: 'dead', note: 'No lights at all since the storm' });
    expect(statusTokenFrom(res.headers.location!)).toBe(call.status_token);

    const game = await t.db.owner.execute(sql`select status from games where id = ${gameId}`);
    expect(game.rows[0]).toEqual({ status: 'down' });
    const downtime = await t.db.owner.execute(sql`select call_id, ended_at from downtime_intervals where game_id = ${gameId}`);
    expect(downtime.rows).toEqual([{ call_id: call.id, ended_at: null }]);

    const receipt = await request(app).get(res.headers.location!).expect(200);
    expect(receipt.text).toContain('We have your report');
    expect(receipt.text).toContain(`href="/status/${call.status_token}"`);
    expect(receipt.text).toContain(`${ORIGIN}/status/${call.status_token}`);

    const status = await request(app).get(`/status/${call.status_token}`).expect(200);
    expect(status.text).toContain(TITLE);
    expect(status.text).toContain(venueName(0));
    expect(status.text).toContain('Reported');
    expect(status.text).toContain('<meta http-equiv="refresh" content="60">');
  });

  it('a second report of a game waiting for a fix joins the open call', async () => {
    const gameId = a.gameIds[1]!;
    const first = await report(tokens[1]!, { problem: 'ball_stuck' }).expect(303);
    const second = await report(tokens[1]!, { problem: 'no_sound', note: 'and it is silent' }).expect(303);
    expect(statusTokenFrom(second.headers.location!)).toBe(statusTokenFrom(first.headers.location!));
    expect(new URL(second.headers.location!, ORIGIN).searchParams.get('joined')).toBe('1');
    expect(await count(sql`select count(*)::int as n from service_calls where game_id = ${gameId}`)).toBe(1);
    const joined = await t.db.owner.execute(
      sql`select e.detail from call_events e join service_calls c on c.id = e.call_id where c.game_id = ${gameId} and e.kind = 'report_joined'`,
    );
    expect(joined.rows).toEqual([{ detail: { problem: 'no_sound', note: 'and it is silent', source: 'game_tag' } }]);
    const receipt = await request(app).get(second.headers.location!).expect(200);
    expect(receipt.text).toContain('had already been reported');
  });
});

describe('the status page', () => {
  it('shows the state in plain words and a timeline in the operator’s time zone, and nothing private', async () => {
    const gameId = a.gameIds[2]!;
    const sent = await report(tokens[2]!, {
      problem: 'display_out',
      note: 'Reporter note',
      phone: '(312) 555-0142',
      smsConsent: 'yes',
    }).expect(303);
    const statusToken = statusTokenFrom(sent.headers.location!);
    const [call] = (await t.db.owner.execute(sql`select id, reporter_phone from service_calls where game_id = ${gameId}`)).rows as {
      id: string;
      reporter_phone: string;
    }[];
    expect(call!.reporter_phone).toBe('+13125550142');

    // Staff work the call: a technician with a name and a phone, and a note only staff should read.
    const tech = await createUser(t.db.owner, { name: 'Tessa Solderworth', phone: '+13125550177' });
    await t.db.owner.insert(memberships).values({ tenantId: a.tenantId, userId: tech.id, role: 'technician' });
    const owner = await signedInAgent(t, a.ownerEmail);
    const assigned = await owner
      .post(`/api/calls/${call!.id}/assign`)
      .set(JSON_HEADERS)
      .send({ technicianId: tech.id, version: 1 })
      .expect(200);
    await owner
      .post(`/api/calls/${call!.id}/transition`)
      .set(JSON_HEADERS)
      .send({ to: 'on_the_way', version: assigned.body.version })
      .expect(200);
    await owner.post(`/api/calls/${call!.id}/notes`).set(JSON_HEADERS).send({ note: 'Venue owes us for the last repair' }).expect(201);
    // A known moment for the opening: 18:30 UTC on 15 January is 12:30 PM in Chicago (CST, UTC−6).
    await t.db.owner.execute(sql`update call_events set at = '2026-01-15T18:30:00Z' where call_id = ${call!.id} and kind = 'opened'`);

    const res = await request(app).get(`/status/${statusToken}`).expect(200);
    expect(res.text).toContain('On the way');
    expect(res.text).toContain('A technician is on the way');
    const steps = [...res.text.matchAll(/<li><span>([^<]+)<\/span>/g)].map((m) => m[1]);
    expect(steps).toEqual(['Reported', 'Assigned', 'On the way']);
    expect(res.text).toMatch(/Jan 15, 12:30\s?PM CST/);
    expect(res.text).not.toContain('6:30');
    for (const secret of [
      'Tessa',
      'Solderworth',
      '555-0142',
      '5550142',
      '5550177',
      '5550100',
      'Venue owes',
      'Reporter note',
      'Alpha',
      tech.email,
    ]) {
      expect(res.text).not.toContain(secret);
    }
  });

  it('an unknown status link gets a friendly 404 page', async () => {
    const res = await request(app).get('/status/NoSuchStatusTokenAtAll123').expect(404);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('We cannot find this report');
  });
});

describe('tags that do not work', () => {
  it('an unknown tag gets a friendly 404 page, never an error dump', async () => {
    for (const token of ['ThisTokenDoesNotExist0001', 'x', "abc'def"]) {
      const res = await request(app)
        .get(`/t/${encodeURIComponent(token)}`)
        .expect(404);
      expect(res.headers['content-type']).toMatch(/text\/html/);
      expect(res.text).toContain('This game tag is not active');
      expect(res.text).not.toMatch(/Error:|Not found|\.ts:\d+|node_modules/);
    }
  });

  it('a retired game’s tag is not active and takes no report', async () => {
    const retiredToken = tokens[11]!;
    await t.db.owner.execute(sql`update games set retired_at = now() where id = ${a.gameIds[11]!}`);
    const page = await request(app).get(`/t/${retiredToken}`).expect(404);
    expect(page.text).toContain('This game tag is not active');
    const before = await callsOf(a.tenantId);
    const res = await report(retiredToken, { problem: 'dead' }).expect(404);
    expect(res.text).toContain('This game tag is not active');
    expect(await callsOf(a.tenantId)).toBe(before);
  });
});

describe('bad input changes nothing', () => {
  it('a malformed phone number comes back beside its field with a 400, the rest kept and escaped, nothing stored', async () => {
    const before = await callsOf(a.tenantId);
    const files = await filesOnDisk();
    const note = '<script>alert("x")</script> flippers weak';
    const res = await report(tokens[3]!, { problem: 'other', note, phone: '12', smsConsent: 'yes' }).expect(400);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toMatch(/<p class="error" id="phone-error">The mobile number must be a valid phone number/);
    expect(res.text).toMatch(/<input type="tel" name="phone" id="phone"[^>]*aria-invalid="true"/);
    expect(res.text).toContain('value="other" checked');
    expect(res.text).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; flippers weak</textarea>');
    expect(res.text).not.toContain('<script>alert');
    expect(await callsOf(a.tenantId)).toBe(before);
    expect(await filesOnDisk()).toBe(files);
  });

  it('no problem chosen, or a note over 1000 characters, is refused with the message beside the field', async () => {
    const before = await callsOf(a.tenantId);
    const none = await report(tokens[3]!, { note: 'hello' }).expect(400);
    expect(none.text).toContain('<p class="error" id="problem-error">Choose what is wrong with the game.</p>');
    const long = await report(tokens[3]!, { problem: 'other', note: 'x'.repeat(1001) }).expect(400);
    expect(long.text).toContain('<p class="error" id="note-error">Your note must be at most 1000 characters.</p>');
    expect(await callsOf(a.tenantId)).toBe(before);
  });

  it('a script in the note is stored as text and never comes back as markup', async () => {
    const note = '<script>alert(1)</script><img src=x onerror=alert(2)>';
    const sent = await report(tokens[4]!, { problem: 'no_credit', note }).expect(303);
    const stored = await t.db.owner.execute(sql`select note from service_calls where game_id = ${a.gameIds[4]!}`);
    expect(stored.rows).toEqual([{ note }]);
    const receipt = await request(app).get(sent.headers.location!).expect(200);
    const status = await request(app)
      .get(`/status/${statusTokenFrom(sent.headers.location!)}`)
      .expect(200);
    for (const page of [receipt.text, status.text]) {
      expect(page).not.toContain('<script>alert');
      expect(page).not.toContain('<img src=x');
    }
  });

  it('a venue name with markup in it is shown as text', async () => {
    await t.db.owner.execute(sql`update venues set name = '<b>Bold</b> & Co' where id = ${a.venueIds[5]!}`);
    const res = await request(app).get(`/t/${tokens[5]}`).expect(200);
    expect(res.text).toContain('&lt;b&gt;Bold&lt;/b&gt; &amp; Co');
    expect(res.text).not.toContain('<b>Bold</b>');
  });
});

describe('the phone number for text updates', () => {
  it('is not stored without the consent box ticked, and the receipt says so', async () => {
    const sent = await report(tokens[6]!, { problem: 'dead', phone: '(312) 555-0142' }).expect(303);
    expect(new URL(sent.headers.location!, ORIGIN).searchParams.get('sms')).toBe('not-kept');
    const stored = await t.db.owner.execute(
      sql`select reporter_phone, reporter_sms_consent from service_calls where game_id = ${a.gameIds[6]!}`,
    );
    expect(stored.rows).toEqual([{ reporter_phone: null, reporter_sms_consent: false }]);
    const receipt = await request(app).get(sent.headers.location!).expect(200);
    expect(receipt.text).toContain('did not keep the number');
    expect(receipt.text).not.toContain('555-0142');
  });

  it('ticking the box without a number is refused', async () => {
    const before = await callsOf(a.tenantId);
    const res = await report(tokens[6]!, { problem: 'dead', smsConsent: 'yes' }).expect(400);
    expect(res.text).toContain('Enter a mobile number for text updates');
    expect(await callsOf(a.tenantId)).toBe(before);
  });
});

describe('photos', () => {
  it('an upload over 10 MB gets a 413 with a clear message; no call, no file', async () => {
    const before = await callsOf(a.tenantId);
    const files = await filesOnDisk();
    const big = Buffer.alloc(10 * 1024 * 1024 + 1, 0xff);
    const res = await report(
      tokens[7]!,
      { problem: 'dead', note: 'big photo' },
      { bytes: big, name: 'cabinet.jpg', type: 'image/jpeg' },
    ).expect(413);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('<p class="error" id="photo-error">The photo is larger than 10 MB.');
    expect(res.text).toContain('big photo</textarea>');
    expect(await callsOf(a.tenantId)).toBe(before);
    expect(await filesOnDisk()).toBe(files);
  });

  it('a text file renamed .jpg is refused by its content with a 400; no call, no file', async () => {
    const before = await callsOf(a.tenantId);
    const files = await filesOnDisk();
    const fake = Buffer.from('This is not a picture, just text pretending to be one.\n'.repeat(20));
    const res = await report(tokens[7]!, { problem: 'dead' }, { bytes: fake, name: 'photo.jpg', type: 'image/jpeg' }).expect(400);
    expect(res.text).toContain('<p class="error" id="photo-error">The photo must be a JPEG, PNG or WebP picture.</p>');
    expect(await callsOf(a.tenantId)).toBe(before);
    expect(await filesOnDisk()).toBe(files);
  });

  it('a photo is stored upright without its EXIF/GPS block, with a thumbnail, and staff can read it', async () => {
    // A 400 × 200 camera picture marked "rotate 90°" (orientation 6) and carrying a GPS position.
    const original = await sharp({ create: { width: 400, height: 200, channels: 3, background: { r: 200, g: 30, b: 30 } } })
      .jpeg()
      .withExif({
        IFD0: { Make: 'TestCam' },
        IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '41/1 52/1 30/1', GPSLongitudeRef: 'W', GPSLongitude: '87/1 37/1 40/1' },
      })
      .withMetadata({ orientation: 6 })
      .toBuffer();
    const input = await sharp(original).metadata();
    expect(hasGpsDirectory(input.exif)).toBe(true);
    expect(input.orientation).toBe(6);

    const files = await filesOnDisk();
    await report(tokens[8]!, { problem: 'display_out' }, { bytes: original, name: 'IMG_0001.jpg', type: 'image/jpeg' }).expect(303);
    const [row] = (
      await t.db.owner.execute(
        sql`select p.id, p.call_id, p.width, p.height, p.content_type from call_photos p join service_calls c on c.id = p.call_id where c.game_id = ${a.gameIds[8]!}`,
      )
    ).rows as { id: string; call_id: string; width: number; height: number; content_type: string }[];
    expect(row).toMatchObject({ width: 200, height: 400, content_type: 'image/jpeg' });
    expect(await filesOnDisk()).toBe(files + 2);
    expect(await count(sql`select count(*)::int as n from call_events where call_id = ${row!.call_id} and kind = 'photo'`)).toBe(1);

    // Signed in to this file's app, whose photo folder holds the file.
    const owner = request.agent(app);
    expect(await signIn(owner, a.ownerEmail)).toBe(200);
    const stored = await owner.get(`/api/calls/${row!.call_id}/photos/${row!.id}`).buffer(true).expect(200);
    expect(stored.headers['content-type']).toMatch(/image\/jpeg/);
    const meta = await sharp(stored.body as Buffer).metadata();
    expect(meta.exif).toBeUndefined();
    expect(hasGpsDirectory(meta.exif)).toBe(false);
    expect(meta.orientation).toBeUndefined();
    expect([meta.width, meta.height]).toEqual([200, 400]);
    expect((stored.body as Buffer).includes(Buffer.from('TestCam'))).toBe(false);

    const thumb = await owner.get(`/api/calls/${row!.call_id}/photos/${row!.id}?size=thumb`).buffer(true).expect(200);
    const thumbMeta = await sharp(thumb.body as Buffer).metadata();
    expect(thumbMeta.format).toBe('webp');
    expect(Math.max(thumbMeta.width!, thumbMeta.height!)).toBeLessThanOrEqual(320);
  });
});

describe('rate limits', () => {
  // A router of its own with lowered limits (the app's defaults are 5 per tag per 10 minutes, 20 per address per hour).
  function limitedApp(limits: Parameters<typeof publicTagsRouter>[0]['limits']) {
    const limited = express();
    limited.set('trust proxy', 'loopback');
    limited.use(publicTagsRouter({ db: t.db.app, photos: folderPhotoStore(photoDir), appOrigin: ORIGIN, limits }));
    return limited;
  }

  it('a flood of reports on one tag gets a 429 page and stores nothing more', async () => {
    const limited = limitedApp({ perTag: { max: 2, windowMs: 60_000 } });
    await report(tokens[9]!, { problem: 'dead' }, undefined, limited).expect(303);
    await report(tokens[9]!, { problem: 'dead' }, undefined, limited).expect(303);
    const events = () =>
      count(sql`select count(*)::int as n from call_events e join service_calls c on c.id = e.call_id where c.game_id = ${a.gameIds[9]!}`);
    const before = { calls: await callsOf(a.tenantId), events: await events(), files: await filesOnDisk() };
    const photo = await sharp({ create: { width: 50, height: 50, channels: 3, background: '#888' } })
      .jpeg()
      .toBuffer();
    const res = await report(
      tokens[9]!,
      { problem: 'dead', note: 'third' },
      { bytes: photo, name: 'p.jpg', type: 'image/jpeg' },
      limited,
    ).expect(429);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('Too many reports just now');
    expect(res.text).toMatch(/try again in about \d+ minutes?/);
    expect({ calls: await callsOf(a.tenantId), events: await events(), files: await filesOnDisk() }).toEqual(before);
    // Another tag is not held back by this one's flood.
    await report(tokens[10]!, { problem: 'dead' }, undefined, limited).expect(303);
  });

  it('one address sending reports for many tags is stopped too', async () => {
    const limited = limitedApp({ perAddress: { max: 2, windowMs: 60_000 } });
    const from = (token: string) => request(limited).post(`/t/${token}`).set('X-Forwarded-For', '203.0.113.9').field('problem', 'other');
    await from(tokens[3]!).expect(303);
    await from(tokens[5]!).expect(303);
    const before = await callsOf(b.tenantId);
    const bToken = (
      (await t.db.owner.execute(sql`select tag_token from games where id = ${b.gameIds[0]!}`)).rows[0] as { tag_token: string }
    ).tag_token;
    const res = await from(bToken).expect(429);
    expect(res.text).toContain('Too many reports just now');
    expect(await callsOf(b.tenantId)).toBe(before);
    // Someone else, elsewhere, still gets through.
    await request(limited).post(`/t/${bToken}`).set('X-Forwarded-For', '203.0.113.10').field('problem', 'other').expect(303);
  });
});
