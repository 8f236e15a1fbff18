// Making or changing a care plan: which games (a model's or one game), what to do (tasks in order, or a bench-job
// template), the skills and time on site, when (calendar in plain words, plays, power-on hours, capacitor life —
// whichever comes first, with a lead), and the usual technician. Durations are typed as people say them.
import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { ArrowDown, ArrowUp, Plus, Trash2 } from 'lucide-react';
import type { CarePlan, CarePlanInput } from '@bumperline/contracts/care-plans';
import { choicesFromRule, defaultChoices } from '@bumperline/domain/schedules/rule-wording';
import { useCarePlan, useSaveCarePlan } from '../../api/care-plans.ts';
import { useBenchTemplates } from '../../api/bench-templates.ts';
import { useTechnicians } from '../../api/calls.ts';
import { useGames, useModels } from '../../api/games.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { Field, inputClass } from '../../components/field.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading } from '../../components/states.tsx';
import { ApiError } from '../../lib/api-client.ts';
import { formatDays, formatMinutes, readDays, readMinutes } from '../../lib/duration-entry.ts';
import { asSentence, defaultLocale, type LocaleSettings } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { RuleEditor, ruleOutcome, type RuleState } from './rule-editor.tsx';

interface Draft {
  name: string;
  scope: 'model' | 'game';
  modelId: string;
  gameId: string;
  gameSearch: string;
  work: 'tasks' | 'template';
  tasks: string[];
  benchTemplateId: string;
  skills: string;
  onSite: string;
  byCalendar: boolean;
  rule: RuleState;
  byPlays: boolean;
  playsEvery: string;
  byHours: boolean;
  hoursEvery: string;
  byCapacitorLife: boolean;
  lead: string;
  technicianId: string;
}

/** A week from today at 9:00: a sensible first date for a new plan. */
function newDraft(): Draft {
  const start = new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
  return {
    name: '',
    scope: 'model',
    modelId: '',
    gameId: '',
    gameSearch: '',
    work: 'tasks',
    tasks: [''],
    benchTemplateId: '',
    skills: '',
    onSite: '45 min',
    byCalendar: true,
    rule: { startDate: start, startTime: '09:00', choices: defaultChoices(`${start}T09:00`) },
    byPlays: false,
    playsEvery: '',
    byHours: false,
    hoursEvery: '',
    byCapacitorLife: false,
    lead: '7 days',
    technicianId: '',
  };
}

function draftOf(plan: CarePlan): Draft {
  const base = newDraft();
  const start = plan.ruleStart ?? `${base.rule.startDate}T${base.rule.startTime}`;
  return {
    ...base,
    name: plan.name,
    scope: plan.scope,
    modelId: plan.model?.id ?? '',
    gameId: plan.game?.id ?? '',
    work: plan.benchTemplate ? 'template' : 'tasks',
    tasks: plan.tasks.length ? plan.tasks : [''],
    benchTemplateId: plan.benchTemplate?.id ?? '',
    skills: plan.skills.join(', '),
    onSite: formatMinutes(plan.onSiteMinutes),
    byCalendar: !!plan.rule,
    rule: {
      startDate: start.slice(0, 10),
      startTime: start.slice(11, 16),
      choices: (plan.rule && choicesFromRule(plan.rule, start)) || defaultChoices(start),
    },
    byPlays: plan.playsEvery !== null,
    playsEvery: plan.playsEvery?.toString() ?? '',
    byHours: plan.hoursEvery !== null,
    hoursEvery: plan.hoursEvery?.toString() ?? '',
    byCapacitorLife: plan.byCapacitorLife,
    lead: formatDays(plan.leadDays),
    technicianId: plan.technician?.id ?? '',
  };
}

type Errors = Record<string, string>;

const wholeCount = (text: string) => {
  const digits = text.replace(/[\s,]/g, '');
  return /^\d+$/.test(digits) && Number(digits) > 0 ? Number(digits) : null;
};

