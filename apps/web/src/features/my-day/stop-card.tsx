// One stop on the day: when the technician gets there, where, what to do, and a big Navigate button that opens the
// phone's maps app with directions.
import { ChevronRight, Clock, Navigation } from 'lucide-react';
import { Link } from 'react-router-dom';
import { stopItemKindLabels } from '@bumperline/contracts/care-vocabulary';
import type { RouteStop, UnscheduledStop } from '@bumperline/contracts/route-days';
import { formatMinutes } from '../../lib/duration-entry.ts';
import { paths } from '../../lib/paths.ts';
import { openCount, type ItemView } from './day-overlay.ts';
import { ItemStateBadge } from './item-state-badge.tsx';

export function NavigateButton({ href, venue }: { href: string; venue: string }) {
  return (
    <a
      href={href}
      target="_blank"
      rel="noopener noreferrer"
      className="btn-primary min-h-14 flex-1 text-lg"
      aria-label={`Navigate to ${venue}`}
    >
      <Navigation aria-hidden className="size-5" /> Navigate
    </a>
  );
}

export function StopItems({ items }: { items: ItemView[] }) {
  return (
    <ul className="grid gap-2">
      {items.map((item) => (
        <li key={item.kind + item.id} className="grid gap-1 rounded-md bg-paper-dim px-3 py-2">
          <span className="text-sm font-semibold text-ink-muted">{stopItemKindLabels[item.kind]}</span>
          <span className="font-bold text-ink">{item.title}</span>
          <span className="text-ink-soft">
            {item.game.modelTitle} · {item.game.serial}
          </span>
          <ItemStateBadge item={item} />
        </li>
      ))}
    </ul>
  );
}

export function StopCard({ number, stop, items }: { number: number | null; stop: RouteStop | UnscheduledStop; items: ItemView[] }) {
  const timed = 'arrival' in stop ? stop : null;
  const left = openCount(items);
  return (
    <li className="card grid gap-3" aria-label={`Stop ${number ?? ''} ${stop.venue.name}`.replace('  ', ' ')}>
      <div className="flex items-start gap-3">
        <span
          aria-hidden
          className="flex size-10 shrink-0 items-center justify-center rounded-full border-4 border-brass-bright bg-bar text-lg font-extrabold text-bar-text"
        >
          {number ?? '–'}
        </span>
        <div className="min-w-0 flex-1">
          {timed ? (
            <p className="tabular flex flex-wrap items-center gap-x-2 text-xl font-extrabold text-ink">
              <Clock aria-hidden className="size-5" /> {timed.serviceStart}
              {timed.waitMinutes > 0 && (
                <span className="text-base font-semibold text-ink-soft">
                  arrive {timed.arrival}, opens {timed.serviceStart}
                </span>
              )}
            </p>
          ) : (
            <p className="font-bold text-attention">{(stop as UnscheduledStop).reason}</p>
          )}
          <h2 className="text-lg font-extrabold break-words text-ink">{stop.venue.name}</h2>
          <p className="break-words text-ink-soft">
            {stop.venue.address}, {stop.venue.city}
          </p>
          <p className="text-sm text-ink-muted">
            Open {stop.venue.openingHours} · about {formatMinutes(stop.onSiteMinutes)} on site
            {timed && timed.travelMinutesFromPrevious > 0 ? ` · ${formatMinutes(timed.travelMinutesFromPrevious)} drive` : ''}
          </p>
        </div>
      </div>
      <StopItems items={items} />
      <div className="flex flex-wrap gap-2">
        <NavigateButton href={stop.mapsUrl} venue={stop.venue.name} />
        <Link to={paths.myStop(stop.venue.id)} className="btn-secondary min-h-14 flex-1 text-lg">
          Open stop{left > 0 ? ` (${left} to do)` : ''} <ChevronRight aria-hidden className="size-5" />
        </Link>
      </div>
    </li>
  );
}
