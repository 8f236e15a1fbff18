// The one table: search, sortable headers, keyset paging and CSV export, with loading/empty/error states.
import { ArrowDown, ArrowUp, ArrowUpDown, ChevronLeft, ChevronRight, Download, Search } from 'lucide-react';
import { useEffect, useState, type ReactNode } from 'react';
import { toCsv } from '../lib/csv.ts';
import { Empty, ErrorState, Loading } from './states.tsx';
import { inputClass } from './field.tsx';

export interface Column<T, S extends string> {
  header: string;
  cell: (row: T) => ReactNode;
  /** The API sort key, when this column can be sorted. */
  sort?: S;
  /** The value written to the CSV export. */
  csv: (row: T) => string | number | null;
  className?: string;
}

export interface DataTableProps<T, S extends string> {
  caption: string;
  columns: Column<T, S>[];
  rows: T[] | undefined;
  rowKey: (row: T) => string;
  isLoading: boolean;
  error: unknown;
  onRetry: () => void;
  search: string;
  onSearch: (q: string) => void;
  searchLabel: string;
  sort: S;
  order: 'asc' | 'desc';
  onSort: (s: S) => void;
  onSortSet: (s: S, order: 'asc' | 'desc') => void;
  hasPrev: boolean;
  hasNext: boolean;
  onPrev: () => void;
  onNext: () => void;
  /** Fetches every row matching the current search and filters, for export. */
  exportAll: () => Promise<T[]>;
  exportName: string;
  emptyTitle: string;
  emptyHint?: ReactNode;
  filters?: ReactNode;
}

export function DataTable<T, S extends string>(p: DataTableProps<T, S>) {
  const [draft, setDraft] = useState(p.search);
  const [exporting, setExporting] = useState(false);
  // When the search changes from outside (back button, a link), show it in the box.
  const [shownSearch, setShownSearch] = useState(p.search);
  if (p.search !== shownSearch) {
    setShownSearch(p.search);
    setDraft(p.search);
  }
  // Search as the person types, without a request per keystroke.
  useEffect(() => {
    if (draft === p.search) return;
    const t = setTimeout(() => p.onSearch(draft), 300);
    return () => clearTimeout(t);
  }, [draft, p]);

  async function exportCsv() {
    setExporting(true);
    try {
      const all = await p.exportAll();
      const csv = toCsv(
        p.columns.map((c) => c.header),
        all.map((row) => p.columns.map((c) => c.csv(row))),
      );
      const url = URL.createObjectURL(new Blob([csv], { type: 'text/csv;charset=utf-8' }));
      const a = document.createElement('a');
      a.href = url;
      a.download = `${p.exportName}-${new Date().toISOString().slice(0, 10)}.csv`;
      a.click();
      URL.revokeObjectURL(url);
    } finally {
      setExporting(false);
    }
  }

  return (
    <section className="card p-0" aria-label={p.caption}>
      <div className="flex flex-wrap items-center gap-3 border-b border-paper-line p-3">
        <label className="relative min-w-56 flex-1">
          <span className="sr-only">{p.searchLabel}</span>
          <Search aria-hidden className="pointer-events-none absolute top-3 left-3 size-5 text-ink-muted" />
          <input
            type="search"
            className={`${inputClass} pl-10`}
            placeholder={p.searchLabel}
            value={draft}
            onChange={(e) => setDraft(e.target.value)}
          />
        </label>
        {p.filters}
        <div className="flex items-center gap-2 md:hidden">
          <span className="font-semibold" id="sort-label">
            Sort
          </span>
          <select
            aria-labelledby="sort-label"
            className={`${inputClass} w-auto`}
            value={`${p.sort}:${p.order}`}
            onChange={(e) => {
              const [s, o] = e.target.value.split(':') as [S, 'asc' | 'desc'];
              p.onSortSet(s, o);
            }}
          >
            {p.columns
              .filter((c) => c.sort)
              .flatMap((c) => [
                <option key={`${c.sort}:asc`} value={`${c.sort}:asc`}>
                  {c.header}, ascending
                </option>,
                <option key={`${c.sort}:desc`} value={`${c.sort}:desc`}>
                  {c.header}, descending
                </option>,
              ])}
          </select>
        </div>
        <button type="button" className="btn-secondary" onClick={exportCsv} disabled={exporting}>
          <Download aria-hidden className="size-4" /> {exporting ? 'Exporting…' : 'Export CSV'}
        </button>
      </div>
      {p.isLoading ? (
        <Loading />
      ) : p.error ? (
        <ErrorState error={p.error} onRetry={p.onRetry} />
      ) : !p.rows?.length ? (
        <Empty title={p.emptyTitle}>{p.emptyHint}</Empty>
      ) : (
        <>
          {/* On a phone each row is a card: the first column as its title, the rest as labelled values. */}
          <ul className="divide-y divide-paper-line md:hidden" aria-label={p.caption}>
            {p.rows.map((row) => (
              <li key={p.rowKey(row)} className="grid gap-1 px-3 py-3">
                <div className="text-lg">{p.columns[0]!.cell(row)}</div>
                <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
                  {p.columns.slice(1).map((c) => (
                    <div key={c.header} className="contents">
                      <dt className="font-semibold text-ink-soft">{c.header}</dt>
                      <dd>{c.cell(row)}</dd>
                    </div>
                  ))}
                </dl>
              </li>
            ))}
          </ul>
          <div className="hidden overflow-x-auto md:block">
            <table className="w-full text-left">
              <caption className="sr-only">{p.caption}</caption>
              <thead className="bg-paper-dim text-sm text-ink-soft">
                <tr>
                  {p.columns.map((c) => (
                    <th
                      key={c.header}
                      scope="col"
                      className={`px-3 py-2 font-bold ${c.className ?? ''}`}
                      aria-sort={c.sort && c.sort === p.sort ? (p.order === 'asc' ? 'ascending' : 'descending') : undefined}
                    >
                      {c.sort ? (
                        <button
                          type="button"
                          className="inline-flex items-center gap-1 font-bold hover:text-ink"
                          onClick={() => p.onSort(c.sort!)}
                        >
                          {c.header}
                          {c.sort === p.sort ? (
                            p.order === 'asc' ? (
                              <ArrowUp aria-hidden className="size-4" />
                            ) : (
                              <ArrowDown aria-hidden className="size-4" />
                            )
                          ) : (
                            <ArrowUpDown aria-hidden className="size-4 opacity-50" />
                          )}
                        </button>
                      ) : (
                        c.header
                      )}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {p.rows.map((row) => (
                  <tr key={p.rowKey(row)} className="border-t border-paper-line hover:bg-paper-dim/60">
                    {p.columns.map((c) => (
                      <td key={c.header} className={`px-3 py-2.5 align-middle ${c.className ?? ''}`}>
                        {c.cell(row)}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
      <nav aria-label="Pages" className="flex items-center justify-end gap-2 border-t border-paper-line p-3">
        <button type="button" className="btn-secondary" onClick={p.onPrev} disabled={!p.hasPrev}>
          <ChevronLeft aria-hidden className="size-4" /> Previous
        </button>
        <button type="button" className="btn-secondary" onClick={p.onNext} disabled={!p.hasNext}>
          Next <ChevronRight aria-hidden className="size-4" />
        </button>
      </nav>
    </section>
  );
}
