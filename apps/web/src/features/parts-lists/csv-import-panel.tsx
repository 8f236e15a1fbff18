// What a CSV file with problems would have brought in: every problem by row, and nothing taken into the table
// until the file is fixed and chosen again (or the import is cancelled).
import { FileWarning } from 'lucide-react';
import { GRID_COLUMNS, CSV_HEADER } from './parts-grid.ts';
import type { CsvImport } from './csv-import.ts';

export type ImportResult = CsvImport & { fileName: string };

/** A long list of problems shows its first ones; the count says how many more. */
const SHOWN_PROBLEMS = 200;

const columnLabel = (field: string) => GRID_COLUMNS.find((c) => c.field === field)?.label.toLowerCase() ?? null;

export function CsvImportPanel({ result, onChooseAgain, onCancel }: { result: ImportResult; onChooseAgain(): void; onCancel(): void }) {
  const { problems, rows, fileName } = result;
  const fileWide = problems.some((p) => p.row === 0);
  const rowsWithProblems = new Set(problems.filter((p) => p.row > 0).map((p) => p.row)).size;
  return (
    <section role="alert" aria-labelledby="csv-import-heading" className="grid gap-2 rounded-md border border-down bg-down-tint p-3">
      <h3 id="csv-import-heading" className="flex items-center gap-2 font-bold text-down">
        <FileWarning aria-hidden className="size-5" />
        {fileName}: nothing imported yet
      </h3>
      <p className="text-ink">
        {fileWide ? 'The file cannot be read as a parts list.' : `${rowsWithProblems} of ${rows.length} rows have problems.`} Fix them in
        the file and choose it again; the table stays as it is until then.
      </p>
      <ul className="max-h-72 overflow-auto rounded border border-paper-line bg-white p-2 text-sm">
        {problems.slice(0, SHOWN_PROBLEMS).map((p, i) => (
          <li key={i} className="border-b border-paper-line py-1 last:border-b-0">
            {p.row > 0 ? (
              <strong className="tabular">
                Row {p.row}
                {p.designator && ` (${p.designator})`}
              </strong>
            ) : (
              <strong>File</strong>
            )}
            {columnLabel(p.field) && <span className="text-ink-soft"> · {columnLabel(p.field)}</span>}: {p.message}
          </li>
        ))}
        {problems.length > SHOWN_PROBLEMS && <li className="py-1 text-ink-soft">…and {problems.length - SHOWN_PROBLEMS} more.</li>}
      </ul>
      {fileWide && <p className="text-sm text-ink-soft">The first line must name the columns: {CSV_HEADER}.</p>}
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn-primary" onClick={onChooseAgain}>
          Choose the corrected file
        </button>
        <button type="button" className="btn-secondary" onClick={onCancel}>
          Cancel import
        </button>
      </div>
    </section>
  );
}
