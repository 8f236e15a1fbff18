// PostgreSQL text cannot hold a NUL character, so a string carrying one would fail deep inside a query.
// Every parsed input (JSON or form body, query string, path parameters) is checked once, up front, and
// refused with the field named — before anything is written.
import type { RequestHandler } from 'express';
import { ValidationError } from './errors.ts';

/** The path of the first string (or key) holding a NUL character, or undefined. */
export function findNulByte(value: unknown, path: string, depth = 0): string | undefined {
  if (typeof value === 'string') return value.includes('\u0000') ? path : undefined;
  if (depth > 20 || value === null || typeof value !== 'object') return undefined;
  for (const [key, inner] of Object.entries(value as Record<string, unknown>)) {
    const at = Array.isArray(value) ? `${path}.${key}` : path ? `${path}.${key}` : key;
    if (key.includes('\u0000')) return at;
    const found = findNulByte(inner, at, depth + 1);
    if (found) return found;
  }
  return undefined;
}

export function assertNoNulBytes(sources: Record<string, unknown>): void {
  for (const [where, value] of Object.entries(sources)) {
    const field = findNulByte(value, '');
    if (field !== undefined) {
      throw new ValidationError([{ field: field || `(${where})`, message: 'must not contain a NUL character' }]);
    }
  }
}

/** Use after a body parser: refuses NUL characters anywhere in the body, query or path parameters. */
export const refuseNulBytes: RequestHandler = (req, _res, next) => {
  assertNoNulBytes({ body: req.body, query: req.query, params: req.params });
  next();
};
