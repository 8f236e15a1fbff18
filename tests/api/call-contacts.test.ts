// Whom a call's messages went to — a reporter's phone, a venue's e-mail — is for the office to see.
// A technician reading the same call sees that a text went out, never the number.
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { can, type Role } from '@bumperline/contracts/roles';
import { withScope } from '@bumperline/db/client';
import { openCall } from '@bumperline/api/services/service-calls';
import { buildTestApp, JSON_HEADERS, ORIGIN, signedInAgent, type TestApp } from '../support/app.ts';
import { companyWithEveryRole, type CompanyFixture } from '../support/factories.ts';

const REPORTER = '+13125550142';
let t: TestApp;
let company: CompanyFixture;
let callId: string;
let people: Record<Role, string>;

beforeAll(async () => {
  t = await buildTestApp();
  ({ company, people } = await companyWithEveryRole(t.db.owner, 'Contact Coin', 1));
  // A report from the game tag with a phone and consent to texts.
  const opened = await withScope(t.db.app, { tenantId: company.tenantId }, (tx) =>
    openCall(tx, {
      gameId: company.gameIds[0]!,
      problem: 'dead',
      note: '',
      source: 'game_tag',
      reporterPhone: REPORTER,
      smsConsent: true,
      actor: { userId: null, role: null, label: 'Reporter' },
      appOrigin: ORIGIN,
    }),
  );
  callId = opened.callId;
  // The technician sets off: the reporter, who asked for texts, is told.
  const owner = await signedInAgent(t, people.owner);
  const techId = (await t.db.owner.execute(sql`select id from users where email = ${people.technician}`)).rows[0]!.id as string;
  const assigned = await owner.post(`/api/calls/${callId}/assign`).set(JSON_HEADERS).send({ technicianId: techId, version: 1 }).expect(200);
  await owner
    .post(`/api/calls/${callId}/transition`)
    .set(JSON_HEADERS)
    .send({ to: 'on_the_way', version: assigned.body.version })
    .expect(200);
});
afterAll(() => t.close());

describe('message recipients on a call', () => {
  it('show in full to owners and dispatchers and masked to technicians', async () => {
    const seen: Partial<Record<Role, string[]>> = {};
    for (const role of ['owner', 'dispatcher', 'technician'] as const) {
      const agent = await signedInAgent(t, people[role]);
      const res = await agent.get(`/api/calls/${callId}`).expect(200);
      const addresses = (res.body.messages as { channel: string; toAddress: string }[])
        .filter((m) => m.channel === 'sms')
        .map((m) => m.toAddress);
      // The text to the reporter is there for every role to see; what differs is the number.
      expect(addresses.length, role).toBeGreaterThan(0);
      seen[role] = addresses;
      expect(JSON.stringify(res.body).includes('5550142'), role).toBe(can(role, 'calls:contacts'));
    }
    expect(seen.owner).toContain(REPORTER);
    expect(seen.dispatcher).toContain(REPORTER);
    expect(seen.technician).toContain('•••• 42');
  });

  it('are not reachable by a venue contact at all', async () => {
    const agent = await signedInAgent(t, people.venue_contact);
    await agent.get(`/api/calls/${callId}`).expect(403);
  });
});
