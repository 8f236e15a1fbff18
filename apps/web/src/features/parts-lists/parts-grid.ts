// The parts-list editor's own logic, apart from React: the rows as typed, their problems (judged by the domain's
// rowsFromRecords and checkPartsList, the same code the API runs), where a key press moves, what a paste from a
// spreadsheet fills, and the filter.
import Papa from 'papaparse';
import { partKindLabels, partKinds, type PartKind } from '@bumperline/contracts/bench-vocabulary';
import type { PartRow, PartRowInput } from '@bumperline/contracts/parts-lists';
import { PARTS_LIST_COLUMNS, rowsFromRecords, type PartsListColumn } from '@bumperline/domain/components/parts-list-columns';
import { checkPartsList, readPartKind, type PartEntryInput } from '@bumperline/domain/components/parts-list-entry';

export type GridField = 'designator' | 'kind' | 'value' | 'tolerance' | 'rating' | 'ratedTemperatureC' | 'ratedLifeHours' | 'notes';

/** The editor's columns, left to right: the CSV's columns in the same order. */
export const GRID_COLUMNS: readonly { field: GridField; csv: PartsListColumn; label: string; hint: string }[] = [
  { field: 'designator', csv: 'designator', label: 'Designator', hint: 'R12' },
  { field: 'kind', csv: 'kind', label: 'Kind', hint: '' },
  { field: 'value', csv: 'value', label: 'Value', hint: '4k7, 100µF, T2.5A 250V' },
  { field: 'tolerance', csv: 'tolerance', label: 'Tolerance', hint: '5%, J' },
  { field: 'rating', csv: 'rating', label: 'Rating', hint: '1/4 W, 35 V' },
  { field: 'ratedTemperatureC', csv: 'rated_temperature_c', label: 'Rated °C', hint: '105' },
  { field: 'ratedLifeHours', csv: 'rated_life_hours', label: 'Rated life (h)', hint: '2000' },
  { field: 'notes', csv: 'notes', label: 'Notes', hint: '' },
];
export const GRID_FIELDS: readonly GridField[] = GRID_COLUMNS.map((c) => c.field);

/** One row of the editor: every cell as typed (numbers too), so nothing a person typed is ever lost. */
export interface GridRow {
  /** Stable while the row is edited (React key, focus, problems). */
  key: string;
  /** The saved part's id, when it came from the server. */
  id?: string;
  designator: string;
  /** A part kind's code, or text pasted that is not one (shown and reported as it is). */
  kind: string;
  value: string;
  tolerance: string;
  rating: string;
  ratedTemperatureC: string;
  ratedLifeHours: string;
  notes: string;
}

export type KeyMaker = () => string;

export function blankRow(key: string): GridRow {
  return {
    key,
    designator: '',
    kind: 'resistor',
    value: '',
    tolerance: '',
    rating: '',
    ratedTemperatureC: '',
    ratedLifeHours: '',
    notes: '',
  };
}

export function gridRowFromPart(part: PartRow | PartRowInput, key: string): GridRow {
  return {
    key,
    id: part.id,
    designator: part.designator,
    kind: part.kind,
    value: part.value,
    tolerance: part.tolerance ?? '',
    rating: part.rating ?? '',
    ratedTemperatureC: part.ratedTemperatureC == null ? '' : String(part.ratedTemperatureC),
    ratedLifeHours: part.ratedLifeHours == null ? '' : String(part.ratedLifeHours),
    notes: part.notes ?? '',
  };
}

export function gridRowFromEntry(entry: PartEntryInput, key: string): GridRow {
  return gridRowFromPart({ ...entry, kind: entry.kind as PartKind }, key);
}

/** A row with nothing typed but its kind: left out of the check and the save, as a spreadsheet's empty line. */
export function isBlankRow(row: GridRow): boolean {
  return GRID_FIELDS.every((field) => field === 'kind' || row[field].trim() === '');
}

