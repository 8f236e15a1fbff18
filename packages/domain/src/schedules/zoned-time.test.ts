import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatWallTime, instantOf, offsetAt, parseWallTime, requireTimeZone, wallTimeAt } from './zoned-time.ts';

const wall = (text: string) => parseWallTime(text);

describe('zoned time (IANA tz database through Intl)', () => {
  it('offsets: Berlin +1 h in winter, +2 h in summer; New York −5 h / −4 h (tz database)', () => {
    expect(offsetAt(Date.parse('2024-01-15T12:00:00Z'), 'Europe/Berlin')).toBe(3_600_000);
    expect(offsetAt(Date.parse('2024-07-15T12:00:00Z'), 'Europe/Berlin')).toBe(7_200_000);
    expect(offsetAt(Date.parse('2024-01-15T12:00:00Z'), 'America/New_York')).toBe(-5 * 3_600_000);
    expect(offsetAt(Date.parse('2024-07-15T12:00:00Z'), 'America/New_York')).toBe(-4 * 3_600_000);
  });

  it('an ordinary wall time maps to one instant', () => {
    expect(new Date(instantOf(wall('2024-07-15T14:00'), 'Europe/Berlin')).toISOString()).toBe('2024-07-15T12:00:00.000Z');
  });

  it('skipped times take the offset before the gap (RFC 5545 §3.3.5), also for a 30-minute shift (Lord Howe, from memory)', () => {
    // Berlin skips 02:00–03:00 on 2024-03-31 (EU summer time: last Sunday of March, 01:00 UTC).
    expect(new Date(instantOf(wall('2024-03-31T02:30'), 'Europe/Berlin')).toISOString()).toBe('2024-03-31T01:30:00.000Z');
    // Lord Howe Island moves from +10:30 to +11:00 at 02:00 local on the first Sunday of October (2024-10-06).
    expect(new Date(instantOf(wall('2024-10-06T02:15'), 'Australia/Lord_Howe')).toISOString()).toBe('2024-10-05T15:45:00.000Z');
  });

  it('repeated times take the first occurrence (RFC 5545 §3.3.5)', () => {
    // Berlin repeats 02:00–03:00 on 2024-10-27: 02:30 CEST is 00:30Z, 02:30 CET is 01:30Z.
    expect(new Date(instantOf(wall('2024-10-27T02:30'), 'Europe/Berlin')).toISOString()).toBe('2024-10-27T00:30:00.000Z');
  });

  it('round-trips: the wall time of an instant maps back to that instant or an earlier one with the same wall time (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: Date.UTC(1990, 0, 1) / 1000, max: Date.UTC(2040, 0, 1) / 1000 }),
        fc.constantFrom('Europe/Berlin', 'America/New_York', 'Australia/Lord_Howe', 'Asia/Kolkata', 'UTC', 'America/Santiago'),
        (seconds, zone) => {
          const t = seconds * 1000;
          const w = wallTimeAt(t, zone);
          const back = instantOf(w, zone);
          expect(back).toBeLessThanOrEqual(t);
          expect(t - back).toBeLessThanOrEqual(3 * 3_600_000);
          expect(wallTimeAt(back, zone)).toEqual(w);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('refuses unknown zones and malformed wall times', () => {
    expect(() => requireTimeZone('Europe/Atlantis')).toThrow(expect.objectContaining({ code: 'unknown-time-zone' }));
    expect(() => requireTimeZone('')).toThrow(expect.objectContaining({ code: 'unknown-time-zone' }));
    expect(() => parseWallTime('2024-01-01T25:00')).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(() => parseWallTime('2024-01-01T09:00Z')).toThrow(expect.objectContaining({ code: 'invalid-date' }));
    expect(formatWallTime(wall('2024-01-01 09:05'))).toBe('2024-01-01T09:05:00');
  });
});
