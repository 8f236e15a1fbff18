// A board's parts list as a table that works like a spreadsheet: arrows, Enter and Tab move between cells,
// typing edits, rows pasted from a spreadsheet fill from the current cell, every cell shows its problem as it is
// typed, and the whole list is saved at the version it was opened at (a save by someone else in between is
// reported, never overwritten silently). A CSV file can be imported once it has no problems, and exported.
import { useCallback, useDeferredValue, useEffect, useId, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { useBlocker } from 'react-router-dom';
import { useVirtualizer } from '@tanstack/react-virtual';
import { AlertTriangle, Download, Plus, Save, Search, Upload } from 'lucide-react';
import type { BoardPartsList } from '@bumperline/contracts/parts-lists';
import { ApiError } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { inputClass } from '../../components/field.tsx';
import { useReloadPartsList, useSavePartsList } from '../../api/parts-lists.ts';
import {
  applyPaste,
  blankRow,
  checkGrid,
  filterRows,
  GRID_COLUMNS,
  gridRowFromEntry,
  gridRowFromPart,
  moveCell,
  moveForKey,
  parsePastedRows,
  problemsFromServer,
  type CellProblems,
  type GridField,
  type GridRow,
} from './parts-grid.ts';
import { columnWidth, PartsGridRow, type CellHandlers } from './parts-grid-row.tsx';
import { CsvImportPanel, type ImportResult } from './csv-import-panel.tsx';
import { readPartsCsv } from './csv-import.ts';

let keySeed = 0;
const newKey = () => `r${(keySeed += 1)}`;

const rowsOf = (list: BoardPartsList) => list.parts.map((p) => gridRowFromPart(p, newKey()));

type Notice = { tone: 'ok' | 'error'; text: string; undo?: () => void } | null;

const plural = (n: number, one: string, many: string) => `${n.toLocaleString('en-US')} ${n === 1 ? one : many}`;

export function PartsListEditor({ list, readOnly }: { list: BoardPartsList; readOnly: boolean }) {
  const boardId = list.board.id;
  const [rows, setRows] = useState<GridRow[]>(() => rowsOf(list));
  const [version, setVersion] = useState(list.version);
  const [dirty, setDirty] = useState(false);
  const [filter, setFilter] = useState('');
  const shownFilter = useDeferredValue(filter);
  const [serverProblems, setServerProblems] = useState<Map<string, CellProblems>>(new Map());
  const [notice, setNotice] = useState<Notice>(null);
  const [conflict, setConflict] = useState<BoardPartsList | null>(null);
  const [importing, setImporting] = useState<ImportResult | null>(null);
  const save = useSavePartsList(boardId);
  const reload = useReloadPartsList(boardId);
  const scrollRef = useRef<HTMLDivElement>(null);
  const fileRef = useRef<HTMLInputElement>(null);
  const filterId = useId();

  const check = useMemo(() => checkGrid(rows), [rows]);
  const shown = useMemo(() => filterRows(rows, shownFilter), [rows, shownFilter]);
  const numberOf = useMemo(() => new Map(rows.map((r, i) => [r.key, i + 1])), [rows]);

  // Latest values for the handlers, which stay the same functions so that rows re-render only when they change.
  const latest = useRef({ rows, shown });
  useLayoutEffect(() => {
    latest.current = { rows, shown };
  });

  // Only the rows in view are rendered, so a list of hundreds filters and scrolls at once. The app does not run the
  // React Compiler, which is what this rule guards: the virtualizer is read afresh on every render.
  // eslint-disable-next-line react-hooks/incompatible-library
  const virtualizer = useVirtualizer({
    count: shown.length,
    getScrollElement: () => scrollRef.current,
    estimateSize: () => 52,
    overscan: 8,
  });

  // Focus follows keyboard moves: the target row may first need scrolling into view and rendering.
  const pendingFocus = useRef<{ key: string; col: number } | null>(null);
  const focusPending = useCallback(() => {
    const want = pendingFocus.current;
    if (!want) return;
    const el = scrollRef.current?.querySelector<HTMLElement>(`[data-key="${want.key}"][data-col="${want.col}"]`);
    if (el) {
      pendingFocus.current = null;
      el.focus();
    }
  }, []);
  const focusCell = useCallback(
    (key: string, col: number) => {
      pendingFocus.current = { key, col };
      // A cell already on screen takes focus now; any other once it is scrolled to and rendered (below).
      focusPending();
    },
    [focusPending],
  );
  useLayoutEffect(() => {
    focusPending();
    const want = pendingFocus.current;
    if (!want) return;
    const index = shown.findIndex((r) => r.key === want.key);
    // A row the filter hides stays wanted while a cleared filter is still taking effect.
    if (index >= 0) virtualizer.scrollToIndex(index, { align: 'auto' });
    else if (filter === shownFilter) pendingFocus.current = null;
  });

  const edit = useCallback((change: (rows: GridRow[]) => GridRow[]) => {
    setRows(change);
    setDirty(true);
    setNotice(null);
  }, []);

  const addRow = useCallback(
    (col = 0) => {
      const row = blankRow(newKey());
      edit((rs) => [...rs, row]);
      focusCell(row.key, col);
    },
    [edit, focusCell],
  );

  /** The value a cell had when it took focus, for Escape. */
  const valueOnFocus = useRef('');

  const changeCell = useCallback(
    (key: string, field: GridField, value: string) => {
      edit((rs) => rs.map((r) => (r.key === key ? { ...r, [field]: value } : r)));
      // The server's word on a row stands until the row is edited; the live check then speaks for it.
      setServerProblems((m) => (m.has(key) ? new Map([...m].filter(([k]) => k !== key)) : m));
    },
    [edit],
  );

  const handlers = useMemo<CellHandlers>(
    () => ({
      onChange: changeCell,
      onFocus(e) {
        valueOnFocus.current = e.currentTarget.value;
        // A cell reached by keyboard is selected whole, so typing replaces it as in a spreadsheet.
        if (e.currentTarget instanceof HTMLInputElement) e.currentTarget.select();
      },
      onKeyDown(e: KeyboardEvent<HTMLInputElement | HTMLSelectElement>) {
        const el = e.currentTarget;
        const key = el.dataset.key!;
        const col = Number(el.dataset.col);
        if (e.key === 'Escape' && el instanceof HTMLInputElement && el.value !== valueOnFocus.current) {
          e.preventDefault();
          changeCell(key, GRID_COLUMNS[col]!.field, valueOnFocus.current);
          return;
        }
        const caret =
          el instanceof HTMLInputElement
            ? { atStart: el.selectionStart === 0, atEnd: el.selectionEnd === el.value.length }
            : { atStart: true, atEnd: true };
        const move = moveForKey(e, caret);
        if (!move) return;
        const { shown: visible } = latest.current;
        const row = visible.findIndex((r) => r.key === key);
        const target = moveCell({ row, col }, move, visible.length);
        if (target) {
          e.preventDefault();
          focusCell(visible[target.row]!.key, target.col);
        } else if (e.key === 'Enter' && !e.shiftKey && !readOnly) {
          // Enter on the last row starts a new one, as typing a list down a sheet does.
          e.preventDefault();
          addRow(col);
        } else if (move !== 'next' && move !== 'previous') {
          e.preventDefault();
        }
        // Tab past the last cell leaves the table, as Tab does anywhere else.
      },
      onPaste(e) {
        if (readOnly) return;
        const lines = parsePastedRows(e.clipboardData.getData('text/plain'));
        if (!lines || lines.length === 0) return;
        e.preventDefault();
        const el = e.currentTarget;
        const { rows: current, shown: visible } = latest.current;
        const pasted = applyPaste(
          current,
          visible.map((r) => r.key),
          { key: el.dataset.key!, col: Number(el.dataset.col) },
          lines,
          newKey,
        );
        edit(() => pasted.rows);
        setNotice({ tone: 'ok', text: `Pasted ${plural(pasted.filled, 'row', 'rows')}.` });
      },
      onRemove(key) {
        const { shown: visible } = latest.current;
        const at = visible.findIndex((r) => r.key === key);
        const next = visible[at + 1] ?? visible[at - 1];
        edit((rs) => rs.filter((r) => r.key !== key));
        if (next) focusCell(next.key, 0);
      },
    }),
    [edit, changeCell, focusCell, addRow, readOnly],
  );

  // Leaving with unsaved changes asks first, inside the app and when closing the tab.
  const blocker = useBlocker(({ currentLocation, nextLocation }) => dirty && currentLocation.pathname !== nextLocation.pathname);
  useEffect(() => {
    if (blocker.state !== 'blocked') return;
    if (window.confirm('This parts list has changes that are not saved. Leave without saving them?')) blocker.proceed();
    else blocker.reset();
  }, [blocker]);
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  function load(saved: BoardPartsList) {
    setRows(rowsOf(saved));
    setVersion(saved.version);
    setDirty(false);
    setServerProblems(new Map());
    setConflict(null);
  }

  function focusFirstProblem(problems: Map<string, CellProblems>) {
    const first = rows.find((r) => problems.has(r.key));
    if (!first) return;
    setFilter('');
    const field = Object.keys(problems.get(first.key)!)[0] as GridField | 'row';
    const col = Math.max(
      0,
      GRID_COLUMNS.findIndex((c) => c.field === field),
    );
    focusCell(first.key, col);
  }

  async function saveList(atVersion = version) {
    if (check.count > 0) {
      setNotice({ tone: 'error', text: `Fix ${plural(check.count, 'problem', 'problems')} before saving; each is shown under its cell.` });
      focusFirstProblem(check.problems);
      return;
    }
    try {
      const saved = await save.mutateAsync({ version: atVersion, parts: check.parts });
      load(saved);
      setNotice({ tone: 'ok', text: `Saved ${plural(saved.parts.length, 'part', 'parts')}.` });
    } catch (err) {
      if (err instanceof ApiError && err.status === 409 && err.problem.current) {
        setConflict(err.problem.current as BoardPartsList);
      } else if (err instanceof ApiError && err.problem.errors?.length) {
        const problems = problemsFromServer(err.problem.errors, check.keys);
        setServerProblems(problems);
        setNotice({ tone: 'error', text: 'Nothing was saved: fix the problems shown under the cells.' });
        focusFirstProblem(problems);
      } else {
        setNotice({ tone: 'error', text: err instanceof ApiError ? err.message : 'Could not save. Try again.' });
      }
    }
  }

  function importRows(result: ImportResult) {
    const before = { rows, dirty };
    setImporting(null);
    edit(() => result.rows.map((entry) => gridRowFromEntry(entry, newKey())));
    setFilter('');
    setNotice({
      tone: 'ok',
      text: `Imported ${plural(result.rows.length, 'part', 'parts')} from ${result.fileName}. Not saved yet: save to keep them.`,
      undo: () => {
        setRows(before.rows);
        setDirty(before.dirty);
        setNotice(null);
      },
    });
  }

  const problemsOf = (key: string) => serverProblems.get(key) ?? check.problems.get(key);
  const items = virtualizer.getVirtualItems();
  const paddingTop = items[0]?.start ?? 0;
  const paddingBottom = items.length ? virtualizer.getTotalSize() - items[items.length - 1]!.end : 0;

  return (
    <section aria-labelledby="parts-list-heading" className="card grid gap-3 p-3 sm:p-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="parts-list-heading" className="text-lg font-bold">
            Parts list
          </h2>
          <p className="text-ink-soft tabular" aria-live="polite">
            {shownFilter.trim() ? `${shown.length} of ${plural(rows.length, 'row', 'rows')}` : plural(rows.length, 'row', 'rows')}
            {dirty && <span className="ml-2 font-semibold text-attention">· changes not saved</span>}
          </p>
        </div>
        <div className="flex flex-wrap items-end gap-2">
          <div className="flex flex-col gap-1">
            <label htmlFor={filterId} className="text-sm font-semibold">
              Filter parts
            </label>
            <div className="relative">
              <Search aria-hidden className="pointer-events-none absolute top-1/2 left-3 size-4 -translate-y-1/2 text-ink-muted" />
              <input
                id={filterId}
                type="search"
                className={`${inputClass} w-56 pl-9`}
                placeholder="R12, 4k7, electrolytic…"
                value={filter}
                onChange={(e) => setFilter(e.target.value)}
              />
            </div>
          </div>
          <a className="btn-secondary" href={paths.partsListCsv(boardId)} download>
            <Download aria-hidden className="size-4" /> Export CSV
          </a>
          {!readOnly && (
            <>
              <button type="button" className="btn-secondary" onClick={() => fileRef.current?.click()}>
                <Upload aria-hidden className="size-4" /> Import CSV
              </button>
              <button type="button" className="btn-primary" disabled={save.isPending} onClick={() => saveList()}>
                <Save aria-hidden className="size-4" /> {save.isPending ? 'Saving…' : 'Save'}
              </button>
            </>
          )}
        </div>
      </div>

      {!readOnly && (
        <p className="text-sm text-ink-muted">
          Arrow keys, Enter and Tab move between cells; type to replace a cell, Esc to undo it. Paste rows copied from a spreadsheet (or
          comma-separated lines) into a cell to fill the table from there.
          {dirty && ' Export CSV gives the saved list: save first to include your changes.'}
        </p>
      )}

      <input
        ref={fileRef}
        type="file"
        accept=".csv,text/csv"
        className="sr-only"
        tabIndex={-1}
        aria-hidden
        onChange={async (e) => {
          const file = e.target.files?.[0];
          e.target.value = '';
          if (!file) return;
          const result = { fileName: file.name, ...readPartsCsv(await file.text()) };
          if (result.problems.length === 0) importRows(result);
          else {
            setNotice(null);
            setImporting(result);
          }
        }}
      />

      {importing && (
        <CsvImportPanel result={importing} onChooseAgain={() => fileRef.current?.click()} onCancel={() => setImporting(null)} />
      )}

      {conflict && (
        <div role="alert" className="grid gap-2 rounded-md border border-attention bg-attention-tint p-3">
          <p className="font-semibold text-attention">
            <AlertTriangle aria-hidden className="mr-1 inline size-4" />
            Someone else saved this parts list since you opened it. Your rows are still in the table.
          </p>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className="btn-secondary"
              onClick={async () => {
                load(await reload().catch(() => conflict));
                setNotice({ tone: 'ok', text: 'Loaded the list as it was last saved.' });
              }}
            >
              Load the saved list (drop my changes)
            </button>
            <button
              type="button"
              className="btn-secondary"
              onClick={() => {
                const current = conflict.version;
                setConflict(null);
                setVersion(current);
                void saveList(current);
              }}
            >
              Keep my rows and save over it
            </button>
          </div>
        </div>
      )}

      {notice && (
        <div
          role={notice.tone === 'error' ? 'alert' : 'status'}
          className={`flex flex-wrap items-center gap-3 rounded-md border p-3 font-semibold ${notice.tone === 'error' ? 'border-down bg-down-tint text-down' : 'border-running bg-running-tint text-running'}`}
        >
          {notice.text}
          {notice.undo && (
            <button type="button" className="btn-secondary min-h-9 py-1" onClick={notice.undo}>
              Undo import
            </button>
          )}
        </div>
      )}

      {check.count > 0 && !notice && (
        <p className="font-semibold text-down">
          <AlertTriangle aria-hidden className="mr-1 inline size-4" />
          {plural(check.count, 'problem', 'problems')} to fix before saving.{' '}
          <button type="button" className="link" onClick={() => focusFirstProblem(check.problems)}>
            Go to the first
          </button>
        </p>
      )}

      <div
        ref={scrollRef}
        className="max-h-[70vh] overflow-auto rounded-md border border-paper-line"
        role="region"
        aria-label="Parts list cells"
        tabIndex={-1}
      >
        <table className="w-max min-w-full border-collapse">
          <thead className="sticky top-0 z-10 bg-paper-dim text-left text-sm">
            <tr>
              <th scope="col" className="w-10 px-2 py-2 text-right">
                <span className="sr-only">Row</span>#
              </th>
              {GRID_COLUMNS.map((c, col) => (
                <th
                  key={c.field}
                  scope="col"
                  className={`${columnWidth(c.field)} px-3 py-2 font-bold ${col === 0 ? 'sticky left-0 z-[2] bg-paper-dim' : ''}`}
                >
                  {c.label}
                </th>
              ))}
              <th scope="col" className="w-12">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {paddingTop > 0 && (
              <tr aria-hidden>
                <td colSpan={GRID_COLUMNS.length + 2} style={{ height: paddingTop }} />
              </tr>
            )}
            {items.map((item) => {
              const row = shown[item.index]!;
              return (
                <PartsGridRow
                  key={row.key}
                  row={row}
                  index={item.index}
                  number={numberOf.get(row.key) ?? item.index + 1}
                  problems={problemsOf(row.key)}
                  readOnly={readOnly}
                  handlers={handlers}
                  measure={virtualizer.measureElement}
                />
              );
            })}
            {paddingBottom > 0 && (
              <tr aria-hidden>
                <td colSpan={GRID_COLUMNS.length + 2} style={{ height: paddingBottom }} />
              </tr>
            )}
          </tbody>
        </table>
        {shown.length === 0 && (
          <p className="p-4 text-ink-muted">{rows.length === 0 ? 'No parts listed yet.' : 'No part matches the filter.'}</p>
        )}
      </div>

      {!readOnly && (
        <div>
          <button type="button" className="btn-secondary" onClick={() => addRow()}>
            <Plus aria-hidden className="size-4" /> Add a row
          </button>
        </div>
      )}
    </section>
  );
}
