// One stop: the venue's games with their status, and for each game what to do here — service calls moved through
// their states, care-plan work done or skipped, bench jobs to open — with the game's parts lists to look at.
import { ArrowLeft, ClipboardList, Wrench } from 'lucide-react';
import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { can } from '@bumperline/contracts/roles';
import { gameBoardsQuery } from '../../api/boards.ts';
import { useLocaleSettings, useMe } from '../../api/me.ts';
import { useMyDay } from '../../api/route-days.ts';
import { usePendingChanges } from '../../api/technician-changes.ts';
import { GameStatusBadge } from '../../components/game-status-badge.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { defaultLocale } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { CallItem } from './call-item.tsx';
import { overlayStopItems, stopOf, type ItemView } from './day-overlay.ts';
import { venueGamesQuery } from './my-day-queries.ts';
import { SafetyNote } from './safety-note.tsx';
import { NavigateButton } from './stop-card.tsx';
import { SyncStrip } from './sync-strip.tsx';
import { WorkOrderItem } from './work-order-item.tsx';

function GamePartsLists({ gameId }: { gameId: string }) {
  const boards = useQuery(gameBoardsQuery(gameId));
  const lists = boards.data ? [...new Map([...boards.data.modelBoards.map((b) => [b.id, b.name] as const)]).entries()] : [];
  if (boards.isLoading) return <p className="text-ink-muted">Loading parts lists…</p>;
  if (lists.length === 0) return <p className="text-ink-muted">No parts lists for this model yet.</p>;
  return (
    <ul className="flex flex-wrap gap-2" aria-label="Parts lists">
      {lists.map(([id, name]) => (
        <li key={id}>
          <Link to={paths.partsList(id)} className="btn-secondary min-h-12">
            <ClipboardList aria-hidden className="size-5" /> {name}
          </Link>
        </li>
      ))}
    </ul>
  );
}

function Item({ item, venueName }: { item: ItemView; venueName: string }) {
  if (item.kind === 'service_call') return <CallItem item={item} venueName={venueName} />;
  if (item.kind === 'work_order') return <WorkOrderItem item={item} venueName={venueName} />;
  return (
    <Link to={paths.benchJob(item.id)} className="btn-secondary min-h-14 justify-start text-lg">
      <Wrench aria-hidden className="size-5" /> Bench job: {item.title}
    </Link>
  );
}

export function StopPage() {
  const { venueId = '' } = useParams();
  const me = useMe();
  const day = useMyDay();
  const games = useQuery(venueGamesQuery(venueId));
  const locale = useLocaleSettings() ?? defaultLocale;
  const pending = usePendingChanges().map((p) => p.change);
  const found = stopOf(day.data, venueId);
  const mayReadBench = can(me.data?.role, 'bench:read');

  if (day.isLoading) return <Loading label="Loading the stop…" />;
  if (!day.data) return <ErrorState error={day.error} onRetry={() => day.refetch()} />;
  if (!found) {
    // The office may have moved this stop off the day while the phone was offline: what was not sent (or needs a
    // decision) still shows here.
    return (
      <div className="mx-auto grid max-w-3xl gap-4">
        <SyncStrip savedAt={day.dataUpdatedAt} timeZone={locale.timeZone} locale={locale.locale} />
        <Empty title="This venue is not on your day">
          <Link to={paths.myDay} className="link">
            Back to My day
          </Link>
        </Empty>
      </div>
    );
  }
  const { stop, number } = found;
  const items = overlayStopItems(stop.items, pending);
  // Every game at the venue; a game with work here that the list has not got (offline, first visit) still shows.
  const listed = games.data?.items ?? [];
  const gameIds = [...new Set([...items.map((i) => i.game.id), ...listed.map((g) => g.id)])];
  const gameInfo = (id: string) => {
    const g = listed.find((x) => x.id === id);
    const fromItem = items.find((i) => i.game.id === id)?.game;
    return {
      title: g?.model.title ?? fromItem?.modelTitle ?? 'Game',
      serial: g?.serial ?? fromItem?.serial ?? '',
      status: g?.status ?? null,
    };
  };
  // Work first: games with something to do here come before the others.
  gameIds.sort((a, b) => Number(items.some((i) => i.game.id === b)) - Number(items.some((i) => i.game.id === a)));

  return (
    <div className="mx-auto grid max-w-3xl gap-4">
      <Link to={paths.myDay} className="link inline-flex min-h-12 items-center gap-1 self-start">
        <ArrowLeft aria-hidden className="size-5" /> My day
      </Link>
      <header className="grid gap-1">
        <p className="font-semibold text-ink-muted">
          {number ? `Stop ${number}` : 'Not on the route'}
          {'arrival' in stop ? ` · arrive ${stop.arrival}` : ''}
        </p>
        <h1 className="text-2xl font-extrabold break-words text-ink">{stop.venue.name}</h1>
        <p className="text-ink-soft">
          {stop.venue.address}, {stop.venue.city} · open {stop.venue.openingHours}
        </p>
      </header>
      <div className="flex">
        <NavigateButton href={stop.mapsUrl} venue={stop.venue.name} />
      </div>
      <SyncStrip savedAt={day.dataUpdatedAt} timeZone={locale.timeZone} locale={locale.locale} />
      <SafetyNote />
      {games.isLoading && <Loading label="Loading the venue's games…" />}
      <ul className="grid gap-4" aria-label="Games at this venue">
        {gameIds.map((id) => {
          const g = gameInfo(id);
          const here = items.filter((i) => i.game.id === id);
          return (
            <li key={id} className="card grid gap-3">
              <div className="flex flex-wrap items-center justify-between gap-2">
                <h2 className="text-xl font-extrabold text-ink">
                  <Link to={paths.game(id)} className="hover:underline">
                    {g.title}
                  </Link>{' '}
                  <span className="text-base font-semibold text-ink-soft">{g.serial}</span>
                </h2>
                {g.status && <GameStatusBadge status={g.status} />}
              </div>
              {here.length === 0 ? (
                <p className="text-ink-muted">Nothing to do on this game today.</p>
              ) : (
                <ul className="grid gap-4">
                  {here.map((item) => (
                    <li key={item.kind + item.id} data-item-id={item.id} className="border-t border-paper-line pt-3">
                      <Item item={item} venueName={stop.venue.name} />
                    </li>
                  ))}
                </ul>
              )}
              {mayReadBench && (
                <details>
                  <summary className="min-h-11 cursor-pointer py-2 font-bold text-ink">Parts lists</summary>
                  <GamePartsLists gameId={id} />
                </details>
              )}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
