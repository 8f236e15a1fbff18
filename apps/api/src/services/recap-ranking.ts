// The recap list's order, and its pages: the ranking is worked out in the service (never stored), so a page's cursor
// carries the last row's place in it, keyset-style, and the next page starts after that place. Boards added or judged
// differently in between move in the ranking; no board is sent twice or skipped for it.
import type { RecapFleetRow, RecapStatus } from '@bumperline/contracts/boards';
import { decodeCursor, encodeCursor } from '@bumperline/db/queries/keyset';
import { InvalidCursorError } from '@bumperline/db/errors';

const statusRank: Record<RecapStatus, number> = { overdue: 0, 'due-soon': 1, ok: 1, unknown: 2, 'no-electrolytics': 3 };

/** Where a row stands: status group, date due, game, serial, and the board's id last so no two rows tie. */
type RankKey = readonly [group: number, dueDate: string, gameLabel: string, serial: string, id: string];

const rankKey = (r: RecapFleetRow): RankKey => [
  statusRank[r.recap.status],
  r.recap.dueDate ?? '',
  r.gameLabel ?? '',
  r.serial,
  r.boardInstanceId,
];

function compareKeys(a: RankKey, b: RankKey): number {
  return (
    a[0] - b[0] ||
    a[1].localeCompare(b[1]) ||
    a[2].localeCompare(b[2]) ||
    a[3].localeCompare(b[3]) ||
    (a[4] < b[4] ? -1 : a[4] > b[4] ? 1 : 0)
  );
}

/** Overdue first (longest overdue at the top), then by the date due (least life left first); undated boards last. */
export function compareRecapRows(a: RecapFleetRow, b: RecapFleetRow): number {
  return compareKeys(rankKey(a), rankKey(b));
}

function cursorOf(r: RecapFleetRow): string {
  const [group, dueDate, gameLabel, serial, id] = rankKey(r);
  return encodeCursor({ v: JSON.stringify([group, dueDate, gameLabel, serial]), id });
}

/** The place a cursor we issued names; InvalidCursorError (400 naming `cursor`) for any other. */
function placeOf(raw: string): RankKey {
  const c = decodeCursor(raw)!;
  let v: unknown;
  try {
    v = JSON.parse(c.v);
  } catch {
    throw new InvalidCursorError();
  }
  if (
    Array.isArray(v) &&
    v.length === 4 &&
    Number.isInteger(v[0]) &&
    (v[0] as number) >= 0 &&
    (v[0] as number) <= 3 &&
    v.slice(1).every((s) => typeof s === 'string')
  ) {
    return [v[0] as number, v[1] as string, v[2] as string, v[3] as string, c.id.toLowerCase()];
  }
  throw new InvalidCursorError();
}

/** The rows ranked, the page after `cursor` (from the top without one), and the cursor of the page after it. */
export function rankedPage(rows: readonly RecapFleetRow[], limit: number, cursor: string | undefined) {
  const after = cursor ? placeOf(cursor) : undefined;
  const ranked = rows.map((row) => ({ row, key: rankKey(row) })).sort((a, b) => compareKeys(a.key, b.key));
  const start = after ? ranked.findIndex((r) => compareKeys(r.key, after) > 0) : 0;
  const page = start < 0 ? [] : ranked.slice(start, start + limit).map((r) => r.row);
  const more = start >= 0 && start + limit < ranked.length;
  return { items: page, nextCursor: more ? cursorOf(page[page.length - 1]!) : null };
}
