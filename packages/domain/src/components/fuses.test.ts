import { describe, expect, it } from 'vitest';
import { checkFuseReplacement, parseFuseMarking } from './fuses.ts';

describe('parseFuseMarking (IEC 60127 markings)', () => {
  it.each([
    ['T3.15AL250V', { speed: 'T', amps: 3.15, breakingCapacity: 'L', volts: 250 }],
    ['F2A 250V', { speed: 'F', amps: 2, breakingCapacity: null, volts: 250 }],
    ['T500mA', { speed: 'T', amps: 0.5, breakingCapacity: null, volts: null }],
    ['FF', { speed: 'FF', amps: null, breakingCapacity: null, volts: null }],
    ['M', { speed: 'M', amps: null, breakingCapacity: null, volts: null }],
    ['TT', { speed: 'TT', amps: null, breakingCapacity: null, volts: null }],
    ['T 3,15A H 250V', { speed: 'T', amps: 3.15, breakingCapacity: 'H', volts: 250 }], // decimal comma, common on European parts
    ['FF100mAE125V', { speed: 'FF', amps: 0.1, breakingCapacity: 'E', volts: 125 }],
    ['t1.6al250vac', { speed: 'T', amps: 1.6, breakingCapacity: 'L', volts: 250 }],
  ])('%s', (marking, expected) => {
    expect(parseFuseMarking(marking)).toEqual(expected);
  });

  it.each(['', 'X2A', '2 amps', 'T0A', 'T3.15AL250'])('refuses %j', (marking) => {
    expect(() => parseFuseMarking(marking)).toThrow(expect.objectContaining({ field: 'marking' }));
  });
});

describe('checkFuseReplacement (same current and speed; common practice in repair manuals)', () => {
  it('accepts the like-for-like part, and a higher voltage or breaking capacity', () => {
    expect(checkFuseReplacement('T3.15AL250V', 'T3.15AL250V')).toEqual({ accepted: true, reasons: [] });
    const better = checkFuseReplacement('T3.15AL250V', 'T3.15AH400V');
    expect(better.accepted).toBe(true);
    expect(better.reasons.join(' ')).toMatch(/400 V/);
  });

  it('refuses a higher current: the fuse would not protect the circuit', () => {
    const check = checkFuseReplacement('T3.15AL250V', 'T5AL250V');
    expect(check.accepted).toBe(false);
    expect(check.reasons[0]).toMatch(/higher than the 3.15 A/);
  });

  it('refuses a slower fuse, and a faster one (nuisance blowing, common practice)', () => {
    expect(checkFuseReplacement('F2A250V', 'T2A250V')).toMatchObject({ accepted: false, reasons: [expect.stringMatching(/slower/)] });
    expect(checkFuseReplacement('T2A250V', 'F2A250V')).toMatchObject({
      accepted: false,
      reasons: [expect.stringMatching(/faster.*nuisance/)],
    });
  });

  it('refuses a lower current, a lower voltage, a lower breaking capacity, and unknown ratings', () => {
    expect(checkFuseReplacement('T2A250V', 'T1.6A250V').reasons[0]).toMatch(/lower/);
    expect(checkFuseReplacement('T2A250V', 'T2A125V').reasons[0]).toMatch(/125 V is below/);
    expect(checkFuseReplacement('T2AH250V', 'T2AL250V').reasons[0]).toMatch(/breaking capacity L/);
    expect(checkFuseReplacement('T2A250V', 'T2A').reasons[0]).toMatch(/voltage rating unknown/);
    expect(checkFuseReplacement('T2A', '2A')).toMatchObject({ accepted: false, reasons: [expect.stringMatching(/speed unknown/)] });
  });

  it('needs to know what the circuit calls for', () => {
    expect(() => checkFuseReplacement('2A 250V', 'T2A250V')).toThrow(expect.objectContaining({ code: 'missing-input' }));
    expect(() => checkFuseReplacement('T', 'T2A250V')).toThrow(expect.objectContaining({ code: 'missing-input' }));
  });

  it('takes structured ratings as well as markings, and treats 500 mA and 0.5 A as the same', () => {
    const check = checkFuseReplacement({ speed: 'T', amps: 0.5, breakingCapacity: null, volts: 250 }, 'T0.5A250V');
    expect(check.accepted).toBe(true);
    expect(checkFuseReplacement('T500mA250V', 'T0.5A250V').accepted).toBe(true);
  });
});

describe('checkFuseReplacement with structured ratings', () => {
  it('refuses ratings that are not ratings', () => {
    const good = { speed: 'T', amps: 2, breakingCapacity: null, volts: 250 } as const;
    expect(() => checkFuseReplacement(good, { ...good, amps: -2 })).toThrow(expect.objectContaining({ field: 'candidate.amps' }));
    expect(() => checkFuseReplacement({ ...good, speed: 'X' as never }, good)).toThrow(
      expect.objectContaining({ code: 'unknown-code', field: 'circuit.speed' }),
    );
  });
});
