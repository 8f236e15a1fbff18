import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import twilio from 'twilio';
import type RequestClient from 'twilio/lib/base/RequestClient';
import { startSmsFake, type SmsFake } from './sms-fake.ts';
import { keywordOf } from './keywords.ts';
import { segmentCount } from './message-resource.ts';

const ACCOUNT = 'ACtesttesttesttesttesttesttesttest';
const TOKEN = 'fake-test-token';
const OURS = '+13125550199';
const PUBLIC = 'https://app.bumperline.example';

/** What the app's webhooks received, signature checked with the official SDK. */
interface Received {
  path: string;
  params: Record<string, string>;
  signatureValid: boolean;
}

let receiver: http.Server;
let received: Received[] = [];
let inboundAnswer = '<?xml version="1.0" encoding="UTF-8"?><Response><Message>Got it &amp; thanks</Message></Response>';
let fake: SmsFake;

// The SDK has no base-URL option: its HTTP client is pointed at the fake, as the app does.
class ToFake extends twilio.RequestClient {
  constructor(private readonly origin: string) {
    super();
  }
  override request<T>(opts: RequestClient.RequestOptions<T>) {
    const uri = new URL(opts.uri);
    const to = new URL(this.origin);
    uri.protocol = to.protocol;
    uri.host = to.host;
    return super.request({ ...opts, uri: uri.toString() });
  }
}
const sdk = (token = TOKEN) => twilio(ACCOUNT, token, { httpClient: new ToFake(fake.url) });

beforeAll(async () => {
  receiver = http.createServer((req, res) => {
    let raw = '';
    req.on('data', (c: Buffer) => (raw += c.toString('utf8')));
    req.on('end', () => {
      const params = Object.fromEntries(new URLSearchParams(raw));
      const path = req.url ?? '';
      const signature = String(req.headers['x-twilio-signature'] ?? '');
      received.push({ path, params, signatureValid: twilio.validateRequest(TOKEN, signature, `${PUBLIC}${path}`, params) });
      if (path === '/inbound') res.writeHead(200, { 'Content-Type': 'text/xml' }).end(inboundAnswer);
      else res.writeHead(204).end();
    });
  });
  await new Promise<void>((resolve) => receiver.listen(0, '127.0.0.1', resolve));
  const port = (receiver.address() as AddressInfo).port;
  fake = await startSmsFake({
    accountSid: ACCOUNT,
    authToken: TOKEN,
    webhookUrl: `${PUBLIC}/inbound`,
    statusCallbackUrl: `${PUBLIC}/status-default`,
    deliverTo: `http://127.0.0.1:${port}`,
    statusDelayMs: 5,
  });
});
afterEach(async () => {
  await fake.idle();
  fake.clear();
  received = [];
});
afterAll(async () => {
  await fake.stop();
  await new Promise((resolve) => receiver.close(resolve));
});

describe('SMS fake, driven by the official SDK', () => {
  it('accepts a send and answers with the provider’s message shape', async () => {
    const m = await sdk().messages.create({ to: '+13125550142', from: OURS, body: 'Call ABC123: reply YES' });
    expect(m.sid).toMatch(/^SM[0-9a-f]{32}$/);
    expect(m).toMatchObject({
      status: 'queued',
      to: '+13125550142',
      from: OURS,
      body: 'Call ABC123: reply YES',
      direction: 'outbound-api',
      accountSid: ACCOUNT,
      numSegments: '1',
    });
    expect(m.dateCreated).toBeInstanceOf(Date);
    expect(fake.messagesTo('+13125550142').map((x) => x.sid)).toEqual([m.sid]);
    const fetched = await sdk().messages(m.sid).fetch();
    expect(fetched.body).toBe('Call ABC123: reply YES');
  });

  it('refuses a wrong auth token with 401 and error 20003, and keeps nothing', async () => {
    const err = await sdk('wrong-token')
      .messages.create({ to: '+13125550142', from: OURS, body: 'x' })
      .catch((e: unknown) => e);
    expect(err).toMatchObject({ status: 401, code: 20003 });
    expect(fake.messages()).toEqual([]);
  });

  it('names a missing or malformed field with the provider’s error code', async () => {
    await expect(sdk().messages.create({ to: 'not a number', from: OURS, body: 'x' })).rejects.toMatchObject({ status: 400, code: 21211 });
    await expect(sdk().messages.create({ to: '+13125550142', from: OURS, body: '' })).rejects.toMatchObject({ status: 400, code: 21602 });
  });

  it('posts signed status callbacks queued → sent → delivered to the StatusCallback given with the send', async () => {
    const m = await sdk().messages.create({ to: '+13125550143', from: OURS, body: 'status please', statusCallback: `${PUBLIC}/status` });
    await fake.idle();
    const callbacks = received.filter((r) => r.path === '/status');
    expect(callbacks.map((c) => c.params.MessageStatus)).toEqual(['queued', 'sent', 'delivered']);
    expect(callbacks.every((c) => c.signatureValid && c.params.MessageSid === m.sid)).toBe(true);
    expect(fake.messagesTo('+13125550143')[0]).toMatchObject({ status: 'delivered' });
    expect(fake.messagesTo('+13125550143')[0]!.dateSent).toBeInstanceOf(Date);
  });

  it('uses the configured status URL when a send names none, and reports an unreachable handset', async () => {
    fake.setUnreachable('+13125550144');
    await sdk().messages.create({ to: '+13125550144', from: OURS, body: 'anyone there?' });
    await fake.idle();
    const last = received.filter((r) => r.path === '/status-default').at(-1)!;
    expect(last.params).toMatchObject({ MessageStatus: 'undelivered', ErrorCode: '30003' });
    expect(last.signatureValid).toBe(true);
  });

  it('lists messages with To, From and DateSent filters, page by page', async () => {
    for (const body of ['one', 'two', 'three']) await sdk().messages.create({ to: '+13125550145', from: OURS, body });
    await sdk().messages.create({ to: '+13125550146', from: OURS, body: 'elsewhere' });
    await fake.idle(); // sent, so date_sent is set
    const listed = await sdk().messages.list({ to: '+13125550145', pageSize: 2 });
    expect(listed.map((m) => m.body)).toEqual(['three', 'two', 'one']); // newest first, across two pages
    expect(await sdk().messages.list({ to: '+13125550145', dateSentAfter: new Date(Date.now() + 60_000) })).toEqual([]);
    expect((await sdk().messages.list({ to: '+13125550145', dateSentAfter: new Date(Date.now() - 60_000) })).length).toBe(3);
    expect((await sdk().messages.list({ from: OURS, to: '+13125550146' })).map((m) => m.body)).toEqual(['elsewhere']);
  });

  it('fails the next n sends with 500 on request, then works again', async () => {
    fake.failNext(2, 20500);
    const send = () => sdk().messages.create({ to: '+13125550147', from: OURS, body: 'retry me' });
    await expect(send()).rejects.toMatchObject({ status: 500, code: 20500 });
    await expect(send()).rejects.toMatchObject({ status: 500 });
    await expect(send()).resolves.toMatchObject({ status: 'queued' });
    expect(fake.messagesTo('+13125550147')).toHaveLength(1);
  });
});

