import { describe, expect, it } from 'vitest';
import { changeStep, keyFromTitle, moveStep, newStep, splitDesignators, toEditable, toSteps } from './template-draft.ts';

describe('template editor working copy', () => {
  it('derives a new step key from its title until the key is typed', () => {
    let step = changeStep(newStep(), { title: 'Check the fuses (F1–F3)' });
    expect(step.key).toBe('check-the-fuses-f1-f3');
    step = changeStep(step, { key: 'fuses' });
    step = changeStep(step, { title: 'Fuses' });
    expect(step.key).toBe('fuses');
  });

  it('keeps an existing step’s key when its title changes', () => {
    const [step] = toEditable([
      { key: 'measure', title: 'Measure', instructions: '', record: 'readings', partKinds: ['resistor'], designators: [], cautions: [] },
    ]);
    expect(changeStep(step!, { title: 'Measure the resistors' }).key).toBe('measure');
  });

  it('makes keys the contract accepts', () => {
    expect(keyFromTitle('Réflow — cracked joints!')).toBe('reflow-cracked-joints');
    expect(keyFromTitle('x'.repeat(50))).toHaveLength(40);
    expect(keyFromTitle('a'.repeat(39) + ' b')).toBe('a'.repeat(39));
  });

  it('reads designators as typed and moves steps', () => {
    expect(splitDesignators(' r1, R2;c5  BR1 ')).toEqual(['R1', 'R2', 'C5', 'BR1']);
    expect(moveStep(['a', 'b', 'c'], 2, -1)).toEqual(['a', 'c', 'b']);
    expect(moveStep(['a', 'b', 'c'], 0, -1)).toEqual(['a', 'b', 'c']);
    const steps = toSteps([{ ...newStep(), key: 'k', title: 'T', designatorsText: 'r1 r2' }]);
    expect(steps[0]).toEqual({
      key: 'k',
      title: 'T',
      instructions: '',
      record: 'check',
      partKinds: [],
      designators: ['R1', 'R2'],
      cautions: [],
    });
  });
});
