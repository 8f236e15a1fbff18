import { describe, expect, it } from 'vitest';
import {
  BRIDGE_READING_KEYS,
  evaluateBenchJob,
  judgeDiodeSet,
  judgeFuse,
  judgePower,
  judgeReading,
  partsForStep,
  storedReadingText,
  diodeSetText,
  type BenchJobDraftInput,
  type BenchPart,
  type BenchStepInput,
  type BenchStepProgressInput,
  type Judged,
} from './bench-judgement.ts';
import { readPartEntry, type PartEntryInput } from './parts-list-entry.ts';

function part(id: string, fields: Partial<PartEntryInput>): BenchPart {
  return {
    id,
    ...readPartEntry({
      designator: 'R1',
      kind: 'resistor',
      value: '',
      tolerance: '',
      rating: '',
      ratedTemperatureC: null,
      ratedLifeHours: null,
      ...fields,
    }),
  };
}

function value<T>(judged: Judged<T>): T {
  if (!judged.ok) throw new Error(`expected ok, got “${judged.message}”`);
  return judged.value;
}

function message<T>(judged: Judged<T>): string {
  if (judged.ok) throw new Error('expected a refusal');
  return judged.message;
}

const r600 = part('p-r600', { designator: 'R7', value: '600', tolerance: '10%', rating: '1/4 W' });
const r100k = part('p-r100k', { designator: 'R8', value: '100k', tolerance: '5%' });
const r470 = part('p-r470', { designator: 'R9', value: '470', tolerance: '5%', rating: '1/4 W' });
const c100u = part('p-c100u', { designator: 'C4', kind: 'capacitor', value: '100µF', tolerance: '20%' });
const fuse = part('p-f1', { designator: 'F1', kind: 'fuse', value: 'T2.5A 250V' });
const diode = part('p-d1', { designator: 'D1', kind: 'diode', value: '1N4004' });
const bridge = part('p-br1', { designator: 'BR1', kind: 'bridge_rectifier', value: 'KBPC3510' });

describe('judgeReading', () => {
  it('600 Ω ±10 % read at 570 Ω passes, window 540–660 Ω, −5.0 % (worked example of the bench overhaul procedure)', () => {
    expect(value(judgeReading(r600, '570', false))).toMatchObject({
      verdict: 'pass',
      measured: 570,
      unit: 'Ω',
      min: 540,
      max: 660,
      measuredText: '570 Ω',
      windowText: '540 Ω – 660 Ω',
      deviationText: '\u22125.0 %',
      indicative: false,
    });
  });

  it('100 kΩ read at 100 kΩ passes at 0.0 % (same worked examples)', () => {
    expect(value(judgeReading(r100k, '100k', false))).toMatchObject({
      verdict: 'pass',
      deviationText: '0.0 %',
      windowText: '95 kΩ – 105 kΩ',
    });
  });

  it('reads 570R, 4.63k, 4k63, 100µ and 100uF in the part’s unit (IEC 60062 RKM code; SI prefixes)', () => {
    expect(value(judgeReading(r600, '570R', false)).measured).toBe(570);
    expect(value(judgeReading(r100k, '4.63k', false)).measured).toBe(4630);
    expect(value(judgeReading(r100k, '4k63', false)).measured).toBe(4630);
    expect(value(judgeReading(c100u, '100µ', false)).measured).toBeCloseTo(100e-6, 18);
    expect(value(judgeReading(c100u, '100uF', false)).measuredText).toBe('100 µF');
  });

  it('gives low and high with the edge in trade notation; a low in-circuit reading is only indicative (common practice: parallel paths read low)', () => {
    const low = value(judgeReading(r600, '500', false));
    expect(low).toMatchObject({ verdict: 'low', indicative: false, note: 'below the minimum of 540 Ω', deviationText: '\u221216.7 %' });
    expect(value(judgeReading(r600, '700', false))).toMatchObject({ verdict: 'high', deviationText: '+16.7 %' });
    expect(value(judgeReading(r600, '500', true))).toMatchObject({ verdict: 'low', indicative: true });
    expect(value(judgeReading(r600, '700', true)).indicative).toBe(false);
  });

  it('refuses "abc", a negative value, a unit that does not fit, and a part with no nominal', () => {
    expect(message(judgeReading(r600, 'abc', false))).toBe('“abc” is not a reading — type a value such as 4.7k');
    expect(message(judgeReading(r600, '-570', false))).toMatch(/cannot read below zero/);
    expect(message(judgeReading(r600, '100µF', false))).toBe('µF is not a resistance: read R7 in Ω');
    expect(message(judgeReading(c100u, '4k7Ω', false))).toMatch(/^Ω is not a capacitance/);
    expect(message(judgeReading(diode, '0.6', false))).toMatch(/D1 has no value .* diode test/);
    expect(message(judgeReading(r600, '  ', false))).toMatch(/type a reading/);
  });
});

