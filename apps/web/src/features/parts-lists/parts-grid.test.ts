import { describe, expect, it } from 'vitest';
import {
  applyPaste,
  blankRow,
  checkGrid,
  filterRows,
  moveCell,
  moveForKey,
  parsePastedRows,
  problemsFromServer,
  type GridRow,
} from './parts-grid.ts';

const press = (key: string, more: Partial<{ shiftKey: boolean; altKey: boolean; ctrlKey: boolean; metaKey: boolean }> = {}) => ({
  key,
  shiftKey: false,
  altKey: false,
  ctrlKey: false,
  metaKey: false,
  ...more,
});

const row = (key: string, cells: Partial<GridRow>): GridRow => ({ ...blankRow(key), ...cells });

describe('keys move as in a spreadsheet', () => {
  it('arrows, Enter and Tab; left and right only from the edge of the text', () => {
    const middle = { atStart: false, atEnd: false };
    const whole = { atStart: true, atEnd: true };
    expect(moveForKey(press('ArrowDown'), middle)).toBe('down');
    expect(moveForKey(press('ArrowUp'), middle)).toBe('up');
    expect(moveForKey(press('ArrowLeft'), middle)).toBeNull();
    expect(moveForKey(press('ArrowRight'), middle)).toBeNull();
    expect(moveForKey(press('ArrowLeft'), whole)).toBe('left');
    expect(moveForKey(press('ArrowRight'), { atStart: false, atEnd: true })).toBe('right');
    expect(moveForKey(press('Enter'), middle)).toBe('down');
    expect(moveForKey(press('Enter', { shiftKey: true }), middle)).toBe('up');
    expect(moveForKey(press('Tab'), middle)).toBe('next');
    expect(moveForKey(press('Tab', { shiftKey: true }), middle)).toBe('previous');
    // Typing, and shortcuts such as Ctrl+Arrow (word by word), stay with the cell.
    expect(moveForKey(press('a'), whole)).toBeNull();
    expect(moveForKey(press('ArrowLeft', { ctrlKey: true }), whole)).toBeNull();
  });

  it('lands on the next cell, wraps Tab to the next row, and stops at the edges', () => {
    expect(moveCell({ row: 0, col: 0 }, 'down', 3)).toEqual({ row: 1, col: 0 });
    expect(moveCell({ row: 2, col: 4 }, 'down', 3)).toBeNull();
    expect(moveCell({ row: 0, col: 3 }, 'up', 3)).toBeNull();
    expect(moveCell({ row: 1, col: 7 }, 'next', 3)).toEqual({ row: 2, col: 0 });
    expect(moveCell({ row: 1, col: 0 }, 'previous', 3)).toEqual({ row: 0, col: 7 });
    expect(moveCell({ row: 2, col: 7 }, 'next', 3)).toBeNull();
    expect(moveCell({ row: 1, col: 7 }, 'right', 3)).toBeNull();
    expect(moveCell({ row: 1, col: 2 }, 'left', 3)).toEqual({ row: 1, col: 1 });
  });
});

describe('pasting rows from a spreadsheet', () => {
  it('reads tab-separated lines as a spreadsheet copies them, and comma-separated lines, dropping a header', () => {
    expect(parsePastedRows('R1\tResistor\t4k7\t5%\r\nR2\tResistor\t1k\t5%\r\n')).toEqual([
      ['R1', 'Resistor', '4k7', '5%'],
      ['R2', 'Resistor', '1k', '5%'],
    ]);
    expect(parsePastedRows('designator,kind,value\nC1,electrolytic,"4700µF"\n')).toEqual([['C1', 'electrolytic', '4700µF']]);
    // One line with tabs fills along the row.
    expect(parsePastedRows('4k7\t5%\t1/4 W')).toEqual([['4k7', '5%', '1/4 W']]);
  });

  it('leaves a plain value to the cell, commas and all', () => {
    expect(parsePastedRows('4k7')).toBeNull();
    expect(parsePastedRows('1 A, 400 V')).toBeNull();
    expect(parsePastedRows('T2.5A 250V\n')).toBeNull();
  });

  it('fills from the current cell rightwards and down the rows shown, adding rows past the end', () => {
    const rows = [row('a', { designator: 'R1' }), row('b', { designator: 'R2' }), row('c', { designator: 'C9' })];
    let n = 0;
    const pasted = applyPaste(
      rows,
      ['a', 'c'], // R2 is filtered out of view
      { key: 'a', col: 1 },
      [
        ['Resistor', '4k7', '5%'],
        ['Electrolytic capacitor', '100µF'],
        ['bridge_rectifier', 'KBPC3506'],
        ['flux capacitor', '1.21 GW', '', '', '', '', '', 'past the last column'],
      ],
      () => `new${(n += 1)}`,
    );
    expect(pasted.filled).toBe(4);
    expect(pasted.rows.map((r) => [r.key, r.designator, r.kind, r.value, r.tolerance])).toEqual([
      ['a', 'R1', 'resistor', '4k7', '5%'],
      ['b', 'R2', 'resistor', '', ''],
      ['c', 'C9', 'electrolytic', '100µF', ''],
      ['new1', '', 'bridge_rectifier', 'KBPC3506', ''],
      // A kind that is none of ours is kept as pasted, for the check to report.
      ['new2', '', 'flux capacitor', '1.21 GW', ''],
    ]);
    expect(pasted.rows.at(-1)!.notes).toBe('');
    expect(pasted.order).toEqual(['a', 'c', 'new1', 'new2']);
  });
});

