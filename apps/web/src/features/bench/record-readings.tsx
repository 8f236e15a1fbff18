// A readings step: one row per part, judged live by the domain on every keystroke (no request): PASS / LOW /
// HIGH in words with its shape, the window and the deviation; bad text keeps the text and says why.
import { memo } from 'react';
import { judgeReading } from '@bumperline/domain/components/bench-judgement';
import type { PartRowProps, RecordProps } from './record-props.ts';
import { writtenValue } from './job-parts.ts';
import { setReading } from './draft.ts';
import { fieldDomId } from './field-problems.ts';
import { VerdictBadge, verdictOfReading } from '../../components/verdict-badge.tsx';
import { ValueInput, lettersFor } from './value-input.tsx';

export function ReadingsRecord({ step, progress, parts, readOnly, problems, edit }: RecordProps) {
  if (!parts.length) return <p className="text-ink-soft">This board’s parts list has no parts for this step.</p>;
  return (
    <ul className="grid gap-3 xl:grid-cols-2" aria-label="Readings">
      {parts.map((part) => {
        const field = `steps.${step.key}.readings.${part.id}`;
        const entry = progress.readings[part.id];
        return (
          <ReadingRow
            key={part.id}
            part={part}
            field={field}
            text={entry?.text ?? ''}
            inCircuit={entry?.inCircuit ?? false}
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

const ReadingRow = memo(function ReadingRow({
  part,
  field,
  text,
  inCircuit,
  problem,
  readOnly,
  stepKey,
  edit,
}: PartRowProps & {
  text: string;
  inCircuit: boolean;
}) {
  const id = fieldDomId(field);
  const onChange = (value: Partial<{ text: string; inCircuit: boolean }>) => edit((d) => setReading(d, stepKey, part.id, value));
  const judged = text.trim() === '' || part.lineProblem ? null : judgeReading(part, text, inCircuit);
  const result = judged?.ok ? judged.value : null;
  // The server judges with the same code: once the live verdict reads, its earlier problem is answered.
  const message = part.lineProblem ?? (judged && !judged.ok ? judged.message : undefined) ?? (result ? undefined : problem);
  return (
    <li className="grid content-start gap-2 rounded-md border border-paper-line p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <label htmlFor={id} className="text-lg font-extrabold">
          {part.line.designator}
          <span className="sr-only"> reading</span>
        </label>
        <span className="text-ink-soft tabular">
          <span className="sr-only">Nominal: </span>
          {writtenValue(part.line)}
        </span>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <div className="min-w-0 flex-[1_1_12rem]">
          <ValueInput
            id={id}
            value={text}
            onChange={(t) => onChange({ text: t })}
            letters={lettersFor(part.unit)}
            letterLabel={`${part.line.designator}'s reading`}
            readOnly={readOnly}
            disabled={readOnly}
            placeholder={readOnly ? undefined : part.unit === 'F' ? 'e.g. 98µ' : 'e.g. 570'}
            aria-invalid={!!message}
            aria-describedby={`${id}-result`}
          />
        </div>
        <label className="flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-paper-line px-3 font-semibold">
          <input
            type="checkbox"
            className="size-5 accent-ink"
            checked={inCircuit}
            disabled={readOnly}
            onChange={(e) => onChange({ inCircuit: e.target.checked })}
          />
          In circuit
        </label>
      </div>
      <div id={`${id}-result`} aria-live="polite" className="flex min-h-7 flex-wrap items-center gap-x-3 gap-y-1">
        {message ? (
          <p className="font-semibold text-down">{message}</p>
        ) : result ? (
          <>
            <VerdictBadge verdict={verdictOfReading(result)} />
            <span className="tabular">
              <span className="sr-only">Window </span>
              {result.windowText}
            </span>
            <span className="font-semibold tabular">
              <span className="sr-only">Deviation </span>
              {result.deviationText}
            </span>
            {result.indicative && <span className="w-full font-semibold text-attention">Indicative — lift a leg and measure again.</span>}
            {!result.indicative && result.verdict !== 'pass' && (
              <span className="w-full font-semibold text-down">Out of tolerance: {result.note}</span>
            )}
          </>
        ) : (
          <span className="text-sm text-ink-muted">Not read yet.</span>
        )}
      </div>
    </li>
  );
});