describe('storedReadingText', () => {
  it('shows a stored value with its unit, as the live verdict did, and anything else as typed', () => {
    expect(storedReadingText({ measured: 672, unit: 'Ω', measuredText: '672' })).toBe('672 Ω');
    expect(storedReadingText({ measured: 4630, unit: 'Ω', measuredText: '4k63' })).toBe('4.63 kΩ');
    expect(storedReadingText({ measured: null, unit: null, measuredText: 'forward 0.55 / reverse OL' })).toBe('forward 0.55 / reverse OL');
    expect(storedReadingText({ measured: 0.55, unit: 'volts', measuredText: '0.55' })).toBe('0.55');
  });
});

describe('judgeDiodeSet', () => {
  it('passes a good silicon diode: 0.55 V forward, OL reversed (DMM diode-test function, 0.5–0.8 V)', () => {
    expect(value(judgeDiodeSet(diode, { forward: '0.55', reverse: 'OL' }))).toMatchObject({ verdict: 'pass', complete: true });
    expect(value(judgeDiodeSet(diode, { forward: '550 mV', reverse: 'O.L' })).verdict).toBe('pass');
  });

  it('fails a shorted diode and waits on a half-read one', () => {
    expect(value(judgeDiodeSet(diode, { forward: '0.01', reverse: '0.01' }))).toMatchObject({ verdict: 'fail', complete: true });
    expect(value(judgeDiodeSet(diode, { forward: '0.55', reverse: '' }))).toMatchObject({
      verdict: null,
      complete: false,
      missing: ['reverse'],
    });
  });

  it('judges a bridge rectifier’s four legs; one shorted leg fails it before the set is complete', () => {
    const good = Object.fromEntries(
      BRIDGE_READING_KEYS.filter((k) => k.required).map((k) => [k.key, k.red === '+' || k.black === '-' ? 'OL' : '0.52']),
    );
    expect(value(judgeDiodeSet(bridge, good))).toMatchObject({ verdict: 'pass', complete: true });
    // Cross-check: two junctions in series from − to + (≈1.0–1.4 V, common practice).
    expect(value(judgeDiodeSet(bridge, { ...good, 'minus-plus': '1.05', 'plus-minus': 'OL' })).verdict).toBe('pass');
    expect(value(judgeDiodeSet(bridge, { ...good, 'minus-plus': '0.5' })).verdict).toBe('fail');
    const shorted = value(judgeDiodeSet(bridge, { 'ac1-plus': '0.02', 'plus-ac1': '0.02' }));
    expect(shorted).toMatchObject({ verdict: 'fail', complete: false });
    expect(shorted.detail).toMatch(/AC1→\+/);
  });

  it('refuses unreadable text, an unknown key and a part that is not a diode', () => {
    expect(message(judgeDiodeSet(diode, { forward: 'abc' }))).toMatch(/not a diode-test reading/);
    expect(message(judgeDiodeSet(diode, { sideways: '0.5' }))).toMatch(/sideways/);
    expect(message(judgeDiodeSet(r600, { forward: '0.5' }))).toMatch(/not a diode/);
  });
});

