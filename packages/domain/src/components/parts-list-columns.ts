import { DomainError, isDomainError } from '../errors.ts';
import { readPartKind, type PartEntryInput, type RowProblem } from './parts-list-entry.ts';

/**
 * A parts list as CSV records (the callers parse the file with papaparse, `header: true`, and pass the records):
 * the header is checked, number cells are read, a kind may be its code or its label. The rows then go through
 * checkPartsList like rows typed into the table.
 */

/** The CSV header, in the order an export writes it. */
export const PARTS_LIST_COLUMNS = [
  'designator',
  'kind',
  'value',
  'tolerance',
  'rating',
  'rated_temperature_c',
  'rated_life_hours',
  'notes',
] as const;
export type PartsListColumn = (typeof PARTS_LIST_COLUMNS)[number];

/** Columns a file may leave out: an empty notes column is often dropped by spreadsheets. */
const OPTIONAL_COLUMNS: readonly PartsListColumn[] = ['notes'];

/** Column names as people write them in a header: "Rated temperature (°C)" or "rated-life-hours" still match. */
function columnKey(header: string): string {
  return header
    .trim()
    .toLowerCase()
    .replace(/\(.*?\)/g, '')
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '');
}

const HEADER_ALIASES: Readonly<Record<string, PartsListColumn>> = {
  designator: 'designator',
  reference: 'designator',
  ref: 'designator',
  reference_designator: 'designator',
  kind: 'kind',
  value: 'value',
  tolerance: 'tolerance',
  rating: 'rating',
  rated_temperature_c: 'rated_temperature_c',
  rated_temperature: 'rated_temperature_c',
  rated_life_hours: 'rated_life_hours',
  rated_life: 'rated_life_hours',
  rated_life_h: 'rated_life_hours',
  notes: 'notes',
};

/** Empty stays empty (null); "105", "105 °C", "2000 h", "2,000" become numbers; anything else is a problem. */
function readNumberCell(text: string, field: 'ratedTemperatureC' | 'ratedLifeHours'): number | null {
  const cell = text.trim();
  if (cell === '') return null;
  const unit = field === 'ratedTemperatureC' ? /\s*°?\s*C$/i : /\s*(h|hours?)$/i;
  const bare = cell.replace(unit, '').replace(/(\d),(\d{3})(?!\d)/g, '$1$2');
  if (!/^[-+\u2212]?\d+(\.\d+)?$/.test(bare)) {
    throw new DomainError(
      'not-a-number',
      field === 'ratedTemperatureC'
        ? `“${cell}” is not a temperature: write the °C printed on the sleeve, e.g. 105`
        : `“${cell}” is not a number of hours: write the rated life, e.g. 2000`,
      field,
    );
  }
  return Number(bare.replace('−', '-'));
}

function cellOf(record: Record<string, string>, headerFor: ReadonlyMap<PartsListColumn, string>, column: PartsListColumn): string {
  const header = headerFor.get(column);
  const value = header === undefined ? undefined : record[header];
  return typeof value === 'string' ? value : value === undefined || value === null ? '' : String(value);
}

function isBlankRecord(record: Record<string, string>): boolean {
  return Object.values(record).every((value) => value === undefined || value === null || String(value).trim() === '');
}

/**
 * Records (header → cell) to parts-list rows. A missing column is one problem on row 0 with field `columns`, and no
 * rows are returned; unreadable number cells are problems on their row (the cell then reads as empty). Fully blank
 * lines, which spreadsheets leave at the end of a file, are skipped. Row numbers index the returned rows.
 */
export function rowsFromRecords(records: Record<string, string>[]): { rows: PartEntryInput[]; problems: RowProblem[] } {
  if (!Array.isArray(records)) throw new DomainError('missing-input', 'records must be a list', 'records');
  const kept = records.filter((record) => record !== null && typeof record === 'object' && !isBlankRecord(record));
  const headers = new Set<string>();
  for (const record of kept.length > 0 ? kept : records) {
    if (record && typeof record === 'object') for (const key of Object.keys(record)) headers.add(key);
  }
  const headerFor = new Map<PartsListColumn, string>();
  for (const header of headers) {
    const column = HEADER_ALIASES[columnKey(header)];
    if (column && !headerFor.has(column)) headerFor.set(column, header);
  }
  const missing = PARTS_LIST_COLUMNS.filter((column) => !headerFor.has(column) && !OPTIONAL_COLUMNS.includes(column));
  if (missing.length > 0) {
    return {
      rows: [],
      problems: [
        {
          row: 0,
          field: 'columns',
          message: `missing column${missing.length === 1 ? '' : 's'} ${missing.join(', ')} (the header must name ${PARTS_LIST_COLUMNS.join(', ')})`,
        },
      ],
    };
  }

  const problems: RowProblem[] = [];
  const rows = kept.map((record, row): PartEntryInput => {
    const number = (column: PartsListColumn, field: 'ratedTemperatureC' | 'ratedLifeHours'): number | null => {
      try {
        return readNumberCell(cellOf(record, headerFor, column), field);
      } catch (error) {
        if (!isDomainError(error)) throw error;
        problems.push({ row, field, message: error.message });
        return null;
      }
    };
    const kindText = cellOf(record, headerFor, 'kind').trim();
    let kind = kindText;
    try {
      kind = readPartKind(kindText);
    } catch {
      // Left as written: checkPartsList reports it with the list of kinds.
    }
    const notes = cellOf(record, headerFor, 'notes').trim();
    return {
      designator: cellOf(record, headerFor, 'designator').trim(),
      kind,
      value: cellOf(record, headerFor, 'value').trim(),
      tolerance: cellOf(record, headerFor, 'tolerance').trim(),
      rating: cellOf(record, headerFor, 'rating').trim(),
      ratedTemperatureC: number('rated_temperature_c', 'ratedTemperatureC'),
      ratedLifeHours: number('rated_life_hours', 'ratedLifeHours'),
      notes,
    };
  });
  return { rows, problems };
}

/** Rows back to records under PARTS_LIST_COLUMNS, for an export (papaparse's `unparse` writes them). */
export function recordsFromRows(rows: readonly PartEntryInput[]): Record<PartsListColumn, string>[] {
  return rows.map((row) => ({
    designator: row.designator,
    kind: row.kind,
    value: row.value,
    tolerance: row.tolerance,
    rating: row.rating,
    rated_temperature_c: row.ratedTemperatureC === null ? '' : String(row.ratedTemperatureC),
    rated_life_hours: row.ratedLifeHours === null ? '' : String(row.ratedLifeHours),
    notes: row.notes ?? '',
  }));
}
