import { DomainError } from './errors.ts';

/** Shared guards so every computation rejects bad numbers the same way, never passing NaN or Infinity on. */

export function requireFinite(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new DomainError('not-a-number', `${field} must be a finite number (got ${describe(value)})`, field);
  }
  return value;
}

export function requireNonNegative(value: unknown, field: string): number {
  const n = requireFinite(value, field);
  if (n < 0) throw new DomainError('negative', `${field} must not be negative (got ${n})`, field);
  return n;
}

export function requirePositive(value: unknown, field: string): number {
  const n = requireFinite(value, field);
  if (n <= 0) {
    throw new DomainError(n < 0 ? 'negative' : 'out-of-range', `${field} must be greater than zero (got ${n})`, field);
  }
  return n;
}

export function requireInteger(value: unknown, field: string): number {
  const n = requireFinite(value, field);
  if (!Number.isSafeInteger(n)) {
    throw new DomainError('not-an-integer', `${field} must be a whole number (got ${n})`, field);
  }
  return n;
}

export function requireNonNegativeInteger(value: unknown, field: string): number {
  const n = requireInteger(value, field);
  if (n < 0) throw new DomainError('negative', `${field} must not be negative (got ${n})`, field);
  return n;
}

export function requireInRange(value: unknown, min: number, max: number, field: string): number {
  const n = requireFinite(value, field);
  if (n < min || n > max) {
    throw new DomainError('out-of-range', `${field} must be between ${min} and ${max} (got ${n})`, field);
  }
  return n;
}

export function describe(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') return String(value);
  if (value === null) return 'null';
  if (value === undefined) return 'nothing';
  return typeof value;
}
