import { Link, useParams } from 'react-router-dom';
import { Archive, Pencil } from 'lucide-react';
import { gameKindLabels } from '@bumperline/contracts/game-vocabulary';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { GameStatusBadge } from '../../components/game-status-badge.tsx';
import { ActivitySection } from '../../components/activity-section.tsx';
import { BoardsSection } from '../../components/boards-section.tsx';
import { WorkOrdersSection } from '../../components/work-orders-section.tsx';
import { GameCareSection } from '../../components/game-care-section.tsx';
import { paths } from '../../lib/paths.ts';
import { useCan } from '../../api/use-can.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useGame, useGameDowntime, useRegenerateTag, useRetireGame } from '../../api/games.ts';
import { formatDuration, useNow } from '../../components/target-clock.tsx';
import { formatDate, formatDateTime, formatMoney } from '../../lib/format.ts';
import { useCalls, useOpenCall } from '../../api/calls.ts';
import { CallStateBadge } from '../../components/call-state-badge.tsx';
import { callRef, problemKinds, problemLabels, type ProblemKind } from '@bumperline/contracts/call-vocabulary';
import { inputClass } from '../../components/field.tsx';
import { ApiError } from '../../lib/api-client.ts';
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';

export function GamePage() {
  const { id = '' } = useParams();
  const game = useGame(id);
  const canWrite = useCan('games:write');
  const retire = useRetireGame(id);
  const locale = useLocaleSettings();
  const canReadBench = useCan('bench:read');
  const canReadCare = useCan('care-plans:read');

  if (game.isLoading) return <Loading />;
  if (game.error || !game.data) return <ErrorState error={game.error} onRetry={() => game.refetch()} />;
  const g = game.data;

  return (
    <>
      <PageHeader
        title={g.model.title}
        subtitle={
          <span className="inline-flex flex-wrap items-center gap-2">
            <GameStatusBadge status={g.status} /> {g.model.maker} · {gameKindLabels[g.model.kind]} · serial{' '}
            <span className="tabular">{g.serial}</span>
            {g.retiredAt && <strong className="text-down">Retired {formatDate(g.retiredAt, locale)}</strong>}
          </span>
        }
        actions={
          canWrite &&
          !g.retiredAt && (
            <>
              <Link className="btn-secondary" to={paths.editGame(g.id)}>
                <Pencil aria-hidden className="size-4" /> Edit
              </Link>
              <button
                type="button"
                className="btn-danger"
                disabled={retire.isPending}
                onClick={() => {
                  if (window.confirm(`Retire ${g.model.title} (${g.serial})? It leaves its venue and the active lists; its history stays.`))
                    retire.mutate();
                }}
              >
                <Archive aria-hidden className="size-4" /> Retire
              </button>
            </>
          )
        }
      />
      <div className="grid gap-4 lg:grid-cols-3">
        <section className="card" aria-labelledby="game-facts">
          <h2 id="game-facts" className="mb-3 text-lg font-bold">
            On location
          </h2>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2">
            <dt className="font-semibold">Venue</dt>
            <dd>
              {g.venueId ? (
                <Link className="link" to={paths.venue(g.venueId)}>
                  {g.venueName}
                </Link>
              ) : (
                'Not placed'
              )}
            </dd>
            <dt className="font-semibold">Installed</dt>
            <dd>{formatDate(g.installedOn, locale)}</dd>
            <dt className="font-semibold">Price per play</dt>
            <dd className="tabular">{formatMoney(g.pricePerPlayCents, locale)}</dd>
            <dt className="font-semibold">Model year</dt>
            <dd className="tabular">{g.model.year ?? '—'}</dd>
            {g.tagToken && (
              <>
                <dt className="font-semibold">Game tag</dt>
                <dd>
                  <a className="link" href={`/t/${g.tagToken}`} target="_blank" rel="noreferrer">
                    Open the report page
                  </a>
                  {canWrite && <RegenerateTag gameId={g.id} />}
                </dd>
              </>
            )}
          </dl>
          {g.notes && <p className="mt-3 rounded-md bg-brass-light p-2 text-sm">{g.notes}</p>}
        </section>
        <GameCalls gameId={g.id} title={g.model.title} canReport={!g.retiredAt} />
        {canReadBench && <BoardsSection gameId={g.id} modelTitle={g.model.title} canFit={!g.retiredAt} />}
        {canReadCare && <WorkOrdersSection gameId={g.id} />}
        {canReadCare && <GameCareSection gameId={g.id} />}
        <Downtime gameId={g.id} />
        <ActivitySection entityId={g.id} title="Changes" />
      </div>
    </>
  );
}

