// Bench-job templates (ordered steps with what each records and its cautions) and bench jobs (one board's
// overhaul: the steps copied from a template, the draft saved as the technician types, the readings and parts
// used written when it is finished).
import { z } from 'zod';
import { isoDateTime, pageOf, requiredText, rowVersion, shortText, uuid } from './common.ts';
import { partRow } from './parts-lists.ts';
import {
  benchJobOrigins,
  benchJobStates,
  cautionKinds,
  partKinds,
  readingVerdicts,
  stepRecordKinds,
  type BenchJobDraft,
  type BenchPartUsed,
  type BenchStep,
  type BenchStepProgress,
} from './bench-vocabulary.ts';

// Re-exported so that server code finds the whole bench contract here; screens import bench-vocabulary.ts.
export { benchJobOrigins, benchJobStates, cautionKinds, partKinds, readingVerdicts, stepRecordKinds } from './bench-vocabulary.ts';
export type { BenchJobDraft, BenchPartUsed, BenchStep, BenchStepProgress } from './bench-vocabulary.ts';

/** The record kinds that concern particular parts: such a step must say which (by kind or by designator). */
export const recordKindsNeedingParts = ['readings', 'diode_set', 'fuse', 'power'] as const;

/** A step's key becomes part of field names (`steps.<key>.readings.<partId>`): lower case, digits and hyphens. */
export const benchStepKey = z
  .string()
  .trim()
  .min(1, { error: 'is required' })
  .max(40, { error: 'must be at most 40 characters' })
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, { error: 'must be lower-case letters, digits and hyphens ("measure-resistors")' });

const unique = <T extends string>(values: T[]) => new Set(values).size === values.length;

export const benchStep = z
  .strictObject({
    key: benchStepKey,
    title: requiredText(120),
    instructions: shortText(4000).default(''),
    record: z.enum(stepRecordKinds, { error: `must be one of ${stepRecordKinds.join(', ')}` }),
    partKinds: z
      .array(z.enum(partKinds, { error: `must be one of ${partKinds.join(', ')}` }))
      .max(partKinds.length)
      .refine(unique, { error: 'lists a part kind twice' })
      .default([]),
    designators: z
      .array(requiredText(20))
      .max(200, { error: 'must list at most 200 designators' })
      .refine(unique, { error: 'lists a designator twice' })
      .default([]),
    cautions: z
      .array(z.enum(cautionKinds, { error: `must be one of ${cautionKinds.join(', ')}` }))
      .max(cautionKinds.length)
      .refine(unique, { error: 'lists a caution twice' })
      .default([]),
  })
  .check((ctx) => {
    const step = ctx.value;
    if ((recordKindsNeedingParts as readonly string[]).includes(step.record) && !step.partKinds.length && !step.designators.length) {
      ctx.issues.push({
        code: 'custom',
        input: step.partKinds,
        path: ['partKinds'],
        message: 'must name the part kinds or the designators this step measures',
      });
    }
  }) satisfies z.ZodType<BenchStep>;

/** Steps in order; keys unique within the template (each duplicate is named at its own `steps.<i>.key`). */
export const benchSteps = z
  .array(benchStep)
  .min(1, { error: 'must have at least one step' })
  .max(60, { error: 'must have at most 60 steps' })
  .check((ctx) => {
    const seen = new Set<string>();
    ctx.value.forEach((step, i) => {
      if (seen.has(step.key)) {
        ctx.issues.push({ code: 'custom', input: step.key, path: [i, 'key'], message: `repeats the key "${step.key}" of an earlier step` });
      }
      seen.add(step.key);
    });
  });

/** POST /api/bench-templates. */
export const benchTemplateInput = z.strictObject({
  name: requiredText(120),
  description: shortText(2000).default(''),
  steps: benchSteps,
});
export type BenchTemplateInput = z.input<typeof benchTemplateInput>;

/** PUT /api/bench-templates/:id: the whole template again, with the version it was loaded at. */
export const benchTemplateUpdate = benchTemplateInput.extend({ version: rowVersion });
export type BenchTemplateUpdate = z.input<typeof benchTemplateUpdate>;

/** As stored (output side: defaults already applied). */
const benchStepOut = z.strictObject({
  key: z.string(),
  title: z.string(),
  instructions: z.string(),
  record: z.enum(stepRecordKinds),
  partKinds: z.array(z.enum(partKinds)),
  designators: z.array(z.string()),
  cautions: z.array(z.enum(cautionKinds)),
}) satisfies z.ZodType<BenchStep>;

export const benchTemplate = z.strictObject({
  id: uuid,
  name: z.string(),
  description: z.string(),
  steps: z.array(benchStepOut),
  version: z.number().int(),
  createdAt: isoDateTime,
  updatedAt: isoDateTime,
});
export type BenchTemplate = z.infer<typeof benchTemplate>;

