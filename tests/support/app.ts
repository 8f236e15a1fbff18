import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
// Builds the real API (createApp) on a fresh database, with the mail fake, for supertest.
import pino from 'pino';
import request from 'supertest';
import { Router, type Express } from 'express';
import { devRouter } from '@bumperline/api/routes/dev';
import { devPhoneRouter } from '@bumperline/api/routes/dev-phone';
import { devCarePlansRouter } from '@bumperline/api/routes/dev-care-plans';
import { createApp } from '@bumperline/api/app';
import { createMailer } from '@bumperline/api/services/mailer';
import { SignInLimiter, type SignInLimits } from '@bumperline/api/auth/sign-in-limiter';
import { postgresCounter } from '@bumperline/api/http/rate-limit-counter';
import { startMailFake, type MailFake } from '@bumperline/fakes/mail/mail-fake';
import { startSmsFake, type SmsFake } from '@bumperline/fakes/sms/sms-fake';
import { createSmsSender, type SmsSender } from '@bumperline/api/services/sms';
import { createDb, type Db } from '@bumperline/db/client';
import { freshDatabase, type TestDatabase } from './database.ts';
import { TEST_PASSWORD } from './factories.ts';

export interface TestApp {
  app: Express;
  db: TestDatabase;
  /** The connection pool the app itself uses: `db.app`, or its own pool with `connectTo`. */
  appDb: Db;
  mail: MailFake;
  /** With `{ sms: true }`: the SMS fake, whose signed webhooks reach this app. */
  sms?: TestSms;
  close(): Promise<void>;
}

export interface TestSms {
  fake: SmsFake;
  /** The app's SMS sender (the official SDK), pointed at the fake as main.ts does. */
  sender: SmsSender;
  /** Our number. */
  from: string;
}

export const ORIGIN = 'http://127.0.0.1:3999';
export const SMS_AUTH_TOKEN = 'test-twilio-auth-token';
export const SMS_ACCOUNT_SID = 'ACtesttesttesttesttesttesttesttest';
export const SMS_FROM = '+13125550199';

/**
 * The SMS fake signs its webhooks for the public URL (ORIGIN), as the provider would; they reach the app
 * through a loopback listener, as through a load balancer that keeps the path.
 */
async function startTestSms(): Promise<{ sms: TestSms; server: http.Server }> {
  const server = http.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const statusCallbackUrl = `${ORIGIN}/webhooks/sms/status`;
  const fake = await startSmsFake({
    accountSid: SMS_ACCOUNT_SID,
    authToken: SMS_AUTH_TOKEN,
    number: SMS_FROM,
    webhookUrl: `${ORIGIN}/webhooks/sms/inbound`,
    statusCallbackUrl,
    deliverTo: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
  });
  const sender = createSmsSender({
    accountSid: SMS_ACCOUNT_SID,
    authToken: SMS_AUTH_TOKEN,
    from: SMS_FROM,
    fakeUrl: fake.url,
    statusCallbackUrl,
  });
  return { sms: { fake, sender, from: SMS_FROM }, server };
}

/** The demo's developer pages over this app's fakes, as startup/demo.ts builds them. */
function devPages(mail: MailFake, sms: SmsFake | undefined, appDb: Db): Router {
  const router = Router();
  router.use(devRouter(mail), devCarePlansRouter(appDb));
  if (sms) router.use(devPhoneRouter(sms));
  return router;
}

/**
 * `signInLimit`: failed sign-ins per account before its password sign-in pauses (default 50, so suites
 * that sign in a lot are not slowed); `signInLimits` sets any of the limiter's limits. Several instances
 * of the API on one database: pass the first one's `database` (then only its owner drops it) and, to put
 * a pooler in between, `connectTo` (the app role's URL through it).
 */
export async function buildTestApp(
  opts: { signInLimit?: number; signInLimits?: Partial<SignInLimits>; sms?: boolean; database?: TestDatabase; connectTo?: string } = {},
): Promise<TestApp> {
  const db = opts.database ?? (await freshDatabase());
  const appDb = opts.connectTo ? createDb(opts.connectTo, { max: 4 }) : db.app;
  const mail = await startMailFake();
  const sms = opts.sms ? await startTestSms() : undefined;
  const app = createApp({
    db: appDb,
    mailer: createMailer({ fakePort: mail.port, from: 'Bumperline test <test@bumperline.example>' }),
    logger: pino({ level: process.env.TEST_LOG ?? 'silent' }),
    authSecret: 'test-secret-that-is-at-least-32-characters-long',
    smsAuthToken: SMS_AUTH_TOKEN,
    photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-test-photos')),
    appOrigin: ORIGIN,
    devPages: devPages(mail, sms?.sms.fake, appDb),
    signInLimiter: new SignInLimiter(postgresCounter(appDb), { perAccount: opts.signInLimit ?? 50, ...opts.signInLimits }),
  });
  sms?.server.on('request', app);
  return {
    app,
    db,
    appDb,
    mail,
    ...(sms ? { sms: sms.sms } : {}),
    async close() {
      if (sms) {
        await sms.sms.fake.stop();
        await new Promise((resolve) => {
          sms.server.close(resolve);
          sms.server.closeAllConnections();
        });
      }
      await mail.stop();
      if (appDb !== db.app) await appDb.$client.end();
      if (!opts.database) await db.drop();
    },
  };
}

export type Agent = ReturnType<typeof request.agent>;

/** Signs in through Auth.js's own endpoints, exactly as the web app does. Returns the HTTP status. */
export async function signIn(agent: Agent, email: string, password = TEST_PASSWORD): Promise<number> {
  return (await signInOutcome(agent, email, password)) === 'ok' ? 200 : 401;
}

/** Posts an e-mailed sign-in link's token to Auth.js, as the link page does; returns Auth.js's answer. */
export async function signInWithLink(agent: Agent, token: string | undefined) {
  const csrf = await agent.get('/auth/csrf').expect(200);
  return agent
    .post('/auth/callback/email-link')
    .type('form')
    .set('X-Auth-Return-Redirect', '1')
    .send({ csrfToken: csrf.body.csrfToken, token });
}

/**
 * Signs in with a password and says how it went: 'ok', or the code Auth.js puts in the failed sign-in's
 * url ('credentials' for a wrong e-mail or password; see signInRefusals in the contracts for the others).
 */
export async function signInOutcome(agent: Agent, email: string, password = TEST_PASSWORD): Promise<string> {
  const csrf = await agent.get('/auth/csrf').expect(200);
  const res = await agent
    .post('/auth/callback/credentials')
    .type('form')
    .set('X-Auth-Return-Redirect', '1')
    .send({ csrfToken: csrf.body.csrfToken, email, password });
  const url = new URL(String(res.body.url ?? ''), ORIGIN);
  if (res.status === 200 && !url.searchParams.has('error')) return 'ok';
  return url.searchParams.get('code') ?? url.searchParams.get('error') ?? `status ${res.status}`;
}

export async function signedInAgent(t: TestApp, email: string, password = TEST_PASSWORD): Promise<Agent> {
  const agent = request.agent(t.app);
  const status = await signIn(agent, email, password);
  if (status !== 200) throw new Error(`sign-in failed for ${email}`);
  return agent;
}

/** The headers our state-changing routes require (see apps/api/src/http/csrf.ts). */
export const JSON_HEADERS = { 'X-Requested-With': 'bumperline', Origin: ORIGIN } as const;
