// CSV for exports. A cell that starts with =, +, -, @, tab or CR is read as a formula by spreadsheet
// programs, and names typed by anyone (venues, models, people) reach our exports, so such cells are
// neutralised with a leading apostrophe (OWASP, "CSV Injection"). papaparse's own default pattern misses
// a formula followed by a line break, so we give it a pattern that looks at the first character only.
import Papa from 'papaparse';

const FORMULA_START = /^[=+\-@\t\r]/;

export function toCsv(headers: string[], rows: (string | number | null)[][]): string {
  return Papa.unparse({ fields: headers, data: rows.map((r) => r.map((cell) => cell ?? '')) }, { escapeFormulae: FORMULA_START });
}
