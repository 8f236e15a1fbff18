// A yes/no check, and the note every step can carry (the whole record on a "note" step).
import { inputClass } from '../../components/field.tsx';
import type { RecordProps } from './record-props.ts';
import { updateStep } from './draft.ts';
import { fieldDomId } from './field-problems.ts';

export function CheckRecord({ step, progress, readOnly, problems, edit }: RecordProps) {
  const field = `steps.${step.key}.answer`;
  const id = fieldDomId(field);
  const problem = progress.answer ? undefined : problems[field];
  return (
    <fieldset className="grid gap-2" aria-describedby={problem ? `${id}-problem` : undefined}>
      <legend className="mb-1 font-semibold">Your answer</legend>
      <div className="grid grid-cols-2 gap-2">
        {(['yes', 'no'] as const).map((answer, i) => (
          <label
            key={answer}
            className={`flex min-h-14 cursor-pointer items-center justify-center gap-2 rounded-md border-2 text-lg font-extrabold ${progress.answer === answer ? 'border-ink bg-ink text-white' : 'border-ink bg-white text-ink'}`}
          >
            <input
              id={i === 0 ? id : undefined}
              type="radio"
              name={id}
              className="size-5 accent-brass-bright"
              checked={progress.answer === answer}
              disabled={readOnly}
              onChange={() => edit((d) => updateStep(d, step.key, () => ({ answer })))}
            />
            {answer === 'yes' ? 'Yes' : 'No'}
          </label>
        ))}
      </div>
      {problem && (
        <p id={`${id}-problem`} className="text-sm font-semibold text-down">
          {problem}
        </p>
      )}
    </fieldset>
  );
}

export function NoteRecord({ step, progress, readOnly, problems, edit, main }: RecordProps & { main: boolean }) {
  const field = `steps.${step.key}.note`;
  const id = fieldDomId(field);
  const problem = problems[field];
  return (
    <div className="grid gap-1">
      <label htmlFor={id} className="font-semibold">
        {main ? 'What you found' : 'Note (optional)'}
      </label>
      <textarea
        id={id}
        rows={main ? 5 : 2}
        maxLength={4000}
        className={inputClass}
        value={progress.note}
        disabled={readOnly}
        aria-invalid={!!problem}
        aria-describedby={problem ? `${id}-problem` : undefined}
        onChange={(e) => edit((d) => updateStep(d, step.key, () => ({ note: e.target.value })))}
      />
      {problem && (
        <p id={`${id}-problem`} className="text-sm font-semibold text-down">
          {problem}
        </p>
      )}
    </div>
  );
}
