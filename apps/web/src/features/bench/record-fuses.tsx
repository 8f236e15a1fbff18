// A fuse step: per fuse the circuit's marking from the parts list and the marking of the fuse fitted, accepted
// only when current, voltage and speed match (the domain says why not, e.g. a quick-acting fuse in a time-lag circuit).
import { memo } from 'react';
import { judgeFuse } from '@bumperline/domain/components/bench-judgement';
import type { PartRowProps, RecordProps } from './record-props.ts';
import { setFitted } from './draft.ts';
import { fieldDomId } from './field-problems.ts';
import { VerdictBadge } from '../../components/verdict-badge.tsx';
import { inputClass } from '../../components/field.tsx';

export function FusesRecord({ step, progress, parts, readOnly, problems, edit }: RecordProps) {
  if (!parts.length) return <p className="text-ink-soft">This board’s parts list has no fuses for this step.</p>;
  return (
    <ul className="grid gap-3 xl:grid-cols-2" aria-label="Fuses">
      {parts.map((part) => {
        const field = `steps.${step.key}.fuses.${part.id}`;
        return (
          <FuseRow
            key={part.id}
            part={part}
            field={field}
            fitted={progress.fuses[part.id]?.fitted ?? ''}
            problem={problems[field]}
            readOnly={readOnly}
            stepKey={step.key}
            edit={edit}
          />
        );
      })}
    </ul>
  );
}

const FuseRow = memo(function FuseRow({
  part,
  field,
  fitted,
  problem,
  readOnly,
  stepKey,
  edit,
}: PartRowProps & {
  fitted: string;
}) {
  const id = fieldDomId(field);
  const judged = fitted.trim() === '' || part.lineProblem ? null : judgeFuse(part, fitted);
  const result = judged?.ok ? judged.value : null;
  const message = part.lineProblem ?? (judged && !judged.ok ? judged.message : undefined) ?? (result?.accepted ? undefined : problem);
  return (
    <li className="grid content-start gap-2 rounded-md border border-paper-line p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <span className="text-lg font-extrabold">{part.line.designator}</span>
        <span>
          Circuit needs <strong className="tabular">{part.line.value}</strong>
        </span>
      </div>
      <label htmlFor={id} className="font-semibold">
        Marking on the fuse fitted in {part.line.designator}
      </label>
      <input
        id={id}
        type="text"
        autoComplete="off"
        autoCorrect="off"
        autoCapitalize="characters"
        spellCheck={false}
        className={`${inputClass} text-lg tabular`}
        value={fitted}
        placeholder={readOnly ? undefined : 'as printed, e.g. T2.5A 250V'}
        disabled={readOnly}
        aria-invalid={!!message || (result !== null && !result.accepted)}
        aria-describedby={`${id}-result`}
        onChange={(e) => edit((d) => setFitted(d, stepKey, part.id, e.target.value))}
      />
      <div id={`${id}-result`} aria-live="polite" className="grid min-h-7 gap-1">
        {message && !result ? (
          <p className="font-semibold text-down">{message}</p>
        ) : result ? (
          <>
            <div className="flex flex-wrap items-center gap-2">
              <VerdictBadge verdict={result.accepted ? 'accepted' : 'refused'} />
              <span className="font-semibold">{result.accepted ? 'This fuse may stay in the circuit.' : 'Do not fit this fuse:'}</span>
            </div>
            {result.reasons.length > 0 && (
              <ul className={`list-disc pl-6 ${result.accepted ? 'text-ink-soft' : 'font-semibold text-down'}`}>
                {result.reasons.map((r) => (
                  <li key={r}>{r}</li>
                ))}
              </ul>
            )}
            {message && <p className="font-semibold text-down">{message}</p>}
          </>
        ) : (
          <span className="text-sm text-ink-muted">Not checked yet.</span>
        )}
      </div>
    </li>
  );
});