describe('checking the rows as typed', () => {
  it('names each faulty cell with the domain check, skipping blank rows, and gives the rows to save', () => {
    const rows = [
      row('a', { designator: 'R1', value: '100µF', tolerance: '5%' }),
      row('blank', {}),
      row('b', { designator: 'C1', kind: 'electrolytic', value: '4700µF', tolerance: '20%', rating: '35 V', ratedTemperatureC: '105' }),
      row('c', { designator: 'r1', value: '1k', tolerance: '150%' }),
      row('d', {
        designator: 'C2',
        kind: 'electrolytic',
        value: '10µF',
        tolerance: '20%',
        ratedTemperatureC: 'hot',
        ratedLifeHours: '2,000',
      }),
    ];
    const check = checkGrid(rows);
    expect(check.keys).toEqual(['a', 'b', 'c', 'd']);
    expect(check.problems.has('blank')).toBe(false);
    expect(Object.keys(check.problems.get('a')!)).toEqual(['value']);
    expect(check.problems.get('a')!.value).toMatch(/µF is a capacitor's unit/);
    expect(Object.keys(check.problems.get('b')!)).toEqual(['ratedLifeHours']);
    expect(check.problems.get('c')).toMatchObject({ tolerance: expect.stringMatching(/over 100 %/), designator: 'R1 is already on row 1' });
    // The number cell's own problem wins over the electrolytic's "give the rated temperature".
    expect(check.problems.get('d')).toEqual({ ratedTemperatureC: expect.stringMatching(/“hot” is not a temperature/) });
    expect(check.count).toBe(5);
    expect(check.parts[3]).toMatchObject({ designator: 'C2', ratedTemperatureC: null, ratedLifeHours: 2000 });
  });

  it('has nothing to say about a clean list, whose rows go to the API as numbers', () => {
    const check = checkGrid([
      { ...row('a', { designator: 'F1', kind: 'fuse', value: 'T2.5A 250V' }), id: '0b5e0f3a-1111-4111-8111-111111111111' },
      row('b', {
        designator: 'C1',
        kind: 'electrolytic',
        value: '4700µF',
        tolerance: 'M',
        rating: '35 V',
        ratedTemperatureC: '85',
        ratedLifeHours: '2000 h',
      }),
    ]);
    expect(check.count).toBe(0);
    expect(check.parts).toEqual([
      {
        id: '0b5e0f3a-1111-4111-8111-111111111111',
        designator: 'F1',
        kind: 'fuse',
        value: 'T2.5A 250V',
        tolerance: '',
        rating: '',
        ratedTemperatureC: null,
        ratedLifeHours: null,
        notes: '',
      },
      {
        id: undefined,
        designator: 'C1',
        kind: 'electrolytic',
        value: '4700µF',
        tolerance: 'M',
        rating: '35 V',
        ratedTemperatureC: 85,
        ratedLifeHours: 2000,
        notes: '',
      },
    ]);
  });

  it("puts the API's row errors back on the rows that were sent", () => {
    const problems = problemsFromServer(
      [
        { field: 'parts.1.notes', message: 'must be at most 500 characters' },
        { field: 'parts.0', message: 'is not a part' },
        { field: 'version', message: 'someone else saved' },
      ],
      ['a', 'b'],
    );
    expect([...problems]).toEqual([
      ['b', { notes: 'must be at most 500 characters' }],
      ['a', { row: 'is not a part' }],
    ]);
  });
});

describe('the filter', () => {
  const rows = [
    row('a', { designator: 'R12', value: '4k7' }),
    row('b', { designator: 'C3', kind: 'electrolytic', value: '100µF', notes: 'Near the bridge' }),
    row('c', {}),
  ];
  it('matches any cell or the kind’s label, any case, and keeps the blank row being typed', () => {
    expect(filterRows(rows, 'r12').map((r) => r.key)).toEqual(['a', 'c']);
    expect(filterRows(rows, 'Electrolytic cap').map((r) => r.key)).toEqual(['b', 'c']);
    expect(filterRows(rows, 'BRIDGE').map((r) => r.key)).toEqual(['b', 'c']);
    expect(filterRows(rows, '  ').map((r) => r.key)).toEqual(['a', 'b', 'c']);
  });
});
