import { describe, expect, it } from 'vitest';
import { checkPartsList, readPartEntry, readPartKind, type PartEntryInput } from './parts-list-entry.ts';

function entry(fields: Partial<PartEntryInput>): PartEntryInput {
  return {
    designator: 'R1',
    kind: 'resistor',
    value: '',
    tolerance: '',
    rating: '',
    ratedTemperatureC: null,
    ratedLifeHours: null,
    ...fields,
  };
}

function refusal(fields: Partial<PartEntryInput>): { code: string; field: string | undefined; message: string } {
  try {
    readPartEntry(entry(fields));
  } catch (error) {
    const { code, field, message } = error as { code: string; field: string | undefined; message: string };
    return { code, field, message };
  }
  throw new Error('expected a refusal');
}

describe('readPartEntry: resistors', () => {
  it('reads the worked examples: 600 Ω ±10 %, 100 kΩ (check values of the bench overhaul procedure)', () => {
    expect(readPartEntry(entry({ value: '600', tolerance: '10%' }))).toMatchObject({
      designator: 'R1',
      kind: 'resistor',
      nominal: 600,
      unit: 'Ω',
      tolerance: { kind: 'percent', plus: 10, minus: 10 },
      fuse: null,
    });
    expect(readPartEntry(entry({ value: '100k', tolerance: '±5 %' })).nominal).toBe(100_000);
  });

  it('reads RKM codes: 4k7 = 4.7 kΩ, R47 = 0.47 Ω, 2M2 = 2.2 MΩ (IEC 60062:2016 RKM code, examples from memory)', () => {
    expect(readPartEntry(entry({ value: '4k7', tolerance: 'J' })).nominal).toBe(4700);
    expect(readPartEntry(entry({ value: 'R47', tolerance: 'J' })).nominal).toBe(0.47);
    expect(readPartEntry(entry({ value: '2M2', tolerance: 'J' })).nominal).toBe(2_200_000);
  });

  it('reads colour bands, whose tolerance band gives the tolerance (IEC 60062:2016 §3.2: brown black red gold = 1 kΩ ±5 %)', () => {
    const spec = readPartEntry(entry({ value: 'brown black red gold' }));
    expect(spec.nominal).toBe(1000);
    expect(spec.tolerance).toEqual({ kind: 'percent', plus: 5, minus: 5 });
    // Five bands: yellow violet black brown brown = 470 × 10 = 4.7 kΩ ±1 % (IEC 60062:2016 §3.3).
    expect(readPartEntry(entry({ value: 'yellow violet black brown brown' }))).toMatchObject({
      nominal: 4700,
      tolerance: { plus: 1, minus: 1 },
    });
    // Three bands: no tolerance band means ±20 % (IEC 60062:2016).
    expect(readPartEntry(entry({ value: 'red red orange' })).tolerance).toEqual({ kind: 'percent', plus: 20, minus: 20 });
  });

  it('refuses a tolerance that contradicts the tolerance band', () => {
    expect(refusal({ value: 'brown black red gold', tolerance: '10%' })).toMatchObject({ field: 'tolerance', code: 'conflicting-input' });
    expect(readPartEntry(entry({ value: 'brown black red gold', tolerance: 'J' })).tolerance).toEqual({
      kind: 'percent',
      plus: 5,
      minus: 5,
    });
  });

  it('refuses a unit that does not fit, in trade words', () => {
    expect(refusal({ value: '100µF', tolerance: '5%' })).toEqual({
      code: 'unit-mismatch',
      field: 'value',
      message: "µF is a capacitor's unit; a resistor's value is in Ω, e.g. 4k7",
    });
  });

  it('reads wattage ratings: 1/2 W, ½W, 0.5W, 500 mW, 2 W (common practice spellings)', () => {
    for (const rating of ['1/2 W', '½W', '0.5W', '500 mW', '1/2']) {
      expect(readPartEntry(entry({ value: '470', tolerance: '5%', rating })).ratingWatts).toBe(0.5);
    }
    expect(readPartEntry(entry({ value: '470', tolerance: '5%', rating: '2 W' })).ratingWatts).toBe(2);
    expect(refusal({ value: '470', tolerance: '5%', rating: '35 V' })).toMatchObject({ field: 'rating', code: 'unit-mismatch' });
  });

  it('needs a tolerance unless the colour bands give it', () => {
    expect(refusal({ value: '4k7' })).toMatchObject({ field: 'tolerance', code: 'missing-input' });
  });
});

