// Care-plan queries: the list by name, one plan, saving, retiring, which games a plan covers, and the next-check
// bookkeeping of the scheduled care-plan run. Scoped by the caller's tenant transaction.
import { and, eq, isNull, lte, or, sql, type SQL } from 'drizzle-orm';
import type { Tx } from '../client.ts';
import { benchTemplates, carePlans, gameModels, games, memberships, users, venues } from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { decodeCursor, keysetOrder, keysetWhere, toPage, type SortKey } from './keyset.ts';
import { escapeLike } from './venues.ts';
import { updateAtVersion } from './versioned-update.ts';

const nameKey: SortKey = { expr: sql`lower(${carePlans.name})`, type: 'text' };

// Names of what a plan points at, as sub-selects PostgreSQL runs for the page's rows only.
const modelJson = sql<{
  id: string;
  maker: string;
  title: string;
} | null>`(select json_build_object('id', m.id, 'maker', m.maker, 'title', m.title) from game_models m where m.tenant_id = care_plans.tenant_id and m.id = care_plans.model_id)`;
const gameJson = sql<{
  id: string;
  serial: string;
  modelTitle: string;
} | null>`(select json_build_object('id', g.id, 'serial', g.serial, 'modelTitle', m.title) from games g join game_models m on m.tenant_id = g.tenant_id and m.id = g.model_id where g.tenant_id = care_plans.tenant_id and g.id = care_plans.game_id)`;
const templateJson = sql<{
  id: string;
  name: string;
} | null>`(select json_build_object('id', t.id, 'name', t.name) from bench_templates t where t.tenant_id = care_plans.tenant_id and t.id = care_plans.bench_template_id)`;
const technicianJson = sql<{
  id: string;
  name: string;
} | null>`(select json_build_object('id', u.id, 'name', u.name) from users u where u.id = care_plans.technician_id)`;

const planColumns = {
  id: carePlans.id,
  name: carePlans.name,
  scope: carePlans.scope,
  modelId: carePlans.modelId,
  gameId: carePlans.gameId,
  model: modelJson,
  game: gameJson,
  tasks: carePlans.tasks,
  benchTemplateId: carePlans.benchTemplateId,
  benchTemplate: templateJson,
  skills: carePlans.skills,
  onSiteMinutes: carePlans.onSiteMinutes,
  rule: carePlans.rule,
  ruleStart: carePlans.ruleStart,
  playsEvery: carePlans.playsEvery,
  hoursEvery: carePlans.hoursEvery,
  byCapacitorLife: carePlans.byCapacitorLife,
  leadDays: carePlans.leadDays,
  technicianId: carePlans.technicianId,
  technician: technicianJson,
  nextCheckAt: carePlans.nextCheckAt,
  version: carePlans.version,
  createdAt: carePlans.createdAt,
  updatedAt: carePlans.updatedAt,
  retiredAt: carePlans.retiredAt,
};

export type CarePlanRow = NonNullable<Awaited<ReturnType<typeof getCarePlan>>>;

export interface CarePlanListParams {
  q?: string;
  order: 'asc' | 'desc';
  cursor?: string;
  limit: number;
  includeRetired?: boolean;
  modelId?: string;
  gameId?: string;
}

export async function listCarePlans(tx: Tx, p: CarePlanListParams) {
  const like = p.q ? `%${escapeLike(p.q)}%` : undefined;
  const rows = await tx
    .select({ ...planColumns, sortValue: sql<string>`${nameKey.expr}` })
    .from(carePlans)
    .where(
      and(
        eq(carePlans.tenantId, currentTenant),
        p.includeRetired ? undefined : isNull(carePlans.retiredAt),
        p.modelId ? eq(carePlans.modelId, p.modelId) : undefined,
        p.gameId ? eq(carePlans.gameId, p.gameId) : undefined,
        like ? sql`${carePlans.name} ilike ${like}` : undefined,
        keysetWhere(nameKey, carePlans.id, p.order, decodeCursor(p.cursor)),
      ),
    )
    .orderBy(...keysetOrder(nameKey, carePlans.id, p.order))
    .limit(p.limit + 1);
  return toPage(rows, p.limit);
}

export async function getCarePlan(tx: Tx, id: string) {
  const [row] = await tx
    .select(planColumns)
    .from(carePlans)
    .where(and(eq(carePlans.tenantId, currentTenant), eq(carePlans.id, id)));
  return row;
}

/** The active plans that cover a game: its own, and its model's. */
export async function listCarePlansOfGame(tx: Tx, gameId: string) {
  const modelOfGame = sql`(select g.model_id from games g where g.tenant_id = ${currentTenant} and g.id = ${gameId})`;
  const rows = await tx
    .select(planColumns)
    .from(carePlans)
    .where(
      and(
        eq(carePlans.tenantId, currentTenant),
        isNull(carePlans.retiredAt),
        or(eq(carePlans.gameId, gameId), sql`${carePlans.modelId} = ${modelOfGame}`),
      ),
    )
    .orderBy(sql`lower(${carePlans.name})`, carePlans.id);
  return rows;
}

