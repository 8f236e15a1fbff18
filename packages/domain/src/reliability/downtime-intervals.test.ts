import { describe, expect, it } from 'vitest';
import { mergeDowntime } from './downtime-intervals.ts';

describe('mergeDowntime', () => {
  it('clips to the period, merges overlapping and touching intervals, and closes open ones at the period end', () => {
    const period = { start: 0, end: 100 };
    expect(
      mergeDowntime(
        [
          { start: 50, end: 60 },
          { start: -10, end: 5 },
          { start: 55, end: 70 },
          { start: 70, end: 75 }, // touches the one before: one spell
          { start: 90, end: null },
          { start: 200, end: null },
        ],
        period,
      ),
    ).toEqual([
      { start: 0, end: 5 },
      { start: 50, end: 75 },
      { start: 90, end: 100 },
    ]);
  });

  it('refuses inverted intervals and periods', () => {
    expect(() => mergeDowntime([{ start: 5, end: 4 }], { start: 0, end: 10 })).toThrow(
      expect.objectContaining({ code: 'inverted-period' }),
    );
    expect(() => mergeDowntime([], { start: 10, end: 0 })).toThrow(expect.objectContaining({ code: 'inverted-period', field: 'period' }));
    expect(() => mergeDowntime([{ start: NaN, end: 4 }], { start: 0, end: 10 })).toThrow(expect.objectContaining({ code: 'invalid-date' }));
  });
});
