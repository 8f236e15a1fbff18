// Bench jobs: one board's overhaul, its draft saved as the technician types, and what finishing writes (parts
// used, photos on steps; the readings go to part_readings through part-readings.ts).
import { aliasedTable, and, asc, desc, eq, isNull, or, sql, type SQL } from 'drizzle-orm';
import type { BenchJobDraft, BenchStep } from '@bumperline/contracts/bench-vocabulary';
import type { Tx } from '../client.ts';
import {
  benchJobPartsUsed,
  benchJobPhotos,
  benchJobs,
  boardInstances,
  boardParts,
  gameModels,
  games,
  modelBoards,
  partReadings,
  users,
} from '../schema/index.ts';
import { currentTenant } from '../schema/rls.ts';
import { boardPartColumns } from './board-parts.ts';
import { decodeCursor, keysetOrder, keysetWhere, toPage, type SortKey } from './keyset.ts';
import { updateAtVersion } from './versioned-update.ts';

type JobState = (typeof benchJobs.$inferSelect)['state'];

const openedBy = aliasedTable(users, 'opened_by_user');
const finishedBy = aliasedTable(users, 'finished_by_user');

/** "Starlight Rally · SR-1042": the model's title and the game's serial, for a board fitted in a game. */
const gameLabel = sql<string | null>`case when ${games.id} is null then null else ${gameModels.title} || ' · ' || ${games.serial} end`;

const jobColumns = {
  id: benchJobs.id,
  boardInstanceId: benchJobs.boardInstanceId,
  boardId: boardInstances.boardId,
  boardName: modelBoards.name,
  boardSerial: boardInstances.serial,
  gameId: boardInstances.gameId,
  gameLabel,
  serviceCallId: benchJobs.serviceCallId,
  origin: benchJobs.origin,
  state: benchJobs.state,
  templateId: benchJobs.templateId,
  templateName: benchJobs.templateName,
  steps: benchJobs.steps,
  draft: benchJobs.draft,
  version: benchJobs.version,
  openedBy: openedBy.name,
  openedAt: benchJobs.openedAt,
  updatedAt: benchJobs.updatedAt,
  finishedBy: finishedBy.name,
  finishedAt: benchJobs.finishedAt,
};

/** Jobs with their board, the game the board is in, and who opened and finished them. */
function fromJobs(tx: Tx, columns: Record<string, unknown>) {
  return tx
    .select(columns as typeof jobColumns)
    .from(benchJobs)
    .innerJoin(boardInstances, and(eq(boardInstances.tenantId, benchJobs.tenantId), eq(boardInstances.id, benchJobs.boardInstanceId)))
    .innerJoin(modelBoards, and(eq(modelBoards.tenantId, boardInstances.tenantId), eq(modelBoards.id, boardInstances.boardId)))
    .leftJoin(games, and(eq(games.tenantId, boardInstances.tenantId), eq(games.id, boardInstances.gameId)))
    .leftJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
    .leftJoin(openedBy, eq(openedBy.id, benchJobs.openedBy))
    .leftJoin(finishedBy, eq(finishedBy.id, benchJobs.finishedBy));
}

export type BenchJobRow = Awaited<ReturnType<typeof getBenchJob>> & {};

export async function getBenchJob(tx: Tx, id: string) {
  const [row] = await fromJobs(tx, jobColumns).where(and(eq(benchJobs.tenantId, currentTenant), eq(benchJobs.id, id)));
  return row;
}

/** What a list shows of each job: the job's own columns without its steps, draft and parts. */
const summaryKeys = [
  'id',
  'boardInstanceId',
  'boardName',
  'boardSerial',
  'gameId',
  'gameLabel',
  'serviceCallId',
  'origin',
  'state',
  'templateName',
  'openedBy',
  'openedAt',
  'finishedBy',
  'finishedAt',
] as const satisfies readonly (keyof typeof jobColumns)[];
const summaryColumns = Object.fromEntries(summaryKeys.map((k) => [k, jobColumns[k]]));

export type BenchJobSummaryRow = Pick<BenchJobRow, (typeof summaryKeys)[number]> & { openedByUserId: string | null };

