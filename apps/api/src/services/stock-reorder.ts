// What to order: every level at or below its reorder point, with how many to order and what it costs, grouped by
// supplier (the order each supplier gets).
import type { Tx } from '@bumperline/db/client';
import type { ReorderList } from '@bumperline/contracts/stock';
import { listLowLevels } from '@bumperline/db/queries/stock-levels';
import { lineCostCents, orderQuantity } from '@bumperline/domain/stock/quantity-rules';

export async function reorderList(tx: Tx): Promise<ReorderList> {
  const rows = await listLowLevels(tx);
  const groups = new Map<string, ReorderList['groups'][number]>();
  for (const row of rows) {
    const order = orderQuantity(row.unit, row.quantity, row.reorderPoint, row.reorderQuantity);
    const line = {
      locationId: row.locationId,
      locationName: row.locationName,
      cataloguePartId: row.cataloguePartId,
      partNumber: row.partNumber,
      description: row.description,
      unit: row.unit,
      quantity: row.quantity,
      reorderPoint: row.reorderPoint,
      orderQuantity: order,
      unitCostCents: row.unitCostCents,
      lineCostCents: lineCostCents(order, row.unitCostCents),
    };
    const group = groups.get(row.supplier) ?? { supplier: row.supplier, lines: [], totalCents: 0 };
    group.lines.push(line);
    group.totalCents += line.lineCostCents;
    groups.set(row.supplier, group);
  }
  return { groups: [...groups.values()] };
}
