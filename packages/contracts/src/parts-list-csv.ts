// The parts list's CSV file, as the API writes it and the web app reads it back, and the most rows a list holds.
// No zod here: the web app's import runs in the browser.

/** The most rows one parts list may hold: far above any real board, low enough to keep a save quick. */
export const MAX_PARTS_PER_BOARD = 2000;

/**
 * A cell starting with =, +, -, @, tab or CR is read as a formula by spreadsheet programs, and notes typed by
 * anyone reach the file, so the export puts an apostrophe before such a cell (OWASP, "CSV Injection").
 */
export const CSV_FORMULA_START = /^[=+\-@\t\r]/;

/** A cell as our own export neutralised it, read back as typed ("'+80/-20%" → "+80/-20%"). */
export function cellFromCsv(cell: string): string {
  return cell.startsWith("'") && CSV_FORMULA_START.test(cell.slice(1)) ? cell.slice(1) : cell;
}

/** "Comet Carnival" + "Power supply" → "comet-carnival-power-supply-parts.csv". */
export function partsListFileName(modelTitle: string, boardName: string): string {
  const slug = `${modelTitle} ${boardName}`
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return `${slug || 'board'}-parts.csv`;
}
