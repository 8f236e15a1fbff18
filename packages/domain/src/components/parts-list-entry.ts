import { DomainError, isDomainError } from '../errors.ts';
import { bandsToResistance } from './colour-bands.ts';
import { capacitorToleranceForLetter, parseCapacitorCode } from './capacitor-codes.ts';
import { parseFuseMarking, type FuseRating } from './fuses.ts';
import { absoluteTolerance, percentTolerance, type Tolerance } from './tolerance.ts';
import { toleranceForLetter } from './tolerance-letters.ts';
import { formatQuantity, parseQuantity, type Unit } from './values.ts';

/**
 * One line of a board's parts list as the trade writes it ("R12, resistor, 4k7, 5%, 1/4 W"), read into numbers the
 * bench can judge readings against. Each cell is checked in the words of the bench: a µF value on a resistor, a
 * tolerance over 100 %, an electrolytic without its rated life are refused with a message naming the cell.
 */

/** The part kinds, in the order of `partKinds` in the contracts (this package has no runtime dependencies, so it
 * keeps its own copy; a test in the contracts package checks that the two agree). */
export const PART_KIND_NAMES = [
  'resistor',
  'capacitor',
  'electrolytic',
  'diode',
  'bridge_rectifier',
  'fuse',
  'connector',
  'transistor',
  'regulator',
  'other',
] as const;
export type PartKindName = (typeof PART_KIND_NAMES)[number];

/** The words a person types for each kind (same as `partKindLabels` in the contracts). */
export const PART_KIND_LABELS: Readonly<Record<PartKindName, string>> = {
  resistor: 'Resistor',
  capacitor: 'Capacitor',
  electrolytic: 'Electrolytic capacitor',
  diode: 'Diode',
  bridge_rectifier: 'Bridge rectifier',
  fuse: 'Fuse',
  connector: 'Connector / header',
  transistor: 'Transistor',
  regulator: 'Regulator',
  other: 'Other',
};

export interface PartEntryInput {
  designator: string;
  kind: string;
  value: string;
  tolerance: string;
  rating: string;
  ratedTemperatureC: number | null;
  ratedLifeHours: number | null;
  notes?: string;
}

export interface PartSpec {
  /** Trimmed and upper-cased: "R12". */
  designator: string;
  kind: PartKindName;
  /** In the base unit (Ω, F); null for kinds whose value is a part number (a diode, a connector) and for fuses. */
  nominal: number | null;
  unit: Unit | null;
  tolerance: Tolerance | null;
  /** A fuse's marking read per IEC 60127; null for every other kind. */
  fuse: FuseRating | null;
  ratingWatts: number | null;
  ratingVolts: number | null;
  ratedTemperatureC: number | null;
  ratedLifeHours: number | null;
}

export interface RowProblem {
  /** 0-based index into the list. */
  row: number;
  field: string;
  message: string;
}

const MAX_DESIGNATOR_LENGTH = 16;

/** The unit each measurable kind's value is written in; the other kinds carry a part number or description. */
const VALUE_UNITS: Partial<Record<PartKindName, 'Ω' | 'F'>> = { resistor: 'Ω', capacitor: 'F', electrolytic: 'F' };

const KIND_WORDS: Readonly<Record<PartKindName, string>> = {
  resistor: 'a resistor',
  capacitor: 'a capacitor',
  electrolytic: 'an electrolytic',
  diode: 'a diode',
  bridge_rectifier: 'a bridge rectifier',
  fuse: 'a fuse',
  connector: 'a connector',
  transistor: 'a transistor',
  regulator: 'a regulator',
  other: 'this part',
};

/** What a wrongly placed unit belongs to, in the bench's words. */
const UNIT_OWNERS: Readonly<Record<Unit, string>> = {
  Ω: "a resistor's unit",
  F: "a capacitor's unit",
  H: "an inductor's unit",
  V: 'a voltage',
  A: 'a current',
  W: 'a wattage',
};

