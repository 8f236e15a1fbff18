// Work-order queries: lists by due date (open work, or a game's history), one order, the exactly-once insert the
// care-plan run relies on, versioned changes, and what the run needs from a plan's past work.
import { and, eq, inArray, isNotNull, isNull, ne, sql, type SQL } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { games, workOrders } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { decodeCursor, keysetOrder, keysetWhere, toPage, type SortKey } from './keyset.ts';
import { updateAtVersion } from './versioned-update.ts';
import { escapeLike } from './venues.ts';

const like = (q: string) => `%${escapeLike(q)}%`;

type WorkOrderState = (typeof workOrders.$inferSelect)['state'];
export type DueStateName = 'overdue' | 'due_soon' | 'later';

const dueKey: SortKey = { expr: sql`${workOrders.dueAt}`, type: 'timestamptz' };

const leadDaysOfPlan = sql`(select p.lead_days from care_plans p where p.tenant_id = work_orders.tenant_id and p.id = work_orders.care_plan_id)`;

/**
 * The first moment that is no longer "due soon": the start of the local day `lead` days after today, in the company's
 * zone (due soon = due from now until the end of the lead's last local day).
 */
function dueSoonEnd(now: Date, timeZone: string): SQL {
  return sql`(((${now}::timestamptz at time zone ${timeZone})::date + ${leadDaysOfPlan} + 1)::timestamp at time zone ${timeZone})`;
}

function dueStateExpr(now: Date, timeZone: string): SQL<DueStateName | null> {
  return sql<DueStateName | null>`case when ${workOrders.state} <> 'open' then null when ${workOrders.dueAt} <= ${now} then 'overdue' when ${workOrders.dueAt} < ${dueSoonEnd(now, timeZone)} then 'due_soon' else 'later' end`;
}

function orderColumns(now: Date, timeZone: string) {
  return {
    id: workOrders.id,
    carePlanId: workOrders.carePlanId,
    carePlanName: sql<string>`(select p.name from care_plans p where p.tenant_id = work_orders.tenant_id and p.id = work_orders.care_plan_id)`,
    title: workOrders.title,
    game: sql<{
      id: string;
      serial: string;
      modelTitle: string;
      venue: { id: string; name: string } | null;
    }>`(select json_build_object('id', g.id, 'serial', g.serial, 'modelTitle', m.title, 'venue', case when v.id is null then null else json_build_object('id', v.id, 'name', v.name) end) from games g join game_models m on m.tenant_id = g.tenant_id and m.id = g.model_id left join venues v on v.tenant_id = g.tenant_id and v.id = g.venue_id where g.tenant_id = work_orders.tenant_id and g.id = work_orders.game_id)`,
    gameId: workOrders.gameId,
    dueAt: workOrders.dueAt,
    dueReason: workOrders.dueReason,
    dueState: dueStateExpr(now, timeZone),
    tasks: workOrders.tasks,
    benchTemplateId: workOrders.benchTemplateId,
    benchJobId: workOrders.benchJobId,
    skills: workOrders.skills,
    onSiteMinutes: workOrders.onSiteMinutes,
    state: workOrders.state,
    technicianId: workOrders.technicianId,
    technician: sql<{
      id: string;
      name: string;
    } | null>`(select json_build_object('id', u.id, 'name', u.name) from users u where u.id = work_orders.technician_id)`,
    plannedOn: workOrders.plannedOn,
    note: workOrders.note,
    skipReason: workOrders.skipReason,
    labourMinutes: workOrders.labourMinutes,
    playsAtDone: workOrders.playsAtDone,
    hoursAtDone: workOrders.hoursAtDone,
    closedAt: workOrders.closedAt,
    createdAt: workOrders.createdAt,
    updatedAt: workOrders.updatedAt,
    version: workOrders.version,
  };
}

export interface WorkOrderListParams {
  q?: string;
  now: Date;
  timeZone: string;
  state: WorkOrderState;
  due?: DueStateName;
  gameId?: string;
  venueId?: string;
  carePlanId?: string;
  /** A technician's id, or 'none' for unassigned work. */
  technicianId?: string;
  plannedOn?: string;
  order: 'asc' | 'desc';
  cursor?: string;
  limit: number;
}

