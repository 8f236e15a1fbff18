import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { toCsv } from './csv.ts';

describe('toCsv', () => {
  it('neutralises every cell a spreadsheet would run as a formula (OWASP, CSV Injection)', () => {
    const hostile = ['=HYPERLINK("http://x.example","Click")', '+1+2', '-2+3', '@SUM(A1)', '\tTab', '\rCR', '=cmd\nsecond line'];
    const csv = toCsv(
      ['Venue'],
      hostile.map((h) => [h]),
    );
    const cells = Papa.parse<string[]>(csv, { skipEmptyLines: true })
      .data.slice(1)
      .map((r) => r[0]!);
    expect(cells).toHaveLength(hostile.length);
    for (const [i, cell] of cells.entries()) expect(cell, hostile[i]).toBe(`'${hostile[i]}`);
  });

  it('leaves ordinary text and numbers as they are', () => {
    const csv = toCsv(
      ['Name', 'Plays'],
      [
        ['Lakeshore Lanes', 1200],
        ['Joe’s = best', -5],
        [null, 0],
      ],
    );
    expect(Papa.parse<string[]>(csv, { skipEmptyLines: true }).data).toEqual([
      ['Name', 'Plays'],
      ['Lakeshore Lanes', '1200'],
      ['Joe’s = best', '-5'],
      ['', '0'],
    ]);
  });
});
