import { DomainError, isDomainError } from '../errors.ts';
import { judgeDiode, readDiodeReading, type BridgeTerminal, type DiodeReading, type DiodeVerdict } from './diode-test.ts';
import { checkFuseReplacement, parseFuseMarking, type FuseRating } from './fuses.ts';
import type { PartKindName, PartSpec } from './parts-list-entry.ts';
import { checkResistorPower } from './power.ts';
import { checkReading, type ReadingResult } from './readings.ts';
import { formatQuantity, parseQuantity, UNITS, type Unit } from './values.ts';

/**
 * What the bench records, judged against the parts list: a value reading against its tolerance window, a diode or
 * bridge rectifier's diode-test readings as a set, a fitted fuse against the one the circuit calls for, a voltage
 * across a resistor against its wattage. All synchronous, so the live verdict on screen and the server's re-check
 * run the same code. Text is read as the technician types it ("570", "4k63", "100µ", "OL", "T2.5A 250V").
 */

export type Judged<T> = { ok: true; value: T } | { ok: false; message: string };

function refuse<T>(message: string): Judged<T> {
  return { ok: false, message };
}

// ---- value readings -------------------------------------------------------------------------------------------

export interface ReadingJudgement extends ReadingResult {
  /** In the part's unit (Ω, F). */
  measured: number;
  unit: Unit;
  /** "570 Ω" */
  measuredText: string;
  /** "540 Ω – 660 Ω" */
  windowText: string;
  /** "−5.0 %" */
  deviationText: string;
}

const READING_EXAMPLES: Readonly<Partial<Record<Unit, string>>> = { Ω: '4.7k', F: '100n' };

const QUANTITY_WORDS: Readonly<Record<Unit, string>> = {
  Ω: 'a resistance',
  F: 'a capacitance',
  H: 'an inductance',
  V: 'a voltage',
  A: 'a current',
  W: 'a wattage',
};

/** "−5.0 %", "+3.3 %", "0.0 %": one decimal, a true minus sign. */
export function formatDeviation(percent: number): string {
  const rounded = Math.round(percent * 10) / 10;
  if (rounded === 0) return '0.0 %';
  return `${rounded < 0 ? '\u2212' : '+'}${Math.abs(rounded).toFixed(1)} %`;
}

/** "540 Ω – 660 Ω": four significant figures, so a 1 % part's edges still differ from its nominal. */
export function formatWindow(min: number, max: number, unit: Unit): string {
  return `${formatQuantity(min, unit, { significantDigits: 4 })} – ${formatQuantity(max, unit, { significantDigits: 4 })}`;
}

/** A measured value as the live verdict showed it ("672 Ω", "98.2 µF"): six significant figures, so nothing typed is lost. */
export function formatMeasured(measured: number, unit: Unit): string {
  return formatQuantity(measured, unit, { significantDigits: 6 });
}

/** A stored reading with its unit, or as it was typed when it has no value in a known unit (a diode set's "OL"). */
export function storedReadingText(r: { measured: number | null; unit: string | null; measuredText: string }): string {
  return r.measured !== null && UNITS.includes(r.unit as Unit) ? formatMeasured(r.measured, r.unit as Unit) : r.measuredText;
}

/** A diode set's readings as one line for its history and the job sheet: "forward 0.55 / reverse OL" (blanks left out). */
export function diodeSetText(readings: Readonly<Record<string, string>>): string {
  return Object.entries(readings)
    .filter(([, text]) => text.trim() !== '')
    .map(([key, text]) => `${key} ${text.trim()}`)
    .join(' / ');
}

function writtenUnit(text: string): string | null {
  return /([A-Za-zµμΩΩ]+)\s*$/.exec(text.trim())?.[1] ?? null;
}