const VALUE_EXAMPLES: Readonly<Record<'Ω' | 'F', string>> = { Ω: '4k7', F: '100nF' };

const CAPACITOR_KINDS: readonly PartKindName[] = ['capacitor', 'electrolytic'];

/** Reads a kind given as its code ("bridge_rectifier") or its label ("Bridge rectifier"), any case. */
export function readPartKind(text: string): PartKindName {
  const wanted = typeof text === 'string' ? text.trim().toLowerCase() : '';
  if (wanted === '') throw new DomainError('missing-input', 'say what kind of part this is (resistor, capacitor, fuse, …)', 'kind');
  const found = PART_KIND_NAMES.find(
    (kind) => kind === wanted || PART_KIND_LABELS[kind].toLowerCase() === wanted || kind.replace('_', ' ') === wanted,
  );
  if (!found) {
    throw new DomainError(
      'unknown-code',
      `“${text.trim()}” is not a part kind: use one of ${PART_KIND_NAMES.map((k) => PART_KIND_LABELS[k].toLowerCase()).join(', ')}`,
      'kind',
    );
  }
  return found;
}

function readDesignator(text: string): string {
  const designator = typeof text === 'string' ? text.trim().toUpperCase() : '';
  if (designator === '') throw new DomainError('missing-input', 'every part needs its reference designator, e.g. R12', 'designator');
  if (designator.length > MAX_DESIGNATOR_LENGTH) {
    throw new DomainError('out-of-range', `a reference designator has at most ${MAX_DESIGNATOR_LENGTH} characters`, 'designator');
  }
  // Letters for the kind, then the number, then an optional suffix: R12, BR1, TP1, R12A (IEEE 315 style).
  if (!/^[A-Z]+[0-9]+[A-Z0-9]*$/.test(designator)) {
    throw new DomainError(
      'unparseable',
      `“${text.trim()}” is not a reference designator: letters then a number, as printed on the board (R12, C3, BR1, F1)`,
      'designator',
    );
  }
  return designator;
}

/** The unit as the person wrote it ("µF" of "100µF"), for messages. */
function writtenUnit(text: string, unit: Unit): string {
  const tail = /([A-Za-zµμΩΩ]+)\s*$/.exec(text.trim())?.[1];
  return tail ?? unit;
}

function wrongUnit(text: string, found: Unit, expected: 'Ω' | 'F', kind: PartKindName, field: string): DomainError {
  return new DomainError(
    'unit-mismatch',
    `${writtenUnit(text, found)} is ${UNIT_OWNERS[found]}; ${KIND_WORDS[kind]}'s value is in ${expected}, e.g. ${VALUE_EXAMPLES[expected]}`,
    field,
  );
}

/** A value written with a unit or prefix (or an RKM code), checked against the unit the kind is measured in. */
function readValueIn(text: string, expected: 'Ω' | 'F', kind: PartKindName): number {
  const quantity = parseQuantity(text, { field: 'value' });
  if (quantity.unit !== null && quantity.unit !== expected) throw wrongUnit(text, quantity.unit, expected, kind, 'value');
  return quantity.value;
}

const COLOUR_WORD = /^[a-z]+$/;

function looksLikeColourBands(text: string): string[] | null {
  const words = text
    .trim()
    .toLowerCase()
    .split(/[\s,;/-]+/)
    .filter((w) => w !== '');
  if (words.length === 0 || !words.every((w) => COLOUR_WORD.test(w))) return null;
  // "ohm" or "k" alone are units, not bands.
  return words.length === 1 && words[0] !== 'black' ? null : words;
}

interface ReadValue {
  nominal: number | null;
  /** A tolerance the value itself carried: a tolerance band, or a capacitor code's letter ("104K"). */
  markedTolerance: Tolerance | null;
  fuse: FuseRating | null;
}