describe('readPartEntry: tolerances', () => {
  it('reads %, ±, asymmetric and letter forms (IEC 60062:2016 letter code: J = ±5 %, Z = +80/−20 %)', () => {
    const cases: Array<[string, { plus: number; minus: number }]> = [
      ['5%', { plus: 5, minus: 5 }],
      ['±5 %', { plus: 5, minus: 5 }],
      ['+/-10%', { plus: 10, minus: 10 }],
      ['+80/-20%', { plus: 80, minus: 20 }],
      ['-20/+80 %', { plus: 80, minus: 20 }],
      ['J', { plus: 5, minus: 5 }],
      ['k', { plus: 10, minus: 10 }],
    ];
    for (const [tolerance, expected] of cases) {
      expect(readPartEntry(entry({ value: '1k', tolerance })).tolerance).toEqual({ kind: 'percent', ...expected });
    }
  });

  it('reads an absolute amount in the part’s unit: ±0.25pF on a 4.7 pF capacitor (IEC 60062 C = ±0.25 pF under 10 pF)', () => {
    const absolute = readPartEntry(entry({ designator: 'C1', kind: 'capacitor', value: '4.7pF', tolerance: '±0.25pF' })).tolerance;
    expect(absolute?.kind).toBe('absolute');
    expect(absolute?.plus).toBeCloseTo(0.25e-12, 24);
    expect(readPartEntry(entry({ designator: 'C1', kind: 'capacitor', value: '4p7', tolerance: 'C' })).tolerance?.kind).toBe('absolute');
    expect(refusal({ designator: 'C1', kind: 'capacitor', value: '4.7pF', tolerance: '±1 Ω' })).toMatchObject({
      field: 'tolerance',
      code: 'unit-mismatch',
    });
  });

  it('refuses a tolerance over 100 % and text that is not a tolerance', () => {
    expect(refusal({ value: '1k', tolerance: '150%' })).toMatchObject({ field: 'tolerance', code: 'out-of-range' });
    expect(refusal({ value: '1k', tolerance: '+150/-10%' })).toMatchObject({ field: 'tolerance', code: 'out-of-range' });
    expect(refusal({ value: '1k', tolerance: 'about right' })).toMatchObject({ field: 'tolerance' });
  });
});

describe('readPartEntry: capacitors', () => {
  it('reads 100µF, 100uF, 4n7 and the three-digit code 104 (EIA RS-198: 104 = 10 × 10⁴ pF = 100 nF)', () => {
    const cap = (value: string, tolerance = '10%') => readPartEntry(entry({ designator: 'C1', kind: 'capacitor', value, tolerance }));
    expect(cap('100µF').nominal).toBeCloseTo(100e-6, 18);
    expect(cap('100uF').nominal).toBeCloseTo(100e-6, 18);
    expect(cap('4n7').nominal).toBeCloseTo(4.7e-9, 21);
    expect(cap('104').nominal).toBeCloseTo(100e-9, 21);
    expect(cap('104').unit).toBe('F');
  });

  it("takes a code's tolerance letter when the tolerance cell is empty (104K = 100 nF ±10 %, IEC 60062 letter K)", () => {
    expect(readPartEntry(entry({ designator: 'C1', kind: 'capacitor', value: '104K' })).tolerance).toEqual({
      kind: 'percent',
      plus: 10,
      minus: 10,
    });
  });

  it('refuses a code ending in 0, which reads two ways (220 = 22 pF by the code, or 220 pF)', () => {
    expect(refusal({ designator: 'C1', kind: 'capacitor', value: '220', tolerance: '5%' })).toMatchObject({
      field: 'value',
      code: 'ambiguous',
    });
  });

  it('refuses Ω on a capacitor and reads working voltage as the rating', () => {
    expect(refusal({ designator: 'C1', kind: 'capacitor', value: '4k7Ω', tolerance: '5%' })).toMatchObject({
      field: 'value',
      message: "Ω is a resistor's unit; a capacitor's value is in F, e.g. 100nF",
    });
    const spec = readPartEntry(entry({ designator: 'C1', kind: 'capacitor', value: '100n', tolerance: '10%', rating: '50 VDC' }));
    expect(spec.ratingVolts).toBe(50);
    expect(spec.ratingWatts).toBeNull();
  });
});

