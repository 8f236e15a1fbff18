// The technician's home: today's stops in driving order with arrival times, what to do at each and a Navigate
// button; the route on a map; and what has not reached the office yet. Works from the phone's saved copy offline.
import { lazy, Suspense, useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useMyDay } from '../../api/route-days.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useSettings } from '../../api/settings.ts';
import { usePendingChanges } from '../../api/technician-changes.ts';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { defaultLocale, formatDate } from '../../lib/format.ts';
import { formatMinutes } from '../../lib/duration-entry.ts';
import { overlayStopItems } from './day-overlay.ts';
import { keepStopsOffline } from './my-day-queries.ts';
import { StopCard } from './stop-card.tsx';
import { SyncStrip } from './sync-strip.tsx';
import { useOnline } from './use-online.ts';

const RouteMap = lazy(() => import('./route-map.tsx'));

export function MyDayPage() {
  const day = useMyDay();
  const qc = useQueryClient();
  const online = useOnline();
  const locale = useLocaleSettings() ?? defaultLocale;
  const settings = useSettings();
  const pending = usePendingChanges().map((p) => p.change);

  // While there is signal, fetch what each stop needs so the phone has it later without.
  useEffect(() => {
    if (day.data && online) void keepStopsOffline(qc, day.data).catch(() => undefined);
  }, [day.data, online, qc]);

  const d = day.data;
  const subtitle = d
    ? `${formatDate(d.day, locale)} · ${d.stops.length} ${d.stops.length === 1 ? 'stop' : 'stops'} · ${formatMinutes(d.totals.travelMinutes)} driving · back about ${d.returnTime}`
    : undefined;

  return (
    <div className="mx-auto grid max-w-3xl gap-2">
      <PageHeader title="My day" subtitle={subtitle} />
      <SyncStrip savedAt={day.dataUpdatedAt} timeZone={locale.timeZone} locale={locale.locale} />
      {day.isLoading ? (
        <Loading label="Loading your day…" />
      ) : !d ? (
        <ErrorState error={day.error} onRetry={() => day.refetch()} />
      ) : d.stops.length === 0 && d.unscheduled.length === 0 ? (
        <Empty title="Nothing planned for today">Calls and care-plan work assigned to you for today will show here.</Empty>
      ) : (
        <>
          <ol className="grid gap-3" aria-label="Stops in driving order">
            {d.stops.map((s, i) => (
              <StopCard key={s.venue.id} number={i + 1} stop={s} items={overlayStopItems(s.items, pending)} />
            ))}
          </ol>
          {d.unscheduled.length > 0 && (
            <section aria-labelledby="unscheduled" className="mt-4 grid gap-2">
              <h2 id="unscheduled" className="text-lg font-extrabold text-ink">
                Not on today&rsquo;s route
              </h2>
              <ul className="grid gap-3">
                {d.unscheduled.map((s) => (
                  <StopCard key={s.venue.id} number={null} stop={s} items={overlayStopItems(s.items, pending)} />
                ))}
              </ul>
            </section>
          )}
          {d.stops.length > 0 && (
            <section aria-labelledby="route-map" className="mt-4">
              <h2 id="route-map" className="mb-2 text-lg font-extrabold text-ink">
                Route
              </h2>
              <Suspense fallback={<Loading label="Loading the map…" />}>
                <RouteMap day={d} tileUrl={settings.data?.mapTileUrl ?? ''} />
              </Suspense>
            </section>
          )}
        </>
      )}
    </div>
  );
}
