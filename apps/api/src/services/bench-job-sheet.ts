// The record of a finished bench job as a printable sheet: each step with its cautions and whether they were
// acknowledged, the readings with their windows, deviations and verdicts (an out-of-tolerance part says so in
// words, not only by weight), diode sets, fuse and power checks, parts used, photo thumbnails, who and when.
import type { BenchJob, BenchReading } from '@bumperline/contracts/bench-jobs';
import { cautionsDeferral } from '@bumperline/contracts/bench-cautions';
import { stepRecordLabels } from '@bumperline/contracts/bench-vocabulary';
import { formatDeviation, storedReadingText } from '@bumperline/domain/components/bench-judgement';
import {
  cautionsAcknowledged,
  contentWidth,
  facts,
  heading,
  keepSpace,
  MARGIN,
  newSheet,
  paragraph,
  table,
  title,
  type Cell,
} from './pdf-sheet.ts';

export interface JobSheetInput {
  job: BenchJob;
  /** Formats a moment in the company's time zone. */
  when: (iso: string) => string;
  /** Photo id → a small JPEG of it. */
  thumbnails: Map<string, Buffer>;
}

/** The verdict in words, so it reads the same on a black-and-white printout. */
export function verdictWords(r: Pick<BenchReading, 'verdict' | 'indicative'>): string {
  if (r.verdict === 'pass') return 'Pass';
  if (r.indicative) return 'Low in circuit — indicative: measure out of circuit';
  if (r.verdict === 'low') return 'OUT OF TOLERANCE — LOW';
  if (r.verdict === 'high') return 'OUT OF TOLERANCE — HIGH';
  return 'FAIL';
}

const outOfTolerance = (r: BenchReading) => r.verdict !== 'pass' && !r.indicative;
const strong = (text: string, on: boolean): Cell => (on ? { text, font: { src: 'bold' } } : text);

function readingRow(r: BenchReading): Cell[] {
  const flagged = outOfTolerance(r);
  return [
    strong(flagged ? `✗ ${r.designator}` : r.designator, flagged),
    strong(storedReadingText(r), flagged),
    r.windowText ?? '',
    r.deviationPercent === null ? '' : formatDeviation(r.deviationPercent),
    r.inCircuit ? 'in circuit' : 'out of circuit',
    strong(verdictWords(r), flagged),
  ];
}

function diodeRow(r: BenchReading): Cell[] {
  const flagged = r.verdict !== 'pass';
  return [
    strong(flagged ? `✗ ${r.designator}` : r.designator, flagged),
    r.measuredText,
    strong(flagged ? `FAIL — ${r.note ?? ''}` : `Pass — ${r.note ?? ''}`, flagged),
  ];
}

function stepRecords(doc: PDFKit.PDFDocument, job: BenchJob, stepKey: string): void {
  const evaluation = job.evaluation;
  if (!evaluation) return;
  const readings = evaluation.readings.filter((r) => r.stepKey === stepKey);
  const values = readings.filter((r) => r.measured !== null);
  const sets = readings.filter((r) => r.measured === null);
  if (values.length) {
    table(
      doc,
      ['Part', 'Reading', 'Allowed window', 'Deviation', 'Measured', 'Verdict'],
      values.map(readingRow),
      [0.11, 0.15, 0.22, 0.11, 0.13, 0.28],
    );
  }
  if (sets.length) table(doc, ['Part', 'Diode-test readings', 'Verdict as a set'], sets.map(diodeRow), [0.12, 0.48, 0.4]);
  const fuses = evaluation.fuses.filter((f) => f.stepKey === stepKey);
  if (fuses.length) {
    table(
      doc,
      ['Fuse', 'The circuit needs', 'Fitted', 'Verdict'],
      fuses.map((f) => [
        strong(f.accepted ? f.designator : `✗ ${f.designator}`, !f.accepted),
        f.specified,
        f.fitted,
        strong((f.accepted ? 'Matches' : 'DOES NOT MATCH') + (f.reasons.length ? ` — ${f.reasons.join('; ')}` : ''), !f.accepted),
      ]),
      [0.1, 0.2, 0.2, 0.5],
    );
  }
  const power = evaluation.power.filter((p) => p.stepKey === stepKey);
  if (power.length) {
    table(
      doc,
      ['Part', 'Volts across', 'Verdict'],
      power.map((p) => [
        strong(p.undersized ? `✗ ${p.designator}` : p.designator, p.undersized),
        p.voltsText,
        strong(`${p.undersized ? 'UNDERSIZED — ' : 'Within rating — '}${p.message}`, p.undersized),
      ]),
      [0.12, 0.18, 0.7],
    );
  }
}

