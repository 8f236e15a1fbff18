import { describe, expect, it } from 'vitest';
import { formatDeviation, formatReadingValue } from './reading-format.ts';

describe('formatReadingValue', () => {
  it('writes readings with the SI prefix the trade uses', () => {
    expect(formatReadingValue(570, 'Ω')).toBe('570 Ω');
    expect(formatReadingValue(4630, 'Ω')).toBe('4.63 kΩ');
    expect(formatReadingValue(0.0047, 'F')).toBe('4.7 mF');
    expect(formatReadingValue(12, null)).toBe('12');
    expect(formatReadingValue(12, 'parsecs')).toBe('12');
  });
});

describe('formatDeviation', () => {
  it('signs the deviation with a true minus, and is empty for a reading without one', () => {
    expect(formatDeviation(9.166666)).toBe('+9.2 %');
    expect(formatDeviation(-5)).toBe('−5.0 %');
    expect(formatDeviation(null)).toBe('');
  });
});
