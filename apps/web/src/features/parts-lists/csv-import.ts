// A parts list read from a CSV file in the browser: papaparse reads the file, the domain's rowsFromRecords reads
// the header and the number cells, and checkPartsList judges every row, as the API will on save.
import Papa from 'papaparse';
import { cellFromCsv, MAX_PARTS_PER_BOARD } from '@bumperline/contracts/parts-list-csv';
import { rowsFromRecords } from '@bumperline/domain/components/parts-list-columns';
import { checkPartsList, type PartEntryInput } from '@bumperline/domain/components/parts-list-entry';

export interface ImportProblem {
  /** 1-based row of the file's data (the header is not counted); 0 for the file as a whole. */
  row: number;
  designator: string;
  field: string;
  message: string;
}

export interface CsvImport {
  rows: PartEntryInput[];
  problems: ImportProblem[];
}

/** The file's rows and every problem in them; the rows replace the editor's only when there is none. */
export function readPartsCsv(text: string, maxRows = MAX_PARTS_PER_BOARD): CsvImport {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: 'greedy', transform: cellFromCsv });
  const { rows, problems } = rowsFromRecords(parsed.data);
  const designatorOf = (row: number) => rows[row]?.designator ?? '';
  const found: ImportProblem[] = [];
  const columnProblem = problems.find((p) => p.field === 'columns');
  if (columnProblem) return { rows: [], problems: [{ row: 0, designator: '', field: 'columns', message: columnProblem.message }] };
  if (rows.length > maxRows) {
    return {
      rows: [],
      problems: [
        {
          row: 0,
          designator: '',
          field: 'rows',
          message: `the file has ${rows.length} parts; a parts list holds at most ${maxRows.toLocaleString('en-US')}`,
        },
      ],
    };
  }
  for (const e of parsed.errors) {
    const row = e.row ?? 0;
    const message =
      e.code === 'TooFewFields' || e.code === 'TooManyFields'
        ? `this line has a different number of cells than the header (${e.message.replace(/^Too (few|many) fields: /, '')})`
        : e.message;
    found.push({ row: row + 1, designator: designatorOf(row), field: 'row', message });
  }
  // One message per cell: an unreadable number cell's own, rather than the "give the rated temperature" that follows it.
  const seen = new Set<string>();
  for (const p of [...problems, ...checkPartsList(rows)]) {
    const cell = `${p.row}:${p.field}`;
    if (seen.has(cell)) continue;
    seen.add(cell);
    found.push({ row: p.row + 1, designator: designatorOf(p.row), field: p.field, message: p.message });
  }
  found.sort((x, y) => x.row - y.row);
  return { rows, problems: found };
}
