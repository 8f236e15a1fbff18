// Bench-job templates: the company's handful of overhaul recipes, each an ordered list of steps (kept as JSON).
import { and, asc, eq, sql } from 'drizzle-orm';
import type { BenchStep } from '@bumperline/contracts/bench-vocabulary';
import type { Tx } from '../client.ts';
import { benchTemplates } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { updateAtVersion } from './versioned-update.ts';

const templateColumns = {
  id: benchTemplates.id,
  name: benchTemplates.name,
  description: benchTemplates.description,
  steps: benchTemplates.steps,
  version: benchTemplates.version,
  createdAt: benchTemplates.createdAt,
  updatedAt: benchTemplates.updatedAt,
};

export type BenchTemplateRow = typeof benchTemplates.$inferSelect;

/** Every template by name (bench_templates_tenant_name_idx); the steps are counted, not sent. */
export async function listBenchTemplates(tx: Tx) {
  return tx
    .select({
      id: benchTemplates.id,
      name: benchTemplates.name,
      description: benchTemplates.description,
      stepCount: sql<number>`jsonb_array_length(${benchTemplates.steps})::int`,
      version: benchTemplates.version,
      updatedAt: benchTemplates.updatedAt,
    })
    .from(benchTemplates)
    .where(eq(benchTemplates.tenantId, currentTenant))
    .orderBy(asc(benchTemplates.name), asc(benchTemplates.id));
}

export async function getBenchTemplate(tx: Tx, id: string) {
  const [row] = await tx
    .select(templateColumns)
    .from(benchTemplates)
    .where(and(eq(benchTemplates.tenantId, currentTenant), eq(benchTemplates.id, id)));
  return row;
}

export async function findBenchTemplateByName(tx: Tx, name: string) {
  const [row] = await tx
    .select(templateColumns)
    .from(benchTemplates)
    .where(and(eq(benchTemplates.tenantId, currentTenant), eq(benchTemplates.name, name)));
  return row;
}

export interface BenchTemplateFields {
  name: string;
  description: string;
  steps: BenchStep[];
}

export async function insertBenchTemplate(tx: Tx, values: BenchTemplateFields) {
  const [row] = await tx
    .insert(benchTemplates)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .returning({ id: benchTemplates.id });
  return row!.id;
}

/** The new version, or undefined when the template moved on (or is gone). */
export async function updateBenchTemplate(tx: Tx, id: string, version: number, values: BenchTemplateFields) {
  return (await updateAtVersion(tx, benchTemplates, id, version, values))?.version;
}