/** A value reading against the part's tolerance window. `inCircuit`: taken with the part still soldered in. */
export function judgeReading(spec: PartSpec, text: string, inCircuit: boolean): Judged<ReadingJudgement> {
  if (spec.nominal === null || spec.unit === null) {
    return refuse(`${spec.designator} has no value on the parts list to read against${diodeHint(spec.kind)}`);
  }
  if (spec.tolerance === null) return refuse(`${spec.designator} has no tolerance on the parts list to judge a reading by`);
  const unit = spec.unit;
  const typed = typeof text === 'string' ? text.trim() : '';
  const example = READING_EXAMPLES[unit] ?? '1';
  if (typed === '') return refuse(`type a reading such as ${example}`);
  let measured: number;
  try {
    const quantity = parseQuantity(typed, { field: 'reading' });
    if (quantity.unit !== null && quantity.unit !== unit) {
      return refuse(`${writtenUnit(typed) ?? quantity.unit} is not ${QUANTITY_WORDS[unit]}: read ${spec.designator} in ${unit}`);
    }
    measured = quantity.value;
  } catch (error) {
    if (!isDomainError(error)) throw error;
    if (error.code === 'negative') return refuse(`“${typed}”: ${QUANTITY_WORDS[unit]} cannot read below zero — check the probes`);
    if (error.code === 'unit-mismatch' || error.code === 'unknown-unit') {
      return refuse(`“${typed}” is not ${QUANTITY_WORDS[unit]}: read ${spec.designator} in ${unit}, e.g. ${example}`);
    }
    return refuse(`“${typed}” is not a reading — type a value such as ${example}`);
  }
  const result = checkReading({ nominal: spec.nominal, tolerance: spec.tolerance, measured, inCircuit });
  return {
    ok: true,
    value: {
      ...result,
      measured,
      unit,
      measuredText: formatMeasured(measured, unit),
      windowText: formatWindow(result.min, result.max, unit),
      deviationText: formatDeviation(result.deviationPercent),
      note: noteInTradeNotation(result, unit),
    },
  };
}

function noteInTradeNotation(result: ReadingResult, unit: Unit): string | null {
  if (result.indicative) return result.note;
  if (result.verdict === 'low') return `below the minimum of ${formatQuantity(result.min, unit, { significantDigits: 4 })}`;
  if (result.verdict === 'high') return `above the maximum of ${formatQuantity(result.max, unit, { significantDigits: 4 })}`;
  return null;
}

function diodeHint(kind: PartKindName): string {
  if (kind === 'diode' || kind === 'bridge_rectifier') return ': judge it with the diode test';
  if (kind === 'fuse') return ': check its marking instead';
  return '';
}

// ---- diodes and bridge rectifiers -----------------------------------------------------------------------------

export interface DiodeReadingKey {
  key: string;
  red: BridgeTerminal;
  black: BridgeTerminal;
  label: string;
  /** The eight leg readings are needed for a verdict; the AC-to-AC and − to + readings are cross-checks. */
  required: boolean;
}

function probe(key: string, red: BridgeTerminal, black: BridgeTerminal, required: boolean): DiodeReadingKey {
  // Printed with the true minus sign (U+2212), as the board's silkscreen and a datasheet write it.
  const name = (t: BridgeTerminal) => (t === '-' ? '−' : t);
  return { key, red, black, label: `red on ${name(red)}, black on ${name(black)}`, required };
}

/** The readings a bridge rectifier takes, by key as stored in a bench job's draft. */
export const BRIDGE_READING_KEYS: readonly DiodeReadingKey[] = [
  probe('ac1-plus', 'AC1', '+', true),
  probe('plus-ac1', '+', 'AC1', true),
  probe('ac2-plus', 'AC2', '+', true),
  probe('plus-ac2', '+', 'AC2', true),
  probe('minus-ac1', '-', 'AC1', true),
  probe('ac1-minus', 'AC1', '-', true),
  probe('minus-ac2', '-', 'AC2', true),
  probe('ac2-minus', 'AC2', '-', true),
  probe('ac1-ac2', 'AC1', 'AC2', false),
  probe('ac2-ac1', 'AC2', 'AC1', false),
  probe('minus-plus', '-', '+', false),
  probe('plus-minus', '+', '-', false),
];

/** A single diode's two readings: red on the anode (forward), then red on the cathode (reverse). */
export const DIODE_READING_KEYS: readonly { key: 'forward' | 'reverse'; label: string }[] = [
  { key: 'forward', label: 'forward (red on the anode)' },
  { key: 'reverse', label: 'reverse (red on the cathode)' },
];

