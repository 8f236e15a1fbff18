// One service call: where it stands, who should go (ranked), the moves it can make, its timeline,
// the messages it sent and the reporter's photos.
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Camera, CircuitBoard, MessageSquare, Send, UserMinus, UserPlus } from 'lucide-react';
import type { CallDetail, CallEvent, ServiceCall } from '@bumperline/contracts/calls';
import {
  callRef,
  callStateLabels,
  inStateGroup,
  problemLabels,
  severities,
  severityLabels,
  transitions,
  type CallState,
  type Severity,
} from '@bumperline/contracts/call-vocabulary';
import { PageHeader } from '../../components/page-header.tsx';
import { CallStateBadge } from '../../components/call-state-badge.tsx';
import { TargetClock } from '../../components/target-clock.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { inputClass } from '../../components/field.tsx';
import { paths } from '../../lib/paths.ts';
import { useCan } from '../../api/use-can.ts';
import { useLocaleSettings, useMe } from '../../api/me.ts';
import { useGameBoards } from '../../api/boards.ts';
import {
  useAddNote,
  useAnswerAssignment,
  useAssignCall,
  useCall,
  useRankedTechnicians,
  useSetSeverity,
  useTransitionCall,
} from '../../api/calls.ts';
import { ApiError } from '../../lib/api-client.ts';
import { formatDateTime } from '../../lib/format.ts';

const moveLabels: Partial<Record<CallState, string>> = {
  on_the_way: 'On my way',
  on_site: 'Arrived on site',
  waiting_parts: 'Waiting on parts',
  at_shop: 'Taking it to the shop',
  fixed: 'Fixed',
  closed: 'Close the call',
  cancelled: 'Cancel the call',
};

export function CallPage() {
  const { id = '' } = useParams();
  const detail = useCall(id);
  if (detail.isLoading) return <Loading />;
  if (detail.error || !detail.data) return <ErrorState error={detail.error} onRetry={() => detail.refetch()} />;
  return <CallView detail={detail.data} />;
}

function useConflictMessage() {
  const [message, setMessage] = useState<string | null>(null);
  const onError = (err: unknown) => {
    if (err instanceof ApiError && err.status === 409) {
      const current = err.problem.current as ServiceCall | undefined;
      setMessage(
        `${err.message}${current ? ` It is now "${callStateLabels[current.state]}"${current.technicianName ? `, with ${current.technicianName}` : ''}.` : ''}`,
      );
    } else setMessage(err instanceof ApiError ? err.message : 'That did not work. Try again.');
  };
  return { message, onError, clear: () => setMessage(null) };
}

