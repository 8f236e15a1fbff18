// Route days: the work planned for technicians on a date (open calls, open work orders, bench jobs in progress —
// one query per kind for any number of technicians, each on its (tenant, technician, planned day) partial index),
// the kept stop order, and the moves of a stop's items to another technician or day.
import { and, eq, inArray, isNull, lte, or, sql } from 'drizzle-orm';
import { callStateGroups } from '@bumperline/contracts/calls';
import type { Tx } from '../client.ts';
import {
  benchJobs,
  boardInstances,
  gameModels,
  games,
  memberships,
  routeDays,
  serviceCalls,
  technicianProfiles,
  tenantSettings,
  tenants,
  users,
  venues,
  workOrders,
} from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';

/** The company's clock and driving speed in one statement. */
export async function getRouteDayContext(tx: Tx): Promise<{ timeZone: string; averageSpeedKmh: number }> {
  const [row] = await tx
    .select({ timeZone: tenants.timeZone, averageSpeedKmh: sql<number>`coalesce(${tenantSettings.averageSpeedKmh}, 35)` })
    .from(tenants)
    .leftJoin(tenantSettings, eq(tenantSettings.tenantId, tenants.id))
    .where(eq(tenants.id, currentTenant));
  return row ?? { timeZone: 'UTC', averageSpeedKmh: 35 };
}

/**
 * The company's active technicians (one without a profile yet is active, with the default day), by name, each with
 * their day's kept order and version when someone changed that day (the route_days row, by its primary key).
 */
