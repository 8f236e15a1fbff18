// What to order as a CSV file (one line per part and stock, its supplier first), written by the project's one CSV
// writer (papaparse, formula cells neutralised).
import type { ReorderList } from '@bumperline/contracts/stock';
import { toCsv } from '../../lib/csv.ts';

export const REORDER_CSV_COLUMNS = [
  'supplier',
  'part_number',
  'description',
  'stock',
  'held',
  'reorder_point',
  'order_quantity',
  'unit',
  'unit_cost',
  'line_cost',
];

export function reorderCsv(list: ReorderList): string {
  return toCsv(
    REORDER_CSV_COLUMNS,
    list.groups.flatMap((g) =>
      g.lines.map((l) => [
        g.supplier,
        l.partNumber,
        l.description,
        l.locationName,
        l.quantity,
        l.reorderPoint,
        l.orderQuantity,
        l.unit,
        (l.unitCostCents / 100).toFixed(2),
        (l.lineCostCents / 100).toFixed(2),
      ]),
    ),
  );
}
