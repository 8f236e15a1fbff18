// Bench jobs: the list, opening one on a board, the job itself, saving its draft, finishing it, photos on its steps
// and its sheet as PDF. Thin: parse, call the service, record the audit, return.
import { Router } from 'express';
import sharp from 'sharp';
import { benchDraftSave, benchJobFinish, benchJobListQuery, benchJobOpen, benchPhotoFields } from '@bumperline/contracts/bench-jobs';
import { recordAudit } from '@bumperline/db/queries/audit';
import { getBenchJobPhoto, listBenchJobPhotos, listBenchJobs } from '@bumperline/db/queries/bench-jobs';
import { getCompanyLocale } from '@bumperline/db/queries/companies';
import { NotFoundError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import { type makeScoped } from '../http/guards.ts';
import { takePhoto, takenPhoto } from '../http/photo-upload.ts';
import { benchJobView } from '../services/bench-job-view.ts';
import { finishBenchJob, openBenchJob, saveBenchDraft } from '../services/bench-jobs.ts';
import { jobSheetPdf } from '../services/bench-job-sheet.ts';
import { addBenchPhoto } from '../services/bench-photos.ts';
import type { PhotoStore } from '../services/photo-store.ts';
import { pdfFileName } from '../services/pdf-sheet.ts';

/** The company's clock for the sheet: "12 Mar 2027, 14:05". */
function formatterFor(locale: string, timeZone: string): (iso: string) => string {
  const options: Intl.DateTimeFormatOptions = { dateStyle: 'medium', timeStyle: 'short' };
  let format: Intl.DateTimeFormat;
  try {
    format = new Intl.DateTimeFormat(locale, { ...options, timeZone });
  } catch {
    format = new Intl.DateTimeFormat('en-US', { ...options, timeZone: 'UTC' });
  }
  return (iso) => format.format(new Date(iso));
}

export function benchJobsRouter(deps: { scoped: ReturnType<typeof makeScoped>; photos: PhotoStore }): Router {
  const { scoped, photos } = deps;
  const r = Router();
  // Read and prepared before the transaction opens, with the role checked first (http/photo-upload.ts).
  const takeStepPhoto = takePhoto('bench:work', { stepKey: 'The step' });

  r.get(
    '/',
    scoped('bench:read', async ({ tx, req }) => {
      const page = await listBenchJobs(tx, parse(benchJobListQuery, req.query));
      return {
        ...page,
        items: page.items.map((j) => ({ ...j, openedAt: j.openedAt.toISOString(), finishedAt: j.finishedAt?.toISOString() ?? null })),
      };
    }),
  );

  r.post(
    '/',
    scoped(
      'bench:work',
      async ({ tx, req, actor }) => {
        const input = parse(benchJobOpen, req.body);
        const id = await openBenchJob(tx, { ...input, actor });
        const job = await benchJobView(tx, id);
        await recordAudit(tx, {
          actorUserId: actor.userId,
          action: 'open',
          entity: 'bench_job',
          entityId: id,
          after: {
            boardInstanceId: job.boardInstanceId,
            templateName: job.templateName,
            origin: job.origin,
            serviceCallId: job.serviceCallId,
          },
        });
        return job;
      },
      201,
    ),
  );

  r.get(
    '/:id',
    scoped('bench:read', ({ tx, req }) => benchJobView(tx, idParam(req))),
  );

  r.put(
    '/:id/draft',
    scoped('bench:work', async ({ tx, req }) => {
      const id = idParam(req);
      const { version, draft } = parse(benchDraftSave, req.body);
      return saveBenchDraft(tx, { jobId: id, version, draft });
    }),
  );

  r.post(
    '/:id/finish',
    scoped('bench:work', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const { version } = parse(benchJobFinish, req.body);
      const job = await finishBenchJob(tx, { jobId: id, version, actor });
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'finish',
        entity: 'bench_job',
        entityId: id,
        after: { readings: job.evaluation?.readings.length ?? 0, partsUsed: job.draft.partsUsed.length },
      });
      return job;
    }),
  );

  r.post(
    '/:id/photos',
    takeStepPhoto,
    scoped(
      'bench:work',
      async ({ tx, req, res, actor }) => {
        const id = idParam(req);
        const { stepKey } = parse(benchPhotoFields, req.body);
        const written: string[] = [];
        try {
          const photo = await addBenchPhoto(tx, photos, {
            jobId: id,
            stepKey,
            photo: takenPhoto(res),
            uploadedBy: actor.userId,
            written,
          });
          return { photo };
        } catch (err) {
          // Nothing of a photo that was not recorded may stay on disk.
          await Promise.all(written.map((key) => photos.remove(key).catch(() => {})));
          throw err;
        }
      },
      201,
    ),
  );

  const sendPhoto = (thumb: boolean) =>
    scoped('bench:read', async ({ tx, req, res }) => {
      const photo = await getBenchJobPhoto(tx, idParam(req), idParam(req, 'photoId'));
      if (!photo) throw new NotFoundError('photo');
      res.type(thumb ? 'image/webp' : photo.contentType);
      res.setHeader('Cache-Control', 'private, max-age=3600');
      res.send(await photos.read(thumb ? photo.thumbKey : photo.storageKey));
      return undefined;
    });
  r.get('/:id/photos/:photoId', sendPhoto(false));
  r.get('/:id/photos/:photoId/thumb', sendPhoto(true));

  r.get(
    '/:id/sheet.pdf',
    scoped('bench:read', async ({ tx, req, res, actor }) => {
      const job = await benchJobView(tx, idParam(req));
      const company = await getCompanyLocale(tx, actor.tenantId);
      const thumbnails = new Map<string, Buffer>();
      for (const p of await listBenchJobPhotos(tx, job.id)) {
        // pdfkit embeds JPEG and PNG; the thumbnails are kept as WebP.
        const webp = await photos.read(p.thumbKey).catch(() => undefined);
        if (webp) thumbnails.set(p.id, await sharp(webp).jpeg({ quality: 80 }).toBuffer());
      }
      const pdf = await jobSheetPdf({ job, when: formatterFor(company?.locale ?? 'en-US', company?.timeZone ?? 'UTC'), thumbnails });
      res
        .status(200)
        .type('application/pdf')
        .set('Content-Disposition', `inline; filename="${pdfFileName(`${job.templateName}-${job.boardSerial}`)}.pdf"`)
        .set('Cache-Control', 'no-store')
        .send(pdf);
      return undefined;
    }),
  );

  return r;
}
