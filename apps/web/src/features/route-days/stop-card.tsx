// One stop in a technician's column: its number in the technician's marker style, the venue, when the technician
// gets there and leaves, the driving from the previous stop, and what to do there. Dragged by its handle (mouse,
// touch, or keyboard: space to lift, arrows to move, space to drop).
import { useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { AlertTriangle, Clock, GripVertical, Hourglass, Wrench } from 'lucide-react';
import type { ReactNode } from 'react';
import { severityLabels } from '@bumperline/contracts/call-vocabulary';
import { stopItemKindLabels } from '@bumperline/contracts/care-vocabulary';
import type { RouteStop, RouteStopItem, UnscheduledStop } from '@bumperline/contracts/route-days';
import type { RouteStyle } from '../../components/route-styles.ts';
import { formatDate } from '../../lib/format.ts';
import { formatMinutes } from '../../lib/duration-entry.ts';
import { formatKm } from './words.ts';

export function StopBadge({ style, label }: { style: RouteStyle; label: string }) {
  const shape = style.shape === 'circle' ? 'rounded-full' : style.shape === 'square' ? 'rounded-sm' : 'rounded-sm rotate-45';
  return (
    <span aria-hidden className={`inline-flex size-9 shrink-0 items-center justify-center ${shape}`} style={{ background: style.colour }}>
      <span className={`text-xs font-extrabold text-white ${style.shape === 'diamond' ? '-rotate-45' : ''}`}>{label}</span>
    </span>
  );
}

function ItemLine({ item }: { item: RouteStopItem }) {
  return (
    <li className="flex flex-wrap items-baseline gap-x-2 text-sm">
      <span className="font-semibold text-ink">{stopItemKindLabels[item.kind]}:</span>
      <span className="text-ink">{item.title}</span>
      <span className="text-ink-soft">
        {item.game.modelTitle} · {item.game.serial}
      </span>
      {item.severity === 'down' && (
        <span className="inline-flex items-center gap-1 rounded bg-down-tint px-1.5 font-semibold text-down">
          <AlertTriangle aria-hidden className="size-3.5" /> {severityLabels.down}
        </span>
      )}
      {item.carriedOverFrom && (
        <span className="inline-flex items-center gap-1 rounded bg-attention-tint px-1.5 font-semibold text-attention">
          <Hourglass aria-hidden className="size-3.5" /> Planned for {formatDate(item.carriedOverFrom)}, still open
        </span>
      )}
    </li>
  );
}

export function StopItems({ items }: { items: RouteStopItem[] }) {
  return (
    <ul className="mt-2 space-y-1">
      {items.map((item) => (
        <ItemLine key={`${item.kind}:${item.id}`} item={item} />
      ))}
    </ul>
  );
}

interface SortableStopProps {
  id: string;
  stop: RouteStop;
  number: number;
  style: RouteStyle;
  fromHome: boolean;
  locale: string | undefined;
  disabled: boolean;
  /** The "Move to…" form, opened from the card. */
  children?: ReactNode;
}

export function SortableStopCard({ id, stop, number, style, fromHome, locale, disabled, children }: SortableStopProps) {
  const { attributes, listeners, setNodeRef, setActivatorNodeRef, transform, transition, isDragging } = useSortable({ id, disabled });
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Translate.toString(transform), transition }}
      className={`card relative list-none p-3 ${isDragging ? 'z-10 opacity-80 shadow-lg ring-2 ring-brass' : ''}`}
      data-testid="route-stop"
      data-venue-id={stop.venue.id}
    >
      <div className="flex items-start gap-3">
        <StopBadge style={style} label={`${style.letter}${number}`} />
        <div className="min-w-0 flex-1">
          <p className="font-bold text-ink">
            <span className="sr-only">Stop {number}: </span>
            {stop.venue.name}
          </p>
          <p className="text-sm text-ink-soft">
            {stop.venue.address}, {stop.venue.city}
          </p>
          <p className="mt-1 flex flex-wrap items-center gap-x-2 font-semibold text-ink tabular-nums" data-testid="stop-times">
            <Clock aria-hidden className="size-4" />
            <span>
              {stop.serviceStart}–{stop.departure}
            </span>
            <span className="font-normal text-ink-soft">({formatMinutes(stop.onSiteMinutes)} on site)</span>
          </p>
          {stop.waitMinutes > 0 && (
            <p className="flex items-center gap-1 text-sm text-attention">
              <Hourglass aria-hidden className="size-4" />
              Arrives {stop.arrival}, waits {formatMinutes(stop.waitMinutes)} for opening
            </p>
          )}
          <p className="text-sm text-ink-soft">
            {formatMinutes(stop.travelMinutesFromPrevious)} · {formatKm(stop.kmFromPrevious, locale)} from{' '}
            {fromHome ? 'the start' : 'the previous stop'}
            {' · '}Open {stop.venue.openingHours}
          </p>
          <StopItems items={stop.items} />
          {children}
        </div>
        <button
          type="button"
          ref={setActivatorNodeRef}
          {...attributes}
          {...listeners}
          disabled={disabled}
          className="flex size-11 shrink-0 cursor-grab touch-none items-center justify-center rounded-md border border-paper-line text-ink-soft hover:bg-paper-dim disabled:cursor-not-allowed"
          aria-label={`Drag ${stop.venue.name} to reorder or to another technician`}
        >
          <GripVertical aria-hidden className="size-5" />
        </button>
      </div>
    </li>
  );
}

export function UnscheduledStopCard({ stop, children }: { stop: UnscheduledStop; children?: ReactNode }) {
  return (
    <li
      className="rounded-lg border border-attention bg-attention-tint/40 p-3"
      data-testid="unscheduled-stop"
      data-venue-id={stop.venue.id}
    >
      <p className="flex items-center gap-2 font-bold text-ink">
        <Wrench aria-hidden className="size-4" />
        {stop.venue.name}
      </p>
      <p className="mt-1 flex items-start gap-1 text-sm font-semibold text-attention">
        <AlertTriangle aria-hidden className="mt-0.5 size-4 shrink-0" />
        <span>Not on the route: {stop.reason}.</span>
      </p>
      <p className="text-sm text-ink-soft">
        Open {stop.venue.openingHours} · {formatMinutes(stop.onSiteMinutes)} on site
      </p>
      <StopItems items={stop.items} />
      {children}
    </li>
  );
}
