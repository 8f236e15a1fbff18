// Rows held for one table in COPY's text format, sent with `COPY … FROM STDIN` (pg-copy-streams): the
// fastest way into PostgreSQL short of writing files on the server.
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';

// COPY's text format: tab between fields, newline between rows, \N for NULL; a backslash, tab,
// newline or carriage return inside a value is written as its backslash escape.
const SPECIAL = /[\\\t\n\r]/;
const SPECIALS = /[\\\t\n\r]/g;
const ESCAPES: Record<string, string> = { '\\': '\\\\', '\t': '\\t', '\n': '\\n', '\r': '\\r' };

function copyField(value: unknown): string {
  if (value === null || value === undefined) return '\\N';
  if (value instanceof Date) return value.toISOString();
  const text = typeof value === 'string' ? value : typeof value === 'object' ? JSON.stringify(value) : String(value);
  return SPECIAL.test(text) ? text.replace(SPECIALS, (ch) => ESCAPES[ch]!) : text;
}

/** A PostgreSQL text[] literal: every element quoted, so commas and braces inside one stay in it. */
export function textArray(values: readonly string[]): string {
  return `{${values.map((v) => `"${v.replace(/["\\]/g, (ch) => `\\${ch}`)}"`).join(',')}}`;
}

export class CopyTable<Column extends string> {
  private lines: string[] = [];
  /** Rows sent so far. */
  written = 0;

  constructor(
    readonly name: string,
    readonly columns: readonly Column[],
  ) {}

  add(row: Record<Column, unknown>): void {
    this.lines.push(this.columns.map((c) => copyField(row[c])).join('\t'));
  }

  get pending(): number {
    return this.lines.length;
  }

  /** Sends the held rows in one COPY on `client` and forgets them. */
  async flush(client: pg.ClientBase): Promise<number> {
    const lines = this.lines;
    if (lines.length === 0) return 0;
    this.lines = [];
    const stream = client.query(copyFrom(`COPY ${this.name} (${this.columns.join(', ')}) FROM STDIN`));
    // A few thousand rows per write: fewer, larger chunks than one per row.
    await pipeline(
      Readable.from(
        (function* () {
          for (let i = 0; i < lines.length; i += 2000) yield lines.slice(i, i + 2000).join('\n') + '\n';
        })(),
      ),
      stream,
    );
    this.written += lines.length;
    return lines.length;
  }
}