describe('judgeFuse (IEC 60127 markings)', () => {
  it('a T2.5A 250V circuit accepts T2.5A 250V and refuses F2.5A 250V (faster) and T2A, saying why', () => {
    expect(value(judgeFuse(fuse, 'T2.5A 250V'))).toMatchObject({ accepted: true, reasons: [] });
    const faster = value(judgeFuse(fuse, 'F2.5A 250V'));
    expect(faster.accepted).toBe(false);
    expect(faster.reasons.join(' ')).toMatch(/faster/);
    const lower = value(judgeFuse(fuse, 'T2A'));
    expect(lower.accepted).toBe(false);
    expect(lower.reasons.join(' ')).toMatch(/2 A is lower than the 2.5 A/);
  });

  it('refuses an unreadable marking and a part that is not a fuse', () => {
    expect(message(judgeFuse(fuse, 'slow one'))).toBe('“slow one” is not a fuse marking — type it as printed on the cap, e.g. T2.5A 250V');
    expect(message(judgeFuse(r600, 'T2.5A'))).toMatch(/not a fuse/);
  });
});

describe('judgePower (NASA EEE-INST-002 derating, 50 %)', () => {
  it('12 V across 470 Ω = 0.306 W: a 1/4 W part is undersized; 1 W is the smallest standard rating', () => {
    const judged = value(judgePower(r470, '12 V'));
    expect(judged.watts).toBeCloseTo(0.306, 3);
    expect(judged).toMatchObject({ ratingWatts: 0.25, allowedWatts: 0.125, undersized: true, smallestStandardWatts: 1 });
    expect(judged.message).toMatch(/0.306 W/);
  });

  it('5 V across 600 Ω = 0.042 W is fine on 1/4 W; a part without a wattage cannot be judged', () => {
    expect(value(judgePower(r600, '5')).undersized).toBe(false);
    expect(message(judgePower(r100k, '5 V'))).toMatch(/no wattage/);
    expect(message(judgePower(r600, 'lots'))).toMatch(/not a voltage/);
  });
});

describe('partsForStep', () => {
  it('takes the parts of the step’s kinds and its named designators, in parts-list order', () => {
    const parts = [r600, fuse, c100u, bridge];
    expect(partsForStep({ partKinds: ['fuse'], designators: ['r7'] }, parts).map((p) => p.designator)).toEqual(['R7', 'F1']);
    expect(partsForStep({ partKinds: [], designators: [] }, parts)).toEqual([]);
  });
});

