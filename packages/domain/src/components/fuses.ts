import { DomainError } from '../errors.ts';
import { fromDecimal, nearlyEqual } from '../decimal.ts';
import { describe, requirePositive } from '../input-checks.ts';

/**
 * Miniature fuse markings per IEC 60127: speed letter (FF very quick-acting, F quick-acting, M medium, T time-lag,
 * TT very long time-lag), rated current in A or mA, breaking capacity (L low, E enhanced, H high) and rated voltage:
 * "T3.15AL250V", "F2A 250V", "T500mA", "FF". European parts often print a decimal comma ("T3,15A"), which is read as
 * a decimal point: a fuse marking has no thousands separator.
 */

export type FuseSpeed = 'FF' | 'F' | 'M' | 'T' | 'TT';
export type BreakingCapacity = 'L' | 'E' | 'H';

export interface FuseRating {
  speed: FuseSpeed | null;
  amps: number | null;
  breakingCapacity: BreakingCapacity | null;
  volts: number | null;
}

/** Fastest to slowest. */
export const FUSE_SPEEDS: readonly FuseSpeed[] = ['FF', 'F', 'M', 'T', 'TT'];
const BREAKING_CAPACITIES: readonly BreakingCapacity[] = ['L', 'E', 'H'];

const SPEED_WORDS: Readonly<Record<FuseSpeed, string>> = {
  FF: 'very quick-acting (FF)',
  F: 'quick-acting (F)',
  M: 'medium time-lag (M)',
  T: 'time-lag (T)',
  TT: 'very long time-lag (TT)',
};

export function parseFuseMarking(marking: string): FuseRating {
  if (typeof marking !== 'string') {
    throw new DomainError('unparseable', `a fuse marking must be text such as "T3.15AL250V" (got ${describe(marking)})`, 'marking');
  }
  const compact = marking.replace(/\s+/g, '');
  if (compact === '') throw new DomainError('missing-input', 'the fuse marking is empty', 'marking');
  const match = /^(TT|T|FF|F|M)?(?:(\d+(?:[.,]\d+)?|[.,]\d+)(mA|A))?([LEH])?(?:(\d+(?:[.,]\d+)?)V(?:AC|DC)?)?$/i.exec(compact);
  if (!match || compact.length === 0) {
    throw new DomainError(
      'unparseable',
      `"${marking}" is not an IEC 60127 fuse marking: expected e.g. T3.15AL250V, F2A 250V, T500mA`,
      'marking',
    );
  }
  const [, speedText, currentText, currentUnit, breakingText, voltText] = match;
  if (!speedText && !currentText && !breakingText && !voltText) {
    throw new DomainError('unparseable', `"${marking}" is not a fuse marking`, 'marking');
  }
  const amps = currentText === undefined ? null : fromDecimal(currentText.replace(',', '.'), currentUnit?.toLowerCase() === 'ma' ? -3 : 0);
  if (amps === 0) throw new DomainError('out-of-range', `"${marking}": a fuse cannot be rated 0 A`, 'marking');
  return {
    speed: (speedText?.toUpperCase() as FuseSpeed | undefined) ?? null,
    amps,
    breakingCapacity: (breakingText?.toUpperCase() as BreakingCapacity | undefined) ?? null,
    volts: voltText === undefined ? null : Number(voltText.replace(',', '.')),
  };
}

export interface ReplacementCheck {
  accepted: boolean;
  /** Why it was refused, or what to note even when accepted. Empty when it is a like-for-like match. */
  reasons: string[];
}

