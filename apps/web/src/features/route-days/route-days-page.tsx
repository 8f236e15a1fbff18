// Route days, for the office: every active technician's day for a date side by side, with their routes on one map.
// Drag a stop within a column to fix the order (the day re-plans its times around it), or onto another column to
// give it to that technician; "Move to…" does the same from the keyboard and to another day.
import {
  closestCorners,
  DndContext,
  KeyboardSensor,
  PointerSensor,
  useSensor,
  useSensors,
  type DragEndEvent,
  type UniqueIdentifier,
} from '@dnd-kit/core';
import { arrayMove, sortableKeyboardCoordinates } from '@dnd-kit/sortable';
import { useQueryClient } from '@tanstack/react-query';
import { AlertTriangle, CalendarDays, CheckCircle2, ChevronLeft, ChevronRight, RefreshCw } from 'lucide-react';
import { lazy, Suspense, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { RouteDay } from '@bumperline/contracts/route-days';
import { useLocaleSettings } from '../../api/me.ts';
import { routeDayKeys, useKeepRouteOrder, useMoveStop, useResetRouteOrder, useRouteDayBoard } from '../../api/route-days.ts';
import { useSettings } from '../../api/settings.ts';
import { PageHeader } from '../../components/page-header.tsx';
import { routeStyle } from '../../components/route-styles.ts';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { ApiError } from '../../lib/api-client.ts';
import { formatDate } from '../../lib/format.ts';
import { dayFromSearch } from './route-days-queries.ts';
import { TechnicianColumn } from './technician-column.tsx';
import { shiftDay } from './words.ts';

const RouteDaysMap = lazy(() => import('../../components/route-days-map.tsx'));

function parseDragId(id: UniqueIdentifier): { technicianId: string; venueId?: string } | null {
  const [kind, technicianId, venueId] = String(id).split(':');
  if (!technicianId) return null;
  if (kind === 'stop' && venueId) return { technicianId, venueId };
  if (kind === 'column') return { technicianId };
  return null;
}

export function RouteDaysPage() {
  const [params, setParams] = useSearchParams();
  const requested = dayFromSearch(params);
  const board = useRouteDayBoard(requested || undefined);
  const settings = useSettings();
  const localeSettings = useLocaleSettings();
  const qc = useQueryClient();
  const keep = useKeepRouteOrder();
  const reset = useResetRouteOrder();
  const move = useMoveStop();
  const [saved, setSaved] = useState('');
  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 6 } }),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );

  const day = board.data?.day ?? requested;
  const days = useMemo(() => board.data?.days ?? [], [board.data]);
  const styles = useMemo(() => new Map(days.map((d, i) => [d.technician.id, routeStyle(i)])), [days]);
  const technicians = days.map((d) => ({ id: d.technician.id, name: d.technician.name, letter: styles.get(d.technician.id)!.letter }));
  const busy = keep.isPending || reset.isPending || move.isPending;
  const failure = [keep, reset, move].find((m) => m.isError)?.error;

  const setDay = (next: string) => {
    for (const m of [keep, reset, move]) m.reset();
    setSaved('');
    setParams(next ? { day: next } : {});
  };
  const announce = (text: string) => setSaved(text);
  const dayOf = (technicianId: string): RouteDay | undefined => days.find((d) => d.technician.id === technicianId);

  const moveStop = (from: RouteDay, venueId: string, toTechnicianId: string, toDay: string) => {
    const venue = [...from.stops, ...from.unscheduled].find((s) => s.venue.id === venueId)?.venue.name ?? 'The stop';
    const toName = dayOf(toTechnicianId)?.technician.name ?? 'the technician';
    move.mutate(
      { technicianId: from.technician.id, day: from.day, venueId, toTechnicianId, toDay, version: from.version },
      { onSuccess: () => announce(`${venue} moved to ${toName}${toDay !== from.day ? ` on ${formatDate(toDay, localeSettings)}` : ''}.`) },
    );
  };

  const onDragEnd = ({ active, over }: DragEndEvent) => {
    const from = parseDragId(active.id);
    const target = over ? parseDragId(over.id) : null;
    if (!from?.venueId || !target) return;
    const source = dayOf(from.technicianId);
    if (!source) return;
    if (target.technicianId !== from.technicianId) {
      moveStop(source, from.venueId, target.technicianId, source.day);
      return;
    }
    if (!target.venueId || target.venueId === from.venueId) return;
    const ids = source.stops.map((s) => s.venue.id);
    const venueIds = arrayMove(ids, ids.indexOf(from.venueId), ids.indexOf(target.venueId));
    keep.mutate(
      { technicianId: source.technician.id, day: source.day, venueIds, version: source.version },
      { onSuccess: () => announce(`${source.technician.name}’s order is kept and the times re-planned.`) },
    );
  };

  const stale = failure instanceof ApiError && failure.status === 409;
  return (
    <div>
      <PageHeader
        title="Route days"
        subtitle={
          board.data
            ? `${formatDate(day, localeSettings)}${day === board.data.today ? ' (today)' : ''} · times in ${board.data.timeZone.replace(/_/g, ' ')}`
            : 'Every technician’s stops for a date'
        }
        actions={
          <div className="flex flex-wrap items-end gap-2">
            <button type="button" className="btn-secondary" onClick={() => day && setDay(shiftDay(day, -1))} disabled={!day}>
              <ChevronLeft aria-hidden className="size-4" /> Previous day
            </button>
            <label className="flex flex-col text-sm font-semibold text-ink">
              <span className="flex items-center gap-1">
                <CalendarDays aria-hidden className="size-4" /> Date
              </span>
              <input
                type="date"
                value={day}
                onChange={(e) => setDay(e.target.value)}
                className="min-h-11 rounded-md border border-ink-muted bg-white px-2 font-normal"
              />
            </label>
            <button type="button" className="btn-secondary" onClick={() => day && setDay(shiftDay(day, 1))} disabled={!day}>
              Next day <ChevronRight aria-hidden className="size-4" />
            </button>
            {board.data && day !== board.data.today && (
              <button type="button" className="btn-secondary" onClick={() => setDay('')}>
                Today
              </button>
            )}
          </div>
        }
      />

      <div aria-live="polite" className="min-h-0">
        {failure ? (
          <div role="alert" className="mb-4 flex flex-wrap items-center gap-3 rounded-lg border border-down bg-down-tint p-3 text-down">
            <AlertTriangle aria-hidden className="size-5 shrink-0" />
            <span className="font-semibold">
              {stale
                ? 'Someone changed this day while you were working on it. It now shows the latest; make your change again if it is still needed.'
                : `The change was not saved: ${failure.message} The day is shown as it was.`}
            </span>
            <button type="button" className="btn-secondary" onClick={() => qc.invalidateQueries({ queryKey: routeDayKeys.all })}>
              <RefreshCw aria-hidden className="size-4" /> Reload
            </button>
          </div>
        ) : saved ? (
          <p className="mb-4 flex items-center gap-2 font-semibold text-running">
            <CheckCircle2 aria-hidden className="size-5" /> {saved}
          </p>
        ) : null}
      </div>

      {board.isLoading ? (
        <Loading label="Planning the day…" />
      ) : board.isError ? (
        <ErrorState error={board.error} onRetry={() => board.refetch()} />
      ) : days.length === 0 ? (
        <Empty title="No active technicians">Invite technicians from Team to plan their route days.</Empty>
      ) : (
        <div className="flex flex-col gap-4">
          <Suspense fallback={<Loading label="Loading the map…" />}>
            <RouteDaysMap
              tileUrl={settings.data?.mapTileUrl ?? ''}
              label={`Map of every technician’s route on ${formatDate(day, localeSettings)}`}
              routes={days.map((d) => ({
                key: d.technician.id,
                name: d.technician.name,
                style: styles.get(d.technician.id)!,
                start: d.technician.startPoint ? [d.technician.startPoint.lat, d.technician.startPoint.lng] : null,
                stops: d.stops.map((s) => ({ id: s.venue.id, lat: s.venue.lat, lng: s.venue.lng, title: s.venue.name, time: s.arrival })),
              }))}
            />
          </Suspense>
          {days.every((d) => d.stops.length === 0 && d.unscheduled.length === 0) && (
            <p className="text-ink-soft">Nothing is planned for anyone on this day yet.</p>
          )}
          <DndContext sensors={sensors} collisionDetection={closestCorners} onDragEnd={onDragEnd}>
            <div className="flex gap-4 overflow-x-auto pb-4" data-testid="route-columns">
              {days.map((d) => (
                <TechnicianColumn
                  key={d.technician.id}
                  day={d}
                  style={styles.get(d.technician.id)!}
                  technicians={technicians}
                  locale={localeSettings?.locale}
                  busy={busy}
                  onReset={() =>
                    reset.mutate(
                      { technicianId: d.technician.id, day: d.day, version: d.version },
                      { onSuccess: () => announce(`${d.technician.name}’s day is back in the planner’s order.`) },
                    )
                  }
                  onMove={(venueId, to, toDay) => moveStop(d, venueId, to, toDay)}
                />
              ))}
            </div>
          </DndContext>
        </div>
      )}
    </div>
  );
}