/** The request body, or the problems to show beside each field (the same rules the API applies). */
function toInput(d: Draft, locale: LocaleSettings): { body?: CarePlanInput; errors: Errors } {
  const errors: Errors = {};
  if (!d.name.trim()) errors.name = 'Give the plan a name.';
  if (d.scope === 'model' && !d.modelId) errors.modelId = 'Choose the model whose games it covers.';
  if (d.scope === 'game' && !d.gameId) errors.gameId = 'Choose the game.';
  const tasks = d.tasks.map((t) => t.trim()).filter(Boolean);
  if (d.work === 'tasks' && tasks.length === 0) errors.tasks = 'List at least one task.';
  if (d.work === 'template' && !d.benchTemplateId) errors.benchTemplateId = 'Choose a bench-job template.';
  const onSite = readMinutes(d.onSite);
  if (!onSite.ok) errors.onSiteMinutes = asSentence(onSite.message);
  const lead = readDays(d.lead);
  if (!lead.ok) errors.leadDays = asSentence(lead.message);
  const rule = d.byCalendar ? ruleOutcome(d.rule, locale.timeZone) : null;
  if (rule?.problem) errors.rule = rule.problem;
  const plays = d.byPlays ? wholeCount(d.playsEvery) : null;
  if (d.byPlays && plays === null) errors.playsEvery = 'Enter how many plays, such as 2,000.';
  const hours = d.byHours ? wholeCount(d.hoursEvery) : null;
  if (d.byHours && hours === null) errors.hoursEvery = 'Enter how many hours, such as 500.';
  if (!d.byCalendar && !d.byPlays && !d.byHours && !d.byCapacitorLife) errors.triggers = 'Choose at least one way it falls due.';
  if (Object.keys(errors).length) return { errors };
  return {
    errors,
    body: {
      name: d.name.trim(),
      scope: d.scope,
      modelId: d.scope === 'model' ? d.modelId : null,
      gameId: d.scope === 'game' ? d.gameId : null,
      tasks: d.work === 'tasks' ? tasks : [],
      benchTemplateId: d.work === 'template' ? d.benchTemplateId : null,
      skills: [
        ...new Set(
          d.skills
            .split(',')
            .map((s) => s.trim().toLowerCase())
            .filter(Boolean),
        ),
      ],
      onSiteMinutes: onSite.ok ? onSite.value : 0,
      rule: rule?.rule ?? null,
      ruleStart: rule ? rule.ruleStart : null,
      playsEvery: plays,
      hoursEvery: hours,
      byCapacitorLife: d.byCapacitorLife,
      leadDays: lead.ok ? lead.value : 7,
      technicianId: d.technicianId || null,
    },
  };
}

function TasksEditor({ tasks, onChange, error }: { tasks: string[]; onChange: (t: string[]) => void; error?: string }) {
  const move = (i: number, by: number) => {
    const next = [...tasks];
    const [t] = next.splice(i, 1);
    next.splice(i + by, 0, t!);
    onChange(next);
  };
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={error ? 'tasks-error' : undefined}>
      <legend className="mb-1 font-semibold">Tasks, in order</legend>
      <ol className="flex flex-col gap-2">
        {tasks.map((t, i) => (
          <li key={i} className="flex items-center gap-2">
            <span className="w-6 text-right tabular-nums text-ink-soft">{i + 1}.</span>
            <input
              className={inputClass}
              aria-label={`Task ${i + 1}`}
              value={t}
              aria-invalid={!!error}
              onChange={(e) => onChange(tasks.map((x, j) => (j === i ? e.target.value : x)))}
            />
            <button
              type="button"
              className="btn-secondary px-3"
              aria-label={`Move task ${i + 1} up`}
              disabled={i === 0}
              onClick={() => move(i, -1)}
            >
              <ArrowUp aria-hidden className="size-4" />
            </button>
            <button
              type="button"
              className="btn-secondary px-3"
              aria-label={`Move task ${i + 1} down`}
              disabled={i === tasks.length - 1}
              onClick={() => move(i, 1)}
            >
              <ArrowDown aria-hidden className="size-4" />
            </button>
            <button
              type="button"
              className="btn-secondary px-3"
              aria-label={`Remove task ${i + 1}`}
              disabled={tasks.length === 1}
              onClick={() => onChange(tasks.filter((_, j) => j !== i))}
            >
              <Trash2 aria-hidden className="size-4" />
            </button>
          </li>
        ))}
      </ol>
      <button type="button" className="btn-secondary self-start" onClick={() => onChange([...tasks, ''])}>
        <Plus aria-hidden className="size-4" /> Add a task
      </button>
      {error && (
        <p id="tasks-error" className="text-sm font-semibold text-down">
          {error}
        </p>
      )}
    </fieldset>
  );
}

