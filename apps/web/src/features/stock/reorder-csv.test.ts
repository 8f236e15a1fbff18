import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { REORDER_CSV_COLUMNS, reorderCsv } from './reorder-csv.ts';

describe('reorderCsv', () => {
  it('writes one row per line with its supplier, and neutralises a formula in a typed name', () => {
    const line = {
      locationId: '00000000-0000-4000-8000-000000000001',
      locationName: 'Shop shelves',
      cataloguePartId: '00000000-0000-4000-8000-000000000002',
      partNumber: 'F-T2.5A',
      description: '=HYPERLINK("x")',
      unit: 'each' as const,
      quantity: 3,
      reorderPoint: 5,
      orderQuantity: 20,
      unitCostCents: 45,
      lineCostCents: 900,
    };
    const csv = reorderCsv({ groups: [{ supplier: 'Fuse Barn', lines: [line], totalCents: 900 }] });
    const rows = Papa.parse<string[]>(csv.trim()).data;
    expect(rows).toHaveLength(2);
    expect(rows[0]).toEqual(REORDER_CSV_COLUMNS);
    expect(rows[1]).toEqual(['Fuse Barn', 'F-T2.5A', `'=HYPERLINK("x")`, 'Shop shelves', '3', '5', '20', 'each', '0.45', '9.00']);
  });
});
