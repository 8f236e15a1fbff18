import { describe, expect, it } from 'vitest';
import { formatDays, formatMinutes, readDays, readMinutes } from './duration-entry.ts';

describe('time on site as people say it', () => {
  it.each([
    ['45 min', 45],
    ['45', 45],
    ['45 minutes', 45],
    ['1 h 30', 90],
    ['1h30', 90],
    ['1 h 30 min', 90],
    ['1:30', 90],
    ['2 hours', 120],
    ['1.5 h', 90],
    ['1,5 h', 90],
    ['  90  MIN ', 90],
  ])('"%s" is %i minutes', (text, minutes) => {
    expect(readMinutes(text)).toEqual({ ok: true, value: minutes });
  });

  it.each([
    ['', 'enter how long'],
    ['soon', 'is not a length of time'],
    ['1 h 75', 'is not a length of time'],
    ['0 min', 'at least 1 min'],
    ['1.5 min', 'whole minute'],
    ['25 h', 'at most 24 h'],
  ])('refuses "%s" saying %s', (text, words) => {
    const read = readMinutes(text);
    expect(read.ok).toBe(false);
    expect(read.ok ? '' : read.message).toContain(words);
  });

  it('lets labour be 0 minutes when asked', () => {
    expect(readMinutes('0', { min: 0 })).toEqual({ ok: true, value: 0 });
  });

  it('says minutes back as people write them, and reads its own words again', () => {
    expect([45, 60, 90, 135].map(formatMinutes)).toEqual(['45 min', '1 h', '1 h 30 min', '2 h 15 min']);
    for (const m of [1, 45, 60, 90, 135, 1440]) expect(readMinutes(formatMinutes(m))).toEqual({ ok: true, value: m });
  });
});

describe('lead in days', () => {
  it.each([
    ['7 days', 7],
    ['7', 7],
    ['1 day', 1],
    ['2 weeks', 14],
    ['0', 0],
  ])('"%s" is %i days', (text, days) => {
    expect(readDays(text)).toEqual({ ok: true, value: days });
  });

  it('refuses what is not whole days in range', () => {
    expect(readDays('a week or so').ok).toBe(false);
    expect(readDays('1.5 days').ok).toBe(false);
    expect(readDays('400 days').ok).toBe(false);
    expect(formatDays(1)).toBe('1 day');
    expect(readDays(formatDays(7))).toEqual({ ok: true, value: 7 });
  });
});

describe('durations in days', () => {
  it('reads "3 days" and "1 day" as 24-hour days and says them back the same way', () => {
    expect(readMinutes('3 days', { max: 30 * 24 * 60 })).toEqual({ ok: true, value: 4320 });
    expect(readMinutes('1 day', { max: 30 * 24 * 60 })).toEqual({ ok: true, value: 1440 });
    expect(formatMinutes(4320)).toBe('3 days');
    expect(formatMinutes(1500)).toBe('25 h');
  });
  it('keeps the upper bound in days', () => {
    expect(readMinutes('31 days', { max: 30 * 24 * 60 })).toMatchObject({ ok: false });
  });
});
