import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bandsToResistance, resistanceToBands } from './colour-bands.ts';
import { seriesValues } from './preferred-values.ts';

describe('bandsToResistance (IEC 60062:2016)', () => {
  it('brown-black-orange-gold is 10 kΩ ±5 % (IEC 60062:2016, 3.2 code colours and 3.3 value and tolerance)', () => {
    const r = bandsToResistance(['brown', 'black', 'orange', 'gold']);
    expect(r.ohms).toBe(10_000);
    expect(r.tolerance).toEqual({ kind: 'percent', plus: 5, minus: 5 });
    expect(r.toleranceLetter).toBe('J');
  });

  it('reads the other everyday codes (IEC 60062 digit and multiplier colours)', () => {
    expect(bandsToResistance(['yellow', 'violet', 'red', 'gold']).ohms).toBe(4_700);
    expect(bandsToResistance(['red', 'red', 'brown', 'silver']).ohms).toBe(220);
    expect(bandsToResistance(['red', 'red', 'brown', 'silver']).tolerance.plus).toBe(10);
    expect(bandsToResistance(['brown', 'green', 'green', 'gold']).ohms).toBe(1_500_000);
    expect(bandsToResistance(['white', 'brown', 'white', 'gold']).ohms).toBe(91e9);
  });

  it('gold and silver multipliers divide, and the 2016 edition adds pink for ×0.001', () => {
    expect(bandsToResistance(['yellow', 'violet', 'gold', 'gold']).ohms).toBe(4.7);
    expect(bandsToResistance(['yellow', 'violet', 'silver', 'gold']).ohms).toBe(0.47);
    expect(bandsToResistance(['yellow', 'violet', 'pink', 'gold']).ohms).toBe(0.047);
  });

  it('three bands: no tolerance band means ±20 % (IEC 60062:2016, 3.3)', () => {
    const r = bandsToResistance(['brown', 'black', 'red']);
    expect(r.ohms).toBe(1_000);
    expect(r.tolerance).toEqual({ kind: 'percent', plus: 20, minus: 20 });
    expect(r.toleranceLetter).toBe('M');
  });

  it('five bands carry three digits; six add the temperature coefficient (values from memory of IEC 60062)', () => {
    const five = bandsToResistance(['brown', 'black', 'black', 'red', 'brown']);
    expect(five.ohms).toBe(10_000);
    expect(five.toleranceLetter).toBe('F');
    const six = bandsToResistance(['orange', 'orange', 'black', 'brown', 'brown', 'red']);
    expect(six.ohms).toBe(3_300);
    expect(six.temperatureCoefficientPpmPerK).toBe(50);
    expect(bandsToResistance(['brown', 'black', 'black', 'brown', 'violet', 'brown']).tolerance.plus).toBe(0.1);
  });

  it('tolerance colours: brown F ±1, red G ±2, green D ±0.5, blue C ±0.25, violet B ±0.1 (IEC 60062, from memory)', () => {
    const letterOf = (colour: string) => bandsToResistance(['brown', 'black', 'red', colour]).toleranceLetter;
    expect(['brown', 'red', 'green', 'blue', 'violet'].map(letterOf)).toEqual(['F', 'G', 'D', 'C', 'B']);
  });

  it('the whole tolerance-colour table, and the colours that carry no tolerance', () => {
    // IEC 60062:2016, 3.2 (code colours) and 3.3 (resistance value and tolerance). Silver, gold, brown, red, green,
    // blue, violet and no band agree across every published chart; orange ±0.05 % (W), yellow ±0.02 % (P) and
    // grey ±0.01 % (L) are from memory of the 2016 table (older charts give grey ±0.05 % or leave it out).
    const table: Array<[string, number, string]> = [
      ['silver', 10, 'K'],
      ['gold', 5, 'J'],
      ['brown', 1, 'F'],
      ['red', 2, 'G'],
      ['orange', 0.05, 'W'],
      ['yellow', 0.02, 'P'],
      ['green', 0.5, 'D'],
      ['blue', 0.25, 'C'],
      ['violet', 0.1, 'B'],
      ['grey', 0.01, 'L'],
    ];
    const read = (colour: string) => bandsToResistance(['brown', 'black', 'red', colour]);
    expect(table.map(([colour]) => [colour, read(colour).tolerance.plus, read(colour).toleranceLetter])).toEqual(table);
    expect(table.map(([colour]) => read(colour).tolerance.minus)).toEqual(table.map(([, percent]) => percent));
    // No band: ±20 % (M). Black, white and pink name digits or a multiplier only, never a tolerance.
    expect(bandsToResistance(['brown', 'black', 'red'])).toMatchObject({ tolerance: { plus: 20, minus: 20 }, toleranceLetter: 'M' });
    for (const colour of ['black', 'white', 'pink']) {
      expect(() => read(colour)).toThrow(expect.objectContaining({ code: 'invalid-bands', field: 'bands[3]' }));
    }
  });

  it('a single black band is a zero-ohm link (common practice)', () => {
    expect(bandsToResistance(['black']).ohms).toBe(0);
  });

  it('accepts the US spellings gray and purple', () => {
    expect(bandsToResistance(['gray', 'red', 'brown', 'gold']).ohms).toBe(820);
    expect(bandsToResistance(['purple', 'green', 'black', 'gold']).ohms).toBe(75);
  });

  it.each([
    [['gold', 'red', 'violet', 'yellow'], 'invalid-bands'], // read from the wrong end
    [['brown', 'black', 'beige', 'gold'], 'unknown-colour'],
    [['brown', 'black'], 'invalid-bands'],
    [['brown', 'black', 'red', 'white'], 'invalid-bands'], // white is no tolerance colour
    [['brown', 'black', 'black', 'red', 'brown', 'white'], 'invalid-bands'],
  ])('%j is refused (%s)', (bands, code) => {
    expect(() => bandsToResistance(bands)).toThrow(expect.objectContaining({ code }));
  });
});