export const benchTemplateSummary = z.strictObject({
  id: uuid,
  name: z.string(),
  description: z.string(),
  stepCount: z.number().int(),
  version: z.number().int(),
  updatedAt: isoDateTime,
});
export type BenchTemplateSummary = z.infer<typeof benchTemplateSummary>;
/** GET /api/bench-templates/:id/sheet.pdf?boardId=…: printed for one board's parts list (a model's board), or blank. */
export const benchTemplateSheetQuery = z.strictObject({ boardId: uuid.optional() });

/** GET /api/bench-templates: every template of the company, by name (a company keeps a handful). */
export const benchTemplateList = z.strictObject({ items: z.array(benchTemplateSummary) });
export type BenchTemplateList = z.infer<typeof benchTemplateList>;

// ---- The draft: raw text as typed, bounded in size, never judged when saved (finishing judges it). ----

/** The largest draft a save accepts, as JSON bytes (a whole 400-part board's readings fit easily). */
export const BENCH_DRAFT_MAX_BYTES = 90_000;

const typedText = z.string().max(100, { error: 'must be at most 100 characters' });
const mapKey = z.string().max(64);

export const benchStepProgress = z.strictObject({
  done: z.boolean(),
  acknowledged: z.boolean(),
  answer: z.enum(['yes', 'no']).nullable(),
  note: z.string().max(4000, { error: 'must be at most 4000 characters' }),
  readings: z.record(mapKey, z.strictObject({ text: typedText, inCircuit: z.boolean() })),
  diodes: z.record(mapKey, z.record(mapKey, typedText)),
  fuses: z.record(mapKey, z.strictObject({ fitted: typedText })),
  power: z.record(mapKey, z.strictObject({ volts: typedText })),
}) satisfies z.ZodType<BenchStepProgress>;

export const benchPartUsed = z.strictObject({
  partId: uuid.nullable(),
  /** May be empty while the line is being filled in; finishing requires it. */
  description: z.string().max(200, { error: 'must be at most 200 characters' }),
  quantity: z
    .number({ error: 'must be a number' })
    .int({ error: 'must be a whole number' })
    .min(1, { error: 'must be at least 1' })
    .max(999),
  cataloguePartId: uuid.nullable().optional(),
}) satisfies z.ZodType<BenchPartUsed>;

export const benchJobDraft = z.strictObject({
  steps: z.record(mapKey, benchStepProgress),
  partsUsed: z.array(benchPartUsed).max(200, { error: 'must list at most 200 parts' }),
}) satisfies z.ZodType<BenchJobDraft>;

/** An empty step progress: what a job starts with for every step. */
export function emptyStepProgress(): BenchStepProgress {
  return { done: false, acknowledged: false, answer: null, note: '', readings: {}, diodes: {}, fuses: {}, power: {} };
}

// ---- Requests on jobs ----

/** POST /api/bench-jobs: from a game (the board's game) or from a service call on that game. */
export const benchJobOpen = z.strictObject({
  boardInstanceId: uuid,
  templateId: uuid,
  serviceCallId: uuid.nullable().optional(),
});
export type BenchJobOpen = z.input<typeof benchJobOpen>;

/** PUT /api/bench-jobs/:id/draft. A stale version → 409 naming `version`, `current` = the job as it now is. */
export const benchDraftSave = z.strictObject({ version: rowVersion, draft: benchJobDraft });
export type BenchDraftSave = z.input<typeof benchDraftSave>;
export const benchDraftSaved = z.strictObject({ version: z.number().int(), savedAt: isoDateTime });
export type BenchDraftSaved = z.infer<typeof benchDraftSaved>;

/** POST /api/bench-jobs/:id/finish: judges the saved draft; any problem → 400 naming every field, nothing saved. */
export const benchJobFinish = z.strictObject({ version: rowVersion });
export type BenchJobFinish = z.input<typeof benchJobFinish>;

/** GET /api/bench-jobs. Newest opened first. */
export const benchJobListQuery = z.strictObject({
  state: z.enum(benchJobStates).optional(),
  boardInstanceId: uuid.optional(),
  cursor: z.string().max(500).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(25),
});
export type BenchJobListQuery = z.input<typeof benchJobListQuery>;

/** POST /api/bench-jobs/:id/photos is multipart: `photo` (the file) and this field. */
export const benchPhotoFields = z.strictObject({ stepKey: benchStepKey });

// ---- Responses ----

/** A line of the board's parts list, as written, with its id: the screen judges readings against it live. */
export const benchJobPart = partRow.extend({
  /** Taken off the parts list since (kept on a finished job whose readings name it). */
  removed: z.boolean(),
});
export type BenchJobPart = z.infer<typeof benchJobPart>;