function CallView({ detail }: { detail: CallDetail }) {
  const { call } = detail;
  const me = useMe();
  const locale = useLocaleSettings();
  const canDispatch = useCan('calls:dispatch');
  const conflict = useConflictMessage();
  const transition = useTransitionCall(call.id);
  const answer = useAnswerAssignment(call.id);
  const mine = call.technicianId === me.data?.user.id;
  const canMove = canDispatch || mine;
  const nextStates = transitions[call.state].filter((s) => s !== 'cancelled' || canDispatch);
  const open = !['closed', 'cancelled'].includes(call.state);

  return (
    <>
      <PageHeader
        title={`Call ${callRef(call.id)} · ${call.gameTitle}`}
        subtitle={
          <span className="inline-flex flex-wrap items-center gap-2">
            <CallStateBadge state={call.state} />
            <span>{severityLabels[call.severity]}</span>·<span>{problemLabels[call.problem]}</span>·
            {call.venueId ? (
              <Link className="link" to={paths.venue(call.venueId)}>
                {call.venueName}
              </Link>
            ) : (
              'No venue'
            )}
            ·
            <Link className="link" to={paths.game(call.gameId)}>
              Game {call.gameSerial}
            </Link>
          </span>
        }
      />
      {conflict.message && (
        <div role="alert" className="mb-4 rounded-md border border-down bg-down-tint p-3 font-semibold text-down">
          {conflict.message}
        </div>
      )}
      <div className="grid gap-4 lg:grid-cols-[2fr_3fr]">
        <div className="grid content-start gap-4">
          <section className="card grid gap-2" aria-labelledby="call-facts">
            <h2 id="call-facts" className="text-lg font-bold">
              Where it stands
            </h2>
            <TargetClock openedAt={call.openedAt} targetAt={call.targetAt} stoppedAt={call.fixedAt ?? call.closedAt} />
            <p className="text-sm text-ink-soft">
              Opened {formatDateTime(call.openedAt, locale)} · target {formatDateTime(call.targetAt, locale)}
            </p>
            {call.note && <p className="rounded-md bg-brass-light p-2">“{call.note}”</p>}
            <p>
              Technician: <strong>{call.technicianName ?? 'nobody yet'}</strong>
              {call.technicianId && (call.acceptedAt ? ' (accepted)' : ' (waiting for an answer)')}
            </p>
            {call.reporterWantsSms && <p className="text-sm text-ink-soft">The reporter gets SMS updates.</p>}
            {canDispatch && open && <SeverityPicker call={call} onError={conflict.onError} />}
          </section>

          {mine && call.state === 'assigned' && !call.acceptedAt && (
            <section className="card grid gap-2" aria-label="Your answer">
              <p className="font-semibold">You were assigned this call.</p>
              <div className="flex gap-2">
                <button
                  type="button"
                  className="btn-primary"
                  onClick={() => answer.mutate(true, { onError: conflict.onError, onSuccess: conflict.clear })}
                >
                  Accept
                </button>
                <button
                  type="button"
                  className="btn-secondary"
                  onClick={() => answer.mutate(false, { onError: conflict.onError, onSuccess: conflict.clear })}
                >
                  Decline
                </button>
              </div>
            </section>
          )}

          {canMove && open && nextStates.length > 0 && (
            <section className="card grid gap-2" aria-labelledby="moves">
              <h2 id="moves" className="text-lg font-bold">
                Move the call
              </h2>
              <div className="flex flex-wrap gap-2">
                {nextStates.map((to) => (
                  <button
                    key={to}
                    type="button"
                    className={to === 'cancelled' ? 'btn-danger' : to === 'fixed' || to === 'closed' ? 'btn-primary' : 'btn-secondary'}
                    disabled={transition.isPending}
                    onClick={() =>
                      transition.mutate({ to, version: call.version }, { onError: conflict.onError, onSuccess: conflict.clear })
                    }
                  >
                    {moveLabels[to] ?? callStateLabels[to]}
                  </button>
                ))}
              </div>
            </section>
          )}

          {canDispatch && open && <AssignPanel call={call} onError={conflict.onError} onDone={conflict.clear} />}
          {open && <NoteForm callId={call.id} />}
          <BenchJobSection call={call} />
        </div>

        <div className="grid content-start gap-4">
          <section className="card" aria-labelledby="timeline">
            <h2 id="timeline" className="mb-3 text-lg font-bold">
              Timeline
            </h2>
            <Timeline events={detail.events} locale={locale} />
          </section>
          <section className="card" aria-labelledby="messages">
            <h2 id="messages" className="mb-3 flex items-center gap-2 text-lg font-bold">
              <MessageSquare aria-hidden className="size-5" /> Messages sent
            </h2>
            {!detail.messages.length ? (
              <Empty title="No messages for this call yet." />
            ) : (
              <ul className="grid gap-2">
                {detail.messages.map((m) => (
                  // A status link in a text has no spaces to break at: wrap it anywhere rather than widen the page.
                  <li key={m.id} className="rounded-md border border-paper-line p-2 text-sm wrap-anywhere">
                    <p className="font-semibold">
                      {m.channel === 'sms' ? 'SMS' : 'E-mail'} to {m.toAddress} · {m.status}
                      {m.providerStatus ? ` (${m.providerStatus})` : ''}
                    </p>
                    <p className="text-ink-soft">{m.subject || m.body}</p>
                  </li>
                ))}
              </ul>
            )}
          </section>
          {detail.photos.length > 0 && (
            <section className="card" aria-labelledby="photos">
              <h2 id="photos" className="mb-3 flex items-center gap-2 text-lg font-bold">
                <Camera aria-hidden className="size-5" /> Photos
              </h2>
              <ul className="flex flex-wrap gap-2">
                {detail.photos.map((p) => (
                  <li key={p.id}>
                    <a href={`/api/calls/${call.id}/photos/${p.id}`} target="_blank" rel="noreferrer">
                      <img
                        src={`/api/calls/${call.id}/photos/${p.id}?size=thumb`}
                        alt={`Photo from the ${p.uploadedBy}, ${formatDateTime(p.createdAt, locale)}`}
                        className="h-32 rounded-md border border-paper-line object-cover"
                      />
                    </a>
                  </li>
                ))}
              </ul>
            </section>
          )}
        </div>
      </div>
    </>
  );
}

