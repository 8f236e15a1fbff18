// The day as the technician left it: the saved day with their queued changes laid over it, so a work order marked
// done offline shows done (and "not sent yet") instead of still to do.
import type { RouteDay, RouteStopItem } from '@bumperline/contracts/route-days';
import type { QueuedChange } from '../../lib/queued-change.ts';

export interface ItemView extends RouteStopItem {
  /** The state the technician's queued change will give it, until the office has it. */
  pendingState: string | null;
  /** A queued move to another day ("2026-12-04"). */
  pendingMoveTo: string | null;
}

function overlayItem(item: RouteStopItem, pending: readonly QueuedChange[]): ItemView {
  let pendingState: string | null = null;
  let pendingMoveTo: string | null = null;
  for (const c of pending) {
    if (item.kind === 'work_order' && 'workOrderId' in c && c.workOrderId === item.id) {
      if (c.kind === 'work-order-done') pendingState = 'done';
      if (c.kind === 'work-order-skip') pendingState = 'skipped';
      if (c.kind === 'work-order-move') pendingMoveTo = c.plannedOn;
    }
    if (item.kind === 'service_call' && c.kind === 'call-transition' && c.callId === item.id) pendingState = c.to;
  }
  return { ...item, pendingState, pendingMoveTo };
}

export function overlayStopItems(items: readonly RouteStopItem[], pending: readonly QueuedChange[]): ItemView[] {
  return items.map((i) => overlayItem(i, pending));
}

/** What is still to do at a stop (for the list's "2 of 3 to do"), counting queued changes as done. */
export function openCount(items: readonly ItemView[]): number {
  const closed = new Set(['done', 'skipped', 'fixed', 'closed', 'cancelled', 'finished']);
  return items.filter((i) => !closed.has(i.pendingState ?? i.state) && !i.pendingMoveTo).length;
}

/** The stop for a venue on the saved day, scheduled or not. */
export function stopOf(day: RouteDay | undefined, venueId: string) {
  if (!day) return undefined;
  const i = day.stops.findIndex((s) => s.venue.id === venueId);
  if (i >= 0) return { number: i + 1, stop: day.stops[i]!, scheduled: true as const };
  const u = day.unscheduled.find((s) => s.venue.id === venueId);
  return u ? { number: null, stop: u, scheduled: false as const } : undefined;
}
