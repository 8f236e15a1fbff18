// Keep cost: one row per job (a fixed service call, a done work order, a finished bench job) with its parts at cost
// and labour at the company's rate; and what a job's parts cost, read from where each kind of job records them.
import { and, eq, gte, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { benchJobPartsUsed, catalogueParts, keepCostEntries, partsUsed } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export type KeepCostSource = (typeof keepCostEntries.$inferSelect)['source'];

/** The parts fitted on a job, each with its quantity and unit cost in cents. */
export async function listJobPartsAtCost(tx: Tx, source: KeepCostSource, sourceId: string) {
  if (source === 'bench_job') {
    // A bench job's parts are at cost only where the line names a catalogue part.
    return tx
      .select({ quantity: benchJobPartsUsed.quantity, unitCostCents: catalogueParts.unitCostCents })
      .from(benchJobPartsUsed)
      .innerJoin(
        catalogueParts,
        and(eq(catalogueParts.tenantId, benchJobPartsUsed.tenantId), eq(catalogueParts.id, benchJobPartsUsed.cataloguePartId)),
      )
      .where(and(eq(benchJobPartsUsed.tenantId, currentTenant), eq(benchJobPartsUsed.jobId, sourceId)));
  }
  const column = source === 'service_call' ? partsUsed.serviceCallId : partsUsed.workOrderId;
  return tx
    .select({ quantity: partsUsed.quantity, unitCostCents: partsUsed.unitCostCents })
    .from(partsUsed)
    .where(and(eq(partsUsed.tenantId, currentTenant), eq(column, sourceId)));
}

/** Writes the job's keep cost, replacing an earlier one for the same job (one row per source). */
export async function upsertKeepCost(tx: Tx, values: Omit<typeof keepCostEntries.$inferInsert, 'tenantId' | 'id'>) {
  const [row] = await tx
    .insert(keepCostEntries)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .onConflictDoUpdate({
      target: [keepCostEntries.tenantId, keepCostEntries.source, keepCostEntries.sourceId],
      set: {
        gameId: values.gameId,
        partsCents: values.partsCents,
        labourMinutes: values.labourMinutes,
        labourRateCents: values.labourRateCents,
        labourCents: values.labourCents,
        technicianId: values.technicianId ?? null,
        recordedAt: sql`now()`,
      },
    })
    .returning({ id: keepCostEntries.id });
  return row!.id;
}

/** A game's keep cost since a moment: jobs, parts, labour (the game index). */
export async function sumKeepCostOfGame(tx: Tx, gameId: string, since: Date) {
  const [row] = await tx
    .select({
      jobs: sql<number>`count(*)::int`,
      partsCents: sql<number>`coalesce(sum(${keepCostEntries.partsCents}), 0)::bigint`.mapWith(Number),
      labourMinutes: sql<number>`coalesce(sum(${keepCostEntries.labourMinutes}), 0)::int`,
      labourCents: sql<number>`coalesce(sum(${keepCostEntries.labourCents}), 0)::bigint`.mapWith(Number),
    })
    .from(keepCostEntries)
    .where(and(eq(keepCostEntries.tenantId, currentTenant), eq(keepCostEntries.gameId, gameId), gte(keepCostEntries.recordedAt, since)));
  return row!;
}

export async function getKeepCostOf(tx: Tx, source: KeepCostSource, sourceId: string) {
  const [row] = await tx
    .select()
    .from(keepCostEntries)
    .where(and(eq(keepCostEntries.tenantId, currentTenant), eq(keepCostEntries.source, source), eq(keepCostEntries.sourceId, sourceId)));
  return row;
}
