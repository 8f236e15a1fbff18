// SMS end to end: an assignment's text goes through the outbox and the official SDK to the SMS fake; the
// technician's reply comes back as a signed webhook and accepts or declines the call; STOP and START are
// honoured; unsigned webhooks change nothing; delivery status lands on the outbox row.
import request from 'supertest';
import twilio from 'twilio';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { memberships, smsOptOuts } from '@bumperline/db/schema/index';
import { runOutboxOnce } from '@bumperline/api/jobs/outbox-worker';
import { createMailer } from '@bumperline/api/services/mailer';
import { SmsError, SMS_OPTED_OUT } from '@bumperline/api/services/sms';
import { callRef } from '@bumperline/contracts/calls';
import {
  buildTestApp,
  JSON_HEADERS,
  ORIGIN,
  SMS_AUTH_TOKEN,
  signedInAgent,
  type Agent,
  type TestApp,
  type TestSms,
} from '../support/app.ts';
import { createCompany, type CompanyFixture } from '../support/factories.ts';
import {
  addGame,
  addTechnician,
  assignServiceCall,
  callEventKinds,
  callRow,
  openServiceCall,
  outboxRows,
} from '../support/call-factories.ts';

let t: TestApp;
let sms: TestSms;
let a: CompanyFixture;
let b: CompanyFixture;
let owner: Agent;

beforeAll(async () => {
  t = await buildTestApp({ sms: true });
  sms = t.sms!;
  a = await createCompany(t.db.owner, 'Alpha Amusements', 3);
  b = await createCompany(t.db.owner, 'Beta Games', 2);
  owner = await signedInAgent(t, a.ownerEmail);
});
afterAll(() => t.close());

const mailer = () => createMailer({ fakePort: t.mail.port, from: 'Bumperline test <test@bumperline.example>' });

/** One worker run, then the fake's status callbacks have all been posted back to the app. */
async function deliverOutbox() {
  const summary = await runOutboxOnce({ db: t.db.app, sms: sms.sender, mailer: mailer() });
  await sms.fake.idle();
  return summary;
}

async function optedOut(phone: string): Promise<boolean> {
  return (await t.db.owner.select().from(smsOptOuts).where(eq(smsOptOuts.phone, phone))).length > 0;
}

/** Posts a form to a webhook, signed by the official SDK for `signedUrl` with `token`. */
function postWebhook(path: string, params: Record<string, string>, sign: { token?: string; url?: string } | null = {}) {
  const req = request(t.app).post(path).type('form');
  if (sign)
    req.set('X-Twilio-Signature', twilio.getExpectedTwilioSignature(sign.token ?? SMS_AUTH_TOKEN, sign.url ?? `${ORIGIN}${path}`, params));
  return req.send(params);
}

/** A technician of `company` with a new call assigned to them (the assignment SMS waiting in the outbox). */
async function assignedCall(company: CompanyFixture, phone: string) {
  const tech = await addTechnician(t.db.owner, company.tenantId, phone);
  const callId = await openServiceCall(t.db, company);
  await assignServiceCall(t.db, company, callId, tech.id);
  return { tech, callId };
}

