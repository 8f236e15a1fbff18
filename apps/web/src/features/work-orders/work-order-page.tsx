// One work order: what to do on which game, when it is due and planned, and its actions — move it (a day; the
// office also the technician), skip it with a reason, or mark it done with the time on site ("45 min"), a note and
// the meters read then; a plan with a bench-job template opens its bench job here.
import { useState, type FormEvent, type ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { CalendarDays, CheckCircle2, SkipForward, Wrench } from 'lucide-react';
import { dueReasonLabels, meterKindLabels } from '@bumperline/contracts/care-vocabulary';
import type { WorkOrder } from '@bumperline/contracts/work-orders';
import { useGameBoards } from '../../api/boards.ts';
import { useTechnicians } from '../../api/calls.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useCan } from '../../api/use-can.ts';
import { useWorkOrder, useWorkOrderAction } from '../../api/work-orders.ts';
import { WorkOrderStateBadge } from '../../components/due-state-badge.tsx';
import { Field, inputClass } from '../../components/field.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading } from '../../components/states.tsx';
import { ApiError } from '../../lib/api-client.ts';
import { formatMinutes, readMinutes } from '../../lib/duration-entry.ts';
import { asSentence, formatDate, formatDateTime } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';

type Errors = Record<string, string>;

/** Field messages from a refused action; a stale version says what to do. */
function problemsOf(err: unknown): { errors: Errors; message: string } {
  if (!(err instanceof ApiError)) return { errors: {}, message: 'Could not save. Check the connection and try again.' };
  const errors = Object.fromEntries(Object.entries(err.fieldErrors()).map(([k, v]) => [k, asSentence(v)]));
  const message = err.status === 409 ? `${err.message} The page now shows it as it stands.` : err.message;
  return { errors, message };
}

function ActionCard({ title, icon, children }: { title: string; icon: ReactNode; children: ReactNode }) {
  return (
    <section className="card flex flex-col gap-3">
      <h2 className="flex items-center gap-2 text-lg font-bold">
        {icon} {title}
      </h2>
      {children}
    </section>
  );
}

function Refusal({ message }: { message: string | null }) {
  return message ? (
    <p role="alert" className="font-semibold text-down">
      {message}
    </p>
  ) : null;
}

function DoneForm({ order }: { order: WorkOrder }) {
  const act = useWorkOrderAction(order.id);
  const [labour, setLabour] = useState(formatMinutes(order.onSiteMinutes));
  const [note, setNote] = useState('');
  const [plays, setPlays] = useState('');
  const [hours, setHours] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<string | null>(null);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const found: Errors = {};
    const minutes = readMinutes(labour, { min: 0 });
    if (!minutes.ok) found.labourMinutes = asSentence(minutes.message);
    const readings: { meter: 'plays' | 'hours'; reading: number }[] = [];
    for (const [meter, text] of [
      ['plays', plays],
      ['hours', hours],
    ] as const) {
      const digits = text.replace(/[\s,]/g, '');
      if (digits === '') continue;
      if (!/^\d+$/.test(digits)) found[meter] = 'Enter the meter as a whole number, such as 15,400.';
      else readings.push({ meter, reading: Number(digits) });
    }
    setErrors(found);
    setMessage(null);
    if (Object.keys(found).length || !minutes.ok) return;
    act.mutate(
      { kind: 'done', body: { version: order.version, labourMinutes: minutes.value, note, readings } },
      {
        onError: (err) => {
          const p = problemsOf(err);
          // A reading's error is named by its place in the list: show it beside that meter.
          const byMeter = Object.fromEntries(
            Object.entries(p.errors).map(([k, v]) => {
              const m = /^readings\.(\d+)\./.exec(k);
              return [m ? (readings[Number(m[1])]?.meter ?? k) : k, v];
            }),
          );
          setErrors(byMeter);
          setMessage(p.message);
        },
      },
    );
  };
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3">
      <Field label="Time on site" hint="As you would say it: 45 min, 1 h 30." error={errors.labourMinutes}>
        {(f) => <input {...f} className={inputClass} value={labour} onChange={(e) => setLabour(e.target.value)} />}
      </Field>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label={`${meterKindLabels.plays} meter (optional)`} error={errors.plays}>
          {(f) => <input {...f} className={inputClass} inputMode="numeric" value={plays} onChange={(e) => setPlays(e.target.value)} />}
        </Field>
        <Field label={`${meterKindLabels.hours} meter (optional)`} error={errors.hours}>
          {(f) => <input {...f} className={inputClass} inputMode="numeric" value={hours} onChange={(e) => setHours(e.target.value)} />}
        </Field>
      </div>
      <Field label="Note (optional)" error={errors.note}>
        {(f) => <textarea {...f} className={inputClass} rows={3} value={note} onChange={(e) => setNote(e.target.value)} />}
      </Field>
      <p className="text-sm text-ink-soft">
        Record the parts you fitted on this job before marking it done: they count in the game’s keep cost.
      </p>
      <Refusal message={message} />
      <button type="submit" className="btn-primary self-start" disabled={act.isPending}>
        <CheckCircle2 aria-hidden className="size-5" /> {act.isPending ? 'Saving…' : 'Mark done'}
      </button>
    </form>
  );
}

