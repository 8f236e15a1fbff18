// The foot of a step: "I have read the cautions" (only where the step has cautions), then "Done", which
// cannot be ticked until the cautions are acknowledged, and says so.
import type { BenchStep, BenchStepProgress } from '@bumperline/contracts/bench-vocabulary';
import { fieldDomId } from './field-problems.ts';

interface SignOffProps {
  step: BenchStep;
  progress: BenchStepProgress;
  readOnly: boolean;
  problems: Readonly<Record<string, string>>;
  onChange: (change: Partial<BenchStepProgress>) => void;
}

/** Right under the cautions: the technician says they have read them. */
export function AcknowledgeCautions({ step, progress, readOnly, problems, onChange }: SignOffProps) {
  if (!step.cautions.length) return null;
  const ackField = `steps.${step.key}.acknowledged`;
  const ackId = fieldDomId(ackField);
  const ackProblem = progress.acknowledged ? undefined : problems[ackField];
  return (
    <div>
      <label
        htmlFor={ackId}
        className={`flex min-h-14 cursor-pointer items-center gap-3 rounded-md border-2 px-3 py-2 font-bold ${progress.acknowledged ? 'border-running bg-running-tint' : 'border-attention bg-white'}`}
      >
        <input
          id={ackId}
          type="checkbox"
          className="size-6 shrink-0 accent-ink"
          checked={progress.acknowledged}
          disabled={readOnly}
          aria-invalid={!!ackProblem}
          aria-describedby={ackProblem ? `${ackId}-problem` : undefined}
          // Taking the acknowledgement back also takes back "Done".
          onChange={(e) => onChange(e.target.checked ? { acknowledged: true } : { acknowledged: false, done: false })}
        />
        I have read the cautions
      </label>
      {ackProblem && (
        <p id={`${ackId}-problem`} className="mt-1 text-sm font-semibold text-down">
          {ackProblem}
        </p>
      )}
    </div>
  );
}

/** The step's "Done", which cannot be ticked before the cautions are acknowledged, and says so. */
export function StepDone({ step, progress, readOnly, problems, onChange }: SignOffProps) {
  const blocked = step.cautions.length > 0 && !progress.acknowledged;
  const doneField = `steps.${step.key}.done`;
  const doneId = fieldDomId(doneField);
  const doneProblem = problems[doneField];
  return (
    <div>
      <label
        htmlFor={doneId}
        className={`flex min-h-14 items-center gap-3 rounded-md border-2 px-3 py-2 text-lg font-extrabold ${blocked ? 'cursor-not-allowed border-paper-line bg-paper-dim text-ink-muted' : progress.done ? 'cursor-pointer border-running bg-running-tint text-running' : 'cursor-pointer border-ink bg-white text-ink'}`}
      >
        <input
          id={doneId}
          type="checkbox"
          className="size-6 shrink-0 accent-ink"
          checked={progress.done}
          disabled={readOnly || blocked}
          aria-invalid={!!doneProblem}
          aria-describedby={
            [blocked ? `${doneId}-why` : null, doneProblem ? `${doneId}-problem` : null].filter(Boolean).join(' ') || undefined
          }
          onChange={(e) => onChange({ done: e.target.checked })}
        />
        Done
      </label>
      {blocked && (
        <p id={`${doneId}-why`} className="mt-1 text-sm font-semibold text-ink-soft">
          Tick “I have read the cautions” first: this step cannot be done without it.
        </p>
      )}
      {doneProblem && (
        <p id={`${doneId}-problem`} className="mt-1 text-sm font-semibold text-down">
          {doneProblem}
        </p>
      )}
    </div>
  );
}