export type CarePlanValues = Omit<typeof carePlans.$inferInsert, 'tenantId' | 'id' | 'version' | 'createdAt' | 'updatedAt' | 'retiredAt'>;

export async function insertCarePlan(tx: Tx, values: CarePlanValues): Promise<string> {
  const [row] = await tx
    .insert(carePlans)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .returning({ id: carePlans.id });
  return row!.id;
}

/** Saves at `version` (undefined when stale or gone); the plan is looked at again by the next run. */
export async function updateCarePlan(tx: Tx, id: string, version: number, patch: Partial<CarePlanValues> & { retiredAt?: Date | null }) {
  return updateAtVersion(tx, carePlans, id, version, { ...patch, nextCheckAt: sql`now()` });
}

/** What a plan may point at, checked in one statement: which of these exist in the company (and the technician's role). */
export async function checkCarePlanTargets(
  tx: Tx,
  p: { modelId: string | null; gameId: string | null; benchTemplateId: string | null; technicianId: string | null },
) {
  const exists = (table: SQL, id: string | null) =>
    id ? sql`exists (select 1 from ${table} t where t.tenant_id = ${currentTenant} and t.id = ${id})` : sql`true`;
  const [row] = await tx
    .select({
      model: sql<boolean>`${exists(sql`${gameModels}`, p.modelId)}`,
      game: sql<boolean>`${exists(sql`${games}`, p.gameId)}`,
      template: sql<boolean>`${exists(sql`${benchTemplates}`, p.benchTemplateId)}`,
      technician: p.technicianId
        ? sql<boolean>`exists (select 1 from ${memberships} m where m.tenant_id = ${currentTenant} and m.user_id = ${p.technicianId} and m.role = 'technician')`
        : sql<boolean>`true`,
    })
    .from(sql`(select 1) as one`);
  return row!;
}

/** The games a plan covers (active ones, by serial), with venue; at most `limit`, and how many in all. */
export async function listGamesOfCarePlan(tx: Tx, plan: { modelId: string | null; gameId: string | null }, limit: number) {
  const target = plan.gameId ? eq(games.id, plan.gameId) : eq(games.modelId, plan.modelId ?? '00000000-0000-0000-0000-000000000000');
  const where = and(eq(games.tenantId, currentTenant), isNull(games.retiredAt), target);
  const rows = await tx
    .select({
      id: games.id,
      serial: games.serial,
      modelId: games.modelId,
      modelTitle: gameModels.title,
      venueId: games.venueId,
      venueName: sql<string | null>`(select v.name from ${venues} v where v.tenant_id = games.tenant_id and v.id = games.venue_id)`,
      latitude: sql<number | null>`(select v.latitude from ${venues} v where v.tenant_id = games.tenant_id and v.id = games.venue_id)`,
      longitude: sql<number | null>`(select v.longitude from ${venues} v where v.tenant_id = games.tenant_id and v.id = games.venue_id)`,
    })
    .from(games)
    .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .where(where)
    .orderBy(games.serial, games.id)
    .limit(limit);
  const [count] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(games)
    .where(where);
  return { games: rows, total: count?.n ?? 0 };
}

/** The company's active plans whose next check has come (the run's work list); the partial next-check index serves it. */
export async function listCarePlansToCheck(tx: Tx, now: Date) {
  const rows = await tx
    .select(planColumns)
    .from(carePlans)
    .where(and(eq(carePlans.tenantId, currentTenant), isNull(carePlans.retiredAt), lte(carePlans.nextCheckAt, now)))
    .orderBy(carePlans.nextCheckAt, carePlans.id);
  return rows;
}

/** When the run should look at a plan again (not a user's edit: the version stays). */
export async function setCarePlanNextCheck(tx: Tx, id: string, at: Date): Promise<void> {
  await tx
    .update(carePlans)
    .set({ nextCheckAt: at })
    .where(and(eq(carePlans.tenantId, currentTenant), eq(carePlans.id, id)));
}

/** Something about a game changed (a meter reading, finished work): the plans covering it look again by `at`. */
export async function checkCarePlansOfGameBy(tx: Tx, gameId: string, at: Date): Promise<void> {
  const modelOfGame = sql`(select g.model_id from games g where g.tenant_id = ${currentTenant} and g.id = ${gameId})`;
  await tx
    .update(carePlans)
    .set({ nextCheckAt: sql`least(${carePlans.nextCheckAt}, ${at})` })
    .where(
      and(
        eq(carePlans.tenantId, currentTenant),
        isNull(carePlans.retiredAt),
        or(eq(carePlans.gameId, gameId), sql`${carePlans.modelId} = ${modelOfGame}`),
      ),
    );
}

/** The name of a person (the usual technician), for views; undefined for nobody. */
export async function personName(tx: Tx, userId: string): Promise<string | undefined> {
  const [u] = await tx.select({ name: users.name }).from(users).where(eq(users.id, userId));
  return u?.name;
}
