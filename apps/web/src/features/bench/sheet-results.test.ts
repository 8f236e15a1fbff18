import { describe, expect, it } from 'vitest';
import type { BenchJobPart } from '@bumperline/contracts/bench-jobs';
import type { BenchStep } from '@bumperline/contracts/bench-vocabulary';
import { emptyDraft, setFitted, setReading } from './draft.ts';
import { readJobParts } from './job-parts.ts';
import { describeOutOfTolerance, fromDraft, fromEvaluation, inPartsListOrder, outOfTolerance } from './sheet-results.ts';

const line = (id: string, designator: string, kind: BenchJobPart['kind'], value: string, tolerance = ''): BenchJobPart => ({
  id,
  designator,
  kind,
  value,
  tolerance,
  rating: '',
  ratedTemperatureC: null,
  ratedLifeHours: null,
  notes: '',
  removed: false,
});

const steps: BenchStep[] = [
  { key: 'fuses', title: 'Fuses', instructions: '', record: 'fuse', partKinds: ['fuse'], designators: [], cautions: [] },
  { key: 'measure', title: 'Measure', instructions: '', record: 'readings', partKinds: ['resistor'], designators: [], cautions: [] },
];

describe('job sheet results from an open job', () => {
  const parts = readJobParts([
    line('r1', 'R1', 'resistor', '600', '10%'),
    line('r2', 'R2', 'resistor', '100k', '5%'),
    line('r3', 'R3', 'resistor', '1k', '5%'),
    line('f1', 'F1', 'fuse', 'T2.5A 250V'),
  ]);

  it('lists the part read outside its window in words, and not the ones inside it or low in circuit', () => {
    // The feature's worked example: 600 Ω ±10 % read at 570 Ω passes (window 540–660 Ω).
    // Typed out of order: the sheet lists them as the parts list does.
    let draft = setReading(emptyDraft(), 'measure', 'r3', { text: '800', inCircuit: true });
    draft = setReading(draft, 'measure', 'r2', { text: '112k' });
    draft = setReading(draft, 'measure', 'r1', { text: '570' });
    const results = inPartsListOrder(fromDraft({ steps, draft }, parts), parts);
    expect(results.readings.map((r) => [r.designator, r.verdict, r.indicative])).toEqual([
      ['R1', 'pass', false],
      ['R2', 'high', false],
      ['R3', 'low', true],
    ]);
    const out = outOfTolerance(results);
    expect(out.map((r) => r.designator)).toEqual(['R2']);
    expect(describeOutOfTolerance(out[0]!)).toMatch(/^R2 reads HIGH: 112 kΩ against 95 kΩ – 105 kΩ \(\+12\.0 %\)$/);
  });

  it('carries the circuit’s fuse marking beside the one fitted', () => {
    const draft = setFitted(emptyDraft(), 'fuses', 'f1', 'F2.5A 250V');
    const [fuse] = fromDraft({ steps, draft }, parts).fuses;
    expect(fuse).toMatchObject({ designator: 'F1', specified: 'T2.5A 250V', fitted: 'F2.5A 250V', accepted: false });
    expect(fuse!.reasons.join(' ')).toMatch(/quick|time-lag/i);
  });
});

describe('job sheet results from a finished job', () => {
  it('shows the stored reading with its unit and its deviation in the trade’s notation', () => {
    const results = fromEvaluation({
      readings: [
        {
          partId: 'r7',
          designator: 'R7',
          stepKey: 'measure',
          measuredText: '672',
          measured: 672,
          unit: 'Ω',
          inCircuit: false,
          indicative: false,
          verdict: 'high',
          min: 540,
          max: 660,
          windowText: '540 Ω – 660 Ω',
          deviationPercent: 12,
          note: 'above the maximum of 660 Ω',
        },
      ],
      fuses: [],
      power: [],
    });
    expect(outOfTolerance(results).map(describeOutOfTolerance)).toEqual(['R7 reads HIGH: 672 Ω against 540 Ω – 660 Ω (+12.0 %)']);
  });
});
