// Response-target warnings: open calls nobody has reached whose target is near are texted once to the
// company's dispatch phone and its owners and dispatchers with a mobile, through the outbox; each company
// is warned about its own calls, by its own settings, on its own numbers.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq, inArray } from 'drizzle-orm';
import { outbox, serviceCalls, tenantSettings, users } from '@bumperline/db/schema/index';
import { runTargetWarningsOnce } from '@bumperline/api/jobs/target-warnings';
import { runOutboxOnce } from '@bumperline/api/jobs/outbox-worker';
import { createMailer } from '@bumperline/api/services/mailer';
import { callRef } from '@bumperline/contracts/calls';
import { buildTestApp, ORIGIN, type TestApp } from '../support/app.ts';
import { createCompany, type CompanyFixture } from '../support/factories.ts';
import {
  addMember,
  addTechnician,
  assignServiceCall,
  callEventKinds,
  callRow,
  openServiceCall,
  outboxRows,
} from '../support/call-factories.ts';

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;
const NOW = new Date();
const minutes = (n: number) => n * 60_000;
// A call for a dead game has a 240-minute response target by default: opened this long ago, it has `left` minutes to go.
const openedFor = (left: number) => new Date(NOW.getTime() - minutes(240 - left));

const A_DISPATCH = '+13125550301';
const A_DISPATCHER = '+13125550302';
const A_OWNER = '+13125550303';
const A_TECH = '+13125550304';
const B_DISPATCH = '+13125550311';

const deps = () => ({ db: t.db.app, appOrigin: ORIGIN });
const warningsOf = async (company: CompanyFixture) =>
  (await outboxRows(t.db.owner, company.tenantId)).filter((r) => r.body.includes('response target'));

beforeAll(async () => {
  t = await buildTestApp({ sms: true });
  a = await createCompany(t.db.owner, 'Alpha Amusements', 1);
  b = await createCompany(t.db.owner, 'Beta Games', 1);
  // Alpha: the default 30 minutes' notice; a dispatch phone, a dispatcher and the owner with mobiles, a technician.
  await t.db.owner.insert(tenantSettings).values({ tenantId: a.tenantId, dispatchPhone: A_DISPATCH });
  await addMember(t.db.owner, a.tenantId, 'dispatcher', A_DISPATCHER, 'Dana Dispatch');
  await addMember(t.db.owner, a.tenantId, 'dispatcher', null, 'No Mobile');
  await addMember(t.db.owner, a.tenantId, 'dispatcher', A_DISPATCH, 'Shares The Dispatch Phone');
  await t.db.owner.update(users).set({ phone: A_OWNER }).where(eq(users.id, a.ownerId));
  await addTechnician(t.db.owner, a.tenantId, A_TECH);
  // Beta: an hour's notice, its own dispatch phone only.
  await t.db.owner.insert(tenantSettings).values({ tenantId: b.tenantId, dispatchPhone: B_DISPATCH, warnBeforeMinutes: 60 });
});
afterAll(() => t.close());

