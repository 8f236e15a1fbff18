// The job's steps in order with where each stands: done, problems to fix, cautions. Tapping one opens it.
import { CircleCheck, CircleDashed, OctagonX, TriangleAlert } from 'lucide-react';
import type { BenchJobDraft, BenchStep } from '@bumperline/contracts/bench-vocabulary';

export const FINISH_STEP = 'finish';

export function StepList({
  steps,
  draft,
  current,
  problemCounts,
  onOpen,
  finishLabel,
}: {
  steps: readonly BenchStep[];
  draft: BenchJobDraft;
  current: string;
  problemCounts: Readonly<Record<string, number>>;
  onOpen: (key: string) => void;
  finishLabel: string;
}) {
  return (
    <ol className="grid gap-1">
      {steps.map((step, i) => {
        const done = draft.steps[step.key]?.done ?? false;
        const problems = problemCounts[step.key] ?? 0;
        const isCurrent = step.key === current;
        return (
          <li key={step.key}>
            <button
              type="button"
              aria-current={isCurrent ? 'step' : undefined}
              onClick={() => onOpen(step.key)}
              className={`flex min-h-12 w-full items-center gap-2 rounded-md border-2 px-2 py-1.5 text-left ${isCurrent ? 'border-ink bg-white font-bold' : 'border-transparent hover:bg-white'}`}
            >
              <span className="w-6 shrink-0 text-right font-bold tabular text-ink-muted">{i + 1}</span>
              {problems > 0 ? (
                <OctagonX aria-hidden className="size-5 shrink-0 text-down" />
              ) : done ? (
                <CircleCheck aria-hidden className="size-5 shrink-0 text-running" />
              ) : (
                <CircleDashed aria-hidden className="size-5 shrink-0 text-ink-muted" />
              )}
              <span className="min-w-0 flex-1">
                {step.title}
                <span className="sr-only">
                  {done ? ', done' : ', not done'}
                  {problems ? `, ${problems} ${problems === 1 ? 'problem' : 'problems'}` : ''}
                </span>
              </span>
              {step.cautions.length > 0 && (
                <TriangleAlert aria-label="Has cautions" role="img" className="size-4 shrink-0 text-attention" />
              )}
            </button>
          </li>
        );
      })}
      <li>
        <button
          type="button"
          aria-current={current === FINISH_STEP ? 'step' : undefined}
          onClick={() => onOpen(FINISH_STEP)}
          className={`flex min-h-12 w-full items-center gap-2 rounded-md border-2 px-2 py-1.5 text-left ${current === FINISH_STEP ? 'border-ink bg-white font-bold' : 'border-transparent hover:bg-white'}`}
        >
          <span className="w-6 shrink-0" />
          <CircleCheck aria-hidden className="size-5 shrink-0 text-ink-muted" />
          <span className="flex-1">{finishLabel}</span>
        </button>
      </li>
    </ol>
  );
}
