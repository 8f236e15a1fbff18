// A finished bench job's catalogue parts come off the finisher's van, in the finish's transaction: one 'used'
// movement per line, linked to the job. Too few on the van refuses the finish (409 naming the line's quantity).
import type { Tx } from '@bumperline/db/client';
import { findStockLocationForMove } from '@bumperline/db/queries/stock-locations';
import { ensureVan } from './vans.ts';
import { partForMove, useStock } from './stock-moves.ts';
import { Conflict, InvalidInput } from './workflow-errors.ts';

export async function takeBenchPartsOffVan(
  tx: Tx,
  actor: { userId: string },
  jobId: string,
  partsUsed: readonly { cataloguePartId?: string | null | undefined; quantity: number; description: string }[],
): Promise<void> {
  const lines = partsUsed.map((u, index) => ({ ...u, index })).filter((u) => u.cataloguePartId);
  if (lines.length === 0) return;
  const van = await ensureVan(tx, actor.userId);
  const location = (await findStockLocationForMove(tx, van.id))!;
  for (const line of lines) {
    const field = `partsUsed.${line.index}`;
    try {
      const part = await partForMove(tx, line.cataloguePartId!, `${field}.cataloguePartId`);
      await useStock(
        tx,
        { userId: actor.userId, role: 'technician' },
        { part, location, quantity: line.quantity, job: { benchJobId: jobId } },
      );
    } catch (err) {
      // Name the line: the draft has many, and the screen puts the message beside the one at fault.
      if (err instanceof Conflict)
        throw new Conflict(
          err.message,
          err.current,
          (err.fields ?? []).map((f) => ({ ...f, field: `${field}.${f.field}` })),
        );
      if (err instanceof InvalidInput)
        throw new InvalidInput(err.fields.map((f) => (f.field.startsWith(field) ? f : { ...f, field: `${field}.${f.field}` })));
      throw err;
    }
  }
}
