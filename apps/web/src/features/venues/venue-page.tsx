import { Link, useParams } from 'react-router-dom';
import { Archive, MapPin, Pencil, Phone, Mail, QrCode } from 'lucide-react';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { GameStatusBadge } from '../../components/game-status-badge.tsx';
import { ActivitySection } from '../../components/activity-section.tsx';
import { VenueContactsSection } from './venue-contacts-section.tsx';
import { WorkOrdersSection } from '../../components/work-orders-section.tsx';
import { paths } from '../../lib/paths.ts';
import { useCan } from '../../api/use-can.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useRetireVenue, useVenue } from '../../api/venues.ts';
import { useGames } from '../../api/games.ts';
import { formatDate } from '../../lib/format.ts';

const dayNames = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'];

export function VenuePage() {
  const { id = '' } = useParams();
  const venue = useVenue(id);
  const games = useGames({ venueId: id, limit: 200, sort: 'title', order: 'asc' });
  const canWrite = useCan('venues:write');
  const canReadCare = useCan('care-plans:read');
  const retire = useRetireVenue(id);
  const locale = useLocaleSettings();

  if (venue.isLoading) return <Loading />;
  if (venue.error || !venue.data) return <ErrorState error={venue.error} onRetry={() => venue.refetch()} />;
  const v = venue.data;

  return (
    <>
      <PageHeader
        title={v.name}
        subtitle={
          <span className="inline-flex items-center gap-1">
            <MapPin aria-hidden className="size-4" /> {v.addressLine}, {v.city} {v.postcode}
            {v.retiredAt && <strong className="ml-2 text-down">Retired {formatDate(v.retiredAt, locale)}</strong>}
          </span>
        }
        actions={
          !v.retiredAt && (
            <>
              <a className="btn-secondary" href={`/api/venues/${v.id}/tag-sheet`} target="_blank" rel="noreferrer">
                <QrCode aria-hidden className="size-4" /> Print game tags
              </a>
              {canWrite && (
                <>
                  <Link className="btn-secondary" to={paths.editVenue(v.id)}>
                    <Pencil aria-hidden className="size-4" /> Edit
                  </Link>
                  <button
                    type="button"
                    className="btn-danger"
                    disabled={retire.isPending}
                    onClick={() => {
                      if (window.confirm(`Retire ${v.name}? It leaves the active lists; its history stays.`)) retire.mutate();
                    }}
                  >
                    <Archive aria-hidden className="size-4" /> Retire
                  </button>
                </>
              )}
            </>
          )
        }
      />
      <div className="grid gap-4 lg:grid-cols-3">
        <section className="card lg:col-span-2" aria-labelledby="games-here">
          <h2 id="games-here" className="mb-3 text-lg font-bold">
            Games here ({games.data?.items.length ?? '…'})
          </h2>
          {games.isLoading ? (
            <Loading />
          ) : games.error ? (
            <ErrorState error={games.error} onRetry={() => games.refetch()} />
          ) : !games.data?.items.length ? (
            <Empty title="No games at this venue." />
          ) : (
            <ul className="divide-y divide-paper-line">
              {games.data.items.map((g) => (
                <li key={g.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                  <Link className="link" to={paths.game(g.id)}>
                    {g.model.title} <span className="font-normal text-ink-muted">· {g.serial}</span>
                  </Link>
                  <GameStatusBadge status={g.status} />
                </li>
              ))}
            </ul>
          )}
        </section>
        <section className="card grid content-start gap-3" aria-labelledby="venue-contact">
          <h2 id="venue-contact" className="text-lg font-bold">
            Contact and hours
          </h2>
          <p className="font-semibold">{v.contactName || 'No contact named'}</p>
          {v.contactPhone && (
            <a className="link inline-flex items-center gap-1" href={`tel:${v.contactPhone}`}>
              <Phone aria-hidden className="size-4" /> {v.contactPhone}
            </a>
          )}
          {v.contactEmail && (
            <a className="link inline-flex items-center gap-1" href={`mailto:${v.contactEmail}`}>
              <Mail aria-hidden className="size-4" /> {v.contactEmail}
            </a>
          )}
          <dl className="grid grid-cols-[3rem_1fr] gap-x-2 text-sm tabular">
            {dayNames.map((d, i) => {
              const w = v.openingHours[String(i + 1) as '1'];
              return (
                <div key={d} className="contents">
                  <dt className="font-semibold">{d}</dt>
                  <dd>{w?.length ? w.map((x) => `${x.open}–${x.close}`).join(', ') : 'Closed'}</dd>
                </div>
              );
            })}
          </dl>
          {v.notes && <p className="rounded-md bg-brass-light p-2 text-sm">{v.notes}</p>}
          <p className="text-sm text-ink-muted tabular">
            {v.latitude.toFixed(5)}, {v.longitude.toFixed(5)}
          </p>
        </section>
        <div className="lg:col-span-3">
          <VenueContactsSection venueId={v.id} />
        </div>
        {canReadCare && <WorkOrdersSection venueId={v.id} />}
        <ActivitySection entityId={v.id} title="Activity" />
      </div>
    </>
  );
}
