// A simple editor for bench-job templates: name, description, and steps to add, reorder and remove, each with its
// title, instructions, what it records, the parts it concerns and its cautions. The server checks it all; its
// messages are shown at their fields and nothing typed is lost.
import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { ArrowDown, ArrowUp, Plus, Save, Trash2 } from 'lucide-react';
import type { BenchTemplate } from '@bumperline/contracts/bench-jobs';
import { cautionKinds, partKinds, partKindLabels, stepRecordKinds, stepRecordLabels } from '@bumperline/contracts/bench-vocabulary';
import { cautions } from '@bumperline/contracts/bench-cautions';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading } from '../../components/states.tsx';
import { Field, inputClass } from '../../components/field.tsx';
import { fieldMessage } from '../../components/form-errors.ts';
import { useBenchTemplate, useSaveBenchTemplate } from '../../api/bench-templates.ts';
import { ApiError } from '../../lib/api-client.ts';
import { paths } from '../../lib/paths.ts';
import { changeStep, moveStep, newStep, toEditable, toSteps, type EditableStep } from './template-draft.ts';

export function EditBenchTemplatePage() {
  const { id = '' } = useParams();
  const template = useBenchTemplate(id);
  if (template.isLoading) return <Loading />;
  if (template.error || !template.data) return <ErrorState error={template.error} onRetry={() => template.refetch()} />;
  return <TemplateEditor key={`${template.data.id}@${template.data.version}`} template={template.data} />;
}

export function NewBenchTemplatePage() {
  return <TemplateEditor template={null} />;
}

function TemplateEditor({ template }: { template: BenchTemplate | null }) {
  const navigate = useNavigate();
  const save = useSaveBenchTemplate(template?.id);
  const [name, setName] = useState(template?.name ?? '');
  const [description, setDescription] = useState(template?.description ?? '');
  const [steps, setSteps] = useState<EditableStep[]>(() => (template ? toEditable(template.steps) : [newStep()]));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);

  // A message on a field or on an item of it ("steps.2.designators.0" shows at the step's designators).
  const at = (field: string) => fieldMessage(errors[field] ?? Object.entries(errors).find(([f]) => f.startsWith(`${field}.`))?.[1]);
  const update = (i: number, change: Partial<EditableStep>) =>
    setSteps((list) => list.map((s, j) => (j === i ? changeStep(s, change) : s)));

  function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setFormError(null);
    const body = { name, description, steps: toSteps(steps) };
    save.mutate(template ? { ...body, version: template.version } : body, {
      onSuccess: (saved) => navigate(paths.benchTemplate(saved.id)),
      onError: (err) => {
        if (!(err instanceof ApiError)) return setFormError('Something went wrong. Try again.');
        const byField = err.fieldErrors();
        setErrors(byField);
        const known = (f: string) => f === 'name' || f === 'description' || /^steps\.\d+\.\w+/.test(f);
        const other = (err.problem.errors ?? []).filter((x) => !known(x.field));
        if (err.status === 409)
          setFormError(`${err.message} Reload the page to edit the template as it now is; your changes here are kept until you do.`);
        else if (other.length)
          setFormError(other.map((x) => (x.field === 'steps' ? `Steps: ${x.message}` : `${x.field} ${x.message}`)).join('; '));
        else if (!err.problem.errors?.length) setFormError(err.message);
        // Take the person to the first field at fault.
        const first = err.problem.errors?.[0]?.field;
        if (first) requestAnimationFrame(() => document.querySelector<HTMLElement>(`[data-field="${first}"]`)?.focus());
      },
    });
  }

  return (
    <form onSubmit={onSubmit} className="grid max-w-4xl gap-4" noValidate>
      <PageHeader
        title={template ? `Edit “${template.name}”` : 'New bench-job template'}
        subtitle={
          <Link className="link inline-flex min-h-6 items-center" to={template ? paths.benchTemplate(template.id) : paths.bench}>
            Back without saving
          </Link>
        }
        actions={
          <button type="submit" className="btn-primary" disabled={save.isPending}>
            <Save aria-hidden className="size-4" /> {save.isPending ? 'Saving…' : 'Save'}
          </button>
        }
      />
      {formError && (
        <p role="alert" className="rounded-md border-2 border-down bg-down-tint p-3 font-semibold text-down">
          {formError}
        </p>
      )}
      <div className="card grid gap-3">
        <Field label="Name" error={at('name')}>
          {(p) => (
            <input {...p} data-field="name" className={inputClass} value={name} maxLength={120} onChange={(e) => setName(e.target.value)} />
          )}
        </Field>
        <Field label="Description (optional)" error={at('description')}>
          {(p) => (
            <textarea
              {...p}
              data-field="description"
              rows={2}
              className={inputClass}
              value={description}
              maxLength={2000}
              onChange={(e) => setDescription(e.target.value)}
            />
          )}
        </Field>
      </div>

      <ol className="grid gap-3">
        {steps.map((step, i) => (
          <li key={step.uid}>
            <StepEditor
              step={step}
              index={i}
              count={steps.length}
              at={(f) => at(`steps.${i}.${f}`)}
              onChange={(change) => update(i, change)}
              onMove={(by) => setSteps((list) => moveStep(list, i, by))}
              onRemove={() => setSteps((list) => list.filter((_, j) => j !== i))}
            />
          </li>
        ))}
      </ol>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn-secondary" onClick={() => setSteps((list) => [...list, newStep()])}>
          <Plus aria-hidden className="size-4" /> Add a step
        </button>
        <button type="submit" className="btn-primary" disabled={save.isPending}>
          <Save aria-hidden className="size-4" /> {save.isPending ? 'Saving…' : 'Save the template'}
        </button>
      </div>
    </form>
  );
}

