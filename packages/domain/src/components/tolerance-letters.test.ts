import { describe, expect, it } from 'vitest';
import { letterForTolerance, toleranceForLetter } from './tolerance-letters.ts';

describe('tolerance letters (IEC 60062:2016)', () => {
  it('F ±1 %, G ±2 %, J ±5 %, K ±10 %, M ±20 % (IEC 60062:2016, clause 5, letter code for tolerance; clause number from memory)', () => {
    expect(['F', 'G', 'J', 'K', 'M'].map((l) => toleranceForLetter(l).plus)).toEqual([1, 2, 5, 10, 20]);
  });

  it('B ±0.1 %, C ±0.25 %, D ±0.5 % and the asymmetric Z +80/−20 % (IEC 60062, from memory)', () => {
    expect(toleranceForLetter('B')).toEqual({ kind: 'percent', plus: 0.1, minus: 0.1 });
    expect(toleranceForLetter('c')).toEqual({ kind: 'percent', plus: 0.25, minus: 0.25 });
    expect(toleranceForLetter('D').minus).toBe(0.5);
    expect(toleranceForLetter('Z')).toEqual({ kind: 'percent', plus: 80, minus: 20 });
  });

  it('maps back from a tolerance to its letter, and has none for odd tolerances', () => {
    expect(letterForTolerance({ kind: 'percent', plus: 5, minus: 5 })).toBe('J');
    expect(letterForTolerance({ kind: 'percent', plus: 7, minus: 7 })).toBeNull();
    expect(letterForTolerance({ kind: 'absolute', plus: 1, minus: 1 })).toBeNull();
  });

  it('refuses a letter the standard does not have', () => {
    expect(() => toleranceForLetter('X')).toThrow(expect.objectContaining({ code: 'unknown-code', field: 'tolerance' }));
    expect(() => toleranceForLetter('')).toThrow(expect.objectContaining({ code: 'unknown-code' }));
  });
});
