// A bench job as the screens and the job sheet see it: the job, its board's parts list (to judge readings live),
// its photos, and once finished what it recorded. Readings come from the board's history (part_readings, as judged
// when the job was finished); fuse and power checks, which are not readings of a value, are judged again from the
// job's frozen draft by the same domain code.
import type { BenchJob, BenchJobEvaluation, BenchJobPart } from '@bumperline/contracts/bench-jobs';
import type { BenchJobDraft } from '@bumperline/contracts/bench-vocabulary';
import type { Tx } from '@bumperline/db/client';
import {
  getBenchJob,
  listBenchJobPhotos,
  listPartsForBenchJob,
  listReadingsOfBenchJob,
  type BenchJobRow,
} from '@bumperline/db/queries/bench-jobs';
import { evaluateBenchJob, formatWindow, type BenchEvaluation, type BenchPart } from '@bumperline/domain/components/bench-judgement';
import { readPartEntry } from '@bumperline/domain/components/parts-list-entry';
import type { Unit } from '@bumperline/domain/components/values';
import { isDomainError } from '@bumperline/domain/errors';
import { NotFound } from './workflow-errors.ts';

export const benchPhotoUrl = (jobId: string, photoId: string) => `/api/bench-jobs/${jobId}/photos/${photoId}`;
export const benchThumbUrl = (jobId: string, photoId: string) => `/api/bench-jobs/${jobId}/photos/${photoId}/thumb`;

/** The parts list read by the domain code: the parts it can judge, and why the others cannot be (by part id). */
export function readBenchParts(parts: readonly BenchJobPart[]): { specs: BenchPart[]; unreadable: Map<string, string> } {
  const specs: BenchPart[] = [];
  const unreadable = new Map<string, string>();
  for (const part of parts) {
    try {
      specs.push({ ...readPartEntry(part), id: part.id });
    } catch (err) {
      if (!isDomainError(err)) throw err;
      unreadable.set(part.id, `${part.designator} does not read on the parts list (${err.message}): correct the parts list first`);
    }
  }
  return { specs, unreadable };
}

/** evaluateBenchJob over a job's steps and draft; a part whose parts-list line does not read is named at its field. */
export function judgeBenchDraft(steps: BenchJobRow['steps'], draft: BenchJobDraft, parts: readonly BenchJobPart[]): BenchEvaluation {
  const { specs, unreadable } = readBenchParts(parts);
  const evaluation = evaluateBenchJob({ steps, draft, parts: specs });
  if (unreadable.size === 0) return evaluation;
  const problems = evaluation.problems.map((p) => {
    const partId = /^steps\.[^.]+\.(?:readings|diodes|fuses|power)\.([^.]+)$/.exec(p.field)?.[1];
    const why = partId ? unreadable.get(partId) : undefined;
    return why ? { field: p.field, message: why } : p;
  });
  return { ...evaluation, problems };
}

/** The step a finished job recorded a part's reading on (its draft is frozen once finished). */
function stepOfPart(draft: BenchJobDraft, partId: string): string {
  for (const [key, progress] of Object.entries(draft.steps)) {
    if (progress.readings[partId]?.text.trim() || Object.values(progress.diodes[partId] ?? {}).some((t) => t.trim())) return key;
  }
  return '';
}

/**
 * The fuse and power checks of a finished job, judged again from its frozen draft. Only those steps, and the parts
 * they may concern (of their kinds or named by them), are read: readings and diode sets are stored rows already, and
 * reading every line of a long parts list again on each view was most of the work of showing a job.
 */
function judgeChecks(job: BenchJobRow, parts: readonly BenchJobPart[]): BenchEvaluation {
  const steps = job.steps.filter((s) => s.record === 'fuse' || s.record === 'power');
  const kinds = new Set<string>(steps.flatMap((s) => s.partKinds));
  const named = new Set(steps.flatMap((s) => s.designators.map((d) => d.trim().toUpperCase())));
  const concerned = parts.filter((p) => kinds.has(p.kind) || named.has(p.designator.toUpperCase()));
  const draft = {
    ...job.draft,
    steps: Object.fromEntries(steps.flatMap((s) => (job.draft.steps[s.key] ? [[s.key, job.draft.steps[s.key]!]] : []))),
  };
  return judgeBenchDraft(steps, draft, concerned);
}

async function evaluationOf(tx: Tx, job: BenchJobRow, parts: BenchJobPart[]): Promise<BenchJobEvaluation> {
  const stored = await listReadingsOfBenchJob(tx, job.id);
  const judged = judgeChecks(job, parts);
  const specified = new Map(parts.map((p) => [p.id, p.value]));
  return {
    readings: stored.map((r) => ({
      partId: r.partId,
      designator: r.designator,
      stepKey: stepOfPart(job.draft, r.partId),
      measuredText: r.measuredText,
      measured: r.measured,
      unit: r.unit,
      inCircuit: r.inCircuit,
      indicative: r.indicative,
      verdict: r.verdict,
      min: r.min,
      max: r.max,
      windowText: r.min !== null && r.max !== null && r.unit ? formatWindow(r.min, r.max, r.unit as Unit) : null,
      deviationPercent: r.deviationPercent,
      note: r.note,
    })),
    fuses: judged.fuses.map((f) => ({
      partId: f.partId,
      designator: f.designator,
      stepKey: f.stepKey,
      specified: specified.get(f.partId) ?? '',
      fitted: f.fittedText,
      accepted: f.accepted,
      reasons: f.reasons,
    })),
    power: judged.power.map((p) => ({
      partId: p.partId,
      designator: p.designator,
      stepKey: p.stepKey,
      voltsText: p.voltsText,
      watts: p.watts,
      ratingWatts: p.ratingWatts,
      allowedWatts: p.allowedWatts,
      undersized: p.undersized,
      message: p.message,
    })),
  };
}

/** The job as GET /api/bench-jobs/:id answers it. */
export async function benchJobView(tx: Tx, jobId: string): Promise<BenchJob> {
  const job = await getBenchJob(tx, jobId);
  if (!job) throw new NotFound('bench job');
  const parts = await listPartsForBenchJob(tx, job.boardId, job.id);
  const photos = await listBenchJobPhotos(tx, job.id);
  const { boardId: _boardId, ...fields } = job;
  return {
    ...fields,
    parts,
    photos: photos.map((p) => ({
      id: p.id,
      stepKey: p.stepKey,
      url: benchPhotoUrl(job.id, p.id),
      thumbUrl: benchThumbUrl(job.id, p.id),
      width: p.width,
      height: p.height,
      createdAt: p.createdAt.toISOString(),
    })),
    evaluation: job.state === 'finished' ? await evaluationOf(tx, job, parts) : null,
    openedAt: job.openedAt.toISOString(),
    updatedAt: job.updatedAt.toISOString(),
    finishedAt: job.finishedAt?.toISOString() ?? null,
  };
}