function readValue(text: string, kind: PartKindName): ReadValue {
  const value = typeof text === 'string' ? text.trim() : '';
  if (value === '') {
    const hint =
      kind === 'fuse'
        ? 'the fuse marking, e.g. T2.5A 250V'
        : VALUE_UNITS[kind]
          ? `its value, e.g. ${VALUE_EXAMPLES[VALUE_UNITS[kind]]}`
          : 'its part number or a description, e.g. 1N4004';
    throw new DomainError('missing-input', `give ${hint}`, 'value');
  }
  if (kind === 'resistor') {
    const bands = looksLikeColourBands(value);
    if (bands) {
      try {
        const marking = bandsToResistance(bands);
        return { nominal: marking.ohms, markedTolerance: marking.tolerance, fuse: null };
      } catch (error) {
        if (isDomainError(error)) throw new DomainError(error.code, `colour bands “${value}”: ${error.message}`, 'value');
        throw error;
      }
    }
    return { nominal: readValueIn(value, 'Ω', kind), markedTolerance: null, fuse: null };
  }
  if (kind === 'capacitor' || kind === 'electrolytic') {
    // Digits alone are the EIA three-digit code printed on ceramics ("104" = 100 nF); an electrolytic prints its
    // value in µF, so a bare number there is refused rather than read as a code or as farads.
    const code = /^(\d{1,3})([A-EG-Z])?$/.exec(value);
    if (code) {
      if (kind === 'electrolytic') {
        throw new DomainError('unparseable', `write the electrolytic's value with its unit, e.g. ${code[1]}µF`, 'value');
      }
      const digits = code[1] ?? '';
      // "220" is the code for 22 pF, but people also write 220 meaning 220 pF: refuse to guess.
      if (digits.length === 3 && digits.endsWith('0')) {
        const asCode = parseCapacitorCode(digits).farads;
        throw new DomainError(
          'ambiguous',
          `“${value}” is the code for ${formatQuantity(asCode, 'F')} but reads as ${digits} pF too: write ${formatQuantity(asCode, 'F').replace(' ', '')} or ${digits}pF`,
          'value',
        );
      }
      const read = parseCapacitorCode(value);
      return { nominal: read.farads, markedTolerance: read.tolerance, fuse: null };
    }
    const farads = readValueIn(value, 'F', kind);
    if (farads === 0) throw new DomainError('out-of-range', 'a capacitor cannot be 0 F', 'value');
    return { nominal: farads, markedTolerance: null, fuse: null };
  }
  if (kind === 'fuse') {
    let fuse: FuseRating;
    try {
      fuse = parseFuseMarking(value);
    } catch (error) {
      if (isDomainError(error)) throw new DomainError(error.code, error.message, 'value');
      throw error;
    }
    if (fuse.amps === null)
      throw new DomainError('missing-input', `“${value}” has no current: write it as printed, e.g. T2.5A 250V`, 'value');
    if (fuse.speed === null) {
      throw new DomainError(
        'missing-input',
        `“${value}” has no speed letter (T time-lag, F quick-acting, …): write it as printed, e.g. T2.5A 250V`,
        'value',
      );
    }
    return { nominal: null, markedTolerance: null, fuse };
  }
  return { nominal: null, markedTolerance: null, fuse: null };
}

