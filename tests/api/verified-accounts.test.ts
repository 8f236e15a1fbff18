// An address is proven by an e-mailed link before its password signs in. The first time it is proven
// by any other link than the sign-up's own confirmation (a sign-in link, an invitation, a password
// reset), a password chosen before then is dropped and every session ends: whoever signed up with
// someone else's address cannot keep a way in once the real owner shows up.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { userSessions } from '@bumperline/db/schema/index';
import { buildTestApp, JSON_HEADERS, signedInAgent, signInOutcome, signInWithLink, type TestApp } from '../support/app.ts';
import { createCompany, createUser, TEST_PASSWORD } from '../support/factories.ts';

let t: TestApp;
beforeAll(async () => {
  t = await buildTestApp();
});
afterAll(() => t.close());

const tokenIn = (text?: string) => /token=([\w-]+)/.exec(text ?? '')?.[1];
const mailsTo = (address: string) => t.mail.messages().filter((m) => m.to.includes(address));

function signUp(email: string, password: string, companyName = 'Signup Test Co') {
  return request(t.app).post('/api/account/sign-up').set(JSON_HEADERS).send({ companyName, name: 'Sign Up Person', email, password });
}

async function signInByLink(email: string) {
  await request(t.app).post('/api/account/sign-in-link').set(JSON_HEADERS).send({ email }).expect(202);
  const agent = request.agent(t.app);
  const res = await signInWithLink(agent, tokenIn(t.mail.lastTo(email)?.text));
  expect(res.body.url).not.toMatch(/error=/);
  return agent;
}

describe('sign-up', () => {
  it('answers "check your e-mail" and refuses the password until the e-mailed link is opened', async () => {
    const res = await signUp('Una@Verify.test', 'una passphrase 1').expect(202);
    expect(res.body).toEqual({ status: 'check-your-email' });
    const agent = request.agent(t.app);
    expect(await signInOutcome(agent, 'una@verify.test', 'una passphrase 1')).toBe('unverified');
    // A wrong password learns nothing about the address.
    expect(await signInOutcome(agent, 'una@verify.test', 'not her passphrase')).toBe('credentials');

    const mail = t.mail.lastTo('una@verify.test');
    expect(mail?.subject).toMatch(/confirm/i);
    const token = tokenIn(mail?.text);
    expect(mail?.text).toContain(`/verify-email?token=${token}`);
    // Confirming needs the password chosen at sign-up; a wrong one is named and leaves the link unused.
    const wrong = await request(t.app)
      .post('/api/account/verify-email')
      .set(JSON_HEADERS)
      .send({ token, password: 'not the one' })
      .expect(400);
    expect(wrong.body.errors).toEqual([{ field: 'password', message: 'is not the password chosen at sign-up' }]);
    expect(await signInOutcome(agent, 'una@verify.test', 'una passphrase 1')).toBe('unverified');
    await request(t.app).post('/api/account/verify-email').set(JSON_HEADERS).send({ token, password: 'una passphrase 1' }).expect(204);
    expect(await signInOutcome(agent, 'una@verify.test', 'una passphrase 1')).toBe('ok');
    const me = await agent.get('/api/account/me').expect(200);
    expect(me.body).toMatchObject({ role: 'owner', company: { name: 'Signup Test Co' } });

    // The link works once; a bad token names the field and changes nothing.
    const again = await request(t.app)
      .post('/api/account/verify-email')
      .set(JSON_HEADERS)
      .send({ token, password: 'una passphrase 1' })
      .expect(400);
    expect(again.body.errors).toEqual([{ field: 'token', message: expect.any(String) }]);
    const bad = await request(t.app)
      .post('/api/account/verify-email')
      .set(JSON_HEADERS)
      .send({ token: 'x', password: 'una passphrase 1' })
      .expect(400);
    expect(bad.body.errors[0].field).toBe('token');
  });

  it('mails the confirmation again on request, answering the same whatever the address', async () => {
    await signUp('late@verify.test', 'late passphrase 1').expect(202);
    const first = tokenIn(t.mail.lastTo('late@verify.test')?.text);
    const resend = (email: string) => request(t.app).post('/api/account/verify-email/resend').set(JSON_HEADERS).send({ email });
    const known = await resend('late@verify.test').expect(202);
    const unknown = await resend('nobody@verify.test').expect(202);
    expect(unknown.body).toEqual(known.body);
    expect(mailsTo('nobody@verify.test')).toHaveLength(0);
    const second = tokenIn(t.mail.lastTo('late@verify.test')?.text);
    expect(second).toBeTruthy();
    expect(second).not.toBe(first);
    await request(t.app)
      .post('/api/account/verify-email')
      .set(JSON_HEADERS)
      .send({ token: second, password: 'late passphrase 1' })
      .expect(204);
    expect(await signInOutcome(request.agent(t.app), 'late@verify.test', 'late passphrase 1')).toBe('ok');
    // A proven address gets no confirmation mail.
    const before = mailsTo('late@verify.test').length;
    await resend('late@verify.test').expect(202);
    expect(mailsTo('late@verify.test')).toHaveLength(before);
  });

  it('with an address that has an account answers exactly as for a new one, and tells its owner instead', async () => {
    const owner = await createUser(t.db.owner, { email: 'taken@verify.test' });
    const fresh = await signUp('fresh@verify.test', 'fresh passphrase 1');
    const taken = await signUp('Taken@Verify.test', 'intruder passphrase', 'Intruder Co');
    expect(taken.status).toBe(202);
    expect(taken.status).toBe(fresh.status);
    expect(taken.body).toEqual(fresh.body);

    const notice = t.mail.lastTo(owner.email);
    expect(notice?.subject).toMatch(/sign up/i);
    expect(notice?.text).toMatch(/reset your password/i);
    expect(tokenIn(notice?.text)).toBeUndefined();
    // Nothing changed: the owner's password still works and no company was made for them.
    const agent = await signedInAgent(t, owner.email);
    const me = await agent.get('/api/account/me').expect(200);
    expect(me.body.companies).toEqual([]);
    expect(await signInOutcome(request.agent(t.app), owner.email, 'intruder passphrase')).toBe('credentials');
  });
});

