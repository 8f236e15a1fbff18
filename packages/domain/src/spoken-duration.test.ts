import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DomainError } from './errors.ts';
import { formatSpokenMinutes, parseSpokenMinutes } from './spoken-duration.ts';

describe('parseSpokenMinutes (common practice: how time is written on job sheets)', () => {
  it.each([
    ['45', 45],
    ['45 min', 45],
    ['45min', 45],
    ['45 minutes', 45],
    ['1 h', 60],
    ['1h', 60],
    ['2 hours', 120],
    ['1 h 30', 90],
    ['1h30', 90],
    ['1 h 30 min', 90],
    ['1 hr 5 mins', 65],
    ['1:30', 90],
    ['0:05', 5],
    ['1.5 h', 90],
    ['1,5 h', 90],
    ['  1  H  30  ', 90],
  ])('reads %j as %i minutes', (text, minutes) => {
    expect(parseSpokenMinutes(text)).toBe(minutes);
  });

  it.each(['abc', '1:75', '-5 min', '45 sec', '1 h 30 h'])('refuses %j naming the field, with an example', (text) => {
    expect(() => parseSpokenMinutes(text, 'labourMinutes')).toThrow(DomainError);
    try {
      parseSpokenMinutes(text, 'labourMinutes');
    } catch (e) {
      expect((e as DomainError).field).toBe('labourMinutes');
      expect((e as DomainError).message).toMatch(/45 min/);
    }
  });

  it('refuses an empty entry and a day longer than 24 hours', () => {
    expect(() => parseSpokenMinutes(' ')).toThrow(/required/);
    expect(() => parseSpokenMinutes('25 h')).toThrow(/at most 24 h/);
  });

  it('reads back whatever it writes', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 24 * 60 }), (minutes) => {
        expect(parseSpokenMinutes(formatSpokenMinutes(minutes))).toBe(minutes);
      }),
    );
  });
});