export interface DiodeLegJudgement {
  /** "diode", or a bridge leg: "AC1→+", "-→AC1", … */
  name: string;
  verdict: DiodeVerdict;
  reason: string;
}

export interface DiodeSetJudgement {
  /** 'fail' as soon as any leg read fails; 'pass' only when every needed reading is in and good; null while
   * readings are still missing and none has failed. */
  verdict: 'pass' | 'fail' | null;
  /** Every needed reading is in. */
  complete: boolean;
  /** One line for the screen and the job sheet. */
  detail: string;
  legs: DiodeLegJudgement[];
  /** Keys of the needed readings still empty. */
  missing: string[];
}

const BRIDGE_LEGS: readonly { name: string; forward: string; reverse: string }[] = [
  { name: 'AC1→+', forward: 'ac1-plus', reverse: 'plus-ac1' },
  { name: 'AC2→+', forward: 'ac2-plus', reverse: 'plus-ac2' },
  { name: '-→AC1', forward: 'minus-ac1', reverse: 'ac1-minus' },
  { name: '-→AC2', forward: 'minus-ac2', reverse: 'ac2-minus' },
];

// Two silicon junctions in series, as a bridge reads from − to + (common practice; the same as diode-test.ts).
const SERIES_PAIR_MIN_VOLTS = 1.0;
const SERIES_PAIR_MAX_VOLTS = 1.4;

/** "0.55", "0.55 V", "550 mV", "OL". */
function readDiodeText(text: string, label: string): DiodeReading {
  const typed = text.trim();
  if (/^[0O]\.?L$/i.test(typed)) return readDiodeReading('OL');
  try {
    const quantity = parseQuantity(typed, { field: 'reading' });
    if (quantity.unit !== null && quantity.unit !== 'V') throw new DomainError('unit-mismatch', 'not volts', 'reading');
    return quantity.value;
  } catch (error) {
    if (!isDomainError(error)) throw error;
    throw new DomainError('unparseable', `${label}: “${typed}” is not a diode-test reading — type the volts shown (0.55) or OL`, 'reading');
  }
}

function shown(value: DiodeReading): string {
  return value === 'OL' ? 'OL' : `${value} V`;
}

/** A diode's or a bridge rectifier's diode-test readings, judged as a set (see diode-test.ts for the ranges). */
export function judgeDiodeSet(spec: PartSpec, readings: Record<string, string>): Judged<DiodeSetJudgement> {
  if (spec.kind !== 'diode' && spec.kind !== 'bridge_rectifier') {
    return refuse(`${spec.designator} is not a diode or a bridge rectifier: it takes no diode-test readings`);
  }
  const entered = new Map<string, DiodeReading>();
  const labels = new Map<string, string>(
    spec.kind === 'diode' ? DIODE_READING_KEYS.map((k) => [k.key, k.label]) : BRIDGE_READING_KEYS.map((k) => [k.key, k.label]),
  );
  for (const [key, text] of Object.entries(readings ?? {})) {
    const label = labels.get(key);
    if (label === undefined) return refuse(`${spec.designator} takes no reading “${key}”`);
    if (typeof text !== 'string' || text.trim() === '') continue;
    try {
      entered.set(key, readDiodeText(text, label));
    } catch (error) {
      if (!isDomainError(error)) throw error;
      return refuse(error.message);
    }
  }
  return { ok: true, value: spec.kind === 'diode' ? judgeSingleDiode(entered) : judgeBridge(entered) };
}

function judgeSingleDiode(entered: ReadonlyMap<string, DiodeReading>): DiodeSetJudgement {
  const forward = entered.get('forward');
  const reverse = entered.get('reverse');
  const missing = DIODE_READING_KEYS.map((k) => k.key).filter((key) => !entered.has(key));
  if (forward === undefined || reverse === undefined) {
    return { verdict: null, complete: false, detail: 'read it forward and reverse', legs: [], missing };
  }
  const judged = judgeDiode(forward, reverse);
  const leg: DiodeLegJudgement = { name: 'diode', verdict: judged.verdict, reason: judged.reason };
  return { verdict: judged.verdict === 'good' ? 'pass' : 'fail', complete: true, detail: judged.reason, legs: [leg], missing };
}