function toRecord(row: GridRow): Record<string, string> {
  return Object.fromEntries(GRID_COLUMNS.map((c) => [c.csv, row[c.field]]));
}

export type CellProblems = Partial<Record<GridField | 'row', string>>;

export interface GridCheck {
  /** Problems by row key, the first message per cell. */
  problems: Map<string, CellProblems>;
  /** How many cells (or rows) have a problem. */
  count: number;
  /** The filled rows in order, as the API takes them (meaningful when count is 0). */
  parts: PartRowInput[];
  /** The row key of each of `parts`: the API's `parts.<i>.<column>` errors point back through it. */
  keys: string[];
}

function addProblem(problems: Map<string, CellProblems>, key: string, field: string, message: string): boolean {
  const cells = problems.get(key) ?? {};
  const name = (GRID_FIELDS as readonly string[]).includes(field) ? (field as GridField) : 'row';
  if (cells[name]) return false;
  problems.set(key, { ...cells, [name]: message });
  return true;
}

/** Every filled row judged as the API will judge it: number cells read, then each row and repeated designators. */
export function checkGrid(rows: readonly GridRow[]): GridCheck {
  const filled = rows.filter((row) => !isBlankRow(row));
  const problems = new Map<string, CellProblems>();
  if (filled.length === 0) return { problems, count: 0, parts: [], keys: [] };
  // No filled row is blank to rowsFromRecords either, so its rows line up with `filled`.
  const read = rowsFromRecords(filled.map(toRecord));
  let count = 0;
  for (const p of [...read.problems, ...checkPartsList(read.rows)]) {
    const key = filled[p.row]?.key;
    if (key && addProblem(problems, key, p.field, p.message)) count += 1;
  }
  const parts = read.rows.map((entry, i) => ({ ...entry, kind: entry.kind as PartKind, notes: entry.notes ?? '', id: filled[i]!.id }));
  return { problems, count, parts, keys: filled.map((row) => row.key) };
}

/** The API's field errors (`parts.<i>.<column>`) on the rows they name. */
export function problemsFromServer(
  errors: readonly { field: string; message: string }[],
  keys: readonly string[],
): Map<string, CellProblems> {
  const problems = new Map<string, CellProblems>();
  for (const e of errors) {
    const m = /^parts\.(\d+)(?:\.(\w+))?$/.exec(e.field);
    const key = m ? keys[Number(m[1])] : undefined;
    if (key) addProblem(problems, key, m?.[2] ?? 'row', e.message);
  }
  return problems;
}

export type Move = 'up' | 'down' | 'left' | 'right' | 'next' | 'previous';

export interface KeyPress {
  key: string;
  shiftKey: boolean;
  altKey: boolean;
  ctrlKey: boolean;
  metaKey: boolean;
}

/**
 * Where a key press moves, as in a spreadsheet: arrows (left and right only from the edge of the text, so the
 * caret still moves inside a cell), Enter down and Shift+Enter up, Tab and Shift+Tab along the row.
 */
export function moveForKey(press: KeyPress, caret: { atStart: boolean; atEnd: boolean }): Move | null {
  if (press.ctrlKey || press.metaKey || press.altKey) return null;
  switch (press.key) {
    case 'ArrowUp':
      return 'up';
    case 'ArrowDown':
      return 'down';
    case 'ArrowLeft':
      return caret.atStart ? 'left' : null;
    case 'ArrowRight':
      return caret.atEnd ? 'right' : null;
    case 'Enter':
      return press.shiftKey ? 'up' : 'down';
    case 'Tab':
      return press.shiftKey ? 'previous' : 'next';
    default:
      return null;
  }
}

export interface CellPosition {
  /** Index into the rows shown (the filtered order). */
  row: number;
  col: number;
}