describe('someone signs up with another person’s address', () => {
  it('loses their password when the real person accepts an invitation by its link', async () => {
    const victimAddress = 'newhire@victim.test';
    await signUp(victimAddress, 'attacker passphrase', 'Trap Co').expect(202);

    const company = await createCompany(t.db.owner, 'Victim Amusements', 1);
    const owner = await signedInAgent(t, company.ownerEmail);
    await owner.post('/api/team/invitations').set(JSON_HEADERS).send({ email: victimAddress, role: 'dispatcher' }).expect(201);
    const invitation = t.mail.lastTo(victimAddress);
    expect(invitation?.subject).toMatch(/invited/);
    const token = tokenIn(invitation?.text);
    // The account nobody has proven is not one the invitee must sign in to.
    const info = await request(t.app).get(`/api/invitations/${token}`).expect(200);
    expect(info.body.hasAccount).toBe(false);
    await request(t.app)
      .post(`/api/invitations/${token}/accept`)
      .set(JSON_HEADERS)
      .send({ name: 'Nia Hire', password: 'the real passphrase' })
      .expect(201);

    expect(await signInOutcome(request.agent(t.app), victimAddress, 'attacker passphrase')).toBe('credentials');
    const nia = await signedInAgent(t, victimAddress, 'the real passphrase');
    const me = await nia.get('/api/account/me').expect(200);
    expect(me.body.user.name).toBe('Nia Hire');
    expect(me.body.companies).toContainEqual({ id: company.tenantId, name: 'Victim Amusements', role: 'dispatcher' });
  });

  it('loses their password and every session when the real person signs in by an e-mailed link', async () => {
    const u = await createUser(t.db.owner, { email: 'linked@verify.test', emailVerifiedAt: null });
    // A session from before addresses were checked.
    const [session] = await t.db.owner.insert(userSessions).values({ userId: u.id }).returning();
    expect(await signInOutcome(request.agent(t.app), u.email, TEST_PASSWORD)).toBe('unverified');

    const agent = await signInByLink(u.email);
    await agent.get('/api/account/me').expect(200);
    const [old] = await t.db.owner.select().from(userSessions).where(eq(userSessions.id, session!.id));
    expect(old?.revokedAt).not.toBeNull();
    expect(await signInOutcome(request.agent(t.app), u.email, TEST_PASSWORD)).toBe('credentials');
  });

  it('cannot come back through their own confirmation link once the real person has reset the password', async () => {
    await signUp('reset-first@verify.test', 'attacker passphrase 2').expect(202);
    const confirmation = tokenIn(t.mail.lastTo('reset-first@verify.test')?.text);
    await request(t.app).post('/api/account/password-reset').set(JSON_HEADERS).send({ email: 'reset-first@verify.test' }).expect(202);
    const reset = tokenIn(t.mail.lastTo('reset-first@verify.test')?.text);
    await request(t.app)
      .post('/api/account/password-reset/confirm')
      .set(JSON_HEADERS)
      .send({ token: reset, password: 'owner chose this one' })
      .expect(204);
    // The reset proved the address and kept the password the person chose with it.
    expect(await signInOutcome(request.agent(t.app), 'reset-first@verify.test', 'owner chose this one')).toBe('ok');
    await request(t.app)
      .post('/api/account/verify-email')
      .set(JSON_HEADERS)
      .send({ token: confirmation, password: 'attacker passphrase 2' })
      .expect(400);
    expect(await signInOutcome(request.agent(t.app), 'reset-first@verify.test', 'attacker passphrase 2')).toBe('credentials');
  });
});