function SkipForm({ order }: { order: WorkOrder }) {
  const act = useWorkOrderAction(order.id);
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<string | null>(null);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!reason.trim()) return setErrors({ reason: 'Say why the work is skipped.' });
    setErrors({});
    act.mutate(
      { kind: 'skip', body: { version: order.version, reason: reason.trim() } },
      {
        onError: (err) => {
          const p = problemsOf(err);
          setErrors(p.errors);
          setMessage(p.message);
        },
      },
    );
  };
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3">
      <Field label="Why skip it?" error={errors.reason}>
        {(f) => <input {...f} className={inputClass} value={reason} onChange={(e) => setReason(e.target.value)} />}
      </Field>
      <Refusal message={message} />
      <button type="submit" className="btn-secondary self-start" disabled={act.isPending}>
        <SkipForward aria-hidden className="size-5" /> Skip this work
      </button>
    </form>
  );
}

function MoveForm({ order }: { order: WorkOrder }) {
  const act = useWorkOrderAction(order.id);
  const isOffice = useCan('work-orders:plan');
  const technicians = useTechnicians(isOffice);
  const [day, setDay] = useState(order.plannedOn ?? '');
  const [technicianId, setTechnicianId] = useState(order.technician?.id ?? '');
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<string | null>(null);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setMessage(null);
    const body = {
      version: order.version,
      plannedOn: day || null,
      ...(isOffice && technicianId !== (order.technician?.id ?? '') ? { technicianId: technicianId || null } : {}),
    };
    act.mutate(
      { kind: 'move', body },
      {
        onSuccess: () => setErrors({}),
        onError: (err) => {
          const p = problemsOf(err);
          setErrors(p.errors);
          setMessage(p.message);
        },
      },
    );
  };
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3">
      <Field label="Day" error={errors.plannedOn}>
        {(f) => <input {...f} type="date" className={`${inputClass} w-auto`} value={day} onChange={(e) => setDay(e.target.value)} />}
      </Field>
      {isOffice && (
        <Field label="Technician" error={errors.technicianId}>
          {(f) => (
            <select {...f} className={inputClass} value={technicianId} onChange={(e) => setTechnicianId(e.target.value)}>
              <option value="">Nobody yet</option>
              {(technicians.data?.items ?? []).map((t) => (
                <option key={t.userId} value={t.userId}>
                  {t.name}
                </option>
              ))}
            </select>
          )}
        </Field>
      )}
      <Refusal message={message} />
      <button type="submit" className="btn-secondary self-start" disabled={act.isPending}>
        <CalendarDays aria-hidden className="size-5" /> Move
      </button>
    </form>
  );
}

function BenchJobAction({ order }: { order: WorkOrder }) {
  const boards = useGameBoards(order.game.id);
  const act = useWorkOrderAction(order.id);
  const [boardId, setBoardId] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  if (order.benchJobId)
    return (
      <p>
        <Link className="link" to={paths.benchJob(order.benchJobId)}>
          Go to its bench job
        </Link>
        . Finishing the bench job does not close this work order: mark it done here with the time it took.
      </p>
    );
  const items = boards.data?.items ?? [];
  return (
    <form
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (!boardId) return setMessage('Choose the board to overhaul.');
        act.mutate(
          { kind: 'bench-job', body: { version: order.version, boardInstanceId: boardId } },
          { onError: (err) => setMessage(problemsOf(err).message) },
        );
      }}
    >
      {boards.isLoading ? (
        <Loading label="Loading the game’s boards…" />
      ) : items.length === 0 ? (
        <p className="text-ink-soft">This game has no boards on record: fit one on the game’s page first.</p>
      ) : (
        <Field label="Board">
          {(f) => (
            <select {...f} className={inputClass} value={boardId} onChange={(e) => setBoardId(e.target.value)}>
              <option value="">Choose a board…</option>
              {items.map((b) => (
                <option key={b.id} value={b.id}>
                  {b.boardName} ({b.serial || 'no serial'})
                </option>
              ))}
            </select>
          )}
        </Field>
      )}
      <Refusal message={message} />
      <button type="submit" className="btn-primary self-start" disabled={act.isPending || items.length === 0}>
        <Wrench aria-hidden className="size-5" /> Open the bench job
      </button>
    </form>
  );
}

