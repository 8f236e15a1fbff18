// Accounts: sign-up and sign-in, signing out, password reset and the links mailed for it, sign-in by link.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@bumperline/contracts/roles';
import { buildTestApp, JSON_HEADERS, signIn, signInWithLink, signedInAgent, type TestApp } from '../support/app.ts';
import { companyWithEveryRole, createUser, TEST_PASSWORD, type CompanyFixture } from '../support/factories.ts';

let t: TestApp;
let company: CompanyFixture;
let people: Record<Role, string>;

beforeAll(async () => {
  t = await buildTestApp({ signInLimit: 5 });
  ({ company, people } = await companyWithEveryRole(t.db.owner, 'Gamma Coin'));
});
afterAll(() => t.close());

describe('sign-up and sign-in', () => {
  it('creates a company and its owner, who confirms the address by e-mail and can then sign in and see them', async () => {
    const res = await request(t.app)
      .post('/api/account/sign-up')
      .set(JSON_HEADERS)
      .send({ companyName: 'Delta Darts', name: 'Dee Owner', email: 'Dee@Delta.test', password: 'a long enough passphrase' })
      .expect(202);
    expect(res.body).toEqual({ status: 'check-your-email' });
    const token = /token=([\w-]+)/.exec(t.mail.lastTo('dee@delta.test')?.text ?? '')?.[1];
    await request(t.app)
      .post('/api/account/verify-email')
      .set(JSON_HEADERS)
      .send({ token, password: 'a long enough passphrase' })
      .expect(204);
    const agent = request.agent(t.app);
    expect(await signIn(agent, 'dee@delta.test', 'a long enough passphrase')).toBe(200);
    const me = await agent.get('/api/account/me').expect(200);
    expect(me.body).toMatchObject({ role: 'owner', company: { name: 'Delta Darts', timeZone: 'America/Chicago', currency: 'USD' } });
  });

  it('answers a second sign-up with the same e-mail as any other, and mails the address instead', async () => {
    const res = await request(t.app)
      .post('/api/account/sign-up')
      .set(JSON_HEADERS)
      .send({ companyName: 'Again', name: 'X', email: company.ownerEmail, password: 'another passphrase' })
      .expect(202);
    expect(res.body).toEqual({ status: 'check-your-email' });
    const notice = t.mail.lastTo(company.ownerEmail);
    expect(notice?.text).toMatch(/tried to sign up/);
    expect(await signIn(request.agent(t.app), company.ownerEmail, 'another passphrase')).toBe(401);
  });

  it('refuses a wrong password and rate-limits repeated attempts', async () => {
    const u = await createUser(t.db.owner, { email: 'limited@gamma.test' });
    const agent = request.agent(t.app);
    for (let i = 0; i < 5; i++) expect(await signIn(agent, u.email, 'wrong password!')).toBe(401);
    // The sixth attempt is refused even with the right password.
    expect(await signIn(agent, u.email, TEST_PASSWORD)).toBe(401);
    await agent.get('/api/account/me').expect(401);
  });

  it('signing out revokes the session at once, even if the old cookie is replayed', async () => {
    const agent = await signedInAgent(t, company.ownerEmail);
    const cookie = (await agent.get('/auth/session')).request.cookies;
    await agent.get('/api/account/me').expect(200);
    const csrf = await agent.get('/auth/csrf');
    await agent.post('/auth/signout').type('form').set('X-Auth-Return-Redirect', '1').send({ csrfToken: csrf.body.csrfToken });
    await agent.get('/api/account/me').expect(401);
    await request(t.app).get('/api/account/me').set('Cookie', cookie).expect(401);
  });
});

describe('password reset by e-mail', () => {
  it('mails a one-time link that sets a new password and signs out other sessions', async () => {
    const u = await createUser(t.db.owner, { email: 'forgetful@gamma.test' });
    const old = await signedInAgent(t, u.email);
    await request(t.app).post('/api/account/password-reset').set(JSON_HEADERS).send({ email: u.email }).expect(202);
    // Unknown addresses get the same answer and no mail.
    await request(t.app).post('/api/account/password-reset').set(JSON_HEADERS).send({ email: 'nobody@x.test' }).expect(202);
    expect(t.mail.lastTo('nobody@x.test')).toBeUndefined();
    const mail = t.mail.lastTo(u.email);
    const token = /token=([\w-]+)/.exec(mail?.text ?? '')?.[1];
    expect(token).toBeTruthy();
    await request(t.app)
      .post('/api/account/password-reset/confirm')
      .set(JSON_HEADERS)
      .send({ token, password: 'brand new passphrase' })
      .expect(204);
    await old.get('/api/account/me').expect(401);
    expect(await signIn(request.agent(t.app), u.email, TEST_PASSWORD)).toBe(401);
    expect(await signIn(request.agent(t.app), u.email, 'brand new passphrase')).toBe(200);
    // The link works once.
    const again = await request(t.app)
      .post('/api/account/password-reset/confirm')
      .set(JSON_HEADERS)
      .send({ token, password: 'yet another passphrase' })
      .expect(400);
    expect(again.body.errors[0].field).toBe('token');
  });
});

describe('e-mailed tokens', () => {
  it('a password reset ends every other link mailed to that person', async () => {
    const u = await createUser(t.db.owner, { email: 'many-links@gamma.test' });
    const tokenFor = async (path: string) => {
      await request(t.app).post(path).set(JSON_HEADERS).send({ email: u.email }).expect(202);
      return /token=([\w-]+)/.exec(t.mail.lastTo(u.email)?.text ?? '')?.[1];
    };
    const signInLink = await tokenFor('/api/account/sign-in-link');
    const firstReset = await tokenFor('/api/account/password-reset');
    const secondReset = await tokenFor('/api/account/password-reset');
    await request(t.app)
      .post('/api/account/password-reset/confirm')
      .set(JSON_HEADERS)
      .send({ token: secondReset, password: 'the newest passphrase' })
      .expect(204);
    const stale = await request(t.app)
      .post('/api/account/password-reset/confirm')
      .set(JSON_HEADERS)
      .send({ token: firstReset, password: 'an older reset link' })
      .expect(400);
    expect(stale.body.errors[0].field).toBe('token');
    const link = await signInWithLink(request.agent(t.app), signInLink);
    expect(link.body.url).toMatch(/error=/);
    expect(await signIn(request.agent(t.app), u.email, 'the newest passphrase')).toBe(200);
  });
});

describe('sign-in by e-mailed link', () => {
  it('a venue contact signs in with an e-mailed link, once', async () => {
    const link = await request(t.app).post('/api/account/sign-in-link').set(JSON_HEADERS).send({ email: people.venue_contact });
    expect(link.status).toBe(202);
    const token = /token=([\w-]+)/.exec(t.mail.lastTo(people.venue_contact)?.text ?? '')?.[1];
    const agent = request.agent(t.app);
    const res = await signInWithLink(agent, token);
    expect(res.body.url).not.toMatch(/error=/);
    const me = await agent.get('/api/account/me').expect(200);
    expect(me.body.role).toBe('venue_contact');
    const replay = await signInWithLink(request.agent(t.app), token);
    expect(replay.body.url).toMatch(/error=/);
  });
});