describe('readPartEntry: electrolytics', () => {
  const electrolytic = { designator: 'C12', kind: 'electrolytic', value: '4700µF', tolerance: '20%', rating: '35 V' };

  it('keeps the rated temperature and life that drive capacitor life', () => {
    expect(readPartEntry(entry({ ...electrolytic, ratedTemperatureC: 105, ratedLifeHours: 2000 }))).toMatchObject({
      kind: 'electrolytic',
      ratingVolts: 35,
      ratedTemperatureC: 105,
      ratedLifeHours: 2000,
    });
  });

  it('refuses an electrolytic without them, or with impossible ones', () => {
    expect(refusal({ ...electrolytic, ratedLifeHours: 2000 })).toMatchObject({ field: 'ratedTemperatureC', code: 'missing-input' });
    expect(refusal({ ...electrolytic, ratedTemperatureC: 105 })).toMatchObject({ field: 'ratedLifeHours', code: 'missing-input' });
    expect(refusal({ ...electrolytic, ratedTemperatureC: 105.5, ratedLifeHours: 2000 })).toMatchObject({ field: 'ratedTemperatureC' });
    expect(refusal({ ...electrolytic, ratedTemperatureC: 250, ratedLifeHours: 2000 })).toMatchObject({ field: 'ratedTemperatureC' });
    expect(refusal({ ...electrolytic, ratedTemperatureC: 105, ratedLifeHours: 0 })).toMatchObject({ field: 'ratedLifeHours' });
  });

  it('refuses a bare number, which on an electrolytic is not a code', () => {
    expect(refusal({ ...electrolytic, value: '100', ratedTemperatureC: 105, ratedLifeHours: 2000 })).toMatchObject({
      field: 'value',
      message: "write the electrolytic's value with its unit, e.g. 100µF",
    });
  });

  it('refuses rated temperature and life on other kinds', () => {
    expect(refusal({ value: '1k', tolerance: '5%', ratedTemperatureC: 105 })).toMatchObject({ field: 'ratedTemperatureC' });
  });
});

describe('readPartEntry: fuses and parts without a nominal value', () => {
  it('reads an IEC 60127 fuse marking and keeps no nominal (IEC 60127: T = time-lag)', () => {
    expect(readPartEntry(entry({ designator: 'F1', kind: 'fuse', value: 'T2.5A 250V' }))).toMatchObject({
      nominal: null,
      unit: null,
      tolerance: null,
      fuse: { speed: 'T', amps: 2.5, volts: 250 },
    });
  });

  it('refuses a fuse marking without its current or speed, or one that does not read', () => {
    expect(refusal({ designator: 'F1', kind: 'fuse', value: '250V' })).toMatchObject({ field: 'value', code: 'missing-input' });
    expect(refusal({ designator: 'F1', kind: 'fuse', value: '2.5A' })).toMatchObject({ field: 'value', code: 'missing-input' });
    expect(refusal({ designator: 'F1', kind: 'fuse', value: 'slow blow' })).toMatchObject({ field: 'value', code: 'unparseable' });
  });

  it('keeps a diode’s part number as text, refusing an empty value or a tolerance', () => {
    expect(readPartEntry(entry({ designator: 'D3', kind: 'diode', value: '1N4004' }))).toMatchObject({ nominal: null, tolerance: null });
    expect(
      readPartEntry(entry({ designator: 'BR1', kind: 'bridge_rectifier', value: 'KBPC3510', rating: '35 A 1000 V' })).ratingVolts,
    ).toBeNull();
    expect(refusal({ designator: 'D3', kind: 'diode', value: '' })).toMatchObject({ field: 'value', code: 'missing-input' });
    expect(refusal({ designator: 'D3', kind: 'diode', value: '1N4004', tolerance: '5%' })).toMatchObject({ field: 'tolerance' });
  });
});

