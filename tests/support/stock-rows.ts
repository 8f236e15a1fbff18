// Rows the stock suites make fresh for each request that changes them (arranged as the owner role).
import { sql } from 'drizzle-orm';
import type { TestDatabase } from './database.ts';
import type { FullCompany } from './full-company.ts';

/**
 * An open work order like the fixture's, under a copy of its care plan (a plan has one open order per game).
 */
export async function freshWorkOrder(db: TestDatabase, company: FullCompany): Promise<string> {
  const plan = await db.owner.execute(sql`
    insert into care_plans (tenant_id, name, scope, model_id, tasks, skills, on_site_minutes, rule, rule_start)
    select tenant_id, name, scope, model_id, tasks, skills, on_site_minutes, rule, rule_start from care_plans where id = ${company.care.carePlanId}
    returning id`);
  const planId = (plan.rows[0] as { id: string }).id;
  const r = await db.owner.execute(sql`
    insert into work_orders (tenant_id, care_plan_id, game_id, due_at, due_reason, title, on_site_minutes)
    select tenant_id, ${planId}, game_id, due_at, due_reason, title, on_site_minutes from work_orders where id = ${company.care.workOrderId}
    returning id`);
  return (r.rows[0] as { id: string }).id;
}
