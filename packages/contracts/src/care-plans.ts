// Care plans: recurring preventive work for every game of a model or for one game — what to do (a task list or a
// bench-job template), who usually does it, and when (a calendar rule, plays, power-on hours or capacitor life,
// whichever comes first). Words and closed sets are in care-vocabulary.ts.
import { z } from 'zod';
import { carePlanScopes, dueReasons, dueStates } from './care-vocabulary.ts';
import { int4, isoDateTime, listQueryBase, pageOf, requiredText, rowVersion, shortText, uuid } from './common.ts';

export { carePlanScopes, dueReasons, dueReasonLabels, dueStates, dueStateLabels } from './care-vocabulary.ts';
export type { CarePlanScope, DueReason, DueStateName } from './care-vocabulary.ts';

/** Local wall time of a calendar rule's first occurrence in the company's time zone: "2026-01-06T09:00". */
export const wallTimeText = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, { error: 'must be a local date and time as YYYY-MM-DDTHH:MM' });

const unique = (values: string[]) => new Set(values.map((v) => v.toLowerCase())).size === values.length;

/**
 * POST /api/care-plans. The rule is an RFC 5545 RRULE value written by the plan editor from plain-language choices;
 * the API also refuses a rule that never falls on a date (naming `rule`). Durations are whole minutes and days: the
 * screens read what people type ("45 min", "7 days") and send numbers.
 */
const carePlanFields = z.strictObject({
  name: requiredText(120),
  scope: z.enum(carePlanScopes, { error: `must be one of ${carePlanScopes.join(', ')}` }),
  modelId: uuid.nullable().default(null),
  gameId: uuid.nullable().default(null),
  /** The tasks, in order; leave empty when the plan names a bench-job template. */
  tasks: z.array(requiredText(300)).max(60, { error: 'must list at most 60 tasks' }).default([]),
  benchTemplateId: uuid.nullable().default(null),
  skills: z
    .array(requiredText(40))
    .max(20, { error: 'must list at most 20 skills' })
    .refine(unique, { error: 'lists a skill twice' })
    .default([]),
  onSiteMinutes: int4().min(1, { error: 'must be at least 1 minute' }).max(1440, { error: 'must be at most 24 hours' }),
  rule: shortText(300).nullable().default(null),
  ruleStart: wallTimeText.nullable().default(null),
  playsEvery: int4().min(1, { error: 'must be at least 1' }).nullable().default(null),
  hoursEvery: int4().min(1, { error: 'must be at least 1' }).nullable().default(null),
  byCapacitorLife: z.boolean().default(false),
  leadDays: int4().min(0, { error: 'must not be negative' }).max(365, { error: 'must be at most 365 days' }).default(7),
  /** The usual technician; without one, each work order goes to the nearest technician with the skills. */
  technicianId: uuid.nullable().default(null),
});

/** The rules between fields: the scope's target, a task list or a template, at least one trigger. */
function checkPlan(ctx: z.core.ParsePayload<z.output<typeof carePlanFields>>) {
  const p = ctx.value;
  const issue = (path: string, message: string, input: unknown) => ctx.issues.push({ code: 'custom', input, path: [path], message });
  if (p.scope === 'model' && !p.modelId) issue('modelId', 'is required for a plan that covers a model', p.modelId);
  if (p.scope === 'model' && p.gameId) issue('gameId', 'must be empty for a plan that covers a model', p.gameId);
  if (p.scope === 'game' && !p.gameId) issue('gameId', 'is required for a plan that covers one game', p.gameId);
  if (p.scope === 'game' && p.modelId) issue('modelId', 'must be empty for a plan that covers one game', p.modelId);
  if (p.tasks.length === 0 && !p.benchTemplateId) issue('tasks', 'must list at least one task, or choose a bench-job template', p.tasks);
  if (p.tasks.length > 0 && p.benchTemplateId)
    issue('benchTemplateId', 'choose a task list or a bench-job template, not both', p.benchTemplateId);
  if (p.rule && !p.ruleStart) issue('ruleStart', 'is required with a calendar rule', p.ruleStart);
  if (!p.rule && p.ruleStart) issue('rule', 'is required with a start', p.rule);
  if (!p.rule && p.playsEvery === null && p.hoursEvery === null && !p.byCapacitorLife) {
    issue('rule', 'choose at least one of: a calendar rule, every N plays, every N hours, by capacitor life', p.rule);
  }
}

