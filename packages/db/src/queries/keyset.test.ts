import { sql } from 'drizzle-orm';
import { pgTable, uuid } from 'drizzle-orm/pg-core';
import { describe, expect, it } from 'vitest';
import { InvalidCursorError } from '../errors.ts';
import { decodeCursor, encodeCursor, keysetWhere, type SortKey } from './keyset.ts';

const t = pgTable('t', { id: uuid('id') });
const ID = '6f1c2a3b-4d5e-4f60-8a7b-9c0d1e2f3a4b';
const key = (type: SortKey['type']): SortKey => ({ expr: sql`x`, type });
const where = (type: SortKey['type'], v: string) => () => keysetWhere(key(type), t.id, 'asc', decodeCursor(encodeCursor({ v, id: ID })));

describe('keyset cursors', () => {
  it('accept the values our own queries put in them', () => {
    expect(where('timestamptz', '2026-12-02 17:24:34.123456+00')).not.toThrow();
    expect(where('int', '-2147483648')).not.toThrow();
    expect(where('text', 'Lakeshore Arcade')).not.toThrow();
  });

  it('refuse a hand-made value that would fail its cast in the database', () => {
    expect(where('timestamptz', 'yesterday')).toThrow(InvalidCursorError);
    expect(where('timestamptz', '2026-02-30 10:00:00+00')).toThrow(InvalidCursorError);
    expect(where('int', '2147483648')).toThrow(InvalidCursorError);
    expect(where('int', '1.5')).toThrow(InvalidCursorError);
    expect(where('text', 'a\u0000b')).toThrow(InvalidCursorError);
  });

  it('refuse cursors that are not ours at all', () => {
    expect(() => decodeCursor('not-base64-json')).toThrow(InvalidCursorError);
    expect(() => decodeCursor(encodeCursor({ v: 'x', id: 'not-an-id' }))).toThrow(InvalidCursorError);
  });
});
