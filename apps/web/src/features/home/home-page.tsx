// The first screen after sign-in: what needs attention now. Venue contacts get their venue view.
import { Link } from 'react-router-dom';
import { gameStatusLabels, gameStatuses } from '@bumperline/contracts/games';
import { PageHeader } from '../../components/page-header.tsx';
import { StatusBadge } from '../../components/status-badge.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { paths } from '../../app/paths.ts';
import { useMe } from '../../api/me.ts';
import { useGameSummary, useGames } from '../../api/games.ts';

export function HomePage() {
  const me = useMe();
  if (me.data?.role === 'venue_contact') return <VenueContactHome company={me.data.company?.name ?? ''} />;
  return <TodayPage firstName={me.data?.user.name.split(' ')[0] ?? ''} />;
}

function TodayPage({ firstName }: { firstName: string }) {
  const summary = useGameSummary();
  const down = useGames({ status: 'down', sort: 'venue', order: 'asc', limit: 50 });
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
                  <StatusBadge status={s} />
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

function VenueContactHome({ company }: { company: string }) {
  return (
    <>
      <PageHeader title="Your venue view" subtitle={`Your games are looked after by ${company}.`} />
      <section className="card max-w-2xl">
        <p>
          You are signed in as a venue contact. To report a game that is not working, scan the game tag (the QR sticker) on its cabinet, or
          call {company}.
        </p>
      </section>
    </>
  );
}
