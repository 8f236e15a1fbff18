// Bench rows made fresh for one probe of an endpoint that changes them (a job whose draft is saved or that is
// finished), and a photo on a bench job sent through the app, so that the app's own photo store holds the file.
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { benchJobs, benchTemplates } from '@bumperline/db/schema/index';
import { JSON_HEADERS, type Agent } from './app.ts';
import type { TestDatabase } from './database.ts';
import type { FullCompany } from './full-company.ts';

const emptyProgress = () => ({ done: false, acknowledged: false, answer: null, note: '', readings: {}, diodes: {}, fuses: {}, power: {} });

/** A new job in progress (version 1) on the full company's board, from its template, with nothing entered. */
export async function freshBenchJob(db: TestDatabase, company: FullCompany): Promise<string> {
  const [template] = await db.owner
    .select({ name: benchTemplates.name, steps: benchTemplates.steps })
    .from(benchTemplates)
    .where(and(eq(benchTemplates.tenantId, company.tenantId), eq(benchTemplates.id, company.bench.templateId)));
  const [job] = await db.owner
    .insert(benchJobs)
    .values({
      tenantId: company.tenantId,
      boardInstanceId: company.bench.boardInstanceId,
      templateId: company.bench.templateId,
      templateName: template!.name,
      steps: template!.steps,
      origin: 'game',
      draft: { steps: Object.fromEntries(template!.steps.map((s) => [s.key, emptyProgress()])), partsUsed: [] },
    })
    .returning({ id: benchJobs.id });
  return job!.id;
}

/** An empty draft for the full company's template (its one step, "measure"). */
export const emptyBenchDraft = () => ({ steps: { measure: emptyProgress() }, partsUsed: [] });

/** A small PNG, as a phone might send. */
export const samplePng = () =>
  sharp({ create: { width: 40, height: 30, channels: 3, background: '#8a7' } })
    .png()
    .toBuffer();

/** Sends a photo on the full company's job in progress (step "measure"); the request, for its status. */
export async function sendBenchPhoto(agent: Agent, company: FullCompany) {
  return agent
    .post(`/api/bench-jobs/${company.bench.benchJobId}/photos`)
    .set(JSON_HEADERS)
    .field('stepKey', 'measure')
    .attach('photo', await samplePng(), { filename: 'board.png', contentType: 'image/png' });
}

const sent = new Map<string, Promise<{ jobId: string; photoId: string }>>();
/** One photo on the full company's job, sent once (per company) through the app as the given, allowed, person. */
export function benchPhotoOnce(agent: Agent, company: FullCompany): Promise<{ jobId: string; photoId: string }> {
  let photo = sent.get(company.tenantId);
  if (!photo) {
    photo = sendBenchPhoto(agent, company).then((res) => {
      if (res.status !== 201) throw new Error(`the bench photo was refused: ${res.status} ${res.text}`);
      return { jobId: company.bench.benchJobId, photoId: (res.body as { photo: { id: string } }).photo.id };
    });
    sent.set(company.tenantId, photo);
  }
  return photo;
}