function judgeBridge(entered: ReadonlyMap<string, DiodeReading>): DiodeSetJudgement {
  const missing = BRIDGE_READING_KEYS.filter((k) => k.required && !entered.has(k.key)).map((k) => k.key);
  const legs: DiodeLegJudgement[] = [];
  for (const leg of BRIDGE_LEGS) {
    const forward = entered.get(leg.forward);
    const reverse = entered.get(leg.reverse);
    if (forward === undefined || reverse === undefined) continue;
    const judged = judgeDiode(forward, reverse);
    legs.push({ name: leg.name, verdict: judged.verdict, reason: judged.reason });
  }
  const failures: string[] = legs.filter((l) => l.verdict !== 'good').map((l) => `leg ${l.name}: ${l.reason}`);

  // Cross-checks, when taken (common practice): OL between the AC terminals both ways; two junctions − to +.
  for (const key of ['ac1-ac2', 'ac2-ac1']) {
    const value = entered.get(key);
    if (value !== undefined && value !== 'OL')
      failures.push(`conducts between the AC terminals (${shown(value)}): a leg is shorted or leaky`);
  }
  const pair = entered.get('minus-plus');
  if (pair !== undefined && (pair === 'OL' || pair < SERIES_PAIR_MIN_VOLTS || pair > SERIES_PAIR_MAX_VOLTS)) {
    failures.push(`− to + reads ${shown(pair)}: expected ${SERIES_PAIR_MIN_VOLTS}–${SERIES_PAIR_MAX_VOLTS} V (two junctions in series)`);
  }
  const pairReverse = entered.get('plus-minus');
  if (pairReverse !== undefined && pairReverse !== 'OL') failures.push(`+ to − reads ${shown(pairReverse)}: expected OL`);

  const complete = missing.length === 0;
  if (failures.length > 0) return { verdict: 'fail', complete, detail: failures.join('; '), legs, missing };
  if (!complete) {
    return { verdict: null, complete, detail: `${missing.length} of 8 leg readings still to take`, legs, missing };
  }
  return { verdict: 'pass', complete, detail: 'all four legs one junction forward and OL reversed', legs, missing };
}

// ---- fuses ----------------------------------------------------------------------------------------------------

export interface FuseJudgement {
  accepted: boolean;
  /** Why it was refused, or notes on an accepted one (a higher voltage rating is fine). */
  reasons: string[];
  fitted: FuseRating;
}

/** Whether the fuse fitted (its marking as read off the cap) may stay in the circuit the parts list describes. */
export function judgeFuse(spec: PartSpec, fittedMarking: string): Judged<FuseJudgement> {
  if (spec.fuse === null) return refuse(`${spec.designator} is not a fuse on the parts list`);
  const typed = typeof fittedMarking === 'string' ? fittedMarking.trim() : '';
  if (typed === '') return refuse('type the marking on the fitted fuse, e.g. T2.5A 250V');
  let fitted: FuseRating;
  try {
    fitted = parseFuseMarking(typed);
  } catch (error) {
    if (!isDomainError(error)) throw error;
    return refuse(`“${typed}” is not a fuse marking — type it as printed on the cap, e.g. T2.5A 250V`);
  }
  const check = checkFuseReplacement(spec.fuse, fitted);
  return { ok: true, value: { accepted: check.accepted, reasons: check.reasons, fitted } };
}

// ---- power ----------------------------------------------------------------------------------------------------

export interface PowerJudgement {
  volts: number;
  ohms: number;
  watts: number;
  ratingWatts: number;
  /** The rating × derating (50 %): the most the part should dissipate. */
  allowedWatts: number;
  undersized: boolean;
  /** The smallest standard wattage within derating; null past 10 W. */
  smallestStandardWatts: number | null;
  message: string;
}

