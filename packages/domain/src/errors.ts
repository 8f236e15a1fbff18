/**
 * The one error every domain computation throws for bad input. `code` is stable and machine-readable (the API maps it
 * to a problem-details response); `field` names the input at fault when there is one; `message` says what is wrong in
 * words a technician or dispatcher can act on.
 */
export const DOMAIN_ERROR_CODES = [
  'not-a-number', // NaN, ±Infinity, or not a number at all
  'not-an-integer',
  'negative',
  'out-of-range',
  'unparseable', // text that does not read as what was asked for ("abc Ω")
  'ambiguous', // text that could mean two things ("4,700 Ω": decimal comma or thousands separator?)
  'unknown-unit',
  'unit-mismatch',
  'unknown-colour',
  'invalid-bands',
  'not-representable', // a value the requested code cannot express (4.75 kΩ on a 4-band resistor)
  'unknown-code', // a tolerance letter, fuse speed or similar code that is not in the standard
  'missing-input',
  'conflicting-input',
  'duplicate-id',
  'inverted-period',
  'empty-period',
  'invalid-date',
  'unknown-time-zone',
  'invalid-rule',
  'unsupported-rule-part',
  'invalid-matrix',
  'invalid-tsp',
  'above-rated-temperature',
] as const;

export type DomainErrorCode = (typeof DOMAIN_ERROR_CODES)[number];

export class DomainError extends Error {
  readonly code: DomainErrorCode;
  readonly field: string | undefined;

  constructor(code: DomainErrorCode, message: string, field?: string) {
    super(message);
    this.name = 'DomainError';
    this.code = code;
    this.field = field;
  }
}

export function isDomainError(value: unknown): value is DomainError {
  return value instanceof DomainError;
}
