// Care plans: checking a plan before it is saved (what it points at exists; its calendar rule reads and falls on a
// date), the plan as the API shows it (with its rule in plain words), and a plan's page (its games and when each
// is next due).
import type { CarePlan, CarePlanDetail, CarePlanParsed } from '@bumperline/contracts/care-plans';
import type { Tx } from '@bumperline/db/client';
import { getCompanyLocale } from '@bumperline/db/queries/companies';
import { checkCarePlanTargets, getCarePlan, listGamesOfCarePlan, type CarePlanRow } from '@bumperline/db/queries/care-plans';
import { listGamesWithOpenWorkOrder } from '@bumperline/db/queries/work-orders';
import { DomainError } from '@bumperline/domain/errors';
import { describeRule, ruleOccurs } from '@bumperline/domain/schedules/rule-wording';
import { dueOfPlanGames } from './care-due-of-games.ts';
import { InvalidInput, NotFound } from './workflow-errors.ts';

type Field = { field: string; message: string };

export async function companyZone(tx: Tx, tenantId: string): Promise<string> {
  return (await getCompanyLocale(tx, tenantId))?.timeZone ?? 'UTC';
}

/** The rule's words for a plan, or null without a rule (a stored rule that no longer reads is said plainly). */
function wording(rule: string | null, ruleStart: string | null): string | null {
  if (!rule || !ruleStart) return null;
  try {
    return describeRule(rule, ruleStart);
  } catch {
    return 'On a schedule that no longer reads: choose it again';
  }
}

export function carePlanView(row: CarePlanRow): CarePlan {
  return {
    id: row.id,
    name: row.name,
    scope: row.scope,
    model: row.model,
    game: row.game,
    tasks: row.tasks,
    benchTemplate: row.benchTemplate,
    skills: row.skills,
    onSiteMinutes: row.onSiteMinutes,
    rule: row.rule,
    ruleStart: row.ruleStart,
    ruleWording: wording(row.rule, row.ruleStart),
    playsEvery: row.playsEvery,
    hoursEvery: row.hoursEvery,
    byCapacitorLife: row.byCapacitorLife,
    leadDays: row.leadDays,
    technician: row.technician,
    nextCheckAt: new Date(row.nextCheckAt).toISOString(),
    version: row.version,
    createdAt: new Date(row.createdAt).toISOString(),
    updatedAt: new Date(row.updatedAt).toISOString(),
    retiredAt: row.retiredAt ? new Date(row.retiredAt).toISOString() : null,
  };
}

/**
 * Refuses, naming each field, a plan that points at something not in the company or whose rule does not read or
 * never falls on a date (the 31st of February; an end before the start).
 */
export async function checkCarePlan(tx: Tx, plan: CarePlanParsed, timeZone: string): Promise<void> {
  const problems: Field[] = [];
  const found = await checkCarePlanTargets(tx, plan);
  if (!found.model) problems.push({ field: 'modelId', message: 'is not a model of this company' });
  if (!found.game) problems.push({ field: 'gameId', message: 'is not a game of this company' });
  if (!found.template) problems.push({ field: 'benchTemplateId', message: 'is not a bench-job template of this company' });
  if (!found.technician) problems.push({ field: 'technicianId', message: 'is not a technician of this company' });
  if (plan.rule && plan.ruleStart) {
    try {
      if (!ruleOccurs(plan.rule, { start: plan.ruleStart, timeZone })) {
        problems.push({ field: 'rule', message: 'never falls on a date: choose another day or end' });
      }
    } catch (err) {
      if (!(err instanceof DomainError)) throw err;
      const field = err.field === 'start' ? 'ruleStart' : 'rule';
      problems.push({ field, message: field === 'rule' ? `does not read as a schedule: ${err.message}` : err.message });
    }
  }
  if (problems.length) throw new InvalidInput(problems);
}

export async function carePlanOrThrow(tx: Tx, id: string): Promise<CarePlanRow> {
  const row = await getCarePlan(tx, id);
  if (!row) throw new NotFound('care plan');
  return row;
}

/** The games a plan page lists at most; a model with more says how many in all. */
const GAMES_ON_PAGE = 500;

export async function carePlanDetail(tx: Tx, id: string, tenantId: string, now: Date = new Date()): Promise<CarePlanDetail> {
  const plan = await carePlanOrThrow(tx, id);
  const timeZone = await companyZone(tx, tenantId);
  const { games, total } = await listGamesOfCarePlan(tx, plan, GAMES_ON_PAGE);
  const open = await listGamesWithOpenWorkOrder(tx, plan.id);
  const dues = await dueOfPlanGames(
    tx,
    plan,
    games.map((g) => g.id),
    { now, timeZone },
  );
  return {
    ...carePlanView(plan),
    games: games.map((g) => {
      const due = dues.get(g.id);
      return {
        id: g.id,
        serial: g.serial,
        modelTitle: g.modelTitle,
        venue: g.venueId && g.venueName ? { id: g.venueId, name: g.venueName } : null,
        dueAt: due?.dueAt ? due.dueAt.toISOString() : null,
        dueReason: due?.reason ?? null,
        dueState: !due?.dueAt ? null : due.state === 'overdue' ? 'overdue' : due.state === 'due-soon' ? 'due_soon' : 'later',
        openWorkOrderId: open.get(g.id) ?? null,
      };
    }),
    gamesTotal: total,
  };
}