export function WorkOrderPage() {
  const { id = '' } = useParams();
  const order = useWorkOrder(id);
  const locale = useLocaleSettings();
  const canWork = useCan('work-orders:work');
  if (order.isLoading) return <Loading label="Loading the work order…" />;
  if (order.error) return <ErrorState error={order.error} onRetry={() => void order.refetch()} />;
  const o = order.data!;
  const open = o.state === 'open';
  return (
    <>
      <PageHeader
        title={o.title}
        subtitle={
          <>
            <Link className="link" to={paths.game(o.game.id)}>
              {o.game.modelTitle} ({o.game.serial})
            </Link>
            {o.game.venue ? (
              <>
                {' at '}
                <Link className="link" to={paths.venue(o.game.venue.id)}>
                  {o.game.venue.name}
                </Link>
              </>
            ) : (
              ' in storage'
            )}
          </>
        }
        actions={<WorkOrderStateBadge state={o.state} dueState={o.dueState} />}
      />
      <div className="grid gap-5 lg:grid-cols-2">
        <section className="card" aria-labelledby="order-what">
          <h2 id="order-what" className="mb-2 text-lg font-bold">
            What to do
          </h2>
          {o.tasks.length > 0 ? (
            <ol className="list-inside list-decimal">
              {o.tasks.map((t, i) => (
                <li key={i}>{t}</li>
              ))}
            </ol>
          ) : (
            <p>A bench job: a board overhaul with its steps, cautions and readings.</p>
          )}
          <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="font-semibold">Care plan</dt>
            <dd>
              <Link className="link" to={paths.carePlan(o.carePlanId)}>
                {o.carePlanName}
              </Link>
            </dd>
            <dt className="font-semibold">Due</dt>
            <dd>
              {formatDateTime(o.dueAt, locale)} · {dueReasonLabels[o.dueReason].toLowerCase()}
            </dd>
            <dt className="font-semibold">Planned for</dt>
            <dd>{o.plannedOn ? formatDate(o.plannedOn, locale) : 'No day yet'}</dd>
            <dt className="font-semibold">Technician</dt>
            <dd>{o.technician?.name ?? 'Nobody yet'}</dd>
            <dt className="font-semibold">Time on site</dt>
            <dd>{formatMinutes(o.onSiteMinutes)}</dd>
            {o.skills.length > 0 && (
              <>
                <dt className="font-semibold">Skills</dt>
                <dd>{o.skills.join(', ')}</dd>
              </>
            )}
            {!open && (
              <>
                <dt className="font-semibold">{o.state === 'done' ? 'Done' : 'Skipped'}</dt>
                <dd>
                  {formatDateTime(o.closedAt, locale)}
                  {o.labourMinutes !== null ? ` · ${formatMinutes(o.labourMinutes)} on site` : ''}
                  {o.skipReason ? ` · ${o.skipReason}` : ''}
                </dd>
                {o.note && (
                  <>
                    <dt className="font-semibold">Note</dt>
                    <dd>{o.note}</dd>
                  </>
                )}
              </>
            )}
          </dl>
        </section>
        {open && canWork && (
          <div className="flex flex-col gap-5">
            {o.benchTemplateId && (
              <ActionCard title="Bench job" icon={<Wrench aria-hidden className="size-5" />}>
                <BenchJobAction order={o} />
              </ActionCard>
            )}
            <ActionCard title="Mark done" icon={<CheckCircle2 aria-hidden className="size-5" />}>
              <DoneForm key={o.version} order={o} />
            </ActionCard>
            <ActionCard title="Move" icon={<CalendarDays aria-hidden className="size-5" />}>
              <MoveForm key={o.version} order={o} />
            </ActionCard>
            <ActionCard title="Skip" icon={<SkipForward aria-hidden className="size-5" />}>
              <SkipForm key={o.version} order={o} />
            </ActionCard>
          </div>
        )}
      </div>
    </>
  );
}