describe('resistanceToBands', () => {
  it('gives the bands a technician would read', () => {
    expect(resistanceToBands(10_000, { bands: 4, tolerancePercent: 5 })).toEqual(['brown', 'black', 'orange', 'gold']);
    expect(resistanceToBands(4.7, { bands: 4, tolerancePercent: 5 })).toEqual(['yellow', 'violet', 'gold', 'gold']);
    expect(resistanceToBands(47.5, { bands: 5, tolerancePercent: 1 })).toEqual(['yellow', 'violet', 'green', 'gold', 'brown']);
    expect(resistanceToBands(1_000, { bands: 4, tolerancePercent: 20 })).toEqual(['brown', 'black', 'red']);
    expect(resistanceToBands(3_300, { bands: 6, tolerancePercent: 1, temperatureCoefficientPpmPerK: 50 })).toEqual([
      'orange',
      'orange',
      'black',
      'brown',
      'brown',
      'red',
    ]);
  });

  it('refuses what the bands cannot say rather than rounding', () => {
    expect(() => resistanceToBands(4_750, { bands: 4, tolerancePercent: 5 })).toThrow(
      expect.objectContaining({ code: 'not-representable' }),
    );
    expect(() => resistanceToBands(4_700, { bands: 4, tolerancePercent: 3 })).toThrow(
      expect.objectContaining({ code: 'not-representable' }),
    );
    expect(() => resistanceToBands(-1, { bands: 4, tolerancePercent: 5 })).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(() => resistanceToBands(1e12, { bands: 4, tolerancePercent: 5 })).toThrow(
      expect.objectContaining({ code: 'not-representable' }),
    );
  });

  it('round-trips every E24 value on 4 bands and every E96 value on 5 bands, from 0.01 Ω up (IEC 60063 values)', () => {
    const e24 = seriesValues('E24');
    const e96 = seriesValues('E96');
    fc.assert(
      fc.property(fc.constantFrom(...e24), fc.integer({ min: -2, max: 9 }), fc.constantFrom(1, 2, 5, 10), (m, e, tol) => {
        const ohms = Number(`${m}e${e}`);
        const back = bandsToResistance(resistanceToBands(ohms, { bands: 4, tolerancePercent: tol }));
        expect(back.ohms).toBe(ohms);
        expect(back.tolerance.plus).toBe(tol);
      }),
    );
    fc.assert(
      fc.property(fc.constantFrom(...e96), fc.integer({ min: -1, max: 9 }), (m, e) => {
        const ohms = Number(`${m}e${e}`);
        expect(bandsToResistance(resistanceToBands(ohms, { bands: 5, tolerancePercent: 1 })).ohms).toBe(ohms);
      }),
    );
  });
});
