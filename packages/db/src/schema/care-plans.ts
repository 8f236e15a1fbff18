// Care plans (recurring preventive work for a model's games or one game) and the work orders they create when due.
import { sql } from 'drizzle-orm';
import { bigint, boolean, check, date, foreignKey, index, integer, jsonb, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { carePlanScope, dueReason, workOrderState } from './enums.ts';
import { gameModels, games } from './games.ts';
import { users } from './identity.ts';
import { benchJobs, benchTemplates } from './bench-jobs.ts';
import { tenantTable } from './tenant-table.ts';

/**
 * What to do (a task list, or a bench-job template), for which games, and when: by an RFC 5545 rule from a local
 * start, every N plays, every N power-on hours, when a board's capacitors near the end of their life — whichever
 * comes first.
 */
export const carePlans = tenantTable(
  'care_plans',
  {
    id: uuid('id').notNull().defaultRandom(),
    name: text('name').notNull(),
    scope: carePlanScope.column('scope').notNull(),
    modelId: uuid('model_id'),
    gameId: uuid('game_id'),
    /** The task list, in order; empty when the plan names a bench-job template instead. */
    tasks: jsonb('tasks').$type<string[]>().notNull().default([]),
    benchTemplateId: uuid('bench_template_id'),
    skills: text('skills')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    onSiteMinutes: integer('on_site_minutes').notNull(),
    /** RFC 5545 RRULE value ("FREQ=MONTHLY;BYDAY=TU;BYSETPOS=-1"); the editor writes it, people never see it. */
    rule: text('rule'),
    /** Local wall time of the rule's first occurrence, "2026-01-06T09:00", in the company's time zone. */
    ruleStart: text('rule_start'),
    playsEvery: integer('plays_every'),
    hoursEvery: integer('hours_every'),
    /** Due when a board in the game has its recap due from capacitor life. */
    byCapacitorLife: boolean('by_capacitor_life').notNull().default(false),
    leadDays: integer('lead_days').notNull().default(7),
    /** The usual technician; without one, work goes to the nearest technician with the skills. */
    technicianId: uuid('technician_id').references(() => users.id, { onDelete: 'set null' }),
    /**
     * The earliest moment one of its games may need a new work order (its next due date less the lead, or now when a
     * meter reading, a finished job or an edit may have changed it). The scheduled run looks only at plans past it.
     */
    nextCheckAt: timestamp('next_check_at', { withTimezone: true }).notNull().defaultNow(),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    retiredAt: timestamp('retired_at', { withTimezone: true }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.modelId], foreignColumns: [gameModels.tenantId, gameModels.id] }),
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }),
    foreignKey({ columns: [t.tenantId, t.benchTemplateId], foreignColumns: [benchTemplates.tenantId, benchTemplates.id] }),
    carePlanScope.check('care_plans_scope_check', t.scope),
    check(
      'care_plans_target_check',
      sql`(scope = 'model' and model_id is not null and game_id is null) or (scope = 'game' and game_id is not null and model_id is null)`,
    ),
    check('care_plans_trigger_check', sql`rule is not null or plays_every is not null or hours_every is not null or by_capacitor_life`),
    check('care_plans_rule_start_check', sql`(rule is null) = (rule_start is null)`),
    check(
      'care_plans_positive_check',
      sql`on_site_minutes > 0 and coalesce(plays_every, 1) > 0 and coalesce(hours_every, 1) > 0 and lead_days >= 0`,
    ),
    index('care_plans_tenant_name_idx').on(t.tenantId, sql`lower(${t.name})`, t.id),
    index('care_plans_tenant_model_idx')
      .on(t.tenantId, t.modelId)
      .where(sql`model_id is not null`),
    index('care_plans_tenant_game_idx')
      .on(t.tenantId, t.gameId)
      .where(sql`game_id is not null`),
  ],
);

/**
 * One due piece of a plan's work on one game. At most one is open per plan and game (the unique index is what makes
 * the scheduled run create it exactly once, on any number of instances); done and skipped ones are its history.
 */
export const workOrders = tenantTable(
  'work_orders',
  {
    id: uuid('id').notNull().defaultRandom(),
    carePlanId: uuid('care_plan_id').notNull(),
    gameId: uuid('game_id').notNull(),
    dueAt: timestamp('due_at', { withTimezone: true }).notNull(),
    dueReason: dueReason.column('due_reason').notNull(),
    /** The plan's name, tasks, template and time on site as they were when the work fell due. */
    title: text('title').notNull(),
    tasks: jsonb('tasks').$type<string[]>().notNull().default([]),
    benchTemplateId: uuid('bench_template_id'),
    /** The bench job opened for it, when the plan names a template. */
    benchJobId: uuid('bench_job_id'),
    skills: text('skills')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    onSiteMinutes: integer('on_site_minutes').notNull(),
    state: workOrderState.column('state').notNull().default('open'),
    technicianId: uuid('technician_id').references(() => users.id, { onDelete: 'set null' }),
    /** The day it is planned into a route day (the company's local date). */
    plannedOn: date('planned_on'),
    note: text('note').notNull().default(''),
    skipReason: text('skip_reason'),
    /** Time spent on site, for keep cost. */
    labourMinutes: integer('labour_minutes'),
    /** The meters when it was done: the next plays/hours due counts from these. */
    playsAtDone: bigint('plays_at_done', { mode: 'number' }),
    hoursAtDone: bigint('hours_at_done', { mode: 'number' }),
    closedAt: timestamp('closed_at', { withTimezone: true }),
    closedBy: uuid('closed_by').references(() => users.id, { onDelete: 'set null' }),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.carePlanId], foreignColumns: [carePlans.tenantId, carePlans.id] }),
    foreignKey({ columns: [t.tenantId, t.gameId], foreignColumns: [games.tenantId, games.id] }),
    foreignKey({ columns: [t.tenantId, t.benchTemplateId], foreignColumns: [benchTemplates.tenantId, benchTemplates.id] }),
    foreignKey({ columns: [t.tenantId, t.benchJobId], foreignColumns: [benchJobs.tenantId, benchJobs.id] }),
    dueReason.check('work_orders_due_reason_check', t.dueReason),
    workOrderState.check('work_orders_state_check', t.state),
    check('work_orders_skip_reason_check', sql`state <> 'skipped' or length(trim(skip_reason)) > 0`),
    check('work_orders_labour_check', sql`labour_minutes is null or labour_minutes >= 0`),
    uniqueIndex('work_orders_one_open_key')
      .on(t.tenantId, t.carePlanId, t.gameId)
      .where(sql`state = 'open'`),
    index('work_orders_tenant_plan_game_idx').on(t.tenantId, t.carePlanId, t.gameId, t.closedAt),
    index('work_orders_tenant_open_due_idx')
      .on(t.tenantId, t.dueAt, t.id)
      .where(sql`state = 'open'`),
    index('work_orders_tenant_tech_day_idx')
      .on(t.tenantId, t.technicianId, t.plannedOn, t.id)
      .where(sql`state = 'open'`),
    index('work_orders_tenant_game_idx').on(t.tenantId, t.gameId, t.createdAt, t.id),
    index('work_orders_tenant_state_idx').on(t.tenantId, t.state, t.dueAt, t.id),
  ],
);
