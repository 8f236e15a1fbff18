// A local stand-in for the SMS provider's Messages API, on loopback: the official SDK sends to it as it
// would to the real service (form-encoded, Basic auth, the same JSON back), it refuses numbers that
// texted STOP, posts signed status callbacks and inbound messages to the app, and keeps every message
// for the developer phone page (/dev/phone) and for tests.
import http from 'node:http';
import { timingSafeEqual } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { KEYWORD_REPLIES, keywordOf } from './keywords.ts';
import {
  API_VERSION,
  errorJson,
  messageJson,
  newMessageSid,
  segmentCount,
  type FakeMessage,
  type MessageDirection,
  type MessageStatus,
} from './message-resource.ts';
import { postSignedWebhook, twimlMessages } from './signed-webhook.ts';

export type { FakeMessage, MessageStatus } from './message-resource.ts';

export interface SmsFakeOptions {
  authToken: string;
  accountSid: string;
  /** Where messages people text to our number are posted (the app's inbound webhook, public URL). */
  webhookUrl: string;
  /** Where status changes go when a send names no StatusCallback (like a messaging service's setting). */
  statusCallbackUrl?: string;
  /** Our number, which a phone texts when it has no earlier message to answer. */
  number?: string;
  /** Connect here instead of the webhook URLs' own origin (the signed URL stays the public one). */
  deliverTo?: string;
  /** Pause between a message's status changes, in milliseconds. */
  statusDelayMs?: number;
  port?: number;
}

export interface WebhookDelivery {
  at: Date;
  kind: 'inbound' | 'status';
  url: string;
  status?: number;
  error?: string;
}

export interface SmsFake {
  /** Base URL the SDK is pointed at, e.g. http://127.0.0.1:PORT */
  url: string;
  accountSid: string;
  /** Every message, outbound and inbound, newest first. */
  messages(): FakeMessage[];
  /** Messages sent to `phone`, newest first. */
  messagesTo(phone: string): FakeMessage[];
  /**
   * A phone texts our number: the message is kept, keywords are honoured as the provider does, and the
   * signed inbound webhook is posted; resolves with the webhook's HTTP status. TwiML <Message> replies
   * in the answer are sent back to the phone.
   */
  reply(from: string, body: string): Promise<number>;
  /** The next `n` sends fail with HTTP 500 and this error code, as during a provider outage. */
  failNext(n: number, code?: number): void;
  /** Messages to this phone end "undelivered" (error 30003), as for a handset that is switched off. */
  setUnreachable(phone: string, unreachable?: boolean): void;
  /** Whether the phone texted STOP (and not START since). */
  isOptedOut(phone: string): boolean;
  /** Webhooks posted so far, oldest first. */
  deliveries(): WebhookDelivery[];
  /** Resolves once every pending status change and webhook has been posted. */
  idle(): Promise<void>;
  clear(): void;
  stop(): Promise<void>;
}

const DEFAULT_NUMBER = '+13125550199';
const E164 = /^\+[1-9]\d{6,14}$/;
const KEEP = 1000;
const MAX_BODY = 1600;

