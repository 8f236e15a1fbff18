import { Link, useParams } from 'react-router-dom';
import { Archive, Pencil } from 'lucide-react';
import { gameKindLabels } from '@bumperline/contracts/games';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { StatusBadge } from '../../components/status-badge.tsx';
import { ActivityList } from '../../components/activity-list.tsx';
import { paths } from '../../app/paths.ts';
import { useCan } from '../../api/use-can.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useGame, useRetireGame } from '../../api/games.ts';
import { useActivity } from '../../api/activity.ts';
import { formatDate, formatMoney } from '../../lib/format.ts';

export function GamePage() {
  const { id = '' } = useParams();
  const game = useGame(id);
  const canWrite = useCan('games:write');
  const canAudit = useCan('audit:read');
  const activity = useActivity({ entityId: id }, canAudit);
  const retire = useRetireGame(id);
  const locale = useLocaleSettings();

  if (game.isLoading) return <Loading />;
  if (game.error || !game.data) return <ErrorState error={game.error} onRetry={() => game.refetch()} />;
  const g = game.data;

  return (
    <>
      <PageHeader
        title={g.model.title}
        subtitle={
          <span className="inline-flex flex-wrap items-center gap-2">
            <StatusBadge status={g.status} /> {g.model.maker} · {gameKindLabels[g.model.kind]} · serial{' '}
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
          </dl>
          {g.notes && <p className="mt-3 rounded-md bg-brass-light p-2 text-sm">{g.notes}</p>}
        </section>
        <section className="card lg:col-span-2" aria-labelledby="game-activity">
          <h2 id="game-activity" className="mb-3 text-lg font-bold">
            History
          </h2>
          {!canAudit ? (
            <p className="text-ink-soft">Service calls, work and collections for this game will show here.</p>
          ) : activity.isLoading ? (
            <Loading />
          ) : activity.data?.items.length ? (
            <ActivityList items={activity.data.items} locale={locale} />
          ) : (
            <Empty title="No changes recorded yet." />
          )}
        </section>
      </div>
    </>
  );
}
