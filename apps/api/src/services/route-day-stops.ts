// The work planned for technicians on a date, as stops: each item (call, work order, bench job) with its time on
// site, grouped into one stop per venue (the venue the game stands at), per technician.
import { problemLabels, severities, type ProblemKind, type Severity } from '@bumperline/contracts/call-vocabulary';
import type { RouteStopItem, RouteVenue } from '@bumperline/contracts/route-days';
import type { PlannedItemRow } from '@bumperline/db/queries/route-days';
import type { OpeningHours } from '@bumperline/domain/travel/opening-window';

/**
 * Time on site for a service call, before anyone has looked at the game: our own estimate by severity (common
 * practice for a route, no published source) — a dead game often needs a board out; a cosmetic fault is quick.
 */
export const CALL_ON_SITE_MINUTES: Record<Severity, number> = { down: 60, fault: 45, cosmetic: 30 };
/** Time on site for a bench job done at the venue (a board's recap and reflow): our own estimate, common practice. */
export const BENCH_JOB_ON_SITE_MINUTES = 90;

export interface GatheredStop {
  venue: Omit<RouteVenue, 'openingHours'> & { openingHours: OpeningHours };
  items: RouteStopItem[];
  onSiteMinutes: number;
}

const kindRank = { service_call: 0, work_order: 1, bench_job: 2 } as const;

function itemOf(row: PlannedItemRow, day: string): RouteStopItem {
  const severity = row.severity as Severity | null;
  const onSiteMinutes =
    row.kind === 'service_call'
      ? CALL_ON_SITE_MINUTES[severity ?? 'fault']
      : row.kind === 'bench_job'
        ? BENCH_JOB_ON_SITE_MINUTES
        : (row.onSiteMinutes ?? 0);
  return {
    kind: row.kind,
    id: row.id,
    title: row.kind === 'service_call' ? problemLabels[row.problem as ProblemKind] : row.title,
    game: { id: row.gameId, serial: row.serial, modelTitle: row.modelTitle },
    state: row.state,
    severity,
    onSiteMinutes,
    version: row.version,
    carriedOverFrom: row.plannedOn !== null && row.plannedOn < day ? row.plannedOn : null,
  };
}

/** Calls first (game down first), then care-plan work, then bench jobs; oldest carried-over work first within a kind. */
function byUrgency(a: RouteStopItem, b: RouteStopItem): number {
  const severity = (i: RouteStopItem) => (i.severity ? severities.indexOf(i.severity) : 0);
  return (
    kindRank[a.kind] - kindRank[b.kind] ||
    severity(a) - severity(b) ||
    (a.carriedOverFrom ?? '9999').localeCompare(b.carriedOverFrom ?? '9999') ||
    a.title.localeCompare(b.title) ||
    a.id.localeCompare(b.id)
  );
}

/** Technician id → their stops (one per venue, venues by name until the plan orders them). */
export function gatherStops(rows: readonly PlannedItemRow[], day: string): Map<string, GatheredStop[]> {
  const byTechnician = new Map<string, Map<string, GatheredStop>>();
  for (const row of rows) {
    let stops = byTechnician.get(row.technicianId);
    if (!stops) byTechnician.set(row.technicianId, (stops = new Map()));
    let stop = stops.get(row.venueId);
    if (!stop) {
      stop = {
        venue: {
          id: row.venueId,
          name: row.venueName,
          address: row.address,
          city: row.city,
          lat: row.lat,
          lng: row.lng,
          openingHours: row.openingHours,
        },
        items: [],
        onSiteMinutes: 0,
      };
      stops.set(row.venueId, stop);
    }
    const item = itemOf(row, day);
    stop.items.push(item);
    stop.onSiteMinutes += item.onSiteMinutes;
  }
  const result = new Map<string, GatheredStop[]>();
  for (const [technicianId, stops] of byTechnician) {
    const list = [...stops.values()].sort((a, b) => a.venue.name.localeCompare(b.venue.name) || a.venue.id.localeCompare(b.venue.id));
    for (const stop of list) stop.items.sort(byUrgency);
    result.set(technicianId, list);
  }
  return result;
}
