import { describe, expect, it } from 'vitest';
import { emptyStepProgress } from '@bumperline/contracts/bench-jobs';
import type { BenchJobDraft, BenchStep } from '@bumperline/contracts/bench-vocabulary';
import { recapsBoard } from './bench-jobs.ts';

const step = (key: string, record: BenchStep['record'], partKinds: BenchStep['partKinds']): BenchStep => ({
  key,
  title: key,
  instructions: '',
  record,
  partKinds,
  designators: [],
  cautions: [],
});
const draftWith = (done: Record<string, boolean>): BenchJobDraft => ({
  steps: Object.fromEntries(Object.entries(done).map(([key, d]) => [key, { ...emptyStepProgress(), done: d }])),
  partsUsed: [],
});

describe('recapsBoard', () => {
  const steps = [
    step('discharge', 'check', []),
    step('recap', 'parts_used', ['electrolytic']),
    step('measure', 'readings', ['electrolytic']),
  ];

  it('counts a job whose electrolytic parts-used or check step was ticked done', () => {
    expect(recapsBoard(steps, draftWith({ recap: true }))).toBe(true);
    expect(recapsBoard([step('caps', 'check', ['capacitor', 'electrolytic'])], draftWith({ caps: true }))).toBe(true);
  });

  it('does not count the step left undone, nor a step that only measures the electrolytics', () => {
    expect(recapsBoard(steps, draftWith({ recap: false, discharge: true }))).toBe(false);
    expect(recapsBoard(steps, draftWith({ measure: true }))).toBe(false);
    expect(recapsBoard([step('connectors', 'parts_used', ['connector'])], draftWith({ connectors: true }))).toBe(false);
  });
});