describe('response-target warnings', () => {
  it('warns once per call near or past its target, to the dispatch phone and the office staff, and not otherwise', async () => {
    const soon = await openServiceCall(t.db, a, { now: openedFor(20) });
    const late = await openServiceCall(t.db, a, { now: openedFor(-15) });
    const farOff = await openServiceCall(t.db, a, { now: openedFor(120) });
    const reached = await openServiceCall(t.db, a, { now: openedFor(10) });
    const tech = await addTechnician(t.db.owner, a.tenantId, null, 'On Site Tech');
    await assignServiceCall(t.db, a, reached, tech.id);
    await t.db.owner.update(serviceCalls).set({ state: 'on_site' }).where(eq(serviceCalls.id, reached)); // someone is there
    const assigned = await openServiceCall(t.db, a, { now: openedFor(25) });
    await assignServiceCall(t.db, a, assigned, tech.id); // assigned, not there yet: still warned
    const versionBefore = (await callRow(t.db.owner, a.tenantId, soon)).version;

    expect(await runTargetWarningsOnce(deps(), NOW)).toBe(3);

    const warnings = await warningsOf(a);
    for (const id of [soon, late, assigned]) {
      const mine = warnings.filter((w) => w.callId === id);
      expect(mine.map((w) => w.toAddress).sort()).toEqual([A_DISPATCH, A_DISPATCHER, A_OWNER].sort());
      expect(mine.every((w) => w.channel === 'sms' && w.status === 'pending' && w.body.includes(`call ${callRef(id)}`))).toBe(true);
      const call = await callRow(t.db.owner, a.tenantId, id);
      expect(call.warnedAt?.getTime()).toBe(NOW.getTime());
      expect((await callEventKinds(t.db.owner, a.tenantId, id)).filter((e) => e.kind === 'warned')).toEqual([
        expect.objectContaining({ actorLabel: 'system', detail: expect.objectContaining({ recipients: 3 }) }),
      ]);
    }
    expect(warnings.find((w) => w.callId === soon)!.body).toContain('misses its response target in 20 min');
    expect(warnings.find((w) => w.callId === late)!.body).toContain('is past its response target');
    expect(warnings.find((w) => w.callId === soon)!.body).toContain(`${ORIGIN}/calls/${soon}`);
    expect(warnings.some((w) => w.callId === farOff || w.callId === reached)).toBe(false);
    expect(warnings.some((w) => w.toAddress === A_TECH)).toBe(false);
    expect((await callRow(t.db.owner, a.tenantId, farOff)).warnedAt).toBeNull();
    // Bookkeeping does not bump the version a dispatcher may be editing at.
    expect((await callRow(t.db.owner, a.tenantId, soon)).version).toBe(versionBefore);

    // Once warned, never again.
    expect(await runTargetWarningsOnce(deps(), new Date(NOW.getTime() + minutes(5)))).toBe(0);
    expect(await warningsOf(a)).toHaveLength(warnings.length);
    // The far-off call is warned when its own time comes.
    expect(await runTargetWarningsOnce(deps(), new Date(NOW.getTime() + minutes(95)))).toBe(1);
    expect((await warningsOf(a)).filter((w) => w.callId === farOff)).toHaveLength(3);
  });

  it('each company is warned by its own notice, on its own numbers, about its own calls only', async () => {
    const bCall = await openServiceCall(t.db, b, { now: openedFor(50) }); // inside Beta's 60 minutes, outside Alpha's 30
    const aCount = (await warningsOf(a)).length;
    expect(await runTargetWarningsOnce(deps(), NOW)).toBe(1);
    const bWarnings = await warningsOf(b);
    expect(bWarnings.map((w) => [w.toAddress, w.callId])).toEqual([[B_DISPATCH, bCall]]);
    expect(await warningsOf(a)).toHaveLength(aCount);
    const aNumbers = [A_DISPATCH, A_DISPATCHER, A_OWNER, A_TECH];
    expect(
      (
        await t.db.owner
          .select()
          .from(outbox)
          .where(and(eq(outbox.tenantId, b.tenantId), inArray(outbox.toAddress, aNumbers)))
      ).length,
    ).toBe(0);
  });

  it('two runs at once warn about each call once', async () => {
    const calls = [await openServiceCall(t.db, b, { now: openedFor(5) }), await openServiceCall(t.db, b, { now: openedFor(6) })];
    const [one, two] = await Promise.all([runTargetWarningsOnce(deps(), NOW), runTargetWarningsOnce(deps(), NOW)]);
    expect(one + two).toBe(2);
    for (const id of calls) expect((await warningsOf(b)).filter((w) => w.callId === id)).toHaveLength(1);
  });

  it('the warnings reach the phones through the outbox worker', async () => {
    await runOutboxOnce({
      db: t.db.app,
      sms: t.sms!.sender,
      mailer: createMailer({ fakePort: t.mail.port, from: 'test@bumperline.example' }),
    });
    await t.sms!.fake.idle();
    expect(t.sms!.fake.messagesTo(A_DISPATCH).length).toBe(4); // four of Alpha's calls, one text each
    expect(t.sms!.fake.messagesTo(B_DISPATCH).every((m) => m.body.includes('response target'))).toBe(true);
    expect(t.sms!.fake.messagesTo(A_TECH).some((m) => m.body.includes('response target'))).toBe(false);
  });
});