function describe(e: CallEvent): string {
  switch (e.kind) {
    case 'opened':
      return 'Reported';
    case 'report_joined':
      return `Reported again${e.detail.problem ? `: ${problemLabels[e.detail.problem as keyof typeof problemLabels]}` : ''}${e.detail.note ? ` — “${String(e.detail.note)}”` : ''}`;
    case 'assigned':
      return 'Assigned a technician';
    case 'unassigned':
      return 'Took the technician off';
    case 'accepted':
      return 'Accepted the call';
    case 'declined':
      return 'Declined the call';
    case 'state':
      return `${e.fromState ? callStateLabels[e.fromState] : ''} → ${e.toState ? callStateLabels[e.toState] : ''}${e.detail.note ? ` — “${String(e.detail.note)}”` : ''}`;
    case 'note':
      return e.detail.note ? `Note: “${String(e.detail.note)}”` : 'Changed the severity';
    case 'sms_in':
      return `Replied by SMS: “${String(e.detail.body ?? '')}”`;
    case 'photo':
      return 'Added a photo';
    case 'warned':
      return 'Dispatch warned: close to the response target';
    default:
      return e.kind;
  }
}

function Timeline({ events, locale }: { events: CallEvent[]; locale?: { locale: string; timeZone: string; currency: string } }) {
  return (
    <ol className="grid gap-3">
      {events.map((e) => (
        <li key={e.id} className="border-l-4 border-brass-bright pl-3">
          <p>{describe(e)}</p>
          <p className="text-sm text-ink-muted">
            {e.actorName ?? e.actorLabel ?? 'Someone'} · {formatDateTime(e.at, locale)}
          </p>
        </li>
      ))}
    </ol>
  );
}

function AssignPanel({ call, onError, onDone }: { call: ServiceCall; onError: (e: unknown) => void; onDone: () => void }) {
  const ranked = useRankedTechnicians(call.id, true);
  const assign = useAssignCall(call.id);
  const assignable = inStateGroup('awaitingArrival', call.state);
  if (!assignable) return null;
  return (
    <section className="card grid gap-2" aria-labelledby="assign">
      <h2 id="assign" className="text-lg font-bold">
        Who should go
      </h2>
      <p className="text-sm text-ink-soft">
        Ranked by distance from their home base, the skills this game needs, and the calls they already have.
      </p>
      {ranked.isLoading ? (
        <Loading />
      ) : ranked.error ? (
        <ErrorState error={ranked.error} onRetry={() => ranked.refetch()} />
      ) : !ranked.data?.items.length ? (
        <Empty title="No technicians in this company yet." />
      ) : (
        <ol className="grid gap-2">
          {ranked.data.items.map((t, i) => {
            const current = t.userId === call.technicianId;
            return (
              <li
                key={t.userId}
                className={`flex flex-wrap items-center justify-between gap-2 rounded-md border p-2 ${i === 0 ? 'border-brass-bright' : 'border-paper-line'}`}
              >
                <span>
                  <span className="font-bold">{t.name}</span>
                  {i === 0 && <span className="ml-2 rounded bg-brass-light px-1.5 text-sm font-semibold text-brass">Suggested</span>}
                  <br />
                  <span className="text-sm text-ink-soft tabular">
                    {t.rank ? `${t.rank.distanceKm.toFixed(1)} km · score ${Math.round(t.rank.score)}` : 'no home base set'} · {t.openCalls}{' '}
                    open
                    {t.rank?.missingSkills.length ? ` · lacks ${t.rank.missingSkills.join(', ')}` : ''}
                    {!t.hasPhone ? ' · no phone for SMS' : ''}
                  </span>
                </span>
                {current ? (
                  <button
                    type="button"
                    className="btn-secondary"
                    onClick={() => assign.mutate({ technicianId: null, version: call.version }, { onError, onSuccess: onDone })}
                  >
                    <UserMinus aria-hidden className="size-4" /> Unassign
                  </button>
                ) : (
                  <button
                    type="button"
                    className={i === 0 ? 'btn-primary' : 'btn-secondary'}
                    disabled={assign.isPending}
                    aria-label={`${call.technicianId ? 'Reassign to' : 'Assign'} ${t.name}`}
                    onClick={() => assign.mutate({ technicianId: t.userId, version: call.version }, { onError, onSuccess: onDone })}
                  >
                    <UserPlus aria-hidden className="size-4" /> {call.technicianId ? 'Reassign' : 'Assign'}
                  </button>
                )}
              </li>
            );
          })}
        </ol>
      )}
    </section>
  );
}

