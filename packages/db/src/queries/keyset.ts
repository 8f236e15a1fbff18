// Keyset ("cursor") pagination: the cursor holds the last row's sort value and id, so pages stay
// stable while rows are added, and deep pages cost no OFFSET scan.
import { sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import { InvalidCursorError } from '../errors.ts';

export interface SortKey {
  /** The expression rows are ordered by (must not be NULL). */
  expr: SQL;
  /** The SQL type its cursor value is cast back to. */
  type: 'text' | 'timestamptz' | 'int';
}

export interface Cursor {
  v: string;
  id: string;
}

export function encodeCursor(c: Cursor): string {
  return Buffer.from(JSON.stringify([c.v, c.id])).toString('base64url');
}

/** Undefined for an absent cursor; throws InvalidCursorError for one we did not issue. */
export function decodeCursor(raw: string | undefined): Cursor | undefined {
  if (!raw) return undefined;
  try {
    const parsed: unknown = JSON.parse(Buffer.from(raw, 'base64url').toString('utf8'));
    if (
      Array.isArray(parsed) &&
      parsed.length === 2 &&
      typeof parsed[0] === 'string' &&
      typeof parsed[1] === 'string' &&
      /^[0-9a-f-]{36}$/i.test(parsed[1])
    ) {
      return { v: parsed[0], id: parsed[1] };
    }
  } catch {
    // fall through
  }
  throw new InvalidCursorError();
}

// A cursor is only decoded JSON from the client: its value must fit the sort key's type before it
// reaches a cast, or a hand-made one would fail inside the database.
const INT4 = { min: -2147483648, max: 2147483647 };
const ISO_TIME = /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(:\d{2}(\.\d{1,6})?)?(Z|[+-]\d{2}(:?\d{2})?)?$/;
function fitsType(v: string, type: SortKey['type']): boolean {
  if (v.includes('\u0000')) return false;
  if (type === 'int') return /^-?\d{1,10}$/.test(v) && Number(v) >= INT4.min && Number(v) <= INT4.max;
  if (type === 'timestamptz') return ISO_TIME.test(v) && isCalendarDate(v.slice(0, 10));
  return true;
}

/** 2026-02-30 is not a date (Date.parse would roll it over to March). */
function isCalendarDate(ymd: string): boolean {
  const [y, m, d] = ymd.split('-').map(Number) as [number, number, number];
  const date = new Date(Date.UTC(y, m - 1, d));
  return y >= 1 && date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === d;
}

export function keysetWhere(key: SortKey, id: AnyPgColumn, order: 'asc' | 'desc', cursor?: Cursor): SQL | undefined {
  if (!cursor) return undefined;
  if (!fitsType(cursor.v, key.type)) throw new InvalidCursorError();
  const value = sql`cast(${cursor.v} as ${sql.raw(key.type)})`;
  return order === 'asc'
    ? sql`(${key.expr}, ${id}) > (${value}, ${cursor.id}::uuid)`
    : sql`(${key.expr}, ${id}) < (${value}, ${cursor.id}::uuid)`;
}

export function keysetOrder(key: SortKey, id: AnyPgColumn, order: 'asc' | 'desc'): SQL[] {
  return order === 'asc' ? [sql`${key.expr} asc`, sql`${id} asc`] : [sql`${key.expr} desc`, sql`${id} desc`];
}

/** The page and the cursor for the next one (fetch limit + 1 rows to know whether there is more). */
export function toPage<T extends { id: string; sortValue: string }>(rows: T[], limit: number) {
  const items = rows.slice(0, limit);
  const last = items[items.length - 1];
  return {
    items: items.map(({ sortValue: _s, ...rest }) => rest),
    nextCursor: rows.length > limit && last ? encodeCursor({ v: last.sortValue, id: last.id }) : null,
  };
}
