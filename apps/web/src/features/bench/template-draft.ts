// The template editor's working copy: steps with a local id (for React and reordering), the designators as the
// person types them, and whether the key was typed or still follows the title.
import type { BenchStep } from '@bumperline/contracts/bench-vocabulary';

export interface EditableStep extends Omit<BenchStep, 'designators'> {
  uid: string;
  /** "R1, R2 C5": split on save. */
  designatorsText: string;
  /** A key typed by hand (or an existing step's) is kept; a new step's key follows its title. */
  keyFixed: boolean;
}

let counter = 0;
const nextUid = () => `s${++counter}`;

/** "Check the fuses" → "check-the-fuses" (the contract's key form: lower case, digits, hyphens, ≤ 40). */
export function keyFromTitle(title: string): string {
  return title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40)
    .replace(/-+$/g, '');
}

export function toEditable(steps: readonly BenchStep[]): EditableStep[] {
  return steps.map((s) => ({ ...s, uid: nextUid(), designatorsText: s.designators.join(', '), keyFixed: true }));
}

export function newStep(): EditableStep {
  return {
    uid: nextUid(),
    key: '',
    title: '',
    instructions: '',
    record: 'check',
    partKinds: [],
    designatorsText: '',
    cautions: [],
    keyFixed: false,
  };
}

export function splitDesignators(text: string): string[] {
  return text
    .split(/[\s,;]+/)
    .map((d) => d.trim().toUpperCase())
    .filter(Boolean);
}

export function toSteps(steps: readonly EditableStep[]): BenchStep[] {
  return steps.map((s) => ({
    key: s.key,
    title: s.title,
    instructions: s.instructions,
    record: s.record,
    partKinds: s.partKinds,
    designators: splitDesignators(s.designatorsText),
    cautions: s.cautions,
  }));
}

/** Moves the step at `from` by `by` places (−1 up, +1 down); out of range leaves the list as it is. */
export function moveStep<T>(steps: readonly T[], from: number, by: number): T[] {
  const to = from + by;
  if (from < 0 || from >= steps.length || to < 0 || to >= steps.length) return [...steps];
  const next = [...steps];
  const [moved] = next.splice(from, 1);
  next.splice(to, 0, moved!);
  return next;
}

export function changeStep(step: EditableStep, change: Partial<EditableStep>): EditableStep {
  const next = { ...step, ...change };
  if ('key' in change) next.keyFixed = true;
  if ('title' in change && !next.keyFixed) next.key = keyFromTitle(next.title);
  return next;
}
