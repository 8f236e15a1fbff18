import { describe, expect, it } from 'vitest';
import { DomainError, isDomainError } from './errors.ts';
import { requireFinite, requireInteger, requireNonNegative, requirePositive } from './input-checks.ts';

describe('DomainError', () => {
  it('carries a code, an optional field and a message, and is an Error', () => {
    const error = new DomainError('negative', 'tolerance must not be negative (got -5)', 'tolerance');
    expect(error).toBeInstanceOf(Error);
    expect(isDomainError(error)).toBe(true);
    expect(error.code).toBe('negative');
    expect(error.field).toBe('tolerance');
    expect(error.name).toBe('DomainError');
    expect(isDomainError(new Error('plain'))).toBe(false);
  });
});

describe('input checks', () => {
  it.each([NaN, Infinity, -Infinity, '5', null, undefined])('rejects %s as not a finite number', (value) => {
    expect(() => requireFinite(value, 'x')).toThrow(expect.objectContaining({ code: 'not-a-number', field: 'x' }));
  });
  it('rejects negatives, zero where positive is needed, and fractions where whole numbers are', () => {
    expect(() => requireNonNegative(-0.01, 'x')).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(() => requirePositive(0, 'x')).toThrow(expect.objectContaining({ code: 'out-of-range' }));
    expect(() => requireInteger(1.5, 'x')).toThrow(expect.objectContaining({ code: 'not-an-integer' }));
    expect(requireNonNegative(0, 'x')).toBe(0);
  });
});
