// A power step: the volts measured across each resistor in operation → what it dissipates against its rating
// after derating; an undersized part is flagged with the numbers.
import { memo } from 'react';
import { judgePower } from '@bumperline/domain/components/bench-judgement';
import { formatQuantity } from '@bumperline/domain/components/values';
import type { PartRowProps, RecordProps } from './record-props.ts';
import { writtenValue } from './job-parts.ts';
import { setVolts } from './draft.ts';
import { fieldDomId } from './field-problems.ts';
import { VerdictBadge } from '../../components/verdict-badge.tsx';
import { ValueInput } from './value-input.tsx';

export const watts = (w: number) => formatQuantity(w, 'W', { significantDigits: 3 });

export function PowerRecord({ step, progress, parts, readOnly, problems, edit }: RecordProps) {
  if (!parts.length) return <p className="text-ink-soft">This board’s parts list has no resistors for this step.</p>;
  return (
    <ul className="grid gap-3 xl:grid-cols-2" aria-label="Power checks">
      {parts.map((part) => {
        const field = `steps.${step.key}.power.${part.id}`;
        return (
          <PowerRow
            key={part.id}
            part={part}
            field={field}
            volts={progress.power[part.id]?.volts ?? ''}
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

const PowerRow = memo(function PowerRow({
  part,
  field,
  volts,
  problem,
  readOnly,
  stepKey,
  edit,
}: PartRowProps & {
  volts: string;
}) {
  const id = fieldDomId(field);
  const judged = volts.trim() === '' || part.lineProblem ? null : judgePower(part, volts);
  const result = judged?.ok ? judged.value : null;
  const message = part.lineProblem ?? (judged && !judged.ok ? judged.message : undefined) ?? (result ? undefined : problem);
  return (
    <li className="grid content-start gap-2 rounded-md border border-paper-line p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <label htmlFor={id} className="text-lg font-extrabold">
          {part.line.designator}
          <span className="sr-only"> volts across it</span>
        </label>
        <span className="text-ink-soft tabular">{writtenValue(part.line)}</span>
      </div>
      <ValueInput
        id={id}
        value={volts}
        onChange={(t) => edit((d) => setVolts(d, stepKey, part.id, t))}
        letters={[]}
        letterLabel={part.line.designator}
        disabled={readOnly}
        placeholder={readOnly ? undefined : 'volts across it, e.g. 12'}
        aria-invalid={!!message || !!result?.undersized}
        aria-describedby={`${id}-result`}
      />
      <div id={`${id}-result`} aria-live="polite" className="grid min-h-7 gap-1">
        {message ? (
          <p className="font-semibold text-down">{message}</p>
        ) : result ? (
          <>
            <div className="flex flex-wrap items-center gap-x-3 gap-y-1 tabular">
              <VerdictBadge verdict={result.undersized ? 'undersized' : 'ok'} />
              <span>
                Dissipates <strong>{watts(result.watts)}</strong>
              </span>
              <span>rated {watts(result.ratingWatts)}</span>
              <span>allowed {watts(result.allowedWatts)} after derating</span>
            </div>
            {/* The numbers above say it all for a part within its rating; an undersized one is told why in words. */}
            {result.undersized && <p className="font-semibold text-down">{result.message}</p>}
          </>
        ) : (
          <span className="text-sm text-ink-muted">Not measured yet.</span>
        )}
      </div>
    </li>
  );
});
