// Bench-job templates (ordered steps with cautions) and bench jobs: one board's overhaul, its progress saved as
// the technician types, its readings and parts used written when it is finished.
import { sql } from 'drizzle-orm';
import type { BenchJobDraft, BenchStep } from '@bumperline/contracts/bench-vocabulary';
import { date, foreignKey, index, integer, jsonb, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { benchJobOrigin, benchJobState } from './enums.ts';
import { users } from './identity.ts';
import { serviceCalls } from './calls.ts';
import { boardInstances } from './boards.ts';
import { boardParts } from './parts-lists.ts';
import { tenantTable } from './tenant-table.ts';

export const benchTemplates = tenantTable(
  'bench_templates',
  {
    id: uuid('id').notNull().defaultRandom(),
    name: text('name').notNull(),
    description: text('description').notNull().default(''),
    steps: jsonb('steps').$type<BenchStep[]>().notNull(),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('bench_templates_tenant_name_idx').on(t.tenantId, t.name, t.id)],
);

export const benchJobs = tenantTable(
  'bench_jobs',
  {
    id: uuid('id').notNull().defaultRandom(),
    boardInstanceId: uuid('board_instance_id').notNull(),
    templateId: uuid('template_id'),
    /** The template's name and steps as they were when the job opened: later edits to the template leave it alone. */
    templateName: text('template_name').notNull(),
    steps: jsonb('steps').$type<BenchStep[]>().notNull(),
    origin: benchJobOrigin.column('origin').notNull(),
    serviceCallId: uuid('service_call_id'),
    /** Who is to do it and on which day: it is then a stop on their route day at the game's venue. */
    technicianId: uuid('technician_id').references(() => users.id, { onDelete: 'set null' }),
    plannedOn: date('planned_on'),
    state: benchJobState.column('state').notNull().default('in_progress'),
    draft: jsonb('draft').$type<BenchJobDraft>().notNull(),
    /** Bumped by every save: a save from another device that did not see the latest is refused, not merged. */
    version: integer('version').notNull().default(1),
    openedBy: uuid('opened_by').references(() => users.id, { onDelete: 'set null' }),
    openedAt: timestamp('opened_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    finishedBy: uuid('finished_by').references(() => users.id, { onDelete: 'set null' }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.boardInstanceId], foreignColumns: [boardInstances.tenantId, boardInstances.id] }),
    foreignKey({ columns: [t.tenantId, t.templateId], foreignColumns: [benchTemplates.tenantId, benchTemplates.id] }),
    foreignKey({ columns: [t.tenantId, t.serviceCallId], foreignColumns: [serviceCalls.tenantId, serviceCalls.id] }),
    benchJobState.check('bench_jobs_state_check', t.state),
    benchJobOrigin.check('bench_jobs_origin_check', t.origin),
    index('bench_jobs_tenant_instance_idx').on(t.tenantId, t.boardInstanceId, t.openedAt),
    index('bench_jobs_tenant_state_idx').on(t.tenantId, t.state, t.openedAt, t.id),
    index('bench_jobs_tenant_tech_day_idx')
      .on(t.tenantId, t.technicianId, t.plannedOn, t.id)
      .where(sql`state = 'in_progress' and technician_id is not null`),
    index('bench_jobs_tenant_call_idx')
      .on(t.tenantId, t.serviceCallId)
      .where(sql`service_call_id is not null`),
  ],
);

/** Parts fitted on a finished job (the parts-and-stock issue takes them off a van's stock). */
export const benchJobPartsUsed = tenantTable(
  'bench_job_parts_used',
  {
    id: uuid('id').notNull().defaultRandom(),
    jobId: uuid('job_id').notNull(),
    partId: uuid('part_id'),
    description: text('description').notNull(),
    quantity: integer('quantity').notNull(),
    /** The catalogue part fitted, when known: its stock comes off the finisher's van when the job is finished. */
    cataloguePartId: uuid('catalogue_part_id'),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.jobId], foreignColumns: [benchJobs.tenantId, benchJobs.id] }).onDelete('cascade'),
    foreignKey({ columns: [t.tenantId, t.partId], foreignColumns: [boardParts.tenantId, boardParts.id] }),
    index('bench_job_parts_used_tenant_job_idx').on(t.tenantId, t.jobId),
  ],
);

/** Photos taken on a step, stored like a service call's (photo-intake, photo-store). */
export const benchJobPhotos = tenantTable(
  'bench_job_photos',
  {
    id: uuid('id').notNull().defaultRandom(),
    jobId: uuid('job_id').notNull(),
    stepKey: text('step_key').notNull(),
    storageKey: text('storage_key').notNull(),
    thumbKey: text('thumb_key').notNull(),
    contentType: text('content_type').notNull(),
    bytes: integer('bytes').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    uploadedBy: uuid('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.jobId], foreignColumns: [benchJobs.tenantId, benchJobs.id] }).onDelete('cascade'),
    index('bench_job_photos_tenant_job_idx').on(t.tenantId, t.jobId, t.createdAt),
  ],
);