describe('readPartEntry: designator and kind', () => {
  it('accepts R12, C3, BR1, F1, J2, Q1, U1, R12A, TP1 and upper-cases them', () => {
    for (const designator of ['R12', 'C3', 'BR1', 'F1', 'J2', 'Q1', 'U1', 'R12A', 'TP1']) {
      expect(readPartEntry(entry({ designator: designator.toLowerCase(), kind: 'other', value: 'x' })).designator).toBe(designator);
    }
  });

  it('refuses an empty, over-long or malformed designator', () => {
    expect(refusal({ designator: ' ', value: '1k', tolerance: '5%' })).toMatchObject({ field: 'designator', code: 'missing-input' });
    expect(refusal({ designator: 'R12345678901234567', value: '1k', tolerance: '5%' })).toMatchObject({ field: 'designator' });
    expect(refusal({ designator: '12R', value: '1k', tolerance: '5%' })).toMatchObject({ field: 'designator' });
    expect(refusal({ designator: 'R 12', value: '1k', tolerance: '5%' })).toMatchObject({ field: 'designator' });
  });

  it('reads a kind by its code or its label, and refuses others', () => {
    expect(readPartKind('Bridge rectifier')).toBe('bridge_rectifier');
    expect(readPartKind('ELECTROLYTIC CAPACITOR')).toBe('electrolytic');
    expect(readPartKind('bridge_rectifier')).toBe('bridge_rectifier');
    expect(refusal({ kind: 'inductor', value: '1k' })).toMatchObject({ field: 'kind', code: 'unknown-code' });
  });
});

describe('checkPartsList', () => {
  it('flags each repeated designator, ignoring case, after its first row (rows counted from 1 in the message)', () => {
    const problems = checkPartsList([
      entry({ designator: 'R1', value: '1k', tolerance: '5%' }),
      entry({ designator: 'R2', value: '1k', tolerance: '5%' }),
      entry({ designator: 'R12', value: '1k', tolerance: '5%' }),
      entry({ designator: 'r12', value: '1k', tolerance: '5%' }),
      entry({ designator: 'R12 ', value: '1k', tolerance: '5%' }),
    ]);
    expect(problems).toEqual([
      { row: 3, field: 'designator', message: 'R12 is already on row 3' },
      { row: 4, field: 'designator', message: 'R12 is already on row 3' },
    ]);
  });

  it('reports every faulty cell of a bad row, with the row index', () => {
    const problems = checkPartsList([
      entry({ designator: 'R1', value: '1k', tolerance: '5%' }),
      entry({ designator: '', value: '100µF', tolerance: '200%', rating: '35 V' }),
    ]);
    expect(problems.map((p) => [p.row, p.field])).toEqual([
      [1, 'designator'],
      [1, 'value'],
      [1, 'tolerance'],
      [1, 'rating'],
    ]);
  });

  it('is empty for a good list', () => {
    expect(
      checkPartsList([
        entry({ designator: 'R1', value: '4k7', tolerance: 'J', rating: '1/4 W' }),
        entry({
          designator: 'C1',
          kind: 'electrolytic',
          value: '4700µF',
          tolerance: '20%',
          rating: '35 V',
          ratedTemperatureC: 105,
          ratedLifeHours: 2000,
        }),
        entry({ designator: 'F1', kind: 'fuse', value: 'T2.5A 250V' }),
        entry({ designator: 'BR1', kind: 'bridge_rectifier', value: 'KBPC3510' }),
      ]),
    ).toEqual([]);
  });
});