function rating(value: FuseRating | string, field: string): FuseRating {
  if (typeof value === 'string') return parseFuseMarking(value);
  if (value === null || typeof value !== 'object')
    throw new DomainError('missing-input', `${field} must be a fuse rating or marking`, field);
  if (value.speed !== null && !FUSE_SPEEDS.includes(value.speed)) {
    throw new DomainError(
      'unknown-code',
      `${field}.speed ${describe(value.speed)} is not one of ${FUSE_SPEEDS.join(', ')}`,
      `${field}.speed`,
    );
  }
  if (value.breakingCapacity !== null && !BREAKING_CAPACITIES.includes(value.breakingCapacity)) {
    throw new DomainError(
      'unknown-code',
      `${field}.breakingCapacity ${describe(value.breakingCapacity)} is not L, E or H`,
      `${field}.breakingCapacity`,
    );
  }
  return {
    speed: value.speed,
    breakingCapacity: value.breakingCapacity,
    amps: value.amps === null ? null : requirePositive(value.amps, `${field}.amps`),
    volts: value.volts === null ? null : requirePositive(value.volts, `${field}.volts`),
  };
}

/**
 * Whether `candidate` may replace the fuse the circuit calls for. Same current and speed only; a higher voltage or
 * breaking capacity is fine. A higher current or slower fuse no longer protects the circuit; a lower current or faster
 * fuse blows in normal running (nuisance blowing) — both refused, as repair manuals advise (common practice).
 */
export function checkFuseReplacement(circuit: FuseRating | string, candidate: FuseRating | string): ReplacementCheck {
  const required = rating(circuit, 'circuit');
  const offered = rating(candidate, 'candidate');
  if (required.amps === null) throw new DomainError('missing-input', "the circuit's fuse current rating is needed", 'circuit');
  if (required.speed === null) throw new DomainError('missing-input', "the circuit's fuse speed (FF, F, M, T or TT) is needed", 'circuit');

  const refusals: string[] = [];
  const notes: string[] = [];

  if (offered.amps === null) refusals.push('current rating unknown: read it off the fuse cap');
  else if (!nearlyEqual(offered.amps, required.amps)) {
    refusals.push(
      offered.amps > required.amps
        ? `${offered.amps} A is higher than the ${required.amps} A the circuit needs: it would not blow in time — fire risk`
        : `${offered.amps} A is lower than the ${required.amps} A the circuit needs: it would blow in normal running (nuisance blowing)`,
    );
  }

  if (offered.speed === null) refusals.push('speed unknown: the cap should say FF, F, M, T or TT');
  else if (offered.speed !== required.speed) {
    const slower = FUSE_SPEEDS.indexOf(offered.speed) > FUSE_SPEEDS.indexOf(required.speed);
    refusals.push(
      slower
        ? `${SPEED_WORDS[offered.speed]} is slower than the ${SPEED_WORDS[required.speed]} the circuit needs: it lets damaging current through for longer`
        : `${SPEED_WORDS[offered.speed]} is faster than the ${SPEED_WORDS[required.speed]} the circuit needs: switch-on surges will blow it (nuisance blowing)`,
    );
  }

  if (required.volts !== null) {
    if (offered.volts === null) refusals.push(`voltage rating unknown: it must be at least ${required.volts} V`);
    else if (offered.volts < required.volts) {
      refusals.push(`${offered.volts} V is below the ${required.volts} V rating the circuit needs: it may not break the arc`);
    } else if (offered.volts > required.volts) notes.push(`${offered.volts} V rating is higher than needed, which is fine`);
  }

  if (required.breakingCapacity !== null) {
    const needed = BREAKING_CAPACITIES.indexOf(required.breakingCapacity);
    if (offered.breakingCapacity === null) {
      refusals.push(`breaking capacity unknown: it must be ${required.breakingCapacity} or higher`);
    } else if (BREAKING_CAPACITIES.indexOf(offered.breakingCapacity) < needed) {
      refusals.push(`breaking capacity ${offered.breakingCapacity} is lower than the ${required.breakingCapacity} the circuit needs`);
    } else if (BREAKING_CAPACITIES.indexOf(offered.breakingCapacity) > needed) {
      notes.push(`breaking capacity ${offered.breakingCapacity} is higher than needed, which is fine`);
    }
  }

  return refusals.length > 0 ? { accepted: false, reasons: refusals } : { accepted: true, reasons: notes };
}
