// Every reading ever taken on a board's parts: a part's drift across overhauls.
import { and, asc, eq, sql } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { partReadings } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

export type PartReadingInsert = Omit<typeof partReadings.$inferInsert, 'tenantId' | 'id'>;

/**
 * All readings on one board, by part and then oldest first: one range of part_readings_tenant_instance_part_idx
 * (tenant, board instance, part, taken at), so the rows come back in the index's order without a sort.
 */
export async function listReadingsOfBoardInstance(tx: Tx, boardInstanceId: string) {
  return tx
    .select({
      id: partReadings.id,
      partId: partReadings.partId,
      takenAt: partReadings.takenAt,
      measuredText: partReadings.measuredText,
      measured: partReadings.measured,
      unit: partReadings.unit,
      verdict: partReadings.verdict,
      min: partReadings.min,
      max: partReadings.max,
      deviationPercent: partReadings.deviationPercent,
      indicative: partReadings.indicative,
      inCircuit: partReadings.inCircuit,
      benchJobId: partReadings.benchJobId,
    })
    .from(partReadings)
    .where(and(eq(partReadings.tenantId, currentTenant), eq(partReadings.boardInstanceId, boardInstanceId)))
    .orderBy(asc(partReadings.partId), asc(partReadings.takenAt), asc(partReadings.id));
}

/** Records readings, each already judged against the parts list by the domain code. */
export async function insertPartReadings(tx: Tx, rows: readonly PartReadingInsert[]) {
  if (rows.length === 0) return;
  await tx.insert(partReadings).values(rows.map((r) => ({ ...r, tenantId: sql`${currentTenant}` })));
}
