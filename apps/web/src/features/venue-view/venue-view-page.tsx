// The venue view: a bar owner's games and their status, their calls and how far along they are,
// and reporting a problem — phone-first, big touch targets.
import { useState } from 'react';
import { problemKinds, problemLabels, type ProblemKind } from '@bumperline/contracts/call-vocabulary';
import type { VenueView, VenueViewCall } from '@bumperline/contracts/venue-view';
import { PageHeader } from '../../components/page-header.tsx';
import { GameStatusBadge } from '../../components/game-status-badge.tsx';
import { CallStateBadge } from '../../components/call-state-badge.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { inputClass } from '../../components/field.tsx';
import { formatDateTime } from '../../lib/format.ts';
import { ApiError } from '../../lib/api-client.ts';
import { useLocaleSettings, useMe } from '../../api/me.ts';
import { useVenueReport, useVenueView } from '../../api/venue-view.ts';

export function VenueViewPage() {
  const view = useVenueView();
  const me = useMe();
  if (view.isLoading) return <Loading />;
  if (view.error || !view.data) return <ErrorState error={view.error} onRetry={() => view.refetch()} />;
  const v = view.data;
  const company = me.data?.company?.name ?? 'your operator';
  return (
    <>
      <PageHeader
        title={v.venues.length === 1 ? `Your games at ${v.venues[0]!.name}` : 'Your venue view'}
        subtitle={`Looked after by ${company}.`}
      />
      {!v.venues.length ? (
        <section className="card">
          <Empty title="No venue is linked to your account yet.">
            <p>Ask {company} to link you to your venue.</p>
          </Empty>
        </section>
      ) : (
        <div className="grid gap-4 lg:grid-cols-2">
          <GamesList view={v} />
          <div className="grid content-start gap-4">
            <CallsList title="Open calls" calls={v.openCalls} empty="Nothing is waiting for a fix." />
            <CallsList title="Recent past calls" calls={v.pastCalls.slice(0, 10)} empty="No past calls yet." />
          </div>
        </div>
      )}
    </>
  );
}

function GamesList({ view }: { view: VenueView }) {
  const [reporting, setReporting] = useState<string | null>(null);
  return (
    <section className="card" aria-labelledby="my-games">
      <h2 id="my-games" className="mb-2 text-lg font-bold">
        Games
      </h2>
      {!view.games.length ? (
        <Empty title="No games at your venue." />
      ) : (
        <ul className="divide-y divide-paper-line">
          {view.games.map((g) => (
            <li key={g.id} className="py-3">
              <div className="flex flex-wrap items-center justify-between gap-2">
                <span>
                  <span className="font-bold">{g.title}</span> <span className="text-sm text-ink-muted tabular">· {g.serial}</span>
                </span>
                <GameStatusBadge status={g.status} />
              </div>
              {reporting === g.id ? (
                <ReportForm gameId={g.id} title={g.title} onClose={() => setReporting(null)} />
              ) : (
                <button type="button" className="btn-secondary mt-2" onClick={() => setReporting(g.id)}>
                  Report a problem with {g.title}
                </button>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function ReportForm({ gameId, title, onClose }: { gameId: string; title: string; onClose: () => void }) {
  const report = useVenueReport();
  const [problem, setProblem] = useState<ProblemKind | null>(null);
  const [note, setNote] = useState('');
  const [done, setDone] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  if (done) {
    return (
      <div role="status" className="mt-2 rounded-md border border-running bg-running-tint p-3 font-semibold text-running">
        {done}{' '}
        <button type="button" className="underline" onClick={onClose}>
          Done
        </button>
      </div>
    );
  }
  return (
    <form
      className="mt-2 grid gap-2 rounded-md border border-paper-line p-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (!problem) return setError('Choose what is wrong.');
        report.mutate(
          { gameId, problem, note },
          {
            onSuccess: (r) =>
              setDone(
                r.joined
                  ? 'Thanks — this game already has an open call; we added your report to it.'
                  : 'Thanks — your report is in. We will be in touch.',
              ),
            onError: (err) => setError(err instanceof ApiError ? err.message : 'Could not send the report.'),
          },
        );
      }}
    >
      <fieldset className="grid gap-1">
        <legend className="mb-1 font-semibold">What is wrong with {title}?</legend>
        {problemKinds.map((k) => (
          <label key={k} className="flex min-h-11 items-center gap-3 rounded-md border border-paper-line px-3">
            <input type="radio" name={`problem-${gameId}`} className="size-5" checked={problem === k} onChange={() => setProblem(k)} />
            {problemLabels[k]}
          </label>
        ))}
      </fieldset>
      <label htmlFor={`note-${gameId}`} className="font-semibold">
        Anything else we should know? (optional)
      </label>
      <textarea
        id={`note-${gameId}`}
        rows={2}
        maxLength={1000}
        className={inputClass}
        value={note}
        onChange={(e) => setNote(e.target.value)}
      />
      {error && (
        <p role="alert" className="font-semibold text-down">
          {error}
        </p>
      )}
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={report.isPending}>
          Send report
        </button>
        <button type="button" className="btn-secondary" onClick={onClose}>
          Cancel
        </button>
      </div>
    </form>
  );
}

function CallsList({ title, calls, empty }: { title: string; calls: VenueViewCall[]; empty: string }) {
  const locale = useLocaleSettings();
  return (
    <section className="card" aria-label={title}>
      <h2 className="mb-2 text-lg font-bold">{title}</h2>
      {!calls.length ? (
        <Empty title={empty} />
      ) : (
        <ul className="divide-y divide-paper-line">
          {calls.map((c) => (
            <li key={c.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <span>
                <span className="font-semibold">{c.gameTitle}</span> — {problemLabels[c.problem]}
                <br />
                <span className="text-sm text-ink-muted">Reported {formatDateTime(c.openedAt, locale)}</span>
              </span>
              <CallStateBadge state={c.state} />
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