function PlanForm({ plan }: { plan?: CarePlan }) {
  const [d, setD] = useState<Draft>(() => (plan ? draftOf(plan) : newDraft()));
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const set = (patch: Partial<Draft>) => setD((x) => ({ ...x, ...patch }));
  const locale = useLocaleSettings() ?? defaultLocale;
  const models = useModels();
  const games = useGames({ q: d.gameSearch || undefined, limit: 50, sort: 'title', order: 'asc' });
  const templates = useBenchTemplates();
  const technicians = useTechnicians(true);
  const save = useSaveCarePlan(plan?.id);
  const navigate = useNavigate();

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const { body, errors: found } = toInput(d, locale);
    setErrors(found);
    setFormError(null);
    if (!body) return;
    save.mutate(plan ? { ...body, version: plan.version } : body, {
      onSuccess: (saved) => navigate(paths.carePlan(saved.id)),
      onError: (err) => {
        if (err instanceof ApiError) {
          setErrors(Object.fromEntries(Object.entries(err.fieldErrors()).map(([k, v]) => [k, asSentence(v)])));
          setFormError(
            err.status === 409 ? 'Someone else changed this plan since you opened it. Reload it and make your change again.' : err.message,
          );
        } else setFormError('Could not save the plan.');
      },
    });
  };

  return (
    <form onSubmit={submit} noValidate className="flex max-w-3xl flex-col gap-5">
      {formError && (
        <p role="alert" className="rounded-md border border-down bg-down-tint p-3 font-semibold text-down">
          {formError}
        </p>
      )}
      <Field label="Name" error={errors.name}>
        {(f) => <input {...f} className={inputClass} value={d.name} onChange={(e) => set({ name: e.target.value })} />}
      </Field>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Covers</legend>
        <label className="flex min-h-11 items-center gap-2">
          <input type="radio" className="size-5" name="scope" checked={d.scope === 'model'} onChange={() => set({ scope: 'model' })} />
          Every game of a model
        </label>
        <label className="flex min-h-11 items-center gap-2">
          <input type="radio" className="size-5" name="scope" checked={d.scope === 'game'} onChange={() => set({ scope: 'game' })} />
          One game
        </label>
      </fieldset>
      {d.scope === 'model' ? (
        <Field label="Model" error={errors.modelId}>
          {(f) => (
            <select {...f} className={inputClass} value={d.modelId} onChange={(e) => set({ modelId: e.target.value })}>
              <option value="">Choose a model…</option>
              {(models.data?.items ?? []).map((m) => (
                <option key={m.id} value={m.id}>
                  {m.title} ({m.maker})
                </option>
              ))}
            </select>
          )}
        </Field>
      ) : (
        <div className="flex flex-col gap-2">
          <Field label="Find the game" hint="Search by title, serial or venue.">
            {(f) => <input {...f} className={inputClass} value={d.gameSearch} onChange={(e) => set({ gameSearch: e.target.value })} />}
          </Field>
          <Field label="Game" error={errors.gameId}>
            {(f) => (
              <select {...f} className={inputClass} value={d.gameId} onChange={(e) => set({ gameId: e.target.value })}>
                <option value="">Choose a game…</option>
                {plan?.game && !games.data?.items.some((g) => g.id === plan.game!.id) && (
                  <option value={plan.game.id}>
                    {plan.game.modelTitle} ({plan.game.serial})
                  </option>
                )}
                {(games.data?.items ?? []).map((g) => (
                  <option key={g.id} value={g.id}>
                    {g.model.title} ({g.serial}){g.venueName ? ` — ${g.venueName}` : ''}
                  </option>
                ))}
              </select>
            )}
          </Field>
        </div>
      )}

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">What to do</legend>
        <label className="flex min-h-11 items-center gap-2">
          <input type="radio" className="size-5" name="work" checked={d.work === 'tasks'} onChange={() => set({ work: 'tasks' })} />A list
          of tasks
        </label>
        <label className="flex min-h-11 items-center gap-2">
          <input type="radio" className="size-5" name="work" checked={d.work === 'template'} onChange={() => set({ work: 'template' })} />A
          bench job (board overhaul) from a template
        </label>
      </fieldset>
      {d.work === 'tasks' ? (
        <TasksEditor tasks={d.tasks} onChange={(tasks) => set({ tasks })} error={errors.tasks} />
      ) : (
        <Field label="Bench-job template" error={errors.benchTemplateId}>
          {(f) => (
            <select {...f} className={inputClass} value={d.benchTemplateId} onChange={(e) => set({ benchTemplateId: e.target.value })}>
              <option value="">Choose a template…</option>
              {(templates.data?.items ?? []).map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
            </select>
          )}
        </Field>
      )}

      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Skills needed" hint="Separate with commas: pinball, soldering." error={errors.skills}>
          {(f) => <input {...f} className={inputClass} value={d.skills} onChange={(e) => set({ skills: e.target.value })} />}
        </Field>
        <Field label="Time on site" hint="As you would say it: 45 min, 1 h 30." error={errors.onSiteMinutes}>
          {(f) => <input {...f} className={inputClass} value={d.onSite} onChange={(e) => set({ onSite: e.target.value })} />}
        </Field>
      </div>

      <fieldset className="flex flex-col gap-3" aria-describedby={errors.triggers ? 'triggers-error' : undefined}>
        <legend className="mb-1 font-bold">When it falls due — whichever comes first</legend>
        <label className="flex min-h-11 items-center gap-2">
          <input type="checkbox" className="size-5" checked={d.byCalendar} onChange={(e) => set({ byCalendar: e.target.checked })} />
          By the calendar
        </label>
        {d.byCalendar && <RuleEditor value={d.rule} onChange={(rule) => set({ rule })} locale={locale} serverError={errors.rule} />}
        <div className="flex flex-wrap items-center gap-2">
          <label className="flex min-h-11 items-center gap-2">
            <input type="checkbox" className="size-5" checked={d.byPlays} onChange={(e) => set({ byPlays: e.target.checked })} />
            Every
          </label>
          <input
            className={`${inputClass} w-32 max-w-32`}
            inputMode="numeric"
            aria-label="Plays between services"
            aria-invalid={!!errors.playsEvery}
            disabled={!d.byPlays}
            value={d.playsEvery}
            onChange={(e) => set({ playsEvery: e.target.value })}
          />
          <span>plays on the meter</span>
          {errors.playsEvery && <p className="w-full text-sm font-semibold text-down">{errors.playsEvery}</p>}
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <label className="flex min-h-11 items-center gap-2">
            <input type="checkbox" className="size-5" checked={d.byHours} onChange={(e) => set({ byHours: e.target.checked })} />
            Every
          </label>
          <input
            className={`${inputClass} w-32 max-w-32`}
            inputMode="numeric"
            aria-label="Power-on hours between services"
            aria-invalid={!!errors.hoursEvery}
            disabled={!d.byHours}
            value={d.hoursEvery}
            onChange={(e) => set({ hoursEvery: e.target.value })}
          />
          <span>power-on hours</span>
          {errors.hoursEvery && <p className="w-full text-sm font-semibold text-down">{errors.hoursEvery}</p>}
        </div>
        <label className="flex min-h-11 items-center gap-2">
          <input
            type="checkbox"
            className="size-5"
            checked={d.byCapacitorLife}
            onChange={(e) => set({ byCapacitorLife: e.target.checked })}
          />
          When a board’s capacitors near the end of their life (recap due)
        </label>
        {errors.triggers && (
          <p id="triggers-error" className="text-sm font-semibold text-down">
            {errors.triggers}
          </p>
        )}
        <Field label="Make the work order this long before it is due" hint="As you would say it: 7 days, 2 weeks." error={errors.leadDays}>
          {(f) => <input {...f} className={`${inputClass} max-w-48`} value={d.lead} onChange={(e) => set({ lead: e.target.value })} />}
        </Field>
      </fieldset>

      <Field
        label="Usual technician"
        hint="Without one, each work order goes to the nearest technician with the skills."
        error={errors.technicianId}
      >
        {(f) => (
          <select {...f} className={inputClass} value={d.technicianId} onChange={(e) => set({ technicianId: e.target.value })}>
            <option value="">Nearest with the skills</option>
            {(technicians.data?.items ?? []).map((t) => (
              <option key={t.userId} value={t.userId}>
                {t.name}
              </option>
            ))}
          </select>
        )}
      </Field>

      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : plan ? 'Save changes' : 'Save care plan'}
        </button>
        <Link className="btn-secondary" to={plan ? paths.carePlan(plan.id) : paths.carePlans}>
          Cancel
        </Link>
      </div>
    </form>
  );
}

export function NewCarePlanPage() {
  return (
    <>
      <PageHeader title="New care plan" subtitle="Recurring preventive work for a model’s games or one game." />
      <PlanForm />
    </>
  );
}

export function EditCarePlanPage() {
  const { id = '' } = useParams();
  const plan = useCarePlan(id);
  if (plan.isLoading) return <Loading label="Loading the care plan…" />;
  if (plan.error) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  return (
    <>
      <PageHeader title={`Edit ${plan.data!.name}`} />
      {/* Keyed by the plan: the form starts from the plan as loaded and keeps what is typed while it refetches. */}
      <PlanForm key={plan.data!.id} plan={plan.data!} />
    </>
  );
}