function StepEditor({
  step,
  index,
  count,
  at,
  onChange,
  onMove,
  onRemove,
}: {
  step: EditableStep;
  index: number;
  count: number;
  at: (field: string) => string | undefined;
  onChange: (change: Partial<EditableStep>) => void;
  onMove: (by: number) => void;
  onRemove: () => void;
}) {
  const n = index + 1;
  const field = (f: string) => `steps.${index}.${f}`;
  const toggle = <T extends string>(list: readonly T[], value: T, on: boolean) => (on ? [...list, value] : list.filter((v) => v !== value));
  return (
    <fieldset className="card grid gap-3">
      <legend className="sr-only">Step {n}</legend>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-bold">
          Step {n}
          {step.title ? `: ${step.title}` : ''}
        </h2>
        <div className="flex gap-1">
          <button
            type="button"
            className="btn-secondary px-3"
            disabled={index === 0}
            onClick={() => onMove(-1)}
            aria-label={`Move step ${n} up`}
          >
            <ArrowUp aria-hidden className="size-4" />
          </button>
          <button
            type="button"
            className="btn-secondary px-3"
            disabled={index === count - 1}
            onClick={() => onMove(1)}
            aria-label={`Move step ${n} down`}
          >
            <ArrowDown aria-hidden className="size-4" />
          </button>
          <button type="button" className="btn-danger px-3" disabled={count === 1} onClick={onRemove} aria-label={`Remove step ${n}`}>
            <Trash2 aria-hidden className="size-4" />
          </button>
        </div>
      </div>
      <div className="grid gap-3 sm:grid-cols-[2fr_1fr]">
        <Field label="Title" error={at('title')}>
          {(p) => (
            <input
              {...p}
              data-field={field('title')}
              className={inputClass}
              value={step.title}
              maxLength={120}
              onChange={(e) => onChange({ title: e.target.value })}
            />
          )}
        </Field>
        <Field label="Key" hint="Lower case and hyphens; names the step in its records." error={at('key')}>
          {(p) => (
            <input
              {...p}
              data-field={field('key')}
              className={inputClass}
              value={step.key}
              maxLength={40}
              autoCapitalize="off"
              spellCheck={false}
              onChange={(e) => onChange({ key: e.target.value })}
            />
          )}
        </Field>
      </div>
      <Field label="Instructions" error={at('instructions')}>
        {(p) => (
          <textarea
            {...p}
            data-field={field('instructions')}
            rows={3}
            className={inputClass}
            value={step.instructions}
            maxLength={4000}
            onChange={(e) => onChange({ instructions: e.target.value })}
          />
        )}
      </Field>
      <Field label="What the step records" error={at('record')}>
        {(p) => (
          <select
            {...p}
            data-field={field('record')}
            className={inputClass}
            value={step.record}
            onChange={(e) => onChange({ record: e.target.value as EditableStep['record'] })}
          >
            {stepRecordKinds.map((k) => (
              <option key={k} value={k}>
                {stepRecordLabels[k]}
              </option>
            ))}
          </select>
        )}
      </Field>
      <fieldset className="grid gap-1" aria-describedby={at('partKinds') ? `${step.uid}-kinds-error` : undefined}>
        <legend className="font-semibold">Parts it concerns: every part of these kinds…</legend>
        <div className="flex flex-wrap gap-x-4 gap-y-1">
          {partKinds.map((k, i) => (
            <label key={k} className="flex min-h-11 items-center gap-2">
              <input
                type="checkbox"
                data-field={i === 0 ? field('partKinds') : undefined}
                className="size-5 accent-ink"
                checked={step.partKinds.includes(k)}
                onChange={(e) => onChange({ partKinds: toggle(step.partKinds, k, e.target.checked) })}
              />
              {partKindLabels[k]}
            </label>
          ))}
        </div>
        {at('partKinds') && (
          <p id={`${step.uid}-kinds-error`} className="text-sm font-semibold text-down">
            {at('partKinds')}
          </p>
        )}
      </fieldset>
      <Field label="…or these reference designators" hint="Separated by commas or spaces: R12, R14, BR1." error={at('designators')}>
        {(p) => (
          <input
            {...p}
            data-field={field('designators')}
            className={inputClass}
            value={step.designatorsText}
            autoCapitalize="characters"
            spellCheck={false}
            onChange={(e) => onChange({ designatorsText: e.target.value })}
          />
        )}
      </Field>
      <fieldset className="grid gap-1">
        <legend className="font-semibold">Cautions shown on this step</legend>
        <div className="grid gap-1 sm:grid-cols-2">
          {cautionKinds.map((k) => (
            <label key={k} className="flex min-h-11 items-center gap-2">
              <input
                type="checkbox"
                className="size-5 accent-ink"
                checked={step.cautions.includes(k)}
                onChange={(e) => onChange({ cautions: toggle(step.cautions, k, e.target.checked) })}
              />
              {cautions[k].title}
            </label>
          ))}
        </div>
        {at('cautions') && <p className="text-sm font-semibold text-down">{at('cautions')}</p>}
      </fieldset>
    </fieldset>
  );
}