export interface BenchJobListParams {
  state?: JobState;
  boardInstanceId?: string;
  cursor?: string;
  limit: number;
}

const openedAtKey: SortKey = { expr: sql`${benchJobs.openedAt}`, type: 'timestamptz' };

/**
 * Newest opened first. A state filter reads bench_jobs_tenant_state_idx (tenant, state, opened_at, id) and a board
 * filter bench_jobs_tenant_instance_idx (tenant, board instance, opened_at); unfiltered, the company's jobs (a few
 * per board per year) are sorted. As in listCalls, the page is chosen from bench_jobs alone, then only its rows are
 * joined with their board, game and people.
 */
export async function listBenchJobs(tx: Tx, p: BenchJobListParams) {
  const filters: (SQL | undefined)[] = [
    eq(benchJobs.tenantId, currentTenant),
    p.state ? eq(benchJobs.state, p.state) : undefined,
    p.boardInstanceId ? eq(benchJobs.boardInstanceId, p.boardInstanceId) : undefined,
    keysetWhere(openedAtKey, benchJobs.id, 'desc', decodeCursor(p.cursor)),
  ];
  const page = tx
    .select({ id: benchJobs.id })
    .from(benchJobs)
    .where(and(...filters))
    .orderBy(...keysetOrder(openedAtKey, benchJobs.id, 'desc'))
    .limit(p.limit + 1);
  const rows = (await fromJobs(tx, {
    ...summaryColumns,
    openedByUserId: benchJobs.openedBy,
    sortValue: sql<string>`${openedAtKey.expr}::text`,
  })
    .where(and(eq(benchJobs.tenantId, currentTenant), sql`${benchJobs.id} = any(array(${page}))`))
    .orderBy(...keysetOrder(openedAtKey, benchJobs.id, 'desc'))) as unknown as (BenchJobSummaryRow & { sortValue: string })[];
  return toPage(rows, p.limit);
}

/** A board's jobs, newest first (bench_jobs_tenant_instance_idx): its page lists them. */
export async function listBenchJobsOfBoardInstance(tx: Tx, boardInstanceId: string) {
  return tx
    .select({
      id: benchJobs.id,
      templateName: benchJobs.templateName,
      state: benchJobs.state,
      openedAt: benchJobs.openedAt,
      finishedAt: benchJobs.finishedAt,
    })
    .from(benchJobs)
    .where(and(eq(benchJobs.tenantId, currentTenant), eq(benchJobs.boardInstanceId, boardInstanceId)))
    .orderBy(desc(benchJobs.openedAt), desc(benchJobs.id));
}

export async function insertBenchJob(
  tx: Tx,
  values: {
    boardInstanceId: string;
    templateId: string | null;
    templateName: string;
    steps: BenchStep[];
    origin: (typeof benchJobs.$inferInsert)['origin'];
    serviceCallId: string | null;
    draft: BenchJobDraft;
    openedBy: string | null;
  },
) {
  const [row] = await tx
    .insert(benchJobs)
    .values({ ...values, tenantId: sql`${currentTenant}` })
    .returning({ id: benchJobs.id });
  return row!.id;
}

/** Saves the draft at `version`; the new version, or undefined when another save came first. */
export async function saveBenchJobDraft(tx: Tx, id: string, version: number, draft: BenchJobDraft) {
  return (await updateAtVersion(tx, benchJobs, id, version, { draft }))?.version;
}

/** Marks the job finished at `version`; undefined when it moved on. */
export async function markBenchJobFinished(tx: Tx, id: string, version: number, finishedByUserId: string | null) {
  return (await updateAtVersion(tx, benchJobs, id, version, { state: 'finished', finishedBy: finishedByUserId, finishedAt: new Date() }))
    ?.version;
}

/**
 * The board's parts list as a job sees it: every part still on the list, and any taken off since that this job
 * recorded a reading on (a finished job keeps showing what it measured). By position.
 */