function photoRow(doc: PDFKit.PDFDocument, images: Buffer[]): void {
  if (!images.length) return;
  const size = 110;
  const perRow = Math.max(1, Math.floor((contentWidth(doc) + 8) / (size + 8)));
  for (let i = 0; i < images.length; i += perRow) {
    keepSpace(doc, size + 8);
    const y = doc.y;
    images.slice(i, i + perRow).forEach((image, j) => doc.image(image, MARGIN + j * (size + 8), y, { fit: [size, size] }));
    doc.y = y + size + 8;
  }
  doc.x = MARGIN;
}

/** The whole sheet as PDF bytes. */
export async function jobSheetPdf(input: JobSheetInput): Promise<Buffer> {
  const { job, when } = input;
  const sheet = newSheet(`${job.templateName} — ${job.boardName} ${job.boardSerial}`.trim());
  const { doc } = sheet;
  title(doc, job.templateName, `${job.boardName}${job.boardSerial ? `, serial ${job.boardSerial}` : ''}`);
  facts(doc, [
    ['Game', job.gameLabel ?? 'not fitted in a game'],
    ['Opened', `${when(job.openedAt)}${job.openedBy ? ` by ${job.openedBy}` : ''}`],
    ['Finished', job.finishedAt ? `${when(job.finishedAt)}${job.finishedBy ? ` by ${job.finishedBy}` : ''}` : 'not finished yet'],
  ]);
  paragraph(doc, cautionsDeferral, { muted: true, size: 8 });

  const out = (job.evaluation?.readings ?? []).filter((r) => r.verdict !== 'pass' && !r.indicative);
  const refusedFuses = (job.evaluation?.fuses ?? []).filter((f) => !f.accepted);
  const undersized = (job.evaluation?.power ?? []).filter((p) => p.undersized);
  if (out.length || refusedFuses.length || undersized.length) {
    heading(doc, 'Needs attention');
    for (const r of out) {
      paragraph(doc, `✗ ${r.designator}: ${storedReadingText(r)} — ${verdictWords(r)}${r.windowText ? ` (allowed ${r.windowText})` : ''}`, {
        bold: true,
      });
    }
    for (const f of refusedFuses) paragraph(doc, `✗ ${f.designator}: fitted ${f.fitted} — does not match ${f.specified}`, { bold: true });
    for (const p of undersized) paragraph(doc, `✗ ${p.designator}: UNDERSIZED — ${p.message}`, { bold: true });
  }

  job.steps.forEach((step, i) => {
    const progress = job.draft.steps[step.key];
    heading(doc, `${i + 1}. ${step.title}`);
    paragraph(
      doc,
      `${stepRecordLabels[step.record]} · ${progress?.done ? '✓ Done' : '✗ Not done'}${progress?.answer ? ` · Answer: ${progress.answer}` : ''}`,
      { bold: true, size: 9 },
    );
    if (step.instructions) paragraph(doc, step.instructions, { muted: true, size: 9 });
    cautionsAcknowledged(doc, step.cautions, progress?.acknowledged ?? false);
    stepRecords(doc, job, step.key);
    if (progress?.note) paragraph(doc, `Note: ${progress.note}`);
    photoRow(
      doc,
      job.photos.filter((p) => p.stepKey === step.key).flatMap((p) => input.thumbnails.get(p.id) ?? []),
    );
  });

  heading(doc, 'Parts used');
  if (job.draft.partsUsed.length) {
    const designatorOf = new Map(job.parts.map((p) => [p.id, p.designator]));
    table(
      doc,
      ['Part fitted', 'Quantity', 'Replaces'],
      job.draft.partsUsed.map((u) => [u.description, String(u.quantity), u.partId ? (designatorOf.get(u.partId) ?? '') : '']),
      [0.6, 0.15, 0.25],
    );
  } else paragraph(doc, 'None recorded.', { muted: true });
  return sheet.finish();
}
