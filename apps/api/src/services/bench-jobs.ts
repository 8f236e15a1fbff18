// The bench-job workflow: open a job on a board from a template, save the draft as the technician types (raw text,
// nothing lost, no silent overwrite between devices), and finish it — every reading judged again against the
// parts list by the same domain code the screen uses, then written to the board's history in one transaction.
import { BENCH_DRAFT_MAX_BYTES, emptyStepProgress, type BenchDraftSaved } from '@bumperline/contracts/bench-jobs';
import type { BenchJobDraft, BenchStep } from '@bumperline/contracts/bench-vocabulary';
import type { Tx } from '@bumperline/db/client';
import {
  getBenchJob,
  insertBenchJob,
  insertBenchJobPartsUsed,
  listBenchJobPhotos,
  listPartsForBenchJob,
  markBenchJobFinished,
  saveBenchJobDraft,
  type BenchJobRow,
} from '@bumperline/db/queries/bench-jobs';
import { getBenchTemplate } from '@bumperline/db/queries/bench-templates';
import { getBoardInstance, updateBoardInstance } from '@bumperline/db/queries/board-instances';
import { getCallRow } from '@bumperline/db/queries/calls';
import { insertPartReadings, type PartReadingInsert } from '@bumperline/db/queries/part-readings';
import { diodeSetText, type BenchEvaluation } from '@bumperline/domain/components/bench-judgement';
import { benchJobView, judgeBenchDraft } from './bench-job-view.ts';
import { companyToday } from './company-today.ts';
import { recordKeepCost } from './keep-cost.ts';
import { takeBenchPartsOffVan } from './bench-parts-stock.ts';
import { Conflict, InvalidInput, NotFound } from './workflow-errors.ts';

export interface BenchActor {
  userId: string;
  tenantId: string;
}

type Field = { field: string; message: string };

/** Opens a job on a board: the template's name and steps are copied, so later edits to the template leave it alone. */
export async function openBenchJob(
  tx: Tx,
  p: { boardInstanceId: string; templateId: string; serviceCallId?: string | null; fromWorkOrder?: boolean; actor: BenchActor },
): Promise<string> {
  const board = await getBoardInstance(tx, p.boardInstanceId);
  if (!board) throw new NotFound('board');
  const template = await getBenchTemplate(tx, p.templateId);
  const problems: Field[] = [];
  if (!template) problems.push({ field: 'templateId', message: 'is not a bench-job template of this company' });
  if (p.serviceCallId) {
    const call = await getCallRow(tx, p.serviceCallId);
    if (!call || call.gameId !== board.gameId) {
      problems.push({ field: 'serviceCallId', message: `is not a service call on the game this ${board.boardName.toLowerCase()} is in` });
    }
  }
  if (problems.length || !template) throw new InvalidInput(problems);
  return insertBenchJob(tx, {
    boardInstanceId: board.id,
    templateId: template.id,
    templateName: template.name,
    steps: template.steps,
    origin: p.fromWorkOrder ? 'care_plan' : p.serviceCallId ? 'service_call' : 'game',
    serviceCallId: p.serviceCallId ?? null,
    draft: { steps: Object.fromEntries(template.steps.map((s) => [s.key, emptyStepProgress()])), partsUsed: [] },
    openedBy: p.actor.userId,
  });
}

async function jobOrThrow(tx: Tx, jobId: string): Promise<BenchJobRow> {
  const job = await getBenchJob(tx, jobId);
  if (!job) throw new NotFound('bench job');
  return job;
}

async function staleVersion(tx: Tx, jobId: string, sent: number): Promise<Conflict> {
  const current = await benchJobView(tx, jobId);
  return new Conflict('This bench job was saved on another device since you loaded it. Load that version to go on.', current, [
    { field: 'version', message: `is ${sent}, but the job is now at version ${current.version}` },
  ]);
}

async function refuseIfFinished(tx: Tx, job: BenchJobRow): Promise<void> {
  if (job.state === 'finished') {
    throw new Conflict('This bench job is finished: its record can no longer change.', await benchJobView(tx, job.id));
  }
}

/**
 * Saves what was typed, as typed: readings that do not read yet ("4k", "abc") are kept, so nothing is lost when the
 * job is resumed elsewhere. Refused only for what must never be stored: a step ticked done whose cautions were not
 * acknowledged, a step the job does not have, a draft past the size bound.
 */
export async function saveBenchDraft(tx: Tx, p: { jobId: string; version: number; draft: BenchJobDraft }): Promise<BenchDraftSaved> {
  const job = await jobOrThrow(tx, p.jobId);
  await refuseIfFinished(tx, job);
  const bytes = Buffer.byteLength(JSON.stringify(p.draft));
  if (bytes > BENCH_DRAFT_MAX_BYTES) {
    throw new InvalidInput([
      {
        field: 'draft',
        message: `is ${Math.ceil(bytes / 1000)} kB; a bench job's entries must stay under ${BENCH_DRAFT_MAX_BYTES / 1000} kB`,
      },
    ]);
  }
  // The same judgement as finishing, keeping only what a save refuses: the caution rule and unknown steps.
  const refused = judgeBenchDraft(job.steps, p.draft, []).problems.filter(
    (problem) => problem.field.endsWith('.acknowledged') || /^steps\.[^.]+$/.test(problem.field),
  );
  if (refused.length) throw new InvalidInput(refused);
  if (job.version !== p.version) throw await staleVersion(tx, job.id, p.version);
  const version = await saveBenchJobDraft(tx, job.id, p.version, p.draft);
  if (version === undefined) throw await staleVersion(tx, job.id, p.version);
  return { version, savedAt: new Date().toISOString() };
}