export const carePlanInput = carePlanFields.check(checkPlan);
export type CarePlanInput = z.input<typeof carePlanInput>;
export type CarePlanParsed = z.output<typeof carePlanInput>;

/** PUT /api/care-plans/:id: the whole plan again, with the version it was loaded at (stale → 409, `current`). */
export const carePlanUpdate = carePlanFields.extend({ version: rowVersion }).check(checkPlan);
export type CarePlanUpdate = z.input<typeof carePlanUpdate>;

/** POST /api/care-plans/:id/retire: its open work orders stay until done or skipped; no new ones are made. */
export const carePlanRetire = z.strictObject({ version: rowVersion });
export type CarePlanRetire = z.input<typeof carePlanRetire>;

/** GET /api/care-plans: by name (search matches the name), keyset-paged. */
export const carePlanListQuery = listQueryBase.extend({
  sort: z.enum(['name']).default('name'),
  modelId: uuid.optional(),
  gameId: uuid.optional(),
});
export type CarePlanListQuery = z.input<typeof carePlanListQuery>;

export const personRef = z.strictObject({ id: uuid, name: z.string() });
export type PersonRef = z.infer<typeof personRef>;

export const carePlan = z.strictObject({
  id: uuid,
  name: z.string(),
  scope: z.enum(carePlanScopes),
  model: z.strictObject({ id: uuid, maker: z.string(), title: z.string() }).nullable(),
  game: z.strictObject({ id: uuid, serial: z.string(), modelTitle: z.string() }).nullable(),
  tasks: z.array(z.string()),
  benchTemplate: z.strictObject({ id: uuid, name: z.string() }).nullable(),
  skills: z.array(z.string()),
  onSiteMinutes: z.number().int(),
  rule: z.string().nullable(),
  ruleStart: z.string().nullable(),
  /** The rule in plain words ("Every month on the last Tuesday at 9:00"); null without a calendar rule. */
  ruleWording: z.string().nullable(),
  playsEvery: z.number().int().nullable(),
  hoursEvery: z.number().int().nullable(),
  byCapacitorLife: z.boolean(),
  leadDays: z.number().int(),
  technician: personRef.nullable(),
  nextCheckAt: isoDateTime,
  version: z.number().int(),
  createdAt: isoDateTime,
  updatedAt: isoDateTime,
  retiredAt: isoDateTime.nullable(),
});
export type CarePlan = z.infer<typeof carePlan>;
export const carePlanPage = pageOf(carePlan);
export type CarePlanPage = z.infer<typeof carePlanPage>;

/** One game a plan covers, with when its work is next due (computed at read time). */
export const carePlanGame = z.strictObject({
  id: uuid,
  serial: z.string(),
  modelTitle: z.string(),
  venue: z.strictObject({ id: uuid, name: z.string() }).nullable(),
  /** Null when no trigger has a known date yet (plays with no reading, a rule with no further dates). */
  dueAt: isoDateTime.nullable(),
  dueReason: z.enum(dueReasons).nullable(),
  dueState: z.enum(dueStates).nullable(),
  openWorkOrderId: uuid.nullable(),
});
export type CarePlanGame = z.infer<typeof carePlanGame>;

/** GET /api/care-plans/:id: the plan and the games it covers (at most 500; `gamesTotal` says how many in all). */
export const carePlanDetail = carePlan.extend({
  games: z.array(carePlanGame),
  gamesTotal: z.number().int(),
});
export type CarePlanDetail = z.infer<typeof carePlanDetail>;
