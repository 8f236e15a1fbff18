// Where the server's field problems go on the job screen. Finish answers 400 with fields such as
// `steps.measure.readings.<partId>`, `steps.fuses.fuses.<partId>`, `steps.<key>.acknowledged` or
// `partsUsed.2.quantity`; each is shown beside its input, and the screen scrolls to the first.
import { asSentence } from '../../lib/format.ts';

export interface FieldProblem {
  field: string;
  message: string;
}

export interface PlacedProblems {
  /** Message per field name, as the server named it. */
  byField: Record<string, string>;
  /** How many problems each step has, for the step list. */
  countByStep: Record<string, number>;
  /** The first problem in the order the steps are worked (then parts used), or null. */
  first: FieldProblem | null;
  /** Problems that name no field on this screen: shown together above the steps. */
  unplaced: FieldProblem[];
}

/** The step a field belongs to, or null for job-level fields (`partsUsed.…`, `version`). */
export function stepOfField(field: string): string | null {
  const m = /^steps\.([^.]+)(?:\.|$)/.exec(field);
  return m ? m[1]! : null;
}

/** A DOM id for the input of `field` (ids may not hold every character a step key or leg name can). */
export function fieldDomId(field: string): string {
  return `bench-${field.replace(/[^A-Za-z0-9_-]/g, (c) => `_${c.codePointAt(0)!.toString(16)}_`)}`;
}

export function placeProblems(problems: readonly FieldProblem[], stepKeys: readonly string[]): PlacedProblems {
  const byField: Record<string, string> = {};
  const countByStep: Record<string, number> = {};
  const unplaced: FieldProblem[] = [];
  const placed: { problem: FieldProblem; order: number }[] = [];
  problems.forEach((problem, index) => {
    const step = stepOfField(problem.field);
    const stepIndex = step === null ? -1 : stepKeys.indexOf(step);
    if (step !== null && stepIndex >= 0) {
      countByStep[step] = (countByStep[step] ?? 0) + 1;
    } else if (!problem.field.startsWith('partsUsed')) {
      unplaced.push(problem);
      return;
    }
    // Several messages for one field read as one; each starts as a sentence.
    const sentence = asSentence(problem.message);
    byField[problem.field] = byField[problem.field] ? `${byField[problem.field]} ${sentence}` : sentence;
    // Steps in order, then parts used; within a step, in the server's order.
    placed.push({ problem, order: (stepIndex >= 0 ? stepIndex : stepKeys.length) * 10_000 + index });
  });
  placed.sort((a, b) => a.order - b.order);
  return { byField, countByStep, first: placed[0]?.problem ?? null, unplaced };
}

/** The message for `field`, or for anything under it (a bridge's leg under its part), or undefined. */
export function problemAt(byField: Readonly<Record<string, string>>, field: string): string | undefined {
  if (byField[field]) return byField[field];
  const under = Object.keys(byField).filter((f) => f.startsWith(`${field}.`));
  return under.length ? under.map((f) => byField[f]).join(' ') : undefined;
}