export async function listWorkOrders(tx: Tx, p: WorkOrderListParams) {
  const dueFilter: Record<DueStateName, SQL> = {
    overdue: sql`${workOrders.dueAt} <= ${p.now}`,
    due_soon: sql`${workOrders.dueAt} > ${p.now} and ${workOrders.dueAt} < ${dueSoonEnd(p.now, p.timeZone)}`,
    later: sql`${workOrders.dueAt} >= ${dueSoonEnd(p.now, p.timeZone)}`,
  };
  const rows = await tx
    .select({ ...orderColumns(p.now, p.timeZone), sortValue: sql<string>`${dueKey.expr}::text` })
    .from(workOrders)
    .where(
      and(
        eq(workOrders.tenantId, currentTenant),
        eq(workOrders.state, p.state),
        p.q
          ? sql`(work_orders.title ilike ${like(p.q)} or exists (select 1 from games g join game_models m on m.tenant_id = g.tenant_id and m.id = g.model_id where g.tenant_id = work_orders.tenant_id and g.id = work_orders.game_id and (g.serial ilike ${like(p.q)} or m.title ilike ${like(p.q)})))`
          : undefined,
        p.due ? dueFilter[p.due] : undefined,
        p.gameId ? eq(workOrders.gameId, p.gameId) : undefined,
        p.venueId
          ? inArray(
              workOrders.gameId,
              tx
                .select({ id: games.id })
                .from(games)
                .where(and(eq(games.tenantId, currentTenant), eq(games.venueId, p.venueId))),
            )
          : undefined,
        p.carePlanId ? eq(workOrders.carePlanId, p.carePlanId) : undefined,
        p.technicianId === 'none'
          ? isNull(workOrders.technicianId)
          : p.technicianId
            ? eq(workOrders.technicianId, p.technicianId)
            : undefined,
        p.plannedOn ? eq(workOrders.plannedOn, p.plannedOn) : undefined,
        keysetWhere(dueKey, workOrders.id, p.order, decodeCursor(p.cursor)),
      ),
    )
    .orderBy(...keysetOrder(dueKey, workOrders.id, p.order))
    .limit(p.limit + 1);
  return toPage(rows, p.limit);
}

export async function getWorkOrder(tx: Tx, id: string, now: Date, timeZone: string) {
  const [row] = await tx
    .select(orderColumns(now, timeZone))
    .from(workOrders)
    .where(and(eq(workOrders.tenantId, currentTenant), eq(workOrders.id, id)));
  return row;
}
export type WorkOrderRow = NonNullable<Awaited<ReturnType<typeof getWorkOrder>>>;

export type NewWorkOrder = Omit<typeof workOrders.$inferInsert, 'tenantId' | 'id' | 'state' | 'version' | 'createdAt' | 'updatedAt'>;

/**
 * Inserts an open work order unless the plan already has one open on the game: ON CONFLICT DO NOTHING on the
 * partial unique index (work_orders_one_open_key) makes it exactly once, whatever runs at the same moment. The new
 * id, or undefined when one was already open.
 */
export async function insertWorkOrderOnce(tx: Tx, values: NewWorkOrder): Promise<string | undefined> {
  const [row] = await tx
    .insert(workOrders)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .onConflictDoNothing({ target: [workOrders.tenantId, workOrders.carePlanId, workOrders.gameId], where: sql`state = 'open'` })
    .returning({ id: workOrders.id });
  return row?.id;
}

export async function updateWorkOrder(tx: Tx, id: string, version: number, patch: Partial<typeof workOrders.$inferInsert>) {
  return updateAtVersion(tx, workOrders, id, version, patch);
}

/** The games of a plan that have an open work order. */
export async function listGamesWithOpenWorkOrder(tx: Tx, carePlanId: string): Promise<Map<string, string>> {
  const rows = await tx
    .select({ gameId: workOrders.gameId, id: workOrders.id })
    .from(workOrders)
    .where(and(eq(workOrders.tenantId, currentTenant), eq(workOrders.carePlanId, carePlanId), eq(workOrders.state, 'open')));
  return new Map(rows.map((r) => [r.gameId, r.id]));
}

/** Per game, the plan's last closed (done or skipped) work order: the next one counts from it. */
export async function listLastClosedWorkOrders(tx: Tx, carePlanId: string) {
  const rows = await tx
    .selectDistinctOn([workOrders.gameId], {
      gameId: workOrders.gameId,
      dueAt: workOrders.dueAt,
      closedAt: workOrders.closedAt,
      playsAtDone: workOrders.playsAtDone,
      hoursAtDone: workOrders.hoursAtDone,
    })
    .from(workOrders)
    .where(
      and(
        eq(workOrders.tenantId, currentTenant),
        eq(workOrders.carePlanId, carePlanId),
        ne(workOrders.state, 'open'),
        isNotNull(workOrders.closedAt),
      ),
    )
    .orderBy(workOrders.gameId, sql`${workOrders.closedAt} desc`);
  return new Map(rows.map((r) => [r.gameId, r]));
}

/**
 * Time on site already booked on open work orders, per technician and day from `fromDay` to `toDay` (keys
 * "technicianId|YYYY-MM-DD"): the care-plan run spreads new work by it. Read from the open-work partial index.
 */
export async function listBookedWorkMinutes(tx: Tx, p: { fromDay: string; toDay: string }): Promise<Map<string, number>> {
  const rows = await tx
    .select({
      technicianId: workOrders.technicianId,
      day: workOrders.plannedOn,
      minutes: sql<number>`sum(${workOrders.onSiteMinutes})::int`,
    })
    .from(workOrders)
    .where(
      and(
        eq(workOrders.tenantId, currentTenant),
        eq(workOrders.state, 'open'),
        isNotNull(workOrders.technicianId),
        sql`${workOrders.plannedOn} between ${p.fromDay} and ${p.toDay}`,
      ),
    )
    .groupBy(workOrders.technicianId, workOrders.plannedOn);
  return new Map(rows.map((r) => [`${r.technicianId}|${r.day}`, Number(r.minutes)]));
}