/** The cell a move lands on; null past the edge of the grid (the caller may add a row, or let focus leave). */
export function moveCell(at: CellPosition, move: Move, rowCount: number, colCount = GRID_FIELDS.length): CellPosition | null {
  const { row, col } = at;
  switch (move) {
    case 'up':
      return row > 0 ? { row: row - 1, col } : null;
    case 'down':
      return row < rowCount - 1 ? { row: row + 1, col } : null;
    case 'left':
      return col > 0 ? { row, col: col - 1 } : null;
    case 'right':
      return col < colCount - 1 ? { row, col: col + 1 } : null;
    case 'next':
      if (col < colCount - 1) return { row, col: col + 1 };
      return row < rowCount - 1 ? { row: row + 1, col: 0 } : null;
    case 'previous':
      if (col > 0) return { row, col: col - 1 };
      return row > 0 ? { row: row - 1, col: colCount - 1 } : null;
  }
}

/**
 * Text pasted into a cell read as rows of cells, when it is more than one cell: lines and tabs as a spreadsheet
 * copies them, or comma-separated lines. A header line naming our columns is dropped. Null for a plain value
 * (even one with commas, such as "1 A, 400 V"), which the cell takes as typed.
 */
export function parsePastedRows(text: string): string[][] | null {
  const body = text.replace(/(\r?\n)+$/, '');
  if (!/[\t\r\n]/.test(body)) return null;
  const parsed = Papa.parse<string[]>(body, { delimiter: body.includes('\t') ? '\t' : ',', skipEmptyLines: 'greedy' });
  const lines = parsed.data.map((cells) => cells.map((cell) => cell.trim()));
  const first = (lines[0] ?? []).map((cell) => cell.toLowerCase());
  const isHeader = first.includes('designator') || (first.includes('kind') && first.includes('value'));
  return isHeader ? lines.slice(1) : lines;
}

/** A pasted kind: its code when the text names one (label or code), otherwise the text itself, to be reported. */
function pastedKind(text: string): string {
  try {
    return readPartKind(text);
  } catch {
    return text;
  }
}

/**
 * Fills rows from the cell at `at` rightwards and downwards in the order shown (`order`, row keys), adding rows at
 * the end when the paste runs past the last one. Cells past the last column are dropped.
 */
export function applyPaste(
  rows: readonly GridRow[],
  order: readonly string[],
  at: { key: string; col: number },
  lines: readonly string[][],
  makeKey: KeyMaker,
): { rows: GridRow[]; order: string[]; filled: number } {
  const byKey = new Map(rows.map((row) => [row.key, row]));
  const next = [...rows];
  const shown = [...order];
  const start = Math.max(0, shown.indexOf(at.key));
  lines.forEach((cells, i) => {
    let key = shown[start + i];
    if (key === undefined) {
      const added = blankRow(makeKey());
      next.push(added);
      shown.push(added.key);
      byKey.set(added.key, added);
      key = added.key;
    }
    const row = { ...byKey.get(key)! };
    cells.forEach((cell, j) => {
      const field = GRID_FIELDS[at.col + j];
      if (field) row[field] = field === 'kind' ? pastedKind(cell) : cell;
    });
    byKey.set(key, row);
  });
  return { rows: next.map((row) => byKey.get(row.key)!), order: shown, filled: lines.length };
}

/**
 * The rows whose cells (or kind's label) contain the text, any case; all rows for an empty filter. A blank row
 * always shows: it is the one being typed into.
 */
export function filterRows(rows: readonly GridRow[], text: string): GridRow[] {
  const wanted = text.trim().toLowerCase();
  if (!wanted) return [...rows];
  return rows.filter(
    (row) =>
      isBlankRow(row) ||
      GRID_FIELDS.some((field) => {
        const cell = field === 'kind' ? `${row.kind} ${kindLabel(row.kind)}` : row[field];
        return cell.toLowerCase().includes(wanted);
      }),
  );
}

export function kindLabel(kind: string): string {
  return (partKinds as readonly string[]).includes(kind) ? partKindLabels[kind as PartKind] : kind;
}

/** The CSV header the import expects, for messages. */
export const CSV_HEADER = PARTS_LIST_COLUMNS.join(', ');