describe('assignment text, out and back', () => {
  it('assigning over HTTP queues the text; the worker sends it with the SDK; the fake has it; delivery is recorded', async () => {
    const phone = '+13125550101';
    const tech = await addTechnician(t.db.owner, a.tenantId, phone, 'Rosa Quill');
    const opened = await owner
      .post('/api/calls')
      .set(JSON_HEADERS)
      .send({ gameId: await addGame(t.db, a), problem: 'dead' })
      .expect(201);
    const assigned = await owner
      .post(`/api/calls/${opened.body.id}/assign`)
      .set(JSON_HEADERS)
      .send({ technicianId: tech.id, version: opened.body.version })
      .expect(200);
    expect(assigned.body.state).toBe('assigned');

    const queued = (await outboxRows(t.db.owner, a.tenantId)).filter((r) => r.toAddress === phone);
    expect(queued).toHaveLength(1);
    expect(queued[0]).toMatchObject({ status: 'pending', channel: 'sms', callId: opened.body.id });
    expect(sms.fake.messagesTo(phone)).toHaveLength(0); // nothing leaves before the worker runs

    const summary = await deliverOutbox();
    expect(summary.sent).toBeGreaterThanOrEqual(1);
    const [text] = sms.fake.messagesTo(phone);
    expect(text!.body).toContain(`call ${callRef(opened.body.id)}`);
    expect(text!.body).toContain('Reply YES to accept');
    expect(text!.from).toBe(sms.from);

    const [row] = (await outboxRows(t.db.owner, a.tenantId)).filter((r) => r.toAddress === phone);
    expect(row).toMatchObject({ status: 'sent', providerId: text!.sid, attempts: 1, providerStatus: 'delivered' });
    expect(row!.sentAt).toBeInstanceOf(Date);

    // The call's page lists the message with its delivery status.
    const page = await owner.get(`/api/calls/${opened.body.id}`).expect(200);
    expect(page.body.messages).toEqual([expect.objectContaining({ toAddress: phone, status: 'sent', providerStatus: 'delivered' })]);
  });

  it('a technician texting YES accepts the call, and is told so', async () => {
    const phone = '+13125550102';
    const { tech, callId } = await assignedCall(a, phone);
    await deliverOutbox();

    expect(await sms.fake.reply(phone, 'Yes')).toBe(200);
    const call = await callRow(t.db.owner, a.tenantId, callId);
    expect(call.acceptedAt).toBeInstanceOf(Date);
    expect(call).toMatchObject({ state: 'assigned', technicianId: tech.id });
    const events = await callEventKinds(t.db.owner, a.tenantId, callId);
    expect(events.filter((e) => e.kind === 'accepted')).toHaveLength(1);
    expect(events.find((e) => e.kind === 'sms_in')).toMatchObject({ actorLabel: `SMS from ${phone}`, detail: { body: 'Yes' } });
    await sms.fake.idle();
    expect(sms.fake.messagesTo(phone)[0]!.body).toMatch(new RegExp(`^Accepted call ${callRef(callId)}`));

    // A second YES finds nothing waiting: accepted once.
    await sms.fake.reply(phone, 'YES');
    expect((await callEventKinds(t.db.owner, a.tenantId, callId)).filter((e) => e.kind === 'accepted')).toHaveLength(1);
  });

  it('NO declines: the call goes back to dispatch, unassigned', async () => {
    const phone = '+13125550103';
    const { callId } = await assignedCall(a, phone);
    expect(await sms.fake.reply(phone, 'no')).toBe(200);
    const call = await callRow(t.db.owner, a.tenantId, callId);
    expect(call).toMatchObject({ state: 'reported', technicianId: null, acceptedAt: null });
    const kinds = (await callEventKinds(t.db.owner, a.tenantId, callId)).map((e) => e.kind);
    expect(kinds).toEqual(expect.arrayContaining(['sms_in', 'declined']));
    await sms.fake.idle();
    expect(sms.fake.messagesTo(phone)[0]!.body).toMatch(/^Declined call .* back with dispatch/);
  });

  it('any other text is kept on the call and answered with how to reply', async () => {
    const phone = '+13125550104';
    const { callId } = await assignedCall(a, phone);
    await sms.fake.reply(phone, 'stuck in traffic, 20 min');
    const call = await callRow(t.db.owner, a.tenantId, callId);
    expect(call.acceptedAt).toBeNull();
    expect((await callEventKinds(t.db.owner, a.tenantId, callId)).find((e) => e.kind === 'sms_in')?.detail).toEqual({
      body: 'stuck in traffic, 20 min',
    });
    await sms.fake.idle();
    expect(sms.fake.messagesTo(phone)[0]!.body).toBe(`Reply YES to accept call ${callRef(callId)} or NO to decline it.`);
  });

  it('a number that belongs to no technician gets an empty answer and changes nothing', async () => {
    const stranger = '+13125550198';
    const before = await t.db.owner.execute(sql`select count(*)::int as n from call_events`);
    const res = await postWebhook('/webhooks/sms/inbound', { From: stranger, To: sms.from, Body: 'YES' });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/xml/);
    expect(res.text).toMatch(/<Response\/>$/);
    expect((await t.db.owner.execute(sql`select count(*)::int as n from call_events`)).rows).toEqual(before.rows);
  });

  it('HELP is answered with how the texts work', async () => {
    const res = await postWebhook('/webhooks/sms/inbound', { From: '+13125550105', To: sms.from, Body: 'help' }).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/xml/);
    expect(res.text).toMatch(/<Response><Message>Bumperline service calls: reply YES to accept/);
  });

  it('another company’s call is never touched: a freelancer’s reply answers the newest assignment, in its own company', async () => {
    const phone = '+13125550106';
    const inA = await assignedCall(a, phone);
    // The same person works for Beta too, and was assigned there later.
    await t.db.owner.insert(memberships).values({ tenantId: b.tenantId, userId: inA.tech.id, role: 'technician' });
    const inB = { callId: await openServiceCall(t.db, b) };
    await assignServiceCall(t.db, b, inB.callId, inA.tech.id);
    await sms.fake.reply(phone, 'OK');
    expect((await callRow(t.db.owner, b.tenantId, inB.callId)).acceptedAt).toBeInstanceOf(Date);
    const untouched = await callRow(t.db.owner, a.tenantId, inA.callId);
    expect(untouched.acceptedAt).toBeNull();
    expect((await callEventKinds(t.db.owner, a.tenantId, inA.callId)).map((e) => e.kind)).not.toContain('sms_in');
    // The next answer goes to the one still waiting.
    await sms.fake.reply(phone, 'Y');
    expect((await callRow(t.db.owner, a.tenantId, inA.callId)).acceptedAt).toBeInstanceOf(Date);
  });
});

