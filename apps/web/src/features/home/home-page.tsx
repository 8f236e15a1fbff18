// Today: what needs attention now on the route.
import { Link } from 'react-router-dom';
import { gameStatusLabels, gameStatuses } from '@bumperline/contracts/game-vocabulary';
import { PageHeader } from '../../components/page-header.tsx';
import { GameStatusBadge } from '../../components/game-status-badge.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { paths } from '../../lib/paths.ts';
import { useMe } from '../../api/me.ts';
import { useGameSummary, useGames } from '../../api/games.ts';
import { useCalls } from '../../api/calls.ts';
import { useCan } from '../../api/use-can.ts';
import { CallStateBadge } from '../../components/call-state-badge.tsx';
import { TargetClock } from '../../components/target-clock.tsx';
import { callRef } from '@bumperline/contracts/call-vocabulary';
import { downGamesQuery, openCallsQuery } from './today-queries.ts';

export function HomePage() {
  const me = useMe();
  return <TodayPage firstName={me.data?.user.name.split(' ')[0] ?? ''} />;
}

function TodayPage({ firstName }: { firstName: string }) {
  const summary = useGameSummary();
  const down = useGames(downGamesQuery);
  return (
    <>
      <PageHeader title="Today" subtitle={`Good to see you, ${firstName}. Here is the route at a glance.`} />
      <section aria-labelledby="fleet" className="mb-4">
        <h2 id="fleet" className="sr-only">
          Games by status
        </h2>
        {summary.isLoading ? (
          <Loading />
        ) : summary.error ? (
          <ErrorState error={summary.error} onRetry={() => summary.refetch()} />
        ) : (
          <ul className="grid grid-cols-2 gap-3 md:grid-cols-5">
            {gameStatuses.map((s) => (
              <li key={s}>
                <Link to={`${paths.games}?status=${s}`} className="card flex flex-col gap-2 hover:border-ink">
                  <GameStatusBadge status={s} />
                  <span className="text-3xl font-extrabold tabular">{summary.data?.byStatus[s] ?? 0}</span>
                  <span className="sr-only">{gameStatusLabels[s]} games</span>
                </Link>
              </li>
            ))}
            <li>
              <Link to={paths.games} className="card flex flex-col gap-2 hover:border-ink">
                <span className="font-semibold text-ink-soft">All on the books</span>
                <span className="text-3xl font-extrabold tabular">{summary.data?.total ?? 0}</span>
              </Link>
            </li>
          </ul>
        )}
      </section>
      <OpenCalls />
      <section className="card" aria-labelledby="down-now">
        <h2 id="down-now" className="mb-3 text-lg font-bold">
          Down now
        </h2>
        {down.isLoading ? (
          <Loading />
        ) : down.error ? (
          <ErrorState error={down.error} onRetry={() => down.refetch()} />
        ) : !down.data?.items.length ? (
          <Empty title="Every game is up. Nice." />
        ) : (
          <ul className="divide-y divide-paper-line">
            {down.data.items.map((g) => (
              <li key={g.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <Link className="link" to={paths.game(g.id)}>
                  {g.model.title} <span className="font-normal text-ink-muted">· {g.serial}</span>
                </Link>
                <span className="text-ink-soft">{g.venueName ?? 'Not placed'}</span>
              </li>
            ))}
          </ul>
        )}
      </section>
    </>
  );
}

/** The calls closest to (or past) their response target, or a technician's own calls. */
function OpenCalls() {
  const canDispatch = useCan('calls:dispatch');
  const canRead = useCan('calls:read');
  const calls = useCalls(openCallsQuery(canDispatch));
  if (!canRead) return null;
  return (
    <section className="card mb-4" aria-labelledby="open-calls">
      <h2 id="open-calls" className="mb-3 text-lg font-bold">
        {canDispatch ? 'Calls closest to their target' : 'My calls'}
      </h2>
      {calls.isLoading ? (
        <Loading />
      ) : calls.error ? (
        <ErrorState error={calls.error} onRetry={() => calls.refetch()} />
      ) : !calls.data?.items.length ? (
        <Empty title={canDispatch ? 'No open calls.' : 'No calls assigned to you.'} />
      ) : (
        <ul className="divide-y divide-paper-line">
          {calls.data.items.map((c) => (
            <li key={c.id} className="flex flex-wrap items-center justify-between gap-3 py-2">
              <Link className="link" to={paths.call(c.id)}>
                <span className="tabular">{callRef(c.id)}</span> · {c.gameTitle}{' '}
                <span className="font-normal text-ink-muted">· {c.venueName}</span>
              </Link>
              <span className="flex flex-wrap items-center gap-3">
                <CallStateBadge state={c.state} />
                <TargetClock openedAt={c.openedAt} targetAt={c.targetAt} stoppedAt={c.fixedAt} />
              </span>
            </li>
          ))}
        </ul>
      )}
      <Link className="link mt-3 inline-block" to={canDispatch ? paths.calls : `${paths.calls}?technicianId=me`}>
        {canDispatch ? 'All calls on the map' : 'All my calls'}
      </Link>
    </section>
  );
}
