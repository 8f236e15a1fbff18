// One technician's day as a column: who, when they leave and are back, the totals, the order in force (the
// planner's, or the one kept by the office, with the way back to the planner's), the stops to drag, and the stops
// that could not be fitted with the reason in words.
import { useDroppable } from '@dnd-kit/core';
import { SortableContext, verticalListSortingStrategy } from '@dnd-kit/sortable';
import { Home, ListRestart, Route } from 'lucide-react';
import type { RouteDay } from '@bumperline/contracts/route-days';
import type { RouteStyle } from '../../components/route-styles.ts';
import { MoveStopForm } from './move-stop-form.tsx';
import { SortableStopCard, StopBadge, UnscheduledStopCard } from './stop-card.tsx';
import { formatMinutes } from '../../lib/duration-entry.ts';
import { formatKm } from './words.ts';

export const stopDragId = (technicianId: string, venueId: string) => `stop:${technicianId}:${venueId}`;
export const columnDropId = (technicianId: string) => `column:${technicianId}`;

interface Props {
  day: RouteDay;
  style: RouteStyle;
  technicians: { id: string; name: string; letter: string }[];
  locale: string | undefined;
  busy: boolean;
  onReset: () => void;
  onMove: (venueId: string, toTechnicianId: string, toDay: string) => void;
}

export function TechnicianColumn({ day, style, technicians, locale, busy, onReset, onMove }: Props) {
  const technicianId = day.technician.id;
  const { setNodeRef, isOver } = useDroppable({ id: columnDropId(technicianId) });
  const ids = day.stops.map((s) => stopDragId(technicianId, s.venue.id));
  const headingId = `route-${technicianId}`;
  return (
    <section
      aria-labelledby={headingId}
      className={`flex w-[22rem] shrink-0 flex-col gap-3 rounded-xl border-2 bg-paper-dim p-3 ${isOver ? 'border-brass' : 'border-transparent'}`}
      data-testid="technician-column"
      data-technician-id={technicianId}
    >
      <header className="flex flex-col gap-1">
        <h2 id={headingId} className="flex items-center gap-2 text-lg font-extrabold text-ink">
          <StopBadge style={style} label={style.letter} />
          {day.technician.name}
        </h2>
        <p className="flex items-center gap-1 text-sm text-ink-soft">
          <svg aria-hidden width="36" height="8" className="shrink-0">
            <line x1="0" y1="4" x2="36" y2="4" stroke={style.colour} strokeWidth="4" strokeDasharray={style.dash || undefined} />
          </svg>
          <span>
            Route {style.letter} on the map: {style.patternName}
          </span>
        </p>
        <p className="flex items-center gap-1 text-sm text-ink tabular-nums">
          <Home aria-hidden className="size-4" />
          {day.technician.startPoint
            ? `Leaves ${day.leaveTime}, back by ${day.returnTime} (day ${day.technician.dayStart}–${day.technician.dayEnd})`
            : `No home location recorded: the day starts at the first stop, ${day.stops[0]?.arrival ?? day.technician.dayStart}`}
        </p>
        <p className="flex items-center gap-1 text-sm text-ink-soft tabular-nums" data-testid="column-totals">
          <Route aria-hidden className="size-4" />
          {day.stops.length} {day.stops.length === 1 ? 'stop' : 'stops'} · {formatMinutes(day.totals.travelMinutes)} driving ·{' '}
          {formatKm(day.totals.km, locale)} · {formatMinutes(day.totals.onSiteMinutes)} on site
        </p>
        <div className="flex flex-wrap items-center gap-2 text-sm">
          <span className="font-semibold text-ink" data-testid="order-kind">
            {day.orderKind === 'kept' ? 'Order kept by the office' : 'Planner’s order'}
          </span>
          {day.orderKind === 'kept' && (
            <button type="button" className="btn-secondary min-h-11 px-3 py-1 text-sm" onClick={onReset} disabled={busy}>
              <ListRestart aria-hidden className="size-4" /> Use the planner’s order
            </button>
          )}
        </div>
      </header>

      <SortableContext id={columnDropId(technicianId)} items={ids} strategy={verticalListSortingStrategy}>
        <ol ref={setNodeRef} className="flex min-h-24 flex-col gap-2" aria-label={`${day.technician.name}’s stops in driving order`}>
          {day.stops.map((stop, i) => (
            <SortableStopCard
              key={stop.venue.id}
              id={ids[i]!}
              stop={stop}
              number={i + 1}
              style={style}
              fromHome={i === 0}
              locale={locale}
              disabled={busy}
            >
              <MoveStopForm
                venueName={stop.venue.name}
                technicians={technicians}
                fromTechnicianId={technicianId}
                day={day.day}
                pending={busy}
                onMove={(to, toDay) => onMove(stop.venue.id, to, toDay)}
              />
            </SortableStopCard>
          ))}
          {day.stops.length === 0 && (
            <li className="list-none rounded-lg border-2 border-dashed border-paper-line p-4 text-center text-sm text-ink-soft">
              No stops this day. Drag a stop here to give it to {day.technician.name}.
            </li>
          )}
        </ol>
      </SortableContext>

      {day.unscheduled.length > 0 && (
        <div>
          <h3 className="text-sm font-extrabold text-ink">Could not be fitted ({day.unscheduled.length})</h3>
          <ul className="mt-2 flex flex-col gap-2">
            {day.unscheduled.map((stop) => (
              <UnscheduledStopCard key={stop.venue.id} stop={stop}>
                <MoveStopForm
                  venueName={stop.venue.name}
                  technicians={technicians}
                  fromTechnicianId={technicianId}
                  day={day.day}
                  pending={busy}
                  onMove={(to, toDay) => onMove(stop.venue.id, to, toDay)}
                />
              </UnscheduledStopCard>
            ))}
          </ul>
        </div>
      )}
    </section>
  );
}
