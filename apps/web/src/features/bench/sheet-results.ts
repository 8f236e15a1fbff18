// What a job sheet lists, from either source: a finished job's evaluation as the server stored it, or (for a job
// still open) the same judgement worked out here by the domain from the draft.
import type { BenchJob, BenchJobEvaluation } from '@bumperline/contracts/bench-jobs';
import { diodeSetText, evaluateBenchJob, formatDeviation, storedReadingText } from '@bumperline/domain/components/bench-judgement';
import type { JobPart } from './job-parts.ts';

export interface SheetReading {
  stepKey: string;
  partId: string;
  designator: string;
  /** "570 Ω"; a diode set's readings: "forward 0.55 / reverse OL". */
  measuredText: string;
  /** Null for a diode or bridge rectifier judged as a set. */
  windowText: string | null;
  deviationText: string | null;
  verdict: 'pass' | 'low' | 'high' | 'fail';
  indicative: boolean;
  inCircuit: boolean;
  note: string | null;
}

export interface SheetFuse {
  stepKey: string;
  partId: string;
  designator: string;
  specified: string;
  fitted: string;
  accepted: boolean;
  reasons: string[];
}

export interface SheetPower {
  stepKey: string;
  partId: string;
  designator: string;
  voltsText: string;
  watts: number;
  ratingWatts: number | null;
  allowedWatts: number | null;
  undersized: boolean;
  message: string;
}

export interface SheetResults {
  readings: SheetReading[];
  fuses: SheetFuse[];
  power: SheetPower[];
}

export function fromEvaluation(e: BenchJobEvaluation): SheetResults {
  return {
    readings: e.readings.map((r) => ({
      stepKey: r.stepKey,
      partId: r.partId,
      designator: r.designator,
      // The server keeps the reading as typed ("672"); the sheet shows it with its unit, as the job screen did.
      measuredText: storedReadingText(r),
      windowText: r.windowText,
      deviationText: r.deviationPercent === null ? null : formatDeviation(r.deviationPercent),
      verdict: r.verdict,
      indicative: r.indicative,
      inCircuit: r.inCircuit,
      note: r.note,
    })),
    fuses: e.fuses.map((f) => ({ ...f })),
    power: e.power.map((p) => ({ ...p })),
  };
}

/** An open job's results so far, judged by the same domain code the server finishes with. */
export function fromDraft(job: Pick<BenchJob, 'steps' | 'draft'>, parts: readonly JobPart[]): SheetResults {
  const e = evaluateBenchJob({ steps: job.steps, draft: job.draft, parts });
  const specified = new Map(parts.map((p) => [p.id, p.line.value]));
  return {
    readings: [
      ...e.readings.map((r) => ({
        stepKey: r.stepKey,
        partId: r.partId,
        designator: r.designator,
        measuredText: r.measuredText,
        windowText: r.windowText,
        deviationText: r.deviationText,
        verdict: r.verdict,
        indicative: r.indicative,
        inCircuit: r.inCircuit,
        note: r.note,
      })),
      ...e.diodeSets.map((d) => ({
        stepKey: d.stepKey,
        partId: d.partId,
        designator: d.designator,
        measuredText: diodeSetText(d.readings),
        windowText: null,
        deviationText: null,
        verdict: d.verdict === 'pass' ? ('pass' as const) : ('fail' as const),
        indicative: false,
        inCircuit: false,
        note: d.detail,
      })),
    ],
    fuses: e.fuses.map((f) => ({
      stepKey: f.stepKey,
      partId: f.partId,
      designator: f.designator,
      specified: specified.get(f.partId) ?? '',
      fitted: f.fittedText,
      accepted: f.accepted,
      reasons: f.reasons,
    })),
    power: e.power.map((p) => ({
      stepKey: p.stepKey,
      partId: p.partId,
      designator: p.designator,
      voltsText: p.voltsText,
      watts: p.watts,
      ratingWatts: p.ratingWatts,
      allowedWatts: p.allowedWatts,
      undersized: p.undersized,
      message: p.message,
    })),
  };
}

/** Readings outside their window (a low one taken in circuit is only indicative, so it is listed apart). */
export function outOfTolerance(results: SheetResults): SheetReading[] {
  return results.readings.filter((r) => r.verdict !== 'pass' && !r.indicative);
}

/** "R12 reads HIGH: 712 Ω against 540 Ω – 660 Ω (+18.7 %)". */
export function describeOutOfTolerance(r: SheetReading): string {
  const verdict = r.verdict.toUpperCase();
  if (r.windowText === null) return `${r.designator} FAILS the diode test: ${r.note ?? r.measuredText}`;
  return `${r.designator} reads ${verdict}: ${r.measuredText} against ${r.windowText}${r.deviationText ? ` (${r.deviationText})` : ''}`;
}

/** Rows in the order of the board's parts list (R1, R2, … as printed), whatever order they were typed in. */
export function inPartsListOrder(results: SheetResults, parts: readonly { id: string }[]): SheetResults {
  const position = new Map(parts.map((p, i) => [p.id, i]));
  const byPart = <T extends { partId: string }>(rows: T[]) =>
    [...rows].sort((a, b) => (position.get(a.partId) ?? Number.MAX_SAFE_INTEGER) - (position.get(b.partId) ?? Number.MAX_SAFE_INTEGER));
  return { readings: byPart(results.readings), fuses: byPart(results.fuses), power: byPart(results.power) };
}
