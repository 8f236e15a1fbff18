// One row of the parts-list editor: a cell per column (the kind a list of part kinds), each showing its own
// problem under it. Rendered only while scrolled into view; memoised, so typing re-renders just its row.
import { memo, type ClipboardEvent, type FocusEvent, type KeyboardEvent } from 'react';
import { Trash2 } from 'lucide-react';
import { partKindLabels, partKinds } from '@bumperline/contracts/bench-vocabulary';
import { GRID_COLUMNS, type CellProblems, type GridField, type GridRow } from './parts-grid.ts';

export interface CellHandlers {
  onChange(key: string, field: GridField, value: string): void;
  onKeyDown(e: KeyboardEvent<HTMLInputElement | HTMLSelectElement>): void;
  onPaste(e: ClipboardEvent<HTMLInputElement>): void;
  onFocus(e: FocusEvent<HTMLInputElement | HTMLSelectElement>): void;
  onRemove(key: string): void;
}

/** Widths that keep a row on one line at desktop size; the table scrolls sideways on a phone. */
const WIDTHS: Record<GridField, string> = {
  designator: 'w-20',
  kind: 'w-56',
  value: 'w-40',
  tolerance: 'w-24',
  rating: 'w-28',
  ratedTemperatureC: 'w-20',
  ratedLifeHours: 'w-24',
  notes: 'w-64',
};

export const columnWidth = (field: GridField) => WIDTHS[field];

/** The designator stays in view while a narrow screen scrolls the other columns sideways. */
const STICKY_FIRST = 'sticky left-0 z-[1] bg-white';

const cellInput =
  'w-full rounded border border-transparent bg-transparent px-2 py-1.5 text-base text-ink hover:border-paper-line focus:border-ink focus:bg-white aria-[invalid=true]:border-down aria-[invalid=true]:bg-down-tint';

/** The id of a cell's problem message (aria-describedby). */
export const problemId = (key: string, field: string) => `part-${key}-${field}-problem`;

export const PartsGridRow = memo(function PartsGridRow({
  row,
  number,
  problems,
  readOnly,
  handlers,
  measure,
  index,
}: {
  row: GridRow;
  /** Its place in the whole list, 1-based. */
  number: number;
  problems: CellProblems | undefined;
  readOnly: boolean;
  handlers: CellHandlers;
  measure: (el: HTMLTableRowElement | null) => void;
  /** Its index among the rows shown (the virtual list's). */
  index: number;
}) {
  const name = row.designator.trim() || `row ${number}`;
  return (
    <tr ref={measure} data-index={index} className="border-b border-paper-line align-top">
      <th scope="row" className="w-10 px-2 pt-3 text-right font-normal text-ink-muted tabular">
        {number}
      </th>
      {GRID_COLUMNS.map((column, col) => {
        // A problem with the row as a whole shows under its first cell.
        const problem = problems?.[column.field] ?? (col === 0 ? problems?.row : undefined);
        const common = {
          'aria-label': `${column.label} of ${name}`,
          'aria-invalid': !!problem,
          'aria-describedby': problem ? problemId(row.key, column.field) : undefined,
          'data-key': row.key,
          'data-col': col,
          onKeyDown: handlers.onKeyDown,
          onFocus: handlers.onFocus,
        };
        return (
          <td key={column.field} className={`${columnWidth(column.field)} p-1 ${col === 0 ? STICKY_FIRST : ''}`}>
            {column.field === 'kind' ? (
              <select
                {...common}
                className={`${cellInput} pr-6`}
                value={row.kind}
                disabled={readOnly}
                onChange={(e) => handlers.onChange(row.key, 'kind', e.target.value)}
              >
                {partKinds.map((kind) => (
                  <option key={kind} value={kind}>
                    {partKindLabels[kind]}
                  </option>
                ))}
                {!(partKinds as readonly string[]).includes(row.kind) && <option value={row.kind}>{row.kind || '(none)'}</option>}
              </select>
            ) : (
              <input
                {...common}
                className={`${cellInput} ${column.field === 'ratedTemperatureC' || column.field === 'ratedLifeHours' ? 'tabular text-right' : ''}`}
                value={row[column.field]}
                readOnly={readOnly}
                autoComplete="off"
                spellCheck={false}
                inputMode={column.field === 'ratedTemperatureC' || column.field === 'ratedLifeHours' ? 'numeric' : undefined}
                placeholder={row.designator === '' && row.value === '' ? column.hint : undefined}
                onChange={(e) => handlers.onChange(row.key, column.field, e.target.value)}
                onPaste={handlers.onPaste}
              />
            )}
            {problem && (
              <p id={problemId(row.key, column.field)} className="px-2 pt-0.5 text-sm leading-snug font-semibold text-down">
                {problem}
              </p>
            )}
          </td>
        );
      })}
      <td className="w-12 p-1">
        {!readOnly && (
          <button
            type="button"
            className="inline-flex size-11 items-center justify-center rounded text-ink-muted hover:bg-down-tint hover:text-down"
            aria-label={`Remove ${name}`}
            onClick={() => handlers.onRemove(row.key)}
          >
            <Trash2 aria-hidden className="size-4" />
          </button>
        )}
      </td>
    </tr>
  );
});
