// The demo's route days, ready to work: each technician has four to eight stops today and a few on each of the
// next days — open care-plan work at venues (overdue first), their assigned service calls (a few today, the rest
// on the next days), and the bench job left part-way planned for tomorrow. One technician's tomorrow has a stop
// order the dispatcher fixed by hand. "Today" is the company's calendar date when the seed runs.
import { and, eq, inArray, isNotNull } from 'drizzle-orm';
import { callStateGroups } from '@bumperline/contracts/calls';
import { epochDayFromParts, formatPlainDate } from '@bumperline/domain/plain-date';
import { wallTimeAt } from '@bumperline/domain/schedules/zoned-time';
import type { Tx } from '../client.ts';
import { benchJobs, boardInstances, games, routeDays, serviceCalls, users } from '../schema/index.ts';
import type { PlanGameWork } from './care-plans.ts';
import { demoCompany } from './scenario.ts';

export interface DemoTechnician {
  id: string;
  email: string;
  skills: string[];
}

/** Venues a technician visits per day, today first: enough for a full day without a rush. */
const DAY_CAPACITY = [6, 5, 5, 4];
/** The stops the seed makes sure of, per technician, today and on each of the next days. */
const DAY_AT_LEAST = [5, 4, 3, 3];
/** Of a technician's assigned calls, at most this many venues are today; the rest wait for the next days. */
const CALL_VENUES_TODAY = 3;

/** The company's calendar date at `at`, and `days` after it. */
export function companyDate(at: number, days = 0): string {
  const wall = wallTimeAt(at, demoCompany.timeZone);
  return formatPlainDate(epochDayFromParts(wall.year, wall.month, wall.day) + days);
}

/** Plans the open work orders into technicians' days (in memory: the caller inserts them) and the calls and bench job in place. */
export async function planRouteDays(
  tx: Tx,
  p: { tenantId: string; now: number; works: PlanGameWork[]; technicians: DemoTechnician[]; rand: () => number },
): Promise<void> {
  const { tenantId, now, works, technicians, rand } = p;
  const days = DAY_CAPACITY.map((_, d) => companyDate(now, d));
  const dayVenues = new Map(technicians.map((t) => [t.id, DAY_CAPACITY.map(() => new Set<string>())]));

  // Assigned open calls: a few venues today, the rest spread over the next two days.
  const calls = await tx
    .select({ id: serviceCalls.id, venueId: serviceCalls.venueId, technicianId: serviceCalls.technicianId })
    .from(serviceCalls)
    .where(
      and(
        eq(serviceCalls.tenantId, tenantId),
        inArray(serviceCalls.state, [...callStateGroups.open]),
        isNotNull(serviceCalls.technicianId),
        isNotNull(serviceCalls.venueId),
      ),
    );
  for (const call of calls) {
    const planned = dayVenues.get(call.technicianId!);
    if (!planned) continue;
    const venue = call.venueId!;
    const day = planned[0]!.has(venue) || planned[0]!.size < CALL_VENUES_TODAY ? 0 : planned[1]!.size <= planned[2]!.size ? 1 : 2;
    planned[day]!.add(venue);
    await tx
      .update(serviceCalls)
      .set({ plannedOn: days[day]! })
      .where(and(eq(serviceCalls.tenantId, tenantId), eq(serviceCalls.id, call.id)));
  }

  const eligible = (work: PlanGameWork) => {
    const able = technicians.filter((t) => work.plan.skills.every((s) => t.skills.includes(s)));
    return able.find((t) => t.id === work.plan.technicianId) ?? able[0];
  };
  const openOf = (work: PlanGameWork) => work.orders.find((o) => o.state === 'open');
  const place = (work: PlanGameWork, techId: string, day: number) => {
    const order = openOf(work)!;
    order.technicianId = techId;
    order.plannedOn = days[day]!;
    dayVenues.get(techId)![day]!.add(work.game.venueId!);
  };

  // Open work, most overdue first, into the first day with room (or already going to that venue).
  const open = works.filter((w) => openOf(w) && w.game.venueId).sort((a, b) => openOf(a)!.dueAt!.getTime() - openOf(b)!.dueAt!.getTime());
  for (const work of open) {
    const tech = eligible(work);
    if (!tech) continue;
    const order = openOf(work)!;
    order.technicianId = tech.id;
    // Some work due later in the week is left for the dispatcher to plan.
    if (order.dueAt!.getTime() > now + 3 * 24 * 3600_000 && rand() < 0.5) continue;
    const planned = dayVenues.get(tech.id)!;
    const day = planned.findIndex((venues, d) => venues.has(work.game.venueId!) || venues.size < DAY_CAPACITY[d]!);
    if (day >= 0) place(work, tech.id, day);
  }

  // Enough stops each day for each technician: work that slipped (in the last four months) at venues nobody is
  // going to yet, their own plans' first, then any they have the skills for.
  for (const [day, wanted] of DAY_AT_LEAST.entries()) {
    for (const tech of technicians) {
      const planned = dayVenues.get(tech.id)!;
      const able = (w: PlanGameWork) => w.plan.skills.every((s) => tech.skills.includes(s));
      const candidates = works
        .filter((w) => !openOf(w) && w.game.venueId && able(w))
        .sort((a, b) => Number(b.plan.technicianId === tech.id) - Number(a.plan.technicianId === tech.id));
      for (const work of candidates) {
        if (planned[day]!.size >= wanted) break;
        if (technicians.some((t) => dayVenues.get(t.id)!.some((venues) => venues.has(work.game.venueId!)))) continue;
        if (work.makeOverdue(120)) place(work, tech.id, day);
      }
    }
  }

  // The bench job left part-way goes back on the repair technician's route tomorrow, at its game's venue.
  const recapTech = technicians.find((t) => t.skills.includes('recap'));
  const [job] = await tx
    .select({ id: benchJobs.id, venueId: games.venueId })
    .from(benchJobs)
    .innerJoin(boardInstances, and(eq(boardInstances.tenantId, benchJobs.tenantId), eq(boardInstances.id, benchJobs.boardInstanceId)))
    .innerJoin(games, and(eq(games.tenantId, boardInstances.tenantId), eq(games.id, boardInstances.gameId)))
    .where(and(eq(benchJobs.tenantId, tenantId), eq(benchJobs.state, 'in_progress')));
  if (job?.venueId && recapTech) {
    await tx
      .update(benchJobs)
      .set({ technicianId: recapTech.id, plannedOn: days[1]! })
      .where(and(eq(benchJobs.tenantId, tenantId), eq(benchJobs.id, job.id)));
    dayVenues.get(recapTech.id)![1]!.add(job.venueId);
  }

  // The dispatcher put one technician's tomorrow in an order of their own (the last stop first).
  const [dispatcher] = await tx.select({ id: users.id }).from(users).where(eq(users.email, 'dispatch@lakeshore.example'));
  const busiest = technicians
    .map((t) => ({ id: t.id, venues: [...dayVenues.get(t.id)![1]!] }))
    .sort((a, b) => b.venues.length - a.venues.length)[0];
  if (busiest && busiest.venues.length >= 2) {
    await tx.insert(routeDays).values({
      tenantId,
      technicianId: busiest.id,
      day: days[1]!,
      stopOrder: busiest.venues.reverse(),
      version: 2,
      updatedBy: dispatcher?.id ?? null,
    });
  }
}