function readToleranceText(text: string, kind: PartKindName, nominal: number): Tolerance {
  const unit = VALUE_UNITS[kind] ?? 'Ω';
  const compact = text
    .trim()
    .replace(/\u2212/g, '-')
    .replace(/\+\/-|\+-/g, '±')
    .replace(/\s+/g, '');
  let m: RegExpExecArray | null;
  if (/^[A-Za-z]$/.test(compact)) {
    return CAPACITOR_KINDS.includes(kind) ? capacitorToleranceForLetter(compact.toUpperCase(), nominal) : toleranceForLetter(compact);
  }
  // "+80/-20%", "-20/+80 %": asymmetric percentages.
  if ((m = /^\+(\d+(?:\.\d+)?)%?\/-(\d+(?:\.\d+)?)%$/.exec(compact)) || (m = /^-(\d+(?:\.\d+)?)%?\/\+(\d+(?:\.\d+)?)%$/.exec(compact))) {
    const plusFirst = compact.startsWith('+');
    const a = Number(m[1]);
    const b = Number(m[2]);
    return checkedPercent(plusFirst ? a : b, plusFirst ? b : a);
  }
  // "5%", "±5 %", "5": a bare number is a percentage, the way tolerances are given unless a unit says otherwise.
  if ((m = /^±?(\d+(?:\.\d+)?)%?$/.exec(compact))) {
    const percent = Number(m[1]);
    return checkedPercent(percent, percent);
  }
  // "±0.25pF", "±1Ω": an absolute amount in the part's unit.
  if ((m = /^±?(\d.*)$/.exec(compact))) {
    const quantity = parseQuantity(m[1] ?? '', { field: 'tolerance' });
    if (quantity.unit === null) throw unreadableTolerance(text);
    if (quantity.unit !== unit) {
      throw new DomainError(
        'unit-mismatch',
        `${writtenUnit(text, quantity.unit)} is ${UNIT_OWNERS[quantity.unit]}; ${KIND_WORDS[kind]}'s tolerance is a percentage or an amount in ${unit}`,
        'tolerance',
      );
    }
    return absoluteTolerance(quantity.value);
  }
  throw unreadableTolerance(text);
}

function unreadableTolerance(text: string): DomainError {
  return new DomainError(
    'unparseable',
    `“${text.trim()}” is not a tolerance: write 5%, ±10 %, +80/-20%, a letter such as J, or an amount such as ±0.25pF`,
    'tolerance',
  );
}

function checkedPercent(plus: number, minus: number): Tolerance {
  if (plus > 100 || minus > 100) {
    throw new DomainError(
      'out-of-range',
      `a tolerance over 100 % is not a real part tolerance (got ${Math.max(plus, minus)} %)`,
      'tolerance',
    );
  }
  return percentTolerance({ plus, minus });
}

function sameTolerance(a: Tolerance, b: Tolerance): boolean {
  return a.kind === b.kind && Math.abs(a.plus - b.plus) < 1e-15 && Math.abs(a.minus - b.minus) < 1e-15;
}

function describeTolerance(t: Tolerance): string {
  return t.plus === t.minus ? `±${t.plus} %` : `+${t.plus}/−${t.minus} %`;
}

function readTolerance(text: string, kind: PartKindName, read: ReadValue): Tolerance | null {
  const cell = typeof text === 'string' ? text.trim() : '';
  if (read.nominal === null) {
    if (cell !== '') {
      throw new DomainError(
        'conflicting-input',
        `${KIND_WORDS[kind]} has no value to hold a tolerance against; leave the tolerance empty (put a grade in the notes)`,
        'tolerance',
      );
    }
    return null;
  }
  if (cell === '') {
    if (read.markedTolerance) return read.markedTolerance;
    throw new DomainError(
      'missing-input',
      kind === 'resistor'
        ? 'give the tolerance (e.g. 5% or J), or write the value as colour bands with their tolerance band'
        : `give the tolerance (e.g. 20% or M)`,
      'tolerance',
    );
  }
  const tolerance = readToleranceText(cell, kind, read.nominal);
  if (read.markedTolerance && read.markedTolerance.kind === 'percent' && !sameTolerance(tolerance, read.markedTolerance)) {
    throw new DomainError(
      'conflicting-input',
      `the value is marked ${describeTolerance(read.markedTolerance)} but the tolerance says ${cell}: which is it?`,
      'tolerance',
    );
  }
  return tolerance;
}

const FRACTIONS: Readonly<Record<string, string>> = { '½': '1/2', '¼': '1/4', '⅛': '1/8', '¾': '3/4' };

