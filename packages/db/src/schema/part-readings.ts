// Every reading ever taken on each part of a board: a part's drift across overhauls.
import { sql } from 'drizzle-orm';
import { boolean, doublePrecision, foreignKey, index, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { readingVerdict } from './enums.ts';
import { users } from './identity.ts';
import { boardInstances } from './boards.ts';
import { benchJobs } from './bench-jobs.ts';
import { boardParts } from './parts-lists.ts';
import { tenantTable } from './tenant-table.ts';

/** Every reading taken on a part of a board, re-checked by the server against the parts list when recorded. */
export const partReadings = tenantTable(
  'part_readings',
  {
    id: uuid('id').notNull().defaultRandom(),
    boardInstanceId: uuid('board_instance_id').notNull(),
    partId: uuid('part_id').notNull(),
    benchJobId: uuid('bench_job_id'),
    /** As typed: "570", "4.63k", "0.55 / OL". */
    measuredText: text('measured_text').notNull(),
    /** In the part's unit (Ω, F); null for a diode set, judged as a whole. */
    measured: doublePrecision('measured'),
    unit: text('unit'),
    inCircuit: boolean('in_circuit').notNull().default(false),
    verdict: readingVerdict.column('verdict').notNull(),
    indicative: boolean('indicative').notNull().default(false),
    min: doublePrecision('min'),
    max: doublePrecision('max'),
    deviationPercent: doublePrecision('deviation_percent'),
    note: text('note'),
    takenAt: timestamp('taken_at', { withTimezone: true }).notNull().defaultNow(),
    takenBy: uuid('taken_by').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [
    foreignKey({ columns: [t.tenantId, t.boardInstanceId], foreignColumns: [boardInstances.tenantId, boardInstances.id] }).onDelete(
      'cascade',
    ),
    foreignKey({ columns: [t.tenantId, t.partId], foreignColumns: [boardParts.tenantId, boardParts.id] }),
    readingVerdict.check('part_readings_verdict_check', t.verdict),
    foreignKey({ columns: [t.tenantId, t.benchJobId], foreignColumns: [benchJobs.tenantId, benchJobs.id] }),
    index('part_readings_tenant_instance_part_idx').on(t.tenantId, t.boardInstanceId, t.partId, t.takenAt),
    index('part_readings_tenant_job_idx')
      .on(t.tenantId, t.benchJobId)
      .where(sql`bench_job_id is not null`),
  ],
);