describe('evaluateBenchJob', () => {
  const steps: BenchStepInput[] = [
    { key: 'inspect', record: 'check', partKinds: [], designators: [], cautions: ['mains'] },
    { key: 'fuses', record: 'fuse', partKinds: ['fuse'], designators: [], cautions: [] },
    { key: 'rectifier', record: 'diode_set', partKinds: ['bridge_rectifier'], designators: [], cautions: [] },
    { key: 'measure', record: 'readings', partKinds: ['resistor'], designators: [], cautions: ['hot_iron'] },
    { key: 'power', record: 'power', partKinds: [], designators: ['R9'], cautions: ['mains'] },
  ];
  const parts = [r600, r100k, r470, fuse, bridge];

  function progress(fields: Partial<BenchStepProgressInput>): BenchStepProgressInput {
    return { done: false, acknowledged: false, answer: null, readings: {}, diodes: {}, fuses: {}, power: {}, ...fields };
  }

  it('judges every entry and leaves empty fields out', () => {
    const draft: BenchJobDraftInput = {
      steps: {
        measure: progress({
          readings: { 'p-r600': { text: '570', inCircuit: false }, 'p-r100k': { text: '', inCircuit: false } },
        }),
        fuses: progress({ fuses: { 'p-f1': { fitted: 'F2.5A 250V' } } }),
        rectifier: progress({ diodes: { 'p-br1': { 'ac1-plus': '', 'plus-ac1': '' } } }),
        power: progress({ power: { 'p-r470': { volts: '12 V' } } }),
      },
      partsUsed: [{ partId: 'p-r600', description: '600 Ω 1/4 W metal film', quantity: 1 }],
    };
    const evaluation = evaluateBenchJob({ steps, draft, parts });
    expect(evaluation.problems).toEqual([]);
    expect(evaluation.readings).toHaveLength(1);
    expect(evaluation.readings[0]).toMatchObject({
      stepKey: 'measure',
      partId: 'p-r600',
      designator: 'R7',
      verdict: 'pass',
      windowText: '540 Ω – 660 Ω',
    });
    // A refused fuse on a step not yet ticked is a result, not a problem.
    expect(evaluation.fuses[0]).toMatchObject({ partId: 'p-f1', accepted: false, fittedText: 'F2.5A 250V' });
    expect(evaluation.diodeSets).toEqual([]);
    expect(evaluation.power[0]).toMatchObject({ designator: 'R9', undersized: true });
  });

  it('names each field at fault the way the draft holds it', () => {
    const draft: BenchJobDraftInput = {
      steps: {
        inspect: progress({ done: true, answer: 'yes' }),
        measure: progress({ readings: { 'p-r600': { text: 'abc', inCircuit: false }, 'p-f1': { text: '1', inCircuit: false } } }),
        fuses: progress({ done: true, fuses: { 'p-f1': { fitted: 'T2A' } } }),
        rectifier: progress({ diodes: { 'p-br1': { 'ac1-plus': 'x' } } }),
        power: progress({ done: true, acknowledged: true, power: { 'p-r470': { volts: 'twelve' } } }),
        nonsense: progress({}),
      },
      partsUsed: [
        { partId: null, description: 'KBPC3510', quantity: 0 },
        { partId: 'p-nowhere', description: '', quantity: 1.5 },
      ],
    };
    const fields = evaluateBenchJob({ steps, draft, parts }).problems.map((p) => p.field);
    expect(fields).toEqual([
      'steps.nonsense',
      'steps.inspect.acknowledged',
      'steps.fuses.fuses.p-f1',
      'steps.rectifier.diodes.p-br1',
      'steps.measure.readings.p-r600',
      'steps.measure.readings.p-f1',
      'steps.power.power.p-r470',
      'partsUsed.0.quantity',
      'partsUsed.1.description',
      'partsUsed.1.quantity',
      'partsUsed.1.partId',
    ]);
    const messages = evaluateBenchJob({ steps, draft, parts }).problems;
    expect(messages.find((p) => p.field === 'steps.inspect.acknowledged')?.message).toBe(
      'acknowledge the cautions before ticking this step',
    );
    expect(messages.find((p) => p.field === 'steps.fuses.fuses.p-f1')?.message).toMatch(
      /^fit a fuse that matches before ticking this step: 2 A/,
    );
  });

  it('asks for an answer on a check step ticked done', () => {
    const draft: BenchJobDraftInput = { steps: { inspect: progress({ done: true, acknowledged: true }) }, partsUsed: [] };
    expect(evaluateBenchJob({ steps, draft, parts }).problems).toEqual([
      { field: 'steps.inspect.answer', message: 'answer yes or no before ticking this step' },
    ]);
  });
});

describe('diodeSetText', () => {
  it('writes the readings typed, in order, leaving out blanks', () => {
    expect(diodeSetText({ forward: ' 0.55 ', reverse: 'OL', extra: '  ' })).toBe('forward 0.55 / reverse OL');
    expect(diodeSetText({})).toBe('');
  });
});
