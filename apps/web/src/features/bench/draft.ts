// Reading and changing a bench job's draft without mutating it: every edit makes a new draft object, so the
// autosave can tell what changed and React re-renders only what it must.
import type { BenchJobDraft, BenchPartUsed, BenchStepProgress } from '@bumperline/contracts/bench-vocabulary';

export function emptyProgress(): BenchStepProgress {
  return { done: false, acknowledged: false, answer: null, note: '', readings: {}, diodes: {}, fuses: {}, power: {} };
}

export function emptyDraft(): BenchJobDraft {
  return { steps: {}, partsUsed: [] };
}

/** A step's progress, filled in with empty values for anything the server did not send. */
export function stepProgress(draft: BenchJobDraft, key: string): BenchStepProgress {
  const p = draft.steps[key];
  return p ? { ...emptyProgress(), ...p } : emptyProgress();
}

export function updateStep(draft: BenchJobDraft, key: string, change: (p: BenchStepProgress) => Partial<BenchStepProgress>): BenchJobDraft {
  const current = stepProgress(draft, key);
  return { ...draft, steps: { ...draft.steps, [key]: { ...current, ...change(current) } } };
}

export function setReading(draft: BenchJobDraft, key: string, partId: string, value: Partial<{ text: string; inCircuit: boolean }>) {
  return updateStep(draft, key, (p) => {
    const was = p.readings[partId] ?? { text: '', inCircuit: false };
    return { readings: { ...p.readings, [partId]: { ...was, ...value } } };
  });
}

export function setDiodeReading(draft: BenchJobDraft, key: string, partId: string, leg: string, text: string) {
  return updateStep(draft, key, (p) => ({ diodes: { ...p.diodes, [partId]: { ...p.diodes[partId], [leg]: text } } }));
}

export function setFitted(draft: BenchJobDraft, key: string, partId: string, fitted: string) {
  return updateStep(draft, key, (p) => ({ fuses: { ...p.fuses, [partId]: { fitted } } }));
}

export function setVolts(draft: BenchJobDraft, key: string, partId: string, volts: string) {
  return updateStep(draft, key, (p) => ({ power: { ...p.power, [partId]: { volts } } }));
}

export function setPartsUsed(draft: BenchJobDraft, partsUsed: BenchPartUsed[]): BenchJobDraft {
  return { ...draft, partsUsed };
}

/** Steps ticked done, out of all steps. */
export function progressCount(draft: BenchJobDraft, keys: readonly string[]): { done: number; total: number } {
  return { done: keys.filter((k) => draft.steps[k]?.done).length, total: keys.length };
}
