// The per-request sign-in check reads the cookie Auth.js itself set, and nothing else: a cookie sealed
// with another secret (apps/api/src/auth/session-cookie.test.ts), a garbled one or a revoked session's is simply not signed in (401, never 500).
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { buildTestApp, signedInAgent, type TestApp } from '../support/app.ts';
import { createCompany } from '../support/factories.ts';

let t: TestApp;
beforeAll(async () => {
  t = await buildTestApp();
});
afterAll(() => t.close());

/** The session cookie an agent holds after signing in. */
async function sessionCookieOf(email: string): Promise<string> {
  const agent = await signedInAgent(t, email);
  const res = await agent.get('/auth/session').expect(200);
  expect(res.body?.user?.email).toBe(email);
  const cookie = (agent as unknown as { jar: { getCookie(name: string, opts: object): { value: string } | undefined } }).jar.getCookie(
    'authjs.session-token',
    { domain: '127.0.0.1', path: '/', secure: false, script: false },
  );
  expect(cookie?.value).toBeTruthy();
  return cookie!.value;
}

describe('session cookie', () => {
  it("Auth.js's own cookie signs the person in; a garbled one and a revoked session's do not", async () => {
    const company = await createCompany(t.db.owner, 'Cookie Coin-Op', 1);
    const token = await sessionCookieOf(company.ownerEmail);
    const me = await request(t.app).get('/api/account/me').set('Cookie', `authjs.session-token=${token}`).expect(200);
    expect(me.body.user.email).toBe(company.ownerEmail);
    expect(me.body.role).toBe('owner');

    await request(t.app)
      .get('/api/account/me')
      .set('Cookie', `authjs.session-token=${token.slice(0, -6)}xxxxxx`)
      .expect(401);
    await request(t.app).get('/api/account/me').set('Cookie', 'authjs.session-token=%E0%A4%A').expect(401);

    await t.db.owner.execute(sql`update user_sessions set revoked_at = now() where user_id = ${company.ownerId}`);
    await request(t.app).get('/api/account/me').set('Cookie', `authjs.session-token=${token}`).expect(401);
    await request(t.app).get('/api/calls').set('Cookie', `authjs.session-token=${token}`).expect(401);
  });
});
