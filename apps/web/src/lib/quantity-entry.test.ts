import { describe, expect, it } from 'vitest';
import { formatQuantity, readQuantity } from './quantity-entry.ts';

describe('readQuantity', () => {
  it('reads whole numbers of parts counted each and refuses fractions in the API’s words', () => {
    expect(readQuantity('3', 'each')).toEqual({ ok: true, value: 3 });
    expect(readQuantity('1.5', 'each')).toEqual({ ok: false, message: 'whole numbers only: this part is counted each' });
    expect(readQuantity('-2', 'each')).toEqual({ ok: false, message: 'whole numbers only: this part is counted each' });
    expect(readQuantity('0', 'each')).toEqual({ ok: false, message: 'must be more than 0' });
    expect(readQuantity('0', 'each', { allowZero: true })).toEqual({ ok: true, value: 0 });
  });

  it('reads decimals of metres, grams and millilitres, with the unit or a decimal comma', () => {
    expect(readQuantity('2.5 m', 'm')).toEqual({ ok: true, value: 2.5 });
    expect(readQuantity('2,25', 'g')).toEqual({ ok: true, value: 2.25 });
    expect(readQuantity('0.0001', 'ml')).toEqual({ ok: false, message: 'must have at most three decimals' });
    expect(readQuantity('lots', 'm')).toEqual({ ok: false, message: 'is not a number' });
    expect(readQuantity('', 'm')).toEqual({ ok: false, message: 'Enter how many' });
  });

  it('shows a quantity with its unit', () => {
    expect(formatQuantity(3, 'each')).toBe('3');
    expect(formatQuantity(2.5, 'm')).toBe('2.5 m');
  });
});