export async function listPartsForBenchJob(tx: Tx, boardId: string, jobId: string) {
  return tx
    .select({ ...boardPartColumns, removed: sql<boolean>`${boardParts.removedAt} is not null` })
    .from(boardParts)
    .where(
      and(
        eq(boardParts.tenantId, currentTenant),
        eq(boardParts.boardId, boardId),
        or(
          isNull(boardParts.removedAt),
          sql`exists (select 1 from part_readings r where r.tenant_id = ${boardParts.tenantId} and r.bench_job_id = ${jobId} and r.part_id = ${boardParts.id})`,
        ),
      ),
    )
    .orderBy(asc(boardParts.position), asc(boardParts.designator));
}

/** The readings a finished job recorded (part_readings_tenant_job_idx), in parts-list order. */
export async function listReadingsOfBenchJob(tx: Tx, jobId: string) {
  return tx
    .select({
      id: partReadings.id,
      partId: partReadings.partId,
      designator: boardParts.designator,
      measuredText: partReadings.measuredText,
      measured: partReadings.measured,
      unit: partReadings.unit,
      inCircuit: partReadings.inCircuit,
      indicative: partReadings.indicative,
      verdict: partReadings.verdict,
      min: partReadings.min,
      max: partReadings.max,
      deviationPercent: partReadings.deviationPercent,
      note: partReadings.note,
      takenAt: partReadings.takenAt,
    })
    .from(partReadings)
    .innerJoin(boardParts, and(eq(boardParts.tenantId, partReadings.tenantId), eq(boardParts.id, partReadings.partId)))
    .where(and(eq(partReadings.tenantId, currentTenant), eq(partReadings.benchJobId, jobId)))
    .orderBy(asc(boardParts.position), asc(partReadings.takenAt), asc(partReadings.id));
}

export async function insertBenchJobPartsUsed(
  tx: Tx,
  jobId: string,
  rows: readonly { partId: string | null; description: string; quantity: number; cataloguePartId?: string | null }[],
) {
  if (rows.length === 0) return;
  await tx.insert(benchJobPartsUsed).values(rows.map((r) => ({ ...r, jobId, tenantId: sql`${currentTenant}` })));
}

export async function listBenchJobPartsUsed(tx: Tx, jobId: string) {
  return tx
    .select({
      id: benchJobPartsUsed.id,
      partId: benchJobPartsUsed.partId,
      description: benchJobPartsUsed.description,
      quantity: benchJobPartsUsed.quantity,
    })
    .from(benchJobPartsUsed)
    .where(and(eq(benchJobPartsUsed.tenantId, currentTenant), eq(benchJobPartsUsed.jobId, jobId)))
    .orderBy(asc(benchJobPartsUsed.description), asc(benchJobPartsUsed.id));
}

export async function insertBenchJobPhoto(tx: Tx, p: Omit<typeof benchJobPhotos.$inferInsert, 'tenantId' | 'id' | 'createdAt'>) {
  const [row] = await tx
    .insert(benchJobPhotos)
    .values({ ...p, tenantId: sql`${currentTenant}` })
    .returning({ id: benchJobPhotos.id, createdAt: benchJobPhotos.createdAt });
  return row!;
}

/** A job's photos, oldest first (bench_job_photos_tenant_job_idx). */
export async function listBenchJobPhotos(tx: Tx, jobId: string) {
  return tx
    .select({
      id: benchJobPhotos.id,
      stepKey: benchJobPhotos.stepKey,
      thumbKey: benchJobPhotos.thumbKey,
      width: benchJobPhotos.width,
      height: benchJobPhotos.height,
      createdAt: benchJobPhotos.createdAt,
    })
    .from(benchJobPhotos)
    .where(and(eq(benchJobPhotos.tenantId, currentTenant), eq(benchJobPhotos.jobId, jobId)))
    .orderBy(asc(benchJobPhotos.createdAt), asc(benchJobPhotos.id));
}

export async function getBenchJobPhoto(tx: Tx, jobId: string, photoId: string) {
  const [row] = await tx
    .select()
    .from(benchJobPhotos)
    .where(and(eq(benchJobPhotos.tenantId, currentTenant), eq(benchJobPhotos.jobId, jobId), eq(benchJobPhotos.id, photoId)));
  return row;
}
