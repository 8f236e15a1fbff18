import { describe, expect, it } from 'vitest';
import { ValidationError } from './errors.ts';
import { assertNoNulBytes, findNulByte } from './nul-bytes.ts';

describe('NUL characters in input', () => {
  it('are found with the path of the field that holds them', () => {
    expect(findNulByte({ name: 'ok', address: { line: 'a\u0000b' } }, '')).toBe('address.line');
    expect(findNulByte({ skills: ['pinball', 'x\u0000'] }, '')).toBe('skills.1');
    expect(findNulByte({ 'bad\u0000key': 1 }, '')).toBe('bad\u0000key');
    expect(findNulByte({ name: 'clean', n: 3, list: [] }, '')).toBeUndefined();
  });

  it('are refused as a validation error naming the field', () => {
    let caught: unknown;
    try {
      assertNoNulBytes({ body: { note: 'dead\u0000game' }, query: {} });
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(ValidationError);
    expect((caught as ValidationError).errors).toEqual([{ field: 'note', message: 'must not contain a NUL character' }]);
  });
});
