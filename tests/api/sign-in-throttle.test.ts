// Password guessing is slowed per account (from every address) and per address (across accounts),
// without letting anyone shut an owner out: an e-mailed sign-in link always works and lifts the pause.
// The e-mails anyone can ask for without signing in are capped per address.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { buildTestApp, JSON_HEADERS, signInOutcome, type TestApp } from '../support/app.ts';
import { createUser, TEST_PASSWORD } from '../support/factories.ts';

// Counts the argon2 verifications that sign-in asks for, still doing the real work.
const argon2Calls = vi.hoisted(() => ({ verify: 0 }));
vi.mock('@node-rs/argon2', async (importOriginal) => {
  const real = await importOriginal<typeof import('@node-rs/argon2')>();
  return {
    ...real,
    verify: (...args: Parameters<typeof real.verify>) => {
      argon2Calls.verify += 1;
      return real.verify(...args);
    },
  };
});

let t: TestApp;
beforeAll(async () => {
  t = await buildTestApp({ signInLimits: { perAccount: 5, perAddress: 12 } });
});
afterAll(() => t.close());

/** A browser at `address` (the app believes X-Forwarded-For from the loopback proxy). */
const from = (address: string) => request.agent(t.app).set('X-Forwarded-For', address);
const tokenIn = (text?: string) => /token=([\w-]+)/.exec(text ?? '')?.[1];
const mailsTo = (address: string, subject: RegExp) => t.mail.messages().filter((m) => m.to.includes(address) && subject.test(m.subject));

describe('password sign-in', () => {
  it('pauses an account after its failures from every address together, until an e-mailed link is used', async () => {
    const u = await createUser(t.db.owner, { email: 'paused@throttle.test' });
    for (let i = 1; i <= 5; i++) expect(await signInOutcome(from(`203.0.113.${i}`), u.email, `wrong guess ${i}`)).toBe('credentials');
    // A sixth address, even with the right password, is refused; the person is told to use a link.
    expect(await signInOutcome(from('198.51.100.7'), u.email, TEST_PASSWORD)).toBe('account-paused');

    await request(t.app).post('/api/account/sign-in-link').set(JSON_HEADERS).send({ email: u.email }).expect(202);
    const agent = from('198.51.100.7');
    const csrf = await agent.get('/auth/csrf');
    const link = await agent
      .post('/auth/callback/email-link')
      .type('form')
      .set('X-Auth-Return-Redirect', '1')
      .send({ csrfToken: csrf.body.csrfToken, token: tokenIn(t.mail.lastTo(u.email)?.text) });
    expect(link.body.url).not.toMatch(/error=/);
    await agent.get('/api/account/me').expect(200);
    // The link lifted the pause.
    expect(await signInOutcome(from('198.51.100.8'), u.email, TEST_PASSWORD)).toBe('ok');
  });

  it('limits one address across accounts, whether they exist or not, and not other addresses', async () => {
    const u = await createUser(t.db.owner, { email: 'sprayed@throttle.test' });
    for (let i = 1; i <= 12; i++)
      expect(await signInOutcome(from('192.0.2.9'), `target${i}@throttle.test`, 'Summer2026!!')).toBe('credentials');
    expect(await signInOutcome(from('192.0.2.9'), u.email, TEST_PASSWORD)).toBe('too-many-attempts');
    expect(await signInOutcome(from('192.0.2.10'), u.email, TEST_PASSWORD)).toBe('ok');
  });

  it('does not count successful sign-ins against the address', async () => {
    const u = await createUser(t.db.owner, { email: 'busy-office@throttle.test' });
    for (let i = 0; i < 14; i++) expect(await signInOutcome(from('192.0.2.77'), u.email, TEST_PASSWORD)).toBe('ok');
  });

  it('checks the password against a stand-in hash when there is no account, as long as for a real one', async () => {
    const known = await createUser(t.db.owner, { email: 'known@throttle.test' });
    const noPassword = await createUser(t.db.owner, { email: 'contact@throttle.test', passwordHash: null });
    for (const email of ['nobody-here@throttle.test', known.email, noPassword.email]) {
      argon2Calls.verify = 0;
      expect(await signInOutcome(from('192.0.2.200'), email, 'a guessed password')).toBe('credentials');
      expect(argon2Calls.verify, email).toBe(1);
    }
  });
});

describe('e-mails anyone can ask for', () => {
  it('sends at most 5 reset links an hour to one address, answering 202 every time', async () => {
    const u = await createUser(t.db.owner, { email: 'reset-flood@throttle.test' });
    for (let i = 0; i < 7; i++) {
      const res = await request(t.app).post('/api/account/password-reset').set(JSON_HEADERS).send({ email: u.email });
      expect(res.status).toBe(202);
      expect(res.body).toEqual({ status: 'sent-if-known' });
    }
    expect(mailsTo(u.email, /Reset/)).toHaveLength(5);
  });

  it('sends at most 5 sign-in links an hour to one address, answering 202 every time', async () => {
    const u = await createUser(t.db.owner, { email: 'link-flood@throttle.test' });
    for (let i = 0; i < 7; i++)
      await request(t.app).post('/api/account/sign-in-link').set(JSON_HEADERS).send({ email: u.email }).expect(202);
    expect(mailsTo(u.email, /sign-in link/)).toHaveLength(5);
  });
});
