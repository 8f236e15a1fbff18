import { describe, expect, it } from 'vitest';
import { emptyDraft, setFitted, setPartsUsed, setReading, updateStep } from './draft.ts';
import { unsentChanges } from './unsent-changes.ts';

describe('unsentChanges', () => {
  const base = setReading(emptyDraft(), 'measure', 'r12', { text: '560' });

  it('lists only what this device changed and the other device holds differently', () => {
    let mine = setReading(base, 'measure', 'r12', { text: '571' });
    mine = setFitted(mine, 'fuses', 'f1', 'T2.5A 250V');
    mine = updateStep(mine, 'inspect', () => ({ note: 'scorch mark near R3' }));
    // The other device changed the reading too, and typed the same fuse.
    let theirs = setReading(base, 'measure', 'r12', { text: '590' });
    theirs = setFitted(theirs, 'fuses', 'f1', 'T2.5A 250V');
    const changes = unsentChanges(base, mine, theirs);
    expect(changes).toEqual([
      { what: 'reading', stepKey: 'measure', partId: 'r12', leg: null, mine: '571', theirs: '590' },
      { what: 'note', stepKey: 'inspect', partId: null, leg: null, mine: 'scorch mark near R3', theirs: '' },
    ]);
  });

  it('does not list what the other device changed and this one never touched', () => {
    const theirs = setReading(base, 'measure', 'r12', { text: '590' });
    expect(unsentChanges(base, base, theirs)).toEqual([]);
  });

  it('lists parts used added here that the other device lacks', () => {
    const mine = setPartsUsed(base, [{ partId: null, description: 'Bridge rectifier KBPC2504', quantity: 1 }]);
    expect(unsentChanges(base, mine, base)).toEqual([
      { what: 'partUsed', stepKey: null, partId: null, leg: null, mine: 'Bridge rectifier KBPC2504 × 1', theirs: '' },
    ]);
    expect(unsentChanges(base, mine, mine)).toEqual([]);
  });
});