describe('SMS fake, a phone texting our number', () => {
  it('posts a signed inbound webhook, resolves with its status, and sends TwiML replies back', async () => {
    const status = await fake.reply('+13125550150', 'On my way');
    expect(status).toBe(200);
    const hook = received.find((r) => r.path === '/inbound')!;
    expect(hook.signatureValid).toBe(true);
    expect(hook.params).toMatchObject({ From: '+13125550150', To: OURS, Body: 'On my way', AccountSid: ACCOUNT });
    expect(hook.params.OptOutType).toBeUndefined();
    await fake.idle();
    const toPhone = fake.messagesTo('+13125550150');
    expect(toPhone.map((m) => [m.direction, m.body])).toEqual([['outbound-reply', 'Got it & thanks']]);
    expect(fake.messages().find((m) => m.direction === 'inbound')).toMatchObject({ from: '+13125550150', status: 'received' });
  });

  it('honours STOP and START: confirms, refuses sends with 21610 while opted out, sends again after', async () => {
    inboundAnswer = '<Response/>';
    const phone = '+13125550151';
    await fake.reply(phone, ' stop ');
    expect(fake.isOptedOut(phone)).toBe(true);
    expect(received.at(-1)!.params.OptOutType).toBe('STOP');
    const refused = await sdk()
      .messages.create({ to: phone, from: OURS, body: 'are you there?' })
      .catch((e: unknown) => e);
    expect(refused).toMatchObject({ status: 400, code: 21610 });
    await fake.reply(phone, 'START');
    expect(fake.isOptedOut(phone)).toBe(false);
    await sdk().messages.create({ to: phone, from: OURS, body: 'welcome back' });
    await fake.idle();
    expect(fake.messagesTo(phone).map((m) => m.body)).toEqual([
      'welcome back',
      expect.stringMatching(/re-subscribed/),
      expect.stringMatching(/unsubscribed/),
    ]);
  });

  it('drops a TwiML reply to a number that has just opted out', async () => {
    inboundAnswer = '<Response><Message>You will miss us</Message></Response>';
    await fake.reply('+13125550152', 'QUIT');
    await fake.idle();
    expect(fake.messagesTo('+13125550152').map((m) => m.body)).toEqual([expect.stringMatching(/unsubscribed/)]);
  });
});

describe('SMS keywords and segments', () => {
  it('recognises the provider’s keywords only as the whole message', () => {
    expect(['STOP', 'stop', ' Stop. ', 'unsubscribe', 'End!', 'QUIT'].map(keywordOf)).toEqual(Array(6).fill('STOP'));
    expect(['start', 'YES', 'unstop'].map(keywordOf)).toEqual(['START', 'START', 'START']);
    expect(keywordOf('help')).toBe('HELP');
    expect(keywordOf('please stop the machine')).toBeUndefined();
    expect(keywordOf('no')).toBeUndefined();
  });

  // GSM 03.38 / 3GPP TS 23.038: 160 septets in one segment, 153 per part when concatenated; UCS-2 70 / 67.
  it('counts segments as GSM-7 or UCS-2', () => {
    expect(segmentCount('a'.repeat(160))).toBe(1);
    expect(segmentCount('a'.repeat(161))).toBe(2);
    expect(segmentCount('{'.repeat(80))).toBe(1);
    expect(segmentCount('{'.repeat(81))).toBe(2);
    expect(segmentCount('—'.repeat(70))).toBe(1);
    expect(segmentCount('—'.repeat(71))).toBe(2);
  });
});
