// How scheduled jobs find the companies with due work: one indexed query across companies per run, through
// narrow SECURITY DEFINER functions (drizzle/0008_…) that return company ids only. The job then works inside
// each of those companies' scope, so a company with nothing due costs nothing.
import { sql } from 'drizzle-orm';
import type { Db } from '../client.ts';

/** Companies with outbox rows to claim: pending and due, or left 'sending' since before `stuckBefore`. */
export async function listCompaniesWithDueMessages(db: Db, p: { now: Date; stuckBefore: Date }): Promise<string[]> {
  const r = await db.execute<{ tenant_id: string }>(sql`select tenant_id from outbox_due_tenant_ids(${p.now}, ${p.stuckBefore})`);
  return r.rows.map((row) => row.tenant_id);
}

/**
 * Companies with a call nobody has reached or been warned about whose target falls within the company's
 * warning lead of `now`; `longestLeadMinutes` (the most settings allow) bounds the search.
 */
export async function listCompaniesWithCallsToWarn(db: Db, p: { now: Date; longestLeadMinutes: number }): Promise<string[]> {
  const r = await db.execute<{ tenant_id: string }>(
    sql`select tenant_id from warning_due_tenant_ids(${p.now}, make_interval(mins => ${p.longestLeadMinutes}))`,
  );
  return r.rows.map((row) => row.tenant_id);
}

/** Companies with a care plan past its next check (drizzle/0013_…): the care-plan run works only in these. */
export async function listCompaniesWithCarePlansToCheck(db: Db, p: { now: Date }): Promise<string[]> {
  const r = await db.execute<{ tenant_id: string }>(sql`select tenant_id from care_plan_due_tenant_ids(${p.now})`);
  return r.rows.map((row) => row.tenant_id);
}