/** A step ticked done that asks for a photo needs one on it (the domain code does not see photos). */
async function missingPhotos(tx: Tx, job: BenchJobRow): Promise<Field[]> {
  const photoSteps = job.steps.filter((s) => s.record === 'photo' && job.draft.steps[s.key]?.done);
  if (!photoSteps.length) return [];
  const withPhotos = new Set((await listBenchJobPhotos(tx, job.id)).map((photo) => photo.stepKey));
  return photoSteps
    .filter((s) => !withPhotos.has(s.key))
    .map((s) => ({ field: `steps.${s.key}.photos`, message: 'add a photo before ticking this step' }));
}

/**
 * The recap rule: a job recaps its board when one of its steps replaces the electrolytics — a step whose parts
 * include the electrolytic kind and that records parts used or a check — and that step was ticked done. Finishing
 * such a job sets the board's last recap to the company's today, from which its next recap falls due.
 */
export function recapsBoard(steps: readonly BenchStep[], draft: BenchJobDraft): boolean {
  return steps.some(
    (s) => s.partKinds.includes('electrolytic') && (s.record === 'parts_used' || s.record === 'check') && draft.steps[s.key]?.done === true,
  );
}

function readingRows(job: BenchJobRow, evaluation: BenchEvaluation, takenBy: string): PartReadingInsert[] {
  const common = { boardInstanceId: job.boardInstanceId, benchJobId: job.id, takenBy };
  return [
    ...evaluation.readings.map((r) => ({
      ...common,
      partId: r.partId,
      measuredText: r.text,
      measured: r.measured,
      unit: r.unit,
      inCircuit: r.inCircuit,
      verdict: r.verdict,
      indicative: r.indicative,
      min: r.min,
      max: r.max,
      deviationPercent: r.deviationPercent,
      note: r.note,
    })),
    // A diode or bridge is judged as a set: one row, its readings as typed, no single value or window.
    ...evaluation.diodeSets.map((d) => ({
      ...common,
      partId: d.partId,
      measuredText: diodeSetText(d.readings),
      measured: null,
      unit: null,
      inCircuit: false,
      verdict: d.verdict ?? 'fail',
      indicative: false,
      min: null,
      max: null,
      deviationPercent: null,
      note: d.detail,
    })),
  ];
}

/**
 * Finishes the job from its saved draft at `version`. Every problem is reported at once (400, each field named) and
 * nothing is written; otherwise the readings, the parts used, the finished state and (for a recap) the board's
 * last recap date are written together.
 */
export async function finishBenchJob(tx: Tx, p: { jobId: string; version: number; actor: BenchActor }) {
  const job = await jobOrThrow(tx, p.jobId);
  await refuseIfFinished(tx, job);
  if (job.version !== p.version) throw await staleVersion(tx, job.id, p.version);
  const board = await getBoardInstance(tx, job.boardInstanceId);
  if (!board) throw new NotFound('board');
  const parts = await listPartsForBenchJob(tx, board.boardId, job.id);
  const evaluation = judgeBenchDraft(job.steps, job.draft, parts);
  const problems = [...evaluation.problems, ...(await missingPhotos(tx, job))];
  if (problems.length) throw new InvalidInput(problems);

  await insertPartReadings(tx, readingRows(job, evaluation, p.actor.userId));
  await insertBenchJobPartsUsed(
    tx,
    job.id,
    job.draft.partsUsed.map((u) => ({
      partId: u.partId,
      description: u.description.trim(),
      quantity: u.quantity,
      cataloguePartId: u.cataloguePartId ?? null,
    })),
  );
  await takeBenchPartsOffVan(tx, p.actor, job.id, job.draft.partsUsed);
  if ((await markBenchJobFinished(tx, job.id, p.version, p.actor.userId)) === undefined) throw await staleVersion(tx, job.id, p.version);
  if (board.gameId)
    await recordKeepCost(tx, {
      source: 'bench_job',
      sourceId: job.id,
      gameId: board.gameId,
      labourMinutes: 0,
      technicianId: p.actor.userId,
    });
  if (recapsBoard(job.steps, job.draft)) {
    const today = await companyToday(tx, p.actor.tenantId);
    if (!(await updateBoardInstance(tx, board.id, board.version, { lastRecapOn: today }))) {
      throw new Conflict('The board was edited at the same moment. Finish the job again.');
    }
  }
  return benchJobView(tx, job.id);
}