export const benchJobPhoto = z.strictObject({
  id: uuid,
  stepKey: z.string(),
  /** Authorised addresses under /api/bench-jobs/:id/photos/:photoId(/thumb). */
  url: z.string(),
  thumbUrl: z.string(),
  width: z.number().int(),
  height: z.number().int(),
  createdAt: isoDateTime,
});
export type BenchJobPhoto = z.infer<typeof benchJobPhoto>;

/** The part and the step a judged result belongs to: every result of a finished job starts with these. */
const judgedOnPart = {
  partId: uuid,
  designator: z.string(),
  stepKey: z.string(),
};

/** A value read on a part and judged against its window (also a diode or bridge judged as a set: no value). */
export const benchReading = z.strictObject({
  ...judgedOnPart,
  /** As typed: "570", "4.63k"; a diode set's readings joined: "forward 0.55 / reverse OL". */
  measuredText: z.string(),
  measured: z.number().nullable(),
  unit: z.string().nullable(),
  inCircuit: z.boolean(),
  /** In-circuit readings that parallel paths can pull low: a hint, not a verdict to act on alone. */
  indicative: z.boolean(),
  verdict: z.enum(readingVerdicts),
  min: z.number().nullable(),
  max: z.number().nullable(),
  /** "540 Ω – 660 Ω"; null for a diode set. */
  windowText: z.string().nullable(),
  deviationPercent: z.number().nullable(),
  note: z.string().nullable(),
});
export type BenchReading = z.infer<typeof benchReading>;

export const benchFuseCheck = z.strictObject({
  ...judgedOnPart,
  /** The marking on the parts list ("T2.5A 250V") and the one fitted. */
  specified: z.string(),
  fitted: z.string(),
  accepted: z.boolean(),
  reasons: z.array(z.string()),
});
export type BenchFuseCheck = z.infer<typeof benchFuseCheck>;

export const benchPowerCheck = z.strictObject({
  ...judgedOnPart,
  voltsText: z.string(),
  watts: z.number(),
  ratingWatts: z.number().nullable(),
  allowedWatts: z.number().nullable(),
  undersized: z.boolean(),
  message: z.string(),
});
export type BenchPowerCheck = z.infer<typeof benchPowerCheck>;

/** What finishing recorded: readings (and diode sets) as stored in the board's history, fuse and power checks. */
export const benchJobEvaluation = z.strictObject({
  readings: z.array(benchReading),
  fuses: z.array(benchFuseCheck),
  power: z.array(benchPowerCheck),
});
export type BenchJobEvaluation = z.infer<typeof benchJobEvaluation>;

export const benchJob = z.strictObject({
  id: uuid,
  boardInstanceId: uuid,
  boardName: z.string(),
  boardSerial: z.string(),
  gameId: uuid.nullable(),
  /** "Starlight Rally · SR-1042": the model's title and the game's serial. */
  gameLabel: z.string().nullable(),
  serviceCallId: uuid.nullable(),
  origin: z.enum(benchJobOrigins),
  state: z.enum(benchJobStates),
  templateId: uuid.nullable(),
  templateName: z.string(),
  /** The steps as they were when the job opened. */
  steps: z.array(benchStepOut),
  draft: benchJobDraft,
  version: z.number().int(),
  parts: z.array(benchJobPart),
  photos: z.array(benchJobPhoto),
  /** Null while the job is in progress. */
  evaluation: benchJobEvaluation.nullable(),
  openedBy: z.string().nullable(),
  openedAt: isoDateTime,
  updatedAt: isoDateTime,
  finishedBy: z.string().nullable(),
  finishedAt: isoDateTime.nullable(),
});
export type BenchJob = z.infer<typeof benchJob>;

export const benchJobSummary = z.strictObject({
  id: uuid,
  boardInstanceId: uuid,
  boardName: z.string(),
  boardSerial: z.string(),
  gameId: uuid.nullable(),
  gameLabel: z.string().nullable(),
  serviceCallId: uuid.nullable(),
  origin: z.enum(benchJobOrigins),
  state: z.enum(benchJobStates),
  templateName: z.string(),
  openedBy: z.string().nullable(),
  /** Who opened it, to put the signed-in person's own jobs first (names can repeat). */
  openedByUserId: uuid.nullable(),
  openedAt: isoDateTime,
  finishedBy: z.string().nullable(),
  finishedAt: isoDateTime.nullable(),
});
export type BenchJobSummary = z.infer<typeof benchJobSummary>;
export const benchJobPage = pageOf(benchJobSummary);
export type BenchJobPage = z.infer<typeof benchJobPage>;

export const benchPhotoUploaded = z.strictObject({ photo: benchJobPhoto });
export type BenchPhotoUploaded = z.infer<typeof benchPhotoUploaded>;