function NoteForm({ callId }: { callId: string }) {
  const [note, setNote] = useState('');
  const add = useAddNote(callId);
  return (
    <form
      className="card grid gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (note.trim()) add.mutate(note.trim(), { onSuccess: () => setNote('') });
      }}
    >
      <label htmlFor="call-note" className="font-semibold">
        Add a note to the timeline
      </label>
      <textarea id="call-note" rows={2} className={inputClass} value={note} onChange={(e) => setNote(e.target.value)} maxLength={2000} />
      <button type="submit" className="btn-secondary justify-self-start" disabled={!note.trim() || add.isPending}>
        <Send aria-hidden className="size-4" /> Add note
      </button>
    </form>
  );
}

function SeverityPicker({ call, onError }: { call: ServiceCall; onError: (e: unknown) => void }) {
  const setSeverity = useSetSeverity(call.id);
  return (
    <label className="flex flex-wrap items-center gap-2">
      <span className="font-semibold">Severity</span>
      <select
        className={`${inputClass} w-auto`}
        value={call.severity}
        disabled={setSeverity.isPending}
        onChange={(e) => setSeverity.mutate({ severity: e.target.value as Severity, version: call.version }, { onError })}
      >
        {severities.map((s) => (
          <option key={s} value={s}>
            {severityLabels[s]}
          </option>
        ))}
      </select>
    </label>
  );
}

/** A board taken to the bench from this call: its game's boards, each with a way to start a bench job for it. */
function BenchJobSection({ call }: { call: ServiceCall }) {
  const canWork = useCan('bench:work');
  const boards = useGameBoards(call.gameId);
  if (!canWork) return null;
  return (
    <section className="card grid gap-2" aria-labelledby="bench-job">
      <h2 id="bench-job" className="flex items-center gap-2 text-lg font-bold">
        <CircuitBoard aria-hidden className="size-5" /> Bench job
      </h2>
      {boards.isLoading ? (
        <Loading />
      ) : boards.error ? (
        <ErrorState error={boards.error} onRetry={() => boards.refetch()} />
      ) : !boards.data?.items.length ? (
        <p className="text-ink-soft">
          No boards are recorded for this game yet.{' '}
          <Link className="link" to={paths.game(call.gameId)}>
            Add them on the game’s page
          </Link>
          .
        </p>
      ) : (
        <>
          <p className="text-sm text-ink-soft">Taking a board to the bench for this call? Start its bench job here.</p>
          <ul className="grid gap-2">
            {boards.data.items.map((b) => (
              <li key={b.id} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-paper-line p-2">
                <span>
                  <span className="font-bold">{b.boardName}</span>
                  {b.serial && <span className="text-ink-soft"> · serial {b.serial}</span>}
                </span>
                <Link
                  className="btn-secondary"
                  to={paths.newBenchJob(b.id, call.id)}
                  aria-label={`Start a bench job on the ${b.boardName}`}
                >
                  Start a bench job
                </Link>
              </li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}