describe('STOP and START', () => {
  it('STOP is kept (the fake confirms it); later texts are blocked and nothing reaches the phone; START sends again', async () => {
    const phone = '+13125550110';
    await sms.fake.reply(phone, 'STOP');
    expect(await optedOut(phone)).toBe(true);
    await sms.fake.idle();
    expect(sms.fake.messagesTo(phone).map((m) => m.body)).toEqual([expect.stringMatching(/unsubscribed/)]);

    await assignedCall(a, phone);
    await deliverOutbox();
    const blocked = (await outboxRows(t.db.owner, a.tenantId)).filter((r) => r.toAddress === phone);
    expect(blocked).toEqual([expect.objectContaining({ status: 'blocked', providerId: null })]);
    expect(sms.fake.messagesTo(phone)).toHaveLength(1); // still only the provider's STOP confirmation

    await sms.fake.reply(phone, 'start');
    expect(await optedOut(phone)).toBe(false);
    await assignedCall(a, phone);
    await deliverOutbox();
    const rows = (await outboxRows(t.db.owner, a.tenantId)).filter((r) => r.toAddress === phone);
    expect(rows.map((r) => r.status)).toEqual(['blocked', 'sent']);
    expect(sms.fake.messagesTo(phone)[0]!.body).toContain('Reply YES to accept');
  });

  it('a technician who opted out and texts YES opts back in and accepts the waiting call', async () => {
    const phone = '+13125550111';
    const { callId } = await assignedCall(a, phone);
    await sms.fake.reply(phone, 'quit');
    expect(await optedOut(phone)).toBe(true);
    expect((await callRow(t.db.owner, a.tenantId, callId)).acceptedAt).toBeNull(); // STOP is not a decline
    await sms.fake.reply(phone, 'YES');
    expect(await optedOut(phone)).toBe(false);
    expect(sms.fake.isOptedOut(phone)).toBe(false);
    expect((await callRow(t.db.owner, a.tenantId, callId)).acceptedAt).toBeInstanceOf(Date);
  });

  it('when the provider refuses a number as opted out (21610), the row is blocked and the opt-out remembered', async () => {
    const phone = '+13125550112';
    await sms.fake.reply(phone, 'UNSUBSCRIBE');
    await t.db.owner.delete(smsOptOuts).where(eq(smsOptOuts.phone, phone)); // our list lost it; the provider did not
    await assignedCall(a, phone);
    await deliverOutbox();
    const rows = (await outboxRows(t.db.owner, a.tenantId)).filter((r) => r.toAddress === phone);
    expect(rows).toEqual([expect.objectContaining({ status: 'blocked', attempts: 1 })]);
    expect(await optedOut(phone)).toBe(true);
  });
});

