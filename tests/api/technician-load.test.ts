// A technician's load, shown to the dispatcher beside each technician: their calls in the states that
// keep them busy (callStateGroups.technicianLoad), counted for this company only.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { callStateGroups } from '@bumperline/contracts/calls';
import { JSON_HEADERS } from '../support/app.ts';
import { addTechnician, assignServiceCall, openServiceCall } from '../support/call-factories.ts';
import { appWithFullCompany, type FullCompanyApp } from '../support/full-company.ts';

let f: FullCompanyApp;
beforeAll(async () => {
  f = await appWithFullCompany('Loaded Coin-Op');
});
afterAll(() => f?.close());

async function loads(): Promise<Record<string, number>> {
  const res = await f.agents.dispatcher.get('/api/technicians').expect(200);
  return Object.fromEntries((res.body.items as { userId: string; openCalls: number }[]).map((t) => [t.userId, t.openCalls]));
}

describe('technician load', () => {
  it('counts each technician’s calls in the busy states, and drops a call once it leaves them', async () => {
    expect(callStateGroups.technicianLoad).toContain('assigned');
    const { company } = f;
    const idle = await addTechnician(f.t.db.owner, company.tenantId, null, 'Idle Technician');
    // The full company's technician already has one assigned call; give them two more.
    const more = [await openServiceCall(f.t.db, company), await openServiceCall(f.t.db, company)];
    for (const id of more) await assignServiceCall(f.t.db, company, id, company.technician.id);
    expect(await loads()).toMatchObject({ [company.technician.id]: 3, [idle.id]: 0 });

    const call = await f.agents.dispatcher.get(`/api/calls/${more[0]}`).expect(200);
    const res = await f.agents.dispatcher
      .post(`/api/calls/${more[0]}/transition`)
      .set(JSON_HEADERS)
      .send({ to: 'cancelled', version: call.body.call.version, note: 'Venue reset it; works now.' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(await loads()).toMatchObject({ [company.technician.id]: 2, [idle.id]: 0 });
  });
});