/** The voltage measured across a resistor in operation against its wattage after derating (see power.ts). */
export function judgePower(spec: PartSpec, voltsText: string): Judged<PowerJudgement> {
  if (spec.kind !== 'resistor' || spec.nominal === null) return refuse(`${spec.designator} is not a resistor: no wattage to check`);
  if (spec.nominal === 0) return refuse(`${spec.designator} is a zero-ohm link: it drops no voltage to check`);
  if (spec.ratingWatts === null) return refuse(`${spec.designator} has no wattage on the parts list — add its rating, e.g. 1/4 W`);
  const typed = typeof voltsText === 'string' ? voltsText.trim() : '';
  if (typed === '') return refuse('type the voltage across the part, e.g. 12 V');
  let volts: number;
  try {
    // The sign only says which way the probes went: V²/R is the same.
    volts = Math.abs(parseQuantity(typed, { unit: 'V', allowNegative: true, field: 'volts' }).value);
  } catch (error) {
    if (!isDomainError(error)) throw error;
    return refuse(`“${typed}” is not a voltage — type what the meter shows across the part, e.g. 12 V`);
  }
  const check = checkResistorPower({ volts, ohms: spec.nominal, ratedWatts: spec.ratingWatts });
  return {
    ok: true,
    value: {
      volts,
      ohms: spec.nominal,
      watts: check.watts,
      ratingWatts: check.ratedWatts,
      allowedWatts: check.allowedWatts,
      undersized: !check.ok,
      smallestStandardWatts: check.smallestStandardWatts,
      message: check.message,
    },
  };
}

// ---- a whole bench job ----------------------------------------------------------------------------------------

/** The shape of a bench step as far as judging goes (the contracts' BenchStep fits it). */
export interface BenchStepInput {
  key: string;
  record: string;
  partKinds: readonly string[];
  designators: readonly string[];
  cautions: readonly string[];
}

/** The contracts' BenchStepProgress, as far as judging goes. */
export interface BenchStepProgressInput {
  done: boolean;
  acknowledged: boolean;
  answer: 'yes' | 'no' | null;
  readings: Record<string, { text: string; inCircuit: boolean }>;
  diodes: Record<string, Record<string, string>>;
  fuses: Record<string, { fitted: string }>;
  power: Record<string, { volts: string }>;
}

export interface BenchJobDraftInput {
  steps: Record<string, BenchStepProgressInput>;
  partsUsed: readonly { partId: string | null; description: string; quantity: number }[];
}

export type BenchPart = PartSpec & { id: string };

/** The parts a step concerns, in parts-list order: every part of its kinds, and the parts it names. */
export function partsForStep<P extends PartSpec>(step: Pick<BenchStepInput, 'partKinds' | 'designators'>, parts: readonly P[]): P[] {
  const kinds = new Set<string>(step.partKinds);
  const designators = new Set(step.designators.map((d) => d.trim().toUpperCase()));
  return parts.filter((part) => kinds.has(part.kind) || designators.has(part.designator.toUpperCase()));
}

export interface BenchProblem {
  field: string;
  message: string;
}

interface PartResult {
  stepKey: string;
  partId: string;
  designator: string;
}

export interface JudgedReading extends PartResult, ReadingJudgement {
  text: string;
  inCircuit: boolean;
}

export interface JudgedDiodeSet extends PartResult, DiodeSetJudgement {
  /** The readings as typed, by key. */
  readings: Record<string, string>;
}

export interface JudgedFuse extends PartResult, FuseJudgement {
  fittedText: string;
}

export interface JudgedPower extends PartResult, PowerJudgement {
  voltsText: string;
}

export interface BenchEvaluation {
  /** Field-level problems: nothing is saved as finished while there are any. */
  problems: BenchProblem[];
  readings: JudgedReading[];
  /** Sets with a verdict (complete, or already failed); a set still being read is left out. */
  diodeSets: JudgedDiodeSet[];
  fuses: JudgedFuse[];
  power: JudgedPower[];
}

/**
 * Walks every step and what was entered on it: each reading, diode set, fitted fuse and voltage judged against the
 * parts list. Empty fields are not recorded. A refused fuse is a result (accepted false), and becomes a problem only
 * on a step ticked done. Problems name the field the way the draft holds it: `steps.<key>.readings.<partId>`.
 */
