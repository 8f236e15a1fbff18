/**
 * The board page's parts-list editor at 400 parts, apart from React — figures only, no timed assertions.
 *   npm run bench -- parts-grid        (BENCH_RUNS=7 runs, median)
 * What the editor runs (apps/web/src/features/parts-lists/parts-grid.ts): opening the list (each part as a grid row,
 * then every row checked), the check again after each keystroke in a cell (checkGrid: the domain's rowsFromRecords and
 * checkPartsList over every row), and the filter as its text is typed (filterRows). Target: each far inside a frame
 * (16 ms), so the list opens and filters "instantly". The rows are the scale data's 400-part main board.
 */
import { mainBoard400 } from '@bumperline/db/scale/scale-board-designs';
import { checkGrid, filterRows, gridRowFromPart, type GridRow } from '../../apps/web/src/features/parts-lists/parts-grid.ts';

const RUNS = Number(process.env.BENCH_RUNS ?? 7);
/** Calls per run: enough that one run lasts well over the timer's resolution. */
const CALLS = 50;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? NaN;
}

/** Median time of one call, in ms. */
function timeOf(fn: () => unknown): number {
  for (let i = 0; i < CALLS; i++) fn(); // warm up the JIT
  const runs: number[] = [];
  for (let run = 0; run < RUNS; run++) {
    const start = performance.now();
    for (let i = 0; i < CALLS; i++) fn();
    runs.push((performance.now() - start) / CALLS);
  }
  return median(runs);
}

const open = (): GridRow[] => mainBoard400.parts.map((part, i) => gridRowFromPart({ ...part, id: undefined }, `row-${i}`));
const rows = open();
const opened = checkGrid(rows);
if (rows.length !== 400 || opened.count !== 0)
  throw new Error(`expected 400 rows that check clean, got ${rows.length} with ${opened.count} problems`);

// A keystroke in a cell: one row changes, and the whole list is checked again.
const edited = rows.map((row, i) => (i === 123 ? { ...row, value: `${row.value}7` } : row));

const figures: Record<string, string>[] = [];
const add = (step: string, shown: number | string, ms: number) =>
  figures.push({
    step,
    rows: String(shown),
    time: ms < 1 ? `${(ms * 1000).toFixed(ms < 0.01 ? 1 : 0)} µs` : `${ms.toFixed(2)} ms`,
    frame: '16 ms',
  });

add(
  'open: 400 parts as grid rows, then checked',
  rows.length,
  timeOf(() => checkGrid(open())),
);
add(
  'check after a keystroke (checkGrid)',
  rows.length,
  timeOf(() => checkGrid(edited)),
);
// The filter as a person types it, letter by letter, and a few they might type.
for (const text of ['e', 'el', 'ele', 'electrolytic', 'r1', 'R12', '4k7', '74ls', '1/4 w', 'socketed', 'zzz', '']) {
  add(
    `filter "${text}"`,
    filterRows(rows, text).length,
    timeOf(() => filterRows(rows, text)),
  );
}

console.log(`\nParts-list editor at ${rows.length} parts (${mainBoard400.name}), median of ${RUNS} runs of ${CALLS} calls`);
console.table(figures);