describe('webhook signatures', () => {
  it('unsigned, mis-signed or signed for another URL: 403 problem details, and nothing changes', async () => {
    const phone = '+13125550120';
    const { callId } = await assignedCall(a, phone);
    const params = { From: phone, To: sms.from, Body: 'YES' };
    const attempts = [
      await postWebhook('/webhooks/sms/inbound', params, null),
      await postWebhook('/webhooks/sms/inbound', params, { token: 'not-our-token' }),
      await postWebhook('/webhooks/sms/inbound', params, { url: `${ORIGIN}/webhooks/sms/status` }),
      await postWebhook('/webhooks/sms/inbound', { ...params, Body: 'STOP' }, { url: 'https://elsewhere.example/webhooks/sms/inbound' }),
    ];
    for (const res of attempts) {
      expect(res.status).toBe(403);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(res.body.errors).toEqual([expect.objectContaining({ field: 'header:x-twilio-signature' })]);
    }
    // A signed request whose body was changed on the way is refused too.
    const tampered = await request(t.app)
      .post('/webhooks/sms/inbound')
      .type('form')
      .set(
        'X-Twilio-Signature',
        twilio.getExpectedTwilioSignature(SMS_AUTH_TOKEN, `${ORIGIN}/webhooks/sms/inbound`, { ...params, Body: 'NO' }),
      )
      .send(params);
    expect(tampered.status).toBe(403);

    const call = await callRow(t.db.owner, a.tenantId, callId);
    expect(call.acceptedAt).toBeNull();
    expect(call.state).toBe('assigned');
    expect((await callEventKinds(t.db.owner, a.tenantId, callId)).map((e) => e.kind)).not.toContain('sms_in');
    expect(await optedOut(phone)).toBe(false);
  });

  it('a correctly signed webhook with a missing field is refused with 400 naming it', async () => {
    const res = await postWebhook('/webhooks/sms/inbound', { To: sms.from, Body: 'YES' }).expect(400);
    expect(res.body.errors).toEqual([{ field: 'From', message: 'is required' }]);
  });
});