/** "1/2 W", "½W", "0.5W", "500 mW", "2 W": watts. A bare number is watts too. */
function readWatts(text: string): number {
  const written = text.trim().replace(/[½¼⅛¾]/g, (c) => FRACTIONS[c] ?? c);
  const fraction = /^(\d+)\s*\/\s*(\d+)\s*(.*)$/.exec(written);
  if (fraction) {
    const denominator = Number(fraction[2]);
    if (denominator === 0) throw new DomainError('out-of-range', `“${text}” divides by zero`, 'rating');
    const unitText = (fraction[3] ?? '').trim();
    if (unitText !== '' && !/^w(atts?)?$/i.test(unitText)) throw wrongRatingUnit(text, 'resistor');
    return Number(fraction[1]) / denominator;
  }
  const quantity = parseQuantity(written, { field: 'rating' });
  if (quantity.unit !== null && quantity.unit !== 'W') throw wrongRatingUnit(text, 'resistor');
  return quantity.value;
}

function readVolts(text: string, kind: PartKindName): number {
  // "50 VDC", "50V DC": the DC says nothing more for a capacitor's rating.
  const written = text.trim().replace(/\s*(?:V\s*DC|VDC)$/i, ' V');
  const quantity = parseQuantity(written, { field: 'rating' });
  if (quantity.unit !== null && quantity.unit !== 'V') throw wrongRatingUnit(text, kind);
  return quantity.value;
}

function wrongRatingUnit(text: string, kind: PartKindName): DomainError {
  const wanted = kind === 'resistor' ? 'its wattage, e.g. 1/4 W' : 'its working voltage, e.g. 35 V';
  return new DomainError('unit-mismatch', `“${text.trim()}”: ${KIND_WORDS[kind]}'s rating is ${wanted}`, 'rating');
}

function readRating(text: string, kind: PartKindName): { ratingWatts: number | null; ratingVolts: number | null } {
  const cell = typeof text === 'string' ? text.trim() : '';
  if (cell === '') return { ratingWatts: null, ratingVolts: null };
  if (kind === 'resistor') {
    const watts = readWatts(cell);
    if (watts <= 0) throw new DomainError('out-of-range', 'a wattage must be greater than zero', 'rating');
    return { ratingWatts: watts, ratingVolts: null };
  }
  if (CAPACITOR_KINDS.includes(kind)) {
    const volts = readVolts(cell, kind);
    if (volts <= 0) throw new DomainError('out-of-range', 'a working voltage must be greater than zero', 'rating');
    return { ratingWatts: null, ratingVolts: volts };
  }
  // A diode's or a bridge's rating ("3 A 1000 V") is kept as written for the reader; the bench judges none of it.
  return { ratingWatts: null, ratingVolts: null };
}

function readElectrolyticRatings(
  input: PartEntryInput,
  kind: PartKindName,
): { ratedTemperatureC: number | null; ratedLifeHours: number | null } {
  const temperature = input.ratedTemperatureC ?? null;
  const life = input.ratedLifeHours ?? null;
  if (kind !== 'electrolytic') {
    if (temperature !== null) {
      throw new DomainError(
        'conflicting-input',
        'a rated temperature is kept for electrolytics only (it sets their life); leave it empty',
        'ratedTemperatureC',
      );
    }
    if (life !== null) {
      throw new DomainError('conflicting-input', 'a rated life is kept for electrolytics only; leave it empty', 'ratedLifeHours');
    }
    return { ratedTemperatureC: null, ratedLifeHours: null };
  }
  if (temperature === null) {
    throw new DomainError(
      'missing-input',
      "give the electrolytic's rated temperature as printed on its sleeve (85, 105 or 125 °C): it sets the capacitor's life",
      'ratedTemperatureC',
    );
  }
  if (typeof temperature !== 'number' || !Number.isInteger(temperature) || temperature < -55 || temperature > 200) {
    throw new DomainError(
      'out-of-range',
      'the rated temperature is a whole number of °C between −55 and 200 (e.g. 105)',
      'ratedTemperatureC',
    );
  }
  if (life === null) {
    throw new DomainError(
      'missing-input',
      "give the electrolytic's rated life in hours from its datasheet (e.g. 2000 h): it sets the capacitor's life",
      'ratedLifeHours',
    );
  }
  if (typeof life !== 'number' || !Number.isSafeInteger(life) || life <= 0) {
    throw new DomainError('out-of-range', 'the rated life is a whole number of hours greater than zero (e.g. 2000)', 'ratedLifeHours');
  }
  return { ratedTemperatureC: temperature, ratedLifeHours: life };
}