export async function listRouteTechnicians(tx: Tx, p: { day: string; onlyUserId?: string }) {
  return tx
    .select({
      id: users.id,
      name: users.name,
      homeLatitude: technicianProfiles.homeLatitude,
      homeLongitude: technicianProfiles.homeLongitude,
      dayStart: sql<string>`coalesce(${technicianProfiles.dayStart}, '08:00')`,
      dayEnd: sql<string>`coalesce(${technicianProfiles.dayEnd}, '17:00')`,
      stopOrder: routeDays.stopOrder,
      version: routeDays.version,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(technicianProfiles, and(eq(technicianProfiles.tenantId, memberships.tenantId), eq(technicianProfiles.userId, users.id)))
    .leftJoin(routeDays, and(eq(routeDays.tenantId, memberships.tenantId), eq(routeDays.technicianId, users.id), eq(routeDays.day, p.day)))
    .where(
      and(
        eq(memberships.tenantId, currentTenant),
        eq(memberships.role, 'technician'),
        sql`coalesce(${technicianProfiles.active}, true)`,
        p.onlyUserId ? eq(memberships.userId, p.onlyUserId) : undefined,
      ),
    )
    .orderBy(users.name, users.id);
}
export type RouteTechnician = Awaited<ReturnType<typeof listRouteTechnicians>>[number];

const gameAndVenue = {
  gameId: games.id,
  serial: games.serial,
  modelTitle: gameModels.title,
  venueId: venues.id,
  venueName: venues.name,
  address: venues.addressLine,
  city: venues.city,
  lat: venues.latitude,
  lng: venues.longitude,
  openingHours: venues.openingHours,
};

/** What a stop is made of, whatever its kind; venue columns repeat per item (a day has tens of items). */
export interface PlannedItemRow {
  kind: 'service_call' | 'work_order' | 'bench_job';
  id: string;
  technicianId: string;
  plannedOn: string | null;
  state: string;
  version: number;
  /** A call's problem and severity; null for other kinds. */
  problem: string | null;
  severity: string | null;
  /** A work order's title or a bench job's template name; '' for calls (their title is the problem in words). */
  title: string;
  /** A work order's time on site; null for the kinds estimated by the service. */
  onSiteMinutes: number | null;
  gameId: string;
  serial: string;
  modelTitle: string;
  venueId: string;
  venueName: string;
  address: string;
  city: string;
  lat: number;
  lng: number;
  openingHours: typeof venues.$inferSelect.openingHours;
}

export interface PlannedItemsFilter {
  technicianIds: readonly string[];
  day: string;
  /** The day is the company's today: calls without a day and work orders planned earlier and still open land on it. */
  isToday: boolean;
}

/**
 * Open calls of these technicians planned on the day (or on no day, when the day is today). The state list is
 * written as literals so the planner can prove the partial index's condition (service_calls_tenant_tech_open_idx).
 */
async function plannedCalls(tx: Tx, f: PlannedItemsFilter): Promise<PlannedItemRow[]> {
  const unfixed = sql.raw(callStateGroups.unfixed.map((s) => `'${s}'`).join(', '));
  const rows = await tx
    .select({
      id: serviceCalls.id,
      technicianId: sql<string>`${serviceCalls.technicianId}`,
      plannedOn: serviceCalls.plannedOn,
      state: serviceCalls.state,
      version: serviceCalls.version,
      problem: serviceCalls.problem,
      severity: serviceCalls.severity,
      ...gameAndVenue,
    })
    .from(serviceCalls)
    .innerJoin(games, and(eq(games.tenantId, serviceCalls.tenantId), eq(games.id, serviceCalls.gameId)))
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .innerJoin(venues, and(eq(venues.tenantId, games.tenantId), eq(venues.id, games.venueId)))
    .where(
      and(
        eq(serviceCalls.tenantId, currentTenant),
        inArray(serviceCalls.technicianId, [...f.technicianIds]),
        sql`${serviceCalls.state} in (${unfixed})`,
        f.isToday ? or(eq(serviceCalls.plannedOn, f.day), isNull(serviceCalls.plannedOn)) : eq(serviceCalls.plannedOn, f.day),
      ),
    );
  return rows.map((r) => ({ kind: 'service_call', title: '', onSiteMinutes: null, ...r }));
}

/** Open work orders of these technicians planned on the day, or (today) on an earlier day and still open. */
async function plannedWorkOrders(tx: Tx, f: PlannedItemsFilter): Promise<PlannedItemRow[]> {
  const rows = await tx
    .select({
      id: workOrders.id,
      technicianId: sql<string>`${workOrders.technicianId}`,
      plannedOn: workOrders.plannedOn,
      state: workOrders.state,
      version: workOrders.version,
      title: workOrders.title,
      onSiteMinutes: workOrders.onSiteMinutes,
      ...gameAndVenue,
    })
    .from(workOrders)
    .innerJoin(games, and(eq(games.tenantId, workOrders.tenantId), eq(games.id, workOrders.gameId)))
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .innerJoin(venues, and(eq(venues.tenantId, games.tenantId), eq(venues.id, games.venueId)))
    .where(
      and(
        eq(workOrders.tenantId, currentTenant),
        inArray(workOrders.technicianId, [...f.technicianIds]),
        sql`${workOrders.state} = 'open'`,
        f.isToday ? lte(workOrders.plannedOn, f.day) : eq(workOrders.plannedOn, f.day),
      ),
    );
  return rows.map((r) => ({ kind: 'work_order', problem: null, severity: null, ...r }));
}

/** Bench jobs in progress of these technicians planned on the day, at the venue of the game their board is in. */
async function plannedBenchJobs(tx: Tx, f: PlannedItemsFilter): Promise<PlannedItemRow[]> {
  const rows = await tx
    .select({
      id: benchJobs.id,
      technicianId: sql<string>`${benchJobs.technicianId}`,
      plannedOn: benchJobs.plannedOn,
      state: benchJobs.state,
      version: benchJobs.version,
      title: benchJobs.templateName,
      ...gameAndVenue,
    })
    .from(benchJobs)
    .innerJoin(boardInstances, and(eq(boardInstances.tenantId, benchJobs.tenantId), eq(boardInstances.id, benchJobs.boardInstanceId)))
    .innerJoin(games, and(eq(games.tenantId, boardInstances.tenantId), eq(games.id, boardInstances.gameId)))
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .innerJoin(venues, and(eq(venues.tenantId, games.tenantId), eq(venues.id, games.venueId)))
    .where(
      and(
        eq(benchJobs.tenantId, currentTenant),
        inArray(benchJobs.technicianId, [...f.technicianIds]),
        sql`${benchJobs.state} = 'in_progress' and ${benchJobs.technicianId} is not null`,
        eq(benchJobs.plannedOn, f.day),
      ),
    );
  return rows.map((r) => ({ kind: 'bench_job', problem: null, severity: null, onSiteMinutes: null, ...r }));
}

/** Every item planned for these technicians on the day: three statements, whatever the number of technicians. */
export async function listPlannedItems(tx: Tx, f: PlannedItemsFilter): Promise<PlannedItemRow[]> {
  if (f.technicianIds.length === 0) return [];
  const [calls, orders, jobs] = [await plannedCalls(tx, f), await plannedWorkOrders(tx, f), await plannedBenchJobs(tx, f)];
  return [...calls, ...orders, ...jobs];
}

/**
 * Changes a technician's day at `version` (0: the day has no row yet): keeps `stopOrder` when given (empty = the
 * planner's order), and moves the version on either way, so a change made from the day as it was is turned away.
 * The new version, or undefined when the day moved on first.
 */
export async function saveRouteDay(
  tx: Tx,
  p: { technicianId: string; day: string; version: number; userId: string | null; stopOrder?: readonly string[] },
): Promise<number | undefined> {
  if (p.version === 0) {
    const [created] = await tx
      .insert(routeDays)
      .values({
        tenantId: sql`${currentTenant}`,
        technicianId: p.technicianId,
        day: p.day,
        stopOrder: [...(p.stopOrder ?? [])],
        updatedBy: p.userId,
      })
      .onConflictDoNothing()
      .returning({ version: routeDays.version });
    return created?.version;
  }
  const [updated] = await tx
    .update(routeDays)
    .set({
      ...(p.stopOrder ? { stopOrder: [...p.stopOrder] } : {}),
      version: sql`${routeDays.version} + 1`,
      updatedAt: new Date(),
      updatedBy: p.userId,
    })
    .where(
      and(
        eq(routeDays.tenantId, currentTenant),
        eq(routeDays.technicianId, p.technicianId),
        eq(routeDays.day, p.day),
        eq(routeDays.version, p.version),
      ),
    )
    .returning({ version: routeDays.version });
  return updated?.version;
}

/** Marks a day changed whatever its version (a stop arrived on it): made if it had no row, else its version moves on. */
export async function touchRouteDay(tx: Tx, p: { technicianId: string; day: string; userId: string | null }) {
  await tx
    .insert(routeDays)
    .values({ tenantId: sql`${currentTenant}`, technicianId: p.technicianId, day: p.day, updatedBy: p.userId })
    .onConflictDoUpdate({
      target: [routeDays.tenantId, routeDays.technicianId, routeDays.day],
      set: { version: sql`${routeDays.version} + 1`, updatedAt: new Date(), updatedBy: p.userId },
    });
}

/** Moves open work orders to a technician and day; each moves its version on. */
export async function moveWorkOrders(tx: Tx, ids: readonly string[], to: { technicianId: string; day: string }) {
  if (ids.length === 0) return [];
  return tx
    .update(workOrders)
    .set({ technicianId: to.technicianId, plannedOn: to.day, version: sql`${workOrders.version} + 1`, updatedAt: new Date() })
    .where(and(eq(workOrders.tenantId, currentTenant), inArray(workOrders.id, [...ids]), sql`${workOrders.state} = 'open'`))
    .returning({ id: workOrders.id });
}

/** Moves bench jobs in progress to a technician and day; each moves its version on. */
export async function moveBenchJobs(tx: Tx, ids: readonly string[], to: { technicianId: string; day: string }) {
  if (ids.length === 0) return [];
  return tx
    .update(benchJobs)
    .set({ technicianId: to.technicianId, plannedOn: to.day, version: sql`${benchJobs.version} + 1`, updatedAt: new Date() })
    .where(and(eq(benchJobs.tenantId, currentTenant), inArray(benchJobs.id, [...ids]), sql`${benchJobs.state} = 'in_progress'`))
    .returning({ id: benchJobs.id });
}

/** Is this person an active technician of the company (a move's destination)? */
export async function isActiveTechnician(tx: Tx, userId: string): Promise<boolean> {
  const [row] = await tx
    .select({ id: memberships.userId })
    .from(memberships)
    .leftJoin(
      technicianProfiles,
      and(eq(technicianProfiles.tenantId, memberships.tenantId), eq(technicianProfiles.userId, memberships.userId)),
    )
    .where(
      and(
        eq(memberships.tenantId, currentTenant),
        eq(memberships.userId, userId),
        eq(memberships.role, 'technician'),
        sql`coalesce(${technicianProfiles.active}, true)`,
      ),
    );
  return row !== undefined;
}