describe('status callbacks', () => {
  it('update the outbox row’s provider status; undelivered marks it failed; a late, earlier status is ignored', async () => {
    const phone = '+13125550130';
    await assignedCall(a, phone);
    await deliverOutbox();
    const [row] = (await outboxRows(t.db.owner, a.tenantId)).filter((r) => r.toAddress === phone);
    expect(row!.providerStatus).toBe('delivered');

    const unsigned = await postWebhook('/webhooks/sms/status', { MessageSid: row!.providerId!, MessageStatus: 'undelivered' }, null);
    expect(unsigned.status).toBe(403);
    expect((await outboxRows(t.db.owner, a.tenantId)).find((r) => r.id === row!.id)!.providerStatus).toBe('delivered');

    await postWebhook('/webhooks/sms/status', { MessageSid: row!.providerId!, MessageStatus: 'undelivered', ErrorCode: '30003' }).expect(
      204,
    );
    await postWebhook('/webhooks/sms/status', { MessageSid: row!.providerId!, MessageStatus: 'sent' }).expect(204);
    const after = (await outboxRows(t.db.owner, a.tenantId)).find((r) => r.id === row!.id)!;
    expect(after).toMatchObject({ status: 'failed', providerStatus: 'undelivered' });
    expect(after.lastError).toContain('30003');
  });

  it('a handset that cannot be reached ends undelivered through the fake’s own callback', async () => {
    const phone = '+13125550131';
    sms.fake.setUnreachable(phone);
    await assignedCall(b, phone);
    await deliverOutbox();
    const [row] = (await outboxRows(t.db.owner, b.tenantId)).filter((r) => r.toAddress === phone);
    expect(row).toMatchObject({ status: 'failed', providerStatus: 'undelivered' });
  });

  it('a status for a message we do not know changes nothing and is still acknowledged', async () => {
    const before = await t.db.owner.execute(sql`select count(*)::int as n from outbox where provider_status is not null`);
    await postWebhook('/webhooks/sms/status', { MessageSid: 'SM' + 'f'.repeat(32), MessageStatus: 'failed' }).expect(204);
    const after = await t.db.owner.execute(sql`select count(*)::int as n from outbox where provider_status is not null`);
    expect(after.rows).toEqual(before.rows);
    const bad = await postWebhook('/webhooks/sms/status', { MessageSid: 'SM' + 'f'.repeat(32), MessageStatus: 'exploded' }).expect(400);
    expect(bad.body.errors).toEqual([expect.objectContaining({ field: 'MessageStatus' })]);
  });
});

describe('the SMS sender maps provider errors', () => {
  it('opted out: not retryable; provider outage: retryable; malformed number: not retryable', async () => {
    const phone = '+13125550140';
    await sms.fake.reply(phone, 'STOP');
    const optedOutErr = await sms.sender.send(phone, 'hello').catch((e: unknown) => e);
    expect(optedOutErr).toBeInstanceOf(SmsError);
    expect(optedOutErr).toMatchObject({ code: SMS_OPTED_OUT, retryable: false, optedOut: true });

    sms.fake.failNext(1);
    const outage = await sms.sender.send('+13125550141', 'hello').catch((e: unknown) => e);
    expect(outage).toMatchObject({ code: 20500, retryable: true, optedOut: false });

    const malformed = await sms.sender.send('555', 'hello').catch((e: unknown) => e);
    expect(malformed).toMatchObject({ code: 21211, retryable: false });
  });
});

describe('the development phone page', () => {
  it('lists texts per number, escaped, and replies as any number', async () => {
    const res = await request(t.app)
      .post('/dev/phone/reply')
      .type('form')
      .send({ from: '(312) 555-0150', body: '<script>alert(1)</script>' })
      .expect(303);
    expect(res.headers.location).toBe('/dev/phone#phone-13125550150');
    const inbound = sms.fake.messages().find((m) => m.from === '+13125550150');
    expect(inbound?.body).toBe('<script>alert(1)</script>');

    const html = await request(t.app).get('/dev/phone').expect(200);
    expect(html.headers['content-type']).toMatch(/text\/html/);
    expect(html.text).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html.text).not.toContain('<script>alert(1)</script>');
    expect(html.text).toMatch(/<h2 id="phone-13125550150">\+13125550150<\/h2>/);
    expect(html.text).toMatch(/<label for="body-new">Message<\/label>/);

    const json = await request(t.app).get('/dev/phone.json').expect(200);
    expect(json.body.messages[0]).toMatchObject({ from: '+13125550150', direction: 'inbound', body: '<script>alert(1)</script>' });
  });

  it('refuses a reply without a valid number, naming the field', async () => {
    const res = await request(t.app).post('/dev/phone/reply').type('form').send({ from: 'nobody', body: 'hi' }).expect(400);
    expect(res.body.errors).toEqual([expect.objectContaining({ field: 'from' })]);
    const cross = await request(t.app)
      .post('/dev/phone/reply')
      .set('Origin', 'https://evil.example')
      .type('form')
      .send({ from: '+13125550151', body: 'hi' });
    expect(cross.status).toBe(403);
    expect(sms.fake.messages().some((m) => m.from === '+13125550151')).toBe(false);
  });
});
