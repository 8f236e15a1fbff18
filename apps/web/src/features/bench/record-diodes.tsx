// A diode-test step: per diode its forward and reverse readings, per bridge rectifier its legs both ways (and
// the cross-checks), judged as a set by the domain as they are typed.
import { memo } from 'react';
import { BRIDGE_READING_KEYS, DIODE_READING_KEYS, judgeDiodeSet } from '@bumperline/domain/components/bench-judgement';
import type { PartRowProps, RecordProps } from './record-props.ts';
import { writtenValue } from './job-parts.ts';
import { setDiodeReading } from './draft.ts';
import { fieldDomId, problemAt } from './field-problems.ts';
import { VerdictBadge } from '../../components/verdict-badge.tsx';
import { ValueInput } from './value-input.tsx';

export function DiodesRecord({ step, progress, parts, readOnly, problems, edit }: RecordProps) {
  if (!parts.length) return <p className="text-ink-soft">This board’s parts list has no diodes or bridge rectifiers for this step.</p>;
  return (
    <ul className="grid gap-3" aria-label="Diode tests">
      {parts.map((part) => {
        const field = `steps.${step.key}.diodes.${part.id}`;
        return (
          <DiodeSet
            key={part.id}
            part={part}
            field={field}
            readings={progress.diodes[part.id]}
            problem={problemAt(problems, field)}
            readOnly={readOnly}
            stepKey={step.key}
            edit={edit}
          />
        );
      })}
    </ul>
  );
}

const DiodeSet = memo(function DiodeSet({
  part,
  field,
  readings,
  problem,
  readOnly,
  stepKey,
  edit,
}: PartRowProps & {
  readings: Record<string, string> | undefined;
}) {
  const id = fieldDomId(field);
  const keys =
    part.kind === 'bridge_rectifier'
      ? BRIDGE_READING_KEYS.map((k) => ({ key: k.key, label: k.label, extra: !k.required }))
      : DIODE_READING_KEYS.map((k) => ({ key: k.key, label: k.label, extra: false }));
  const values = readings ?? {};
  const anyTyped = Object.values(values).some((v) => v.trim() !== '');
  const judged = anyTyped ? judgeDiodeSet(part, values) : null;
  const result = judged?.ok ? judged.value : null;
  const message = part.lineProblem ?? (judged && !judged.ok ? judged.message : undefined) ?? (result?.verdict ? undefined : problem);
  return (
    <li className="grid content-start gap-2 rounded-md border border-paper-line p-3">
      <fieldset className="grid gap-2" aria-describedby={`${id}-result`}>
        <legend className="flex w-full flex-wrap items-baseline justify-between gap-x-3">
          <span className="text-lg font-extrabold">{part.line.designator}</span>
          <span className="text-ink-soft">{writtenValue(part.line)}</span>
        </legend>
        <div className="grid grid-cols-2 gap-x-2 gap-y-3">
          {keys.map((k, i) => {
            // The first input carries the set's id, so a problem on the set scrolls to it.
            const inputId = i === 0 ? id : `${id}-${i}`;
            return (
              <div key={k.key} className="grid content-end gap-1">
                <label htmlFor={inputId} className="text-sm font-semibold">
                  {k.label}
                  {k.extra && <span className="font-normal text-ink-muted"> (cross-check, optional)</span>}
                </label>
                <ValueInput
                  id={inputId}
                  value={values[k.key] ?? ''}
                  onChange={(t) => edit((d) => setDiodeReading(d, stepKey, part.id, k.key, t))}
                  letters={['OL']}
                  letterLabel={`${part.line.designator}, ${k.label}`}
                  disabled={readOnly}
                  placeholder={readOnly ? undefined : 'V or OL'}
                  aria-invalid={!!message}
                />
              </div>
            );
          })}
        </div>
      </fieldset>
      <div id={`${id}-result`} aria-live="polite" className="flex min-h-7 flex-wrap items-center gap-x-3 gap-y-1">
        {message ? (
          <p className="font-semibold text-down">{message}</p>
        ) : result?.verdict ? (
          <>
            <VerdictBadge verdict={result.verdict} />
            <span>{result.detail}</span>
          </>
        ) : result ? (
          <span className="text-ink-soft">{result.detail}</span>
        ) : (
          <span className="text-sm text-ink-muted">Not read yet.</span>
        )}
      </div>
    </li>
  );
});
