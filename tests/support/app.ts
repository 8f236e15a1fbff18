// Builds the real API (createApp) on a fresh database, with the mail fake, for supertest.
import pino from 'pino';
import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '@bumperline/api/app';
import { createMailer } from '@bumperline/api/services/mailer';
import { SignInLimiter } from '@bumperline/api/auth/sign-in-limiter';
import { startMailFake, type MailFake } from '@bumperline/fakes/mail/mail-fake';
import { freshDatabase, type TestDatabase } from './database.ts';
import { TEST_PASSWORD } from './factories.ts';

export interface TestApp {
  app: Express;
  db: TestDatabase;
  mail: MailFake;
  close(): Promise<void>;
}

export const ORIGIN = 'http://127.0.0.1:3999';

export async function buildTestApp(opts: { signInLimit?: number } = {}): Promise<TestApp> {
  const db = await freshDatabase();
  const mail = await startMailFake();
  const app = createApp({
    db: db.app,
    mailer: createMailer({ fakePort: mail.port, from: 'Bumperline test <test@bumperline.example>' }),
    logger: pino({ level: 'silent' }),
    authSecret: 'test-secret-that-is-at-least-32-characters-long',
    appOrigin: ORIGIN,
    mailFake: mail,
    signInLimiter: new SignInLimiter(opts.signInLimit ?? 50),
  });
  return {
    app,
    db,
    mail,
    async close() {
      await mail.stop();
      await db.drop();
    },
  };
}

export type Agent = ReturnType<typeof request.agent>;

/** Signs in through Auth.js's own endpoints, exactly as the web app does. Returns the HTTP status. */
export async function signIn(agent: Agent, email: string, password = TEST_PASSWORD): Promise<number> {
  const csrf = await agent.get('/auth/csrf').expect(200);
  const res = await agent
    .post('/auth/callback/credentials')
    .type('form')
    .set('X-Auth-Return-Redirect', '1')
    .send({ csrfToken: csrf.body.csrfToken, email, password });
  // Auth.js answers 200 with a url either way; a failed sign-in's url carries ?error=.
  return res.status === 200 && !String(res.body.url ?? '').includes('error=') ? 200 : 401;
}

export async function signedInAgent(t: TestApp, email: string, password = TEST_PASSWORD): Promise<Agent> {
  const agent = request.agent(t.app);
  const status = await signIn(agent, email, password);
  if (status !== 200) throw new Error(`sign-in failed for ${email}`);
  return agent;
}

/** The headers our state-changing routes require (see apps/api/src/http/csrf.ts). */
export const JSON_HEADERS = { 'X-Requested-With': 'bumperline', Origin: ORIGIN } as const;