export function evaluateBenchJob(input: {
  steps: readonly BenchStepInput[];
  draft: BenchJobDraftInput;
  parts: readonly BenchPart[];
}): BenchEvaluation {
  const evaluation: BenchEvaluation = { problems: [], readings: [], diodeSets: [], fuses: [], power: [] };
  const problem = (field: string, message: string) => evaluation.problems.push({ field, message });
  const stepKeys = new Set(input.steps.map((s) => s.key));

  for (const key of Object.keys(input.draft.steps ?? {})) {
    if (!stepKeys.has(key)) problem(`steps.${key}`, 'this bench job has no such step');
  }

  for (const step of input.steps) {
    const progress = input.draft.steps?.[step.key];
    if (!progress) continue;
    const base = `steps.${step.key}`;
    const stepParts = new Map(partsForStep(step, input.parts).map((part) => [part.id, part]));
    const partOf = (partId: string, field: string): BenchPart | undefined => {
      const part = stepParts.get(partId);
      if (!part) problem(field, 'this part is not one this step concerns');
      return part;
    };

    if (progress.done && step.cautions.length > 0 && !progress.acknowledged) {
      problem(`${base}.acknowledged`, 'acknowledge the cautions before ticking this step');
    }
    if (progress.done && step.record === 'check' && progress.answer === null) {
      problem(`${base}.answer`, 'answer yes or no before ticking this step');
    }

    for (const [partId, entry] of Object.entries(progress.readings ?? {})) {
      if (typeof entry?.text !== 'string' || entry.text.trim() === '') continue;
      const field = `${base}.readings.${partId}`;
      const part = partOf(partId, field);
      if (!part) continue;
      const judged = judgeReading(part, entry.text, entry.inCircuit === true);
      if (!judged.ok) problem(field, judged.message);
      else {
        evaluation.readings.push({
          stepKey: step.key,
          partId,
          designator: part.designator,
          text: entry.text.trim(),
          inCircuit: entry.inCircuit === true,
          ...judged.value,
        });
      }
    }

    for (const [partId, readings] of Object.entries(progress.diodes ?? {})) {
      if (Object.values(readings ?? {}).every((text) => typeof text !== 'string' || text.trim() === '')) continue;
      const field = `${base}.diodes.${partId}`;
      const part = partOf(partId, field);
      if (!part) continue;
      const judged = judgeDiodeSet(part, readings);
      if (!judged.ok) problem(field, judged.message);
      else if (judged.value.verdict !== null) {
        evaluation.diodeSets.push({ stepKey: step.key, partId, designator: part.designator, readings: { ...readings }, ...judged.value });
      }
    }

    for (const [partId, entry] of Object.entries(progress.fuses ?? {})) {
      if (typeof entry?.fitted !== 'string' || entry.fitted.trim() === '') continue;
      const field = `${base}.fuses.${partId}`;
      const part = partOf(partId, field);
      if (!part) continue;
      const judged = judgeFuse(part, entry.fitted);
      if (!judged.ok) {
        problem(field, judged.message);
        continue;
      }
      evaluation.fuses.push({ stepKey: step.key, partId, designator: part.designator, fittedText: entry.fitted.trim(), ...judged.value });
      if (!judged.value.accepted && progress.done) {
        problem(field, `fit a fuse that matches before ticking this step: ${judged.value.reasons.join('; ')}`);
      }
    }

    for (const [partId, entry] of Object.entries(progress.power ?? {})) {
      if (typeof entry?.volts !== 'string' || entry.volts.trim() === '') continue;
      const field = `${base}.power.${partId}`;
      const part = partOf(partId, field);
      if (!part) continue;
      const judged = judgePower(part, entry.volts);
      if (!judged.ok) problem(field, judged.message);
      else
        evaluation.power.push({ stepKey: step.key, partId, designator: part.designator, voltsText: entry.volts.trim(), ...judged.value });
    }
  }

  const partIds = new Set(input.parts.map((p) => p.id));
  (input.draft.partsUsed ?? []).forEach((used, i) => {
    if (typeof used?.description !== 'string' || used.description.trim() === '') {
      problem(`partsUsed.${i}.description`, 'say which part was fitted');
    }
    if (typeof used?.quantity !== 'number' || !Number.isSafeInteger(used.quantity) || used.quantity < 1) {
      problem(`partsUsed.${i}.quantity`, 'the quantity is a whole number of parts, 1 or more');
    }
    if (used?.partId != null && !partIds.has(used.partId)) {
      problem(`partsUsed.${i}.partId`, "that part is not on this board's parts list");
    }
  });
  return evaluation;
}