/** Each cell read on its own where it can be, so a row reports every faulty cell in one go. */
function readCells(input: PartEntryInput): { spec: PartSpec | null; errors: DomainError[] } {
  const errors: DomainError[] = [];
  function attempt<T>(read: () => T): T | undefined {
    try {
      return read();
    } catch (error) {
      if (!isDomainError(error)) throw error;
      errors.push(error);
      return undefined;
    }
  }
  const designator = attempt(() => readDesignator(input.designator));
  const kind = attempt(() => readPartKind(input.kind));
  if (kind === undefined) return { spec: null, errors };
  const read = attempt(() => readValue(input.value, kind));
  // The tolerance is judged against the value. When the value does not read, a filled-in tolerance is still
  // checked (against a stand-in value) so the row shows all its faults at once; an empty one waits, since colour
  // bands or a code letter in the value may yet give it.
  const toleranceText = input.tolerance ?? '';
  const standIn: ReadValue = { nominal: VALUE_UNITS[kind] ? 1 : null, markedTolerance: null, fuse: null };
  const tolerance =
    read !== undefined
      ? attempt(() => readTolerance(toleranceText, kind, read))
      : String(toleranceText).trim() !== ''
        ? attempt(() => readTolerance(toleranceText, kind, standIn))
        : undefined;
  const rating = attempt(() => readRating(input.rating ?? '', kind));
  const electrolytic = attempt(() => readElectrolyticRatings(input, kind));
  if (designator === undefined || read === undefined || tolerance === undefined || rating === undefined || electrolytic === undefined) {
    return { spec: null, errors };
  }
  return {
    spec: {
      designator,
      kind,
      nominal: read.nominal,
      unit: read.nominal === null ? null : (VALUE_UNITS[kind] ?? null),
      tolerance,
      fuse: read.fuse,
      ...rating,
      ...electrolytic,
    },
    errors,
  };
}

/** Reads one parts-list line. Throws DomainError naming the first cell at fault. */
export function readPartEntry(input: PartEntryInput): PartSpec {
  if (input === null || typeof input !== 'object') throw new DomainError('missing-input', 'a parts-list line is needed');
  const { spec, errors } = readCells(input);
  const first = errors[0];
  if (first || !spec) throw first ?? new DomainError('missing-input', 'a parts-list line is needed');
  return spec;
}

/** Every row's problems (every faulty cell of each), then each repeated designator, compared without regard to
 * case, on every row after its first use. */
export function checkPartsList(rows: readonly PartEntryInput[]): RowProblem[] {
  if (!Array.isArray(rows)) throw new DomainError('missing-input', 'a parts list must be a list of rows', 'rows');
  const problems: RowProblem[] = [];
  const firstRowOf = new Map<string, number>();
  rows.forEach((input, row) => {
    if (input === null || typeof input !== 'object') {
      problems.push({ row, field: 'row', message: 'this row is empty' });
      return;
    }
    for (const error of readCells(input).errors) problems.push({ row, field: error.field ?? 'row', message: error.message });
    const key = typeof input.designator === 'string' ? input.designator.trim().toUpperCase() : '';
    if (key === '') return;
    const first = firstRowOf.get(key);
    if (first === undefined) firstRowOf.set(key, row);
    else problems.push({ row, field: 'designator', message: `${key} is already on row ${first + 1}` });
  });
  return problems;
}