export async function startSmsFake(opts: SmsFakeOptions): Promise<SmsFake> {
  const store: FakeMessage[] = []; // oldest first
  const log: WebhookDelivery[] = [];
  const optedOut = new Set<string>();
  const unreachable = new Set<string>();
  const pending = new Set<Promise<unknown>>();
  const delay = opts.statusDelayMs ?? 50;
  let failures: { left: number; code: number } = { left: 0, code: 20500 };
  let stopped = false;

  function track<T>(p: Promise<T>): Promise<T> {
    pending.add(p);
    void p.finally(() => pending.delete(p)).catch(() => {});
    return p;
  }
  const pause = () => new Promise((resolve) => setTimeout(resolve, delay));

  function record(m: {
    direction: MessageDirection;
    from: string;
    to: string;
    body: string;
    status: MessageStatus;
    statusCallback?: string | null;
  }) {
    const now = new Date();
    const message: FakeMessage = {
      sid: newMessageSid(),
      direction: m.direction,
      from: m.from,
      to: m.to,
      body: m.body,
      status: m.status,
      errorCode: null,
      errorMessage: null,
      numSegments: segmentCount(m.body),
      dateCreated: now,
      dateUpdated: now,
      dateSent: m.direction === 'inbound' ? now : null,
      statusCallback: m.statusCallback ?? null,
    };
    store.push(message);
    if (store.length > KEEP) store.splice(0, store.length - KEEP);
    return message;
  }

  async function post(kind: WebhookDelivery['kind'], url: string, params: Record<string, string>) {
    const entry: WebhookDelivery = { at: new Date(), kind, url };
    log.push(entry);
    if (log.length > KEEP) log.splice(0, log.length - KEEP);
    try {
      const answer = await postSignedWebhook({ url, params, authToken: opts.authToken, deliverTo: opts.deliverTo });
      entry.status = answer.status;
      return answer;
    } catch (err) {
      entry.error = (err as Error).message;
      throw err;
    }
  }

  function statusParams(m: FakeMessage): Record<string, string> {
    return {
      AccountSid: opts.accountSid,
      ApiVersion: API_VERSION,
      From: m.from,
      To: m.to,
      MessageSid: m.sid,
      SmsSid: m.sid,
      MessageStatus: m.status,
      SmsStatus: m.status,
      ...(m.errorCode ? { ErrorCode: String(m.errorCode) } : {}),
    };
  }

  function setStatus(m: FakeMessage, status: MessageStatus, error?: { code: number; message: string }) {
    m.status = status;
    m.dateUpdated = new Date();
    if (status === 'sent') m.dateSent = m.dateUpdated;
    if (error) {
      m.errorCode = error.code;
      m.errorMessage = error.message;
    }
  }

  /** queued → sent → delivered (or undelivered), each change posted to the message's StatusCallback. */
  function deliver(m: FakeMessage) {
    const announce = async () => {
      if (m.statusCallback && !stopped) await post('status', m.statusCallback, statusParams(m)).catch(() => {});
    };
    void track(
      (async () => {
        await announce();
        await pause();
        if (stopped) return;
        setStatus(m, 'sent');
        await announce();
        await pause();
        if (stopped) return;
        if (unreachable.has(m.to)) setStatus(m, 'undelivered', { code: 30003, message: 'Unreachable destination handset' });
        else setStatus(m, 'delivered');
        await announce();
      })(),
    );
  }

  /** A message from our number to the phone that is not an API send: keyword answers and TwiML replies. */
  function sendReply(from: string, to: string, body: string) {
    deliver(record({ direction: 'outbound-reply', from, to, body, status: 'queued' }));
  }

  /** The number a phone answers: the one that last texted it, as a reply in the same thread would. */
  function ourNumberFor(phone: string): string {
    for (let i = store.length - 1; i >= 0; i--) {
      const m = store[i]!;
      if (m.direction !== 'inbound' && m.to === phone) return m.from;
    }
    return opts.number ?? DEFAULT_NUMBER;
  }

  function authorised(req: http.IncomingMessage): boolean {
    const [scheme, encoded] = (req.headers.authorization ?? '').split(' ');
    if (scheme !== 'Basic' || !encoded) return false;
    const given = Buffer.from(Buffer.from(encoded, 'base64').toString('utf8'));
    const expected = Buffer.from(`${opts.accountSid}:${opts.authToken}`);
    return given.length === expected.length && timingSafeEqual(given, expected);
  }

  function listMessages(url: URL, accountSid: string) {
    const q = url.searchParams;
    const to = q.get('To');
    const from = q.get('From');
    const sentOn = q.get('DateSent');
    const sentBefore = q.get('DateSent<');
    const sentAfter = q.get('DateSent>');
    const pageSize = Math.min(Math.max(Number(q.get('PageSize') ?? 50) || 50, 1), 1000);
    const page = Math.max(Number(q.get('Page') ?? 0) || 0, 0);
    // A date alone (YYYY-MM-DD) compares whole UTC days; a date-time compares instants. Both bounds include.
    const dayOf = (d: Date) => d.toISOString().slice(0, 10);
    const cmp = (sent: Date, bound: string) =>
      /^\d{4}-\d{2}-\d{2}$/.test(bound) ? dayOf(sent).localeCompare(bound) : Math.sign(sent.getTime() - Date.parse(bound));
    const matching = [...store].reverse().filter((m) => {
      if (to && m.to !== to) return false;
      if (from && m.from !== from) return false;
      if (sentOn || sentBefore || sentAfter) {
        if (!m.dateSent) return false;
        if (sentOn && cmp(m.dateSent, sentOn) !== 0) return false;
        if (sentBefore && cmp(m.dateSent, sentBefore) > 0) return false;
        if (sentAfter && cmp(m.dateSent, sentAfter) < 0) return false;
      }
      return true;
    });
    const slice = matching.slice(page * pageSize, (page + 1) * pageSize);
    const base = `/${API_VERSION}/Accounts/${accountSid}/Messages.json`;
    const pageUri = (n: number) => {
      const p = new URLSearchParams(q);
      p.set('PageSize', String(pageSize));
      p.set('Page', String(n));
      p.delete('PageToken');
      if (n > 0) p.set('PageToken', `PA${n}`);
      return `${base}?${p.toString()}`;
    };
    const hasNext = (page + 1) * pageSize < matching.length;
    return {
      end: page * pageSize + Math.max(slice.length - 1, 0),
      first_page_uri: pageUri(0),
      messages: slice.map((m) => messageJson(m, accountSid)),
      next_page_uri: hasNext ? pageUri(page + 1) : null,
      page,
      page_size: pageSize,
      previous_page_uri: page > 0 ? pageUri(page - 1) : null,
      start: page * pageSize,
      uri: pageUri(page),
    };
  }

  function createMessage(params: URLSearchParams): { status: number; json: unknown } {
    const to = (params.get('To') ?? '').trim();
    const from = (params.get('From') ?? '').trim();
    const body = params.get('Body') ?? '';
    if (!to) return { status: 400, json: errorJson(400, 21604, "A 'To' phone number is required.") };
    if (!E164.test(to)) return { status: 400, json: errorJson(400, 21211, `The 'To' number ${to} is not a valid phone number.`) };
    if (!from) return { status: 400, json: errorJson(400, 21603, "A 'From' phone number is required.") };
    if (!E164.test(from))
      return {
        status: 400,
        json: errorJson(400, 21212, `The 'From' number ${from} is not a valid phone number, shortcode, or alphanumeric sender ID.`),
      };
    if (!body) return { status: 400, json: errorJson(400, 21602, 'Message body is required.') };
    if (body.length > MAX_BODY)
      return { status: 400, json: errorJson(400, 21617, 'The concatenated message body exceeds the 1600 character limit.') };
    if (optedOut.has(to)) return { status: 400, json: errorJson(400, 21610, 'Attempt to send to unsubscribed recipient') };
    const message = record({
      direction: 'outbound-api',
      from,
      to,
      body,
      status: 'queued',
      statusCallback: params.get('StatusCallback') || opts.statusCallbackUrl || null,
    });
    deliver(message);
    return { status: 201, json: messageJson(message, opts.accountSid) };
  }

  async function handle(req: http.IncomingMessage): Promise<{ status: number; json: unknown }> {
    const url = new URL(req.url ?? '/', 'http://fake.invalid');
    const route = /^\/2010-04-01\/Accounts\/([^/]+)\/Messages(?:\/([^/]+))?\.json$/.exec(url.pathname);
    const notFound = { status: 404, json: errorJson(404, 20404, `The requested resource ${url.pathname} was not found`) };
    if (!authorised(req)) {
      return { status: 401, json: { ...errorJson(401, 20003, 'Authenticate'), detail: 'Your AccountSid or AuthToken was incorrect.' } };
    }
    if (!route || route[1] !== opts.accountSid) return notFound;
    const sid = route[2];
    if (sid) {
      const m = store.find((x) => x.sid === sid);
      return req.method === 'GET' && m ? { status: 200, json: messageJson(m, opts.accountSid) } : notFound;
    }
    if (req.method === 'GET') return { status: 200, json: listMessages(url, opts.accountSid) };
    if (req.method !== 'POST') return { status: 405, json: errorJson(405, 20004, 'Method not allowed') };
    const raw = await readBody(req);
    if (failures.left > 0) {
      failures = { ...failures, left: failures.left - 1 };
      return { status: 500, json: errorJson(500, failures.code, 'Internal Server Error') };
    }
    return createMessage(new URLSearchParams(raw));
  }

  const server = http.createServer((req, res) => {
    handle(req)
      .catch(() => ({ status: 500, json: errorJson(500, 20500, 'Internal Server Error') }))
      .then(({ status, json }) => {
        res.writeHead(status, { 'Content-Type': 'application/json; charset=utf-8' });
        res.end(JSON.stringify(json));
      });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? 0, '127.0.0.1', () => resolve());
  });
  const { port } = server.address() as AddressInfo;

  return {
    url: `http://127.0.0.1:${port}`,
    accountSid: opts.accountSid,
    messages: () => [...store].reverse(),
    messagesTo: (phone) => store.filter((m) => m.to === phone).reverse(),
    async reply(from, body) {
      const number = ourNumberFor(from);
      const inbound = record({ direction: 'inbound', from, to: number, body, status: 'received' });
      // The provider acts on keywords itself, before and whatever the app answers.
      const keyword = keywordOf(body);
      if (keyword === 'STOP') optedOut.add(from);
      if (keyword === 'START') optedOut.delete(from);
      if (keyword) sendReply(number, from, KEYWORD_REPLIES[keyword]);
      const answer = await track(
        post('inbound', opts.webhookUrl, {
          AccountSid: opts.accountSid,
          ApiVersion: API_VERSION,
          MessageSid: inbound.sid,
          SmsMessageSid: inbound.sid,
          SmsSid: inbound.sid,
          SmsStatus: 'received',
          From: from,
          To: number,
          Body: body,
          NumMedia: '0',
          NumSegments: String(inbound.numSegments),
          ...(keyword ? { OptOutType: keyword } : {}),
        }),
      );
      if (answer.status >= 200 && answer.status < 300 && /xml/i.test(answer.contentType)) {
        // A reply to a number that opted out is dropped, as the provider does.
        for (const text of twimlMessages(answer.body)) if (!optedOut.has(from)) sendReply(number, from, text);
      }
      return answer.status;
    },
    failNext(n, code = 20500) {
      failures = { left: n, code };
    },
    setUnreachable(phone, on = true) {
      if (on) unreachable.add(phone);
      else unreachable.delete(phone);
    },
    isOptedOut: (phone) => optedOut.has(phone),
    deliveries: () => [...log],
    async idle() {
      while (pending.size) await Promise.allSettled([...pending]);
    },
    clear() {
      store.splice(0);
      log.splice(0);
      optedOut.clear();
      unreachable.clear();
      failures = { left: 0, code: 20500 };
    },
    async stop() {
      stopped = true;
      while (pending.size) await Promise.allSettled([...pending]);
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
    },
  };
}

function readBody(req: http.IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (c: Buffer) => {
      size += c.length;
      if (size > 64 * 1024) req.destroy(new Error('request body too large'));
      else chunks.push(c);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}
