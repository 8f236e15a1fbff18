// The arrangement of a resource's API suite: Alpha Amusements (three venues), whose owner is signed in,
// and Beta Games (two venues), another company whose ids Alpha's owner must never reach.
import { sql } from 'drizzle-orm';
import type { Db } from '@bumperline/db/client';
import { signedInAgent, type Agent, type TestApp } from './app.ts';
import { createCompany, type CompanyFixture } from './factories.ts';

export async function twoCompanies(t: TestApp): Promise<{ a: CompanyFixture; b: CompanyFixture; owner: Agent }> {
  const a = await createCompany(t.db.owner, 'Alpha Amusements', 3);
  const b = await createCompany(t.db.owner, 'Beta Games', 2);
  return { a, b, owner: await signedInAgent(t, a.ownerEmail) };
}

/** How many audit-log entries name this row (read as the owner role, across companies). */
export async function auditCount(owner: Db, entityId: string): Promise<number> {
  const r = await owner.execute(sql`select count(*)::int as n from audit_log where entity_id = ${entityId}`);
  return (r.rows[0] as { n: number }).n;
}