function GameCalls({ gameId, title, canReport }: { gameId: string; title: string; canReport: boolean }) {
  const calls = useCalls({ gameId, state: 'all', sort: 'openedAt', order: 'desc', limit: 20 });
  const canOpen = useCan('calls:open') && canReport;
  const locale = useLocaleSettings();
  const open = useOpenCall();
  const navigate = useNavigate();
  const [problem, setProblem] = useState<ProblemKind>('dead');
  const [note, setNote] = useState('');
  const [error, setError] = useState<string | null>(null);
  return (
    <section className="card lg:col-span-2" aria-labelledby="game-calls">
      <h2 id="game-calls" className="mb-3 text-lg font-bold">
        Service calls
      </h2>
      {calls.isLoading ? (
        <Loading />
      ) : calls.error ? (
        <ErrorState error={calls.error} onRetry={() => calls.refetch()} />
      ) : !calls.data?.items.length ? (
        <Empty title="No service calls for this game yet." />
      ) : (
        <ul className="divide-y divide-paper-line">
          {calls.data.items.map((c) => (
            <li key={c.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <span>
                <Link className="link tabular" to={paths.call(c.id)}>
                  {callRef(c.id)}
                </Link>{' '}
                {problemLabels[c.problem]}
                <br />
                <span className="text-sm text-ink-muted">{formatDateTime(c.openedAt, locale)}</span>
              </span>
              <CallStateBadge state={c.state} />
            </li>
          ))}
        </ul>
      )}
      {canOpen && (
        <form
          className="mt-4 grid gap-2 border-t border-paper-line pt-4 sm:grid-cols-[auto_1fr_auto] sm:items-end"
          onSubmit={(e) => {
            e.preventDefault();
            setError(null);
            open.mutate(
              { gameId, problem, note },
              {
                onSuccess: (c) => navigate(paths.call(c.id)),
                onError: (err) => setError(err instanceof ApiError ? err.message : 'Could not open the call.'),
              },
            );
          }}
        >
          <label className="grid gap-1">
            <span className="font-semibold">Open a call for {title}</span>
            <select className={inputClass} value={problem} onChange={(e) => setProblem(e.target.value as ProblemKind)}>
              {problemKinds.map((k) => (
                <option key={k} value={k}>
                  {problemLabels[k]}
                </option>
              ))}
            </select>
          </label>
          <label className="grid gap-1">
            <span className="font-semibold">Note</span>
            <input className={inputClass} value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} />
          </label>
          <button type="submit" className="btn-primary" disabled={open.isPending}>
            Open call
          </button>
          {error && (
            <p role="alert" className="font-semibold text-down sm:col-span-3">
              {error}
            </p>
          )}
        </form>
      )}
    </section>
  );
}

function Downtime({ gameId }: { gameId: string }) {
  const downtime = useGameDowntime(gameId);
  const locale = useLocaleSettings();
  const now = useNow();
  const items = downtime.data?.items ?? [];
  return (
    <section className="card lg:col-span-3" aria-labelledby="game-downtime">
      <h2 id="game-downtime" className="mb-3 text-lg font-bold">
        Downtime
      </h2>
      {downtime.isLoading ? (
        <Loading />
      ) : downtime.error ? (
        <ErrorState error={downtime.error} onRetry={() => downtime.refetch()} />
      ) : !items.length ? (
        <Empty title="This game has not been down." />
      ) : (
        <table className="w-full text-left">
          <caption className="sr-only">Downtime intervals</caption>
          <thead className="bg-paper-dim text-sm text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-2">
                Down from
              </th>
              <th scope="col" className="px-3 py-2">
                Back up
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                For
              </th>
            </tr>
          </thead>
          <tbody>
            {items.slice(0, 12).map((d) => (
              <tr key={d.id} className="border-t border-paper-line">
                <td className="px-3 py-2">{formatDateTime(d.startedAt, locale)}</td>
                <td className="px-3 py-2">
                  {d.endedAt ? formatDateTime(d.endedAt, locale) : <strong className="text-down">Still down</strong>}
                </td>
                <td className="px-3 py-2 text-right tabular">
                  {formatDuration((d.endedAt ? Date.parse(d.endedAt) : now) - Date.parse(d.startedAt))}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}

function RegenerateTag({ gameId }: { gameId: string }) {
  const regenerate = useRegenerateTag(gameId);
  return (
    <button
      type="button"
      className="mt-1 block text-sm font-semibold text-down underline"
      disabled={regenerate.isPending}
      onClick={() => {
        if (window.confirm('Make a new game tag? The QR code on the cabinet stops working until you replace it.')) regenerate.mutate();
      }}
    >
      {regenerate.isSuccess ? 'New tag made — print the venue’s tag sheet' : 'Replace the game tag'}
    </button>
  );
}
