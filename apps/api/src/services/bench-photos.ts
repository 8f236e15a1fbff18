// Photos on a bench job's steps, taken in exactly as a report's photos are (photo-intake.ts: checked by content,
// re-encoded without metadata, shrunk, with a thumbnail) and kept in the same photo store.
import type { BenchJobPhoto } from '@bumperline/contracts/bench-jobs';
import type { Tx } from '@bumperline/db/client';
import { getBenchJob, insertBenchJobPhoto } from '@bumperline/db/queries/bench-jobs';
import { storePreparedPhoto, type PreparedPhoto } from './photo-intake.ts';
import type { PhotoStore } from './photo-store.ts';
import { benchPhotoUrl, benchThumbUrl } from './bench-job-view.ts';
import { Conflict, InvalidInput, NotFound } from './workflow-errors.ts';

/**
 * Stores a prepared photo on a step of an open job. `written` collects the stored keys so the caller can remove
 * them when the transaction does not commit.
 */
export async function addBenchPhoto(
  tx: Tx,
  store: PhotoStore,
  p: { jobId: string; stepKey: string; photo: PreparedPhoto; uploadedBy: string; written: string[] },
): Promise<BenchJobPhoto> {
  const job = await getBenchJob(tx, p.jobId);
  if (!job) throw new NotFound('bench job');
  if (job.state === 'finished') throw new Conflict('This bench job is finished: its record can no longer change.');
  if (!job.steps.some((s) => s.key === p.stepKey))
    throw new InvalidInput([{ field: 'stepKey', message: 'is not a step of this bench job' }]);
  const stored = await storePreparedPhoto(store, p.photo, p.written);
  const row = await insertBenchJobPhoto(tx, { jobId: job.id, stepKey: p.stepKey, ...stored, uploadedBy: p.uploadedBy });
  return {
    id: row.id,
    stepKey: p.stepKey,
    url: benchPhotoUrl(job.id, row.id),
    thumbUrl: benchThumbUrl(job.id, row.id),
    width: p.photo.width,
    height: p.photo.height,
    createdAt: row.createdAt.toISOString(),
  };
}
