import { DomainError } from '../errors.ts';
import { roundToSignificant } from '../decimal.ts';
import { requireFinite, requireInRange, requireNonNegative, requirePositive } from '../input-checks.ts';
import { formatPlainDate, parsePlainDate } from '../plain-date.ts';
import { parseManufactureDate } from './date-codes.ts';

/**
 * Electrolytic capacitor life by the Arrhenius "10 °C rule" of the makers' application notes (Nippon Chemi-Con,
 * technical note "Estimating the life of aluminum electrolytic capacitors"; TDK's power-supply FAQ on capacitor life):
 *   L = L0 × 2^((T0 − T) / 10)
 * L0 the rated life at the rated (upper category) temperature T0, T the temperature the part actually runs at.
 * Hours of life become calendar years through the hours the game is powered each day. The makers cap any estimate at
 * 15 years, because the rubber seal ages whether or not the part is powered (from memory of Nippon Chemi-Con's and
 * other makers' notes), so the cap applies by default.
 */

export interface LifeInput {
  ratedLifeHours: number;
  ratedTemperatureC: number;
  operatingTemperatureC: number;
}

export const DEFAULT_MAX_YEARS = 15;

const DAYS_PER_YEAR = 365.25;

export function estimateLifeHours(input: LifeInput): number {
  const ratedLife = requirePositive(input?.ratedLifeHours, 'ratedLifeHours');
  const rated = requireInRange(input.ratedTemperatureC, -55, 200, 'ratedTemperatureC');
  const operating = requireFinite(input.operatingTemperatureC, 'operatingTemperatureC');
  if (operating > rated) {
    throw new DomainError(
      'above-rated-temperature',
      `operating at ${operating} °C is above the part's rated ${rated} °C: the part is out of specification, not just short-lived`,
      'operatingTemperatureC',
    );
  }
  return ratedLife * 2 ** ((rated - operating) / 10);
}

export interface CalendarLifeInput extends LifeInput {
  /** Hours the game is switched on per day, 0–24. */
  hoursPerDay: number;
  /** Upper limit on the estimate in years (default 15). */
  maxYears?: number;
}

export interface CalendarLife {
  lifeHours: number;
  years: number;
  /** The same life in days: hours ÷ hours per day, or the age limit × 365.25. */
  days: number;
  /** True when the 15-year (or given) limit, not the hours, sets the life. */
  limitedByAge: boolean;
}

export function calendarLife(input: CalendarLifeInput): CalendarLife {
  const lifeHours = estimateLifeHours(input);
  const hoursPerDay = requireNonNegative(input.hoursPerDay, 'hoursPerDay');
  if (hoursPerDay > 24) {
    throw new DomainError('out-of-range', `a day has 24 hours (got ${hoursPerDay} hours per day)`, 'hoursPerDay');
  }
  const maxYears = input.maxYears === undefined ? DEFAULT_MAX_YEARS : requirePositive(input.maxYears, 'maxYears');
  // Days straight from hours: 24,000 h at 8 h a day is exactly 3,000 days, where a trip through years (÷ 365.25,
  // then × 365.25) can come back as 2,999.999… and lose the last day.
  const byHoursDays = hoursPerDay === 0 ? Infinity : lifeHours / hoursPerDay;
  const byHours = byHoursDays / DAYS_PER_YEAR;
  const limitedByAge = byHours > maxYears;
  return limitedByAge
    ? { lifeHours, years: maxYears, days: maxYears * DAYS_PER_YEAR, limitedByAge }
    : { lifeHours, years: byHours, days: byHoursDays, limitedByAge };
}

export type RecapStatus = 'overdue' | 'due-soon' | 'ok';

export interface RecapInput {
  /** Date of manufacture or the board's date code (see date-codes.ts). */
  manufactured: string;
  /** Every electrolytic on the board; the shortest-lived one sets the date. */
  capacitors: readonly LifeInput[];
  hoursPerDay: number;
  /** Today, YYYY-MM-DD. */
  asOf: string;
  /** How far ahead "due soon" starts, in months (default 6). */
  leadMonths?: number;
  maxYears?: number;
}

export interface RecapDue {
  manufactured: string;
  dueDate: string;
  status: RecapStatus;
  /** Index into `capacitors` of the part that sets the date. */
  limitingCapacitor: number;
  lifeYears: number;
  /** Whole months until due (0 or less when overdue). */
  monthsUntilDue: number;
  message: string;
}

const DAYS_PER_MONTH = DAYS_PER_YEAR / 12;

export function recapDue(input: RecapInput): RecapDue {
  parsePlainDate(input?.asOf, 'asOf');
  const made = parseManufactureDate(input.manufactured, input.asOf);
  requireCapacitors(input.capacitors);
  const lives = input.capacitors.map((cap) =>
    calendarLife({ ...cap, hoursPerDay: input.hoursPerDay, ...(input.maxYears === undefined ? {} : { maxYears: input.maxYears }) }),
  );
  return dueFromLives(made.date, lives, input.asOf, input.leadMonths);
}

function requireCapacitors(capacitors: readonly unknown[]): void {
  if (!Array.isArray(capacitors) || capacitors.length === 0) {
    throw new DomainError('missing-input', 'give at least one capacitor to judge the board by', 'capacitors');
  }
}

/** The due date and advice from the start date and each capacitor's life: the shortest-lived part sets the date. */
function dueFromLives(
  from: string,
  lives: readonly { years: number; days: number }[],
  asOf: string,
  leadMonthsInput: number | undefined,
): RecapDue {
  const today = parsePlainDate(asOf, 'asOf');
  const leadMonths = leadMonthsInput === undefined ? 6 : requireNonNegative(leadMonthsInput, 'leadMonths');
  let limiting = 0;
  lives.forEach((life, i) => {
    if (life.years < (lives[limiting]?.years ?? Infinity)) limiting = i;
  });
  const lifeYears = lives[limiting]?.years ?? 0;

  // A part of a day rounds down (3,555.6 days → 3,555): the due date must not be later than the life allows, and
  // a recap a day early is better than a day late.
  const due = parsePlainDate(from) + Math.floor(lives[limiting]?.days ?? 0);
  const dueDate = formatPlainDate(due);
  const daysUntil = due - today;
  const monthsUntilDue = daysUntil <= 0 ? Math.floor(daysUntil / DAYS_PER_MONTH) : Math.ceil(daysUntil / DAYS_PER_MONTH);

  let status: RecapStatus;
  let message: string;
  if (daysUntil <= 0) {
    status = 'overdue';
    message = `recap now — overdue since ${dueDate}`;
  } else if (daysUntil <= leadMonths * DAYS_PER_MONTH) {
    status = 'due-soon';
    message = `due within ${monthsUntilDue} month${monthsUntilDue === 1 ? '' : 's'} (${dueDate})`;
  } else {
    status = 'ok';
    message = `ok — recap due ${dueDate}`;
  }
  return {
    manufactured: from,
    dueDate,
    status,
    limitingCapacitor: limiting,
    lifeYears: roundToSignificant(lifeYears, 12),
    monthsUntilDue,
    message,
  };
}

// ---- a cabinet's temperature through the day --------------------------------------------------------------------

/** Part of a day the game is powered at one temperature inside the cabinet: "4 h at 45 °C". */
export interface TemperatureSlice {
  hours: number;
  temperatureC: number;
}

export interface ProfileLifeInput {
  ratedLifeHours: number;
  ratedTemperatureC: number;
  /** The powered hours of a day, each at its temperature; they sum to the hours powered per day (at most 24). */
  slices: readonly TemperatureSlice[];
  maxYears?: number;
}

export interface ProfileLife extends CalendarLife {
  /** The slices' hours summed. */
  hoursPerDay: number;
  /** The one steady temperature that would use the part up as fast as the profile does; null when never powered. */
  equivalentTemperatureC: number | null;
}

function requireSlices(slices: readonly TemperatureSlice[], ratedTemperatureC: number): number {
  if (!Array.isArray(slices)) throw new DomainError('missing-input', 'slices must be a list of hours at a temperature', 'slices');
  let hours = 0;
  slices.forEach((slice, i) => {
    const field = `slices[${i}]`;
    const h = requireNonNegative(slice?.hours, `${field}.hours`);
    const t = requireFinite(slice.temperatureC, `${field}.temperatureC`);
    if (t > ratedTemperatureC) {
      throw new DomainError(
        'above-rated-temperature',
        `slice ${i + 1} (${h} h at ${t} °C) is above the part's rated ${ratedTemperatureC} °C: the part is out of specification, not just short-lived`,
        `${field}.temperatureC`,
      );
    }
    hours += h;
  });
  if (hours > 24) throw new DomainError('out-of-range', `a day has 24 hours (the slices add up to ${hours} h)`, 'slices');
  return hours;
}

/**
 * Life under a daily temperature profile. Each hour at temperature T uses 1/L(T) of the part's life, L from the
 * 10 °C rule above; a day uses Σ hᵢ / L(Tᵢ), so the life is 1 / Σ (hᵢ / L(Tᵢ)) days, capped by the age limit. This is
 * how the makers combine a varying ambient temperature (COSEL's note on lifetime at varying ambient temperature and
 * Nippon Chemi-Con's technical note: the time-weighted sum of consumed life, a Miner's-rule sum; from memory of both
 * notes). A profile at one temperature gives exactly calendarLife's answer.
 */
export function profileLife(input: ProfileLifeInput): ProfileLife {
  const ratedLife = requirePositive(input?.ratedLifeHours, 'ratedLifeHours');
  const rated = requireInRange(input.ratedTemperatureC, -55, 200, 'ratedTemperatureC');
  const hoursPerDay = requireSlices(input.slices, rated);
  const maxYears = input.maxYears === undefined ? DEFAULT_MAX_YEARS : requirePositive(input.maxYears, 'maxYears');
  const powered = input.slices.filter((slice) => slice.hours > 0);
  const temperatures = new Set(powered.map((slice) => slice.temperatureC));

  // One temperature (or none): the plain calculation, so both paths agree to the last bit.
  if (temperatures.size <= 1) {
    const operatingTemperatureC = powered[0]?.temperatureC ?? rated;
    const life = calendarLife({ ratedLifeHours: ratedLife, ratedTemperatureC: rated, operatingTemperatureC, hoursPerDay, maxYears });
    return { ...life, hoursPerDay, equivalentTemperatureC: powered.length === 0 ? null : operatingTemperatureC };
  }

  // Rated hours used per day: Σ hᵢ × L0 / L(Tᵢ). Written with the ratio L0 / L(Tᵢ) = 2^((Tᵢ − T0)/10), exact for
  // whole steps of 10 °C, so a hand-worked example comes out exact.
  const ratedHoursPerDay = powered.reduce(
    (sum, slice) =>
      sum +
      slice.hours *
        (ratedLife / estimateLifeHours({ ratedLifeHours: ratedLife, ratedTemperatureC: rated, operatingTemperatureC: slice.temperatureC })),
    0,
  );
  const byHoursDays = ratedLife / ratedHoursPerDay;
  const lifeHours = byHoursDays * hoursPerDay;
  const equivalentTemperatureC = roundToSignificant(rated - 10 * Math.log2(lifeHours / ratedLife), 12);
  const byHoursYears = byHoursDays / DAYS_PER_YEAR;
  const limitedByAge = byHoursYears > maxYears;
  return limitedByAge
    ? { lifeHours, years: maxYears, days: maxYears * DAYS_PER_YEAR, limitedByAge, hoursPerDay, equivalentTemperatureC }
    : { lifeHours, years: byHoursYears, days: byHoursDays, limitedByAge, hoursPerDay, equivalentTemperatureC };
}

export interface ProfileRecapInput {
  /** When the clock started: the board's date code or date of manufacture, or the date of its last recap. */
  from: string;
  /** Every electrolytic on the board (rated life and temperature); the shortest-lived one sets the date. */
  capacitors: readonly { ratedLifeHours: number; ratedTemperatureC: number }[];
  /** The cabinet's day: hours powered at each temperature. */
  slices: readonly TemperatureSlice[];
  /** Today, YYYY-MM-DD. */
  asOf: string;
  leadMonths?: number;
  maxYears?: number;
}

/** A profile recap's start: a date or a date code, not after `asOf`. */
function profileStart(fromText: string, asOf: string): string {
  try {
    return parseManufactureDate(fromText, asOf).date;
  } catch (error) {
    if (error instanceof DomainError && error.field === 'dateCode') throw new DomainError(error.code, error.message, 'from');
    throw error;
  }
}

/**
 * Each capacitor's life under the cabinet's profile (profileLife), a too-hot slice named by the capacitor it rules
 * out. It depends on the parts and the cabinet only, so a list of many boards of one design in cabinets alike works
 * it out once per design and cabinet day, then dates each board with recapDueFromLives.
 */
export function profileLives(input: Pick<ProfileRecapInput, 'capacitors' | 'slices' | 'maxYears'>): ProfileLife[] {
  requireCapacitors(input?.capacitors);
  return input.capacitors.map((cap, i) => {
    try {
      return profileLife({ ...cap, slices: input.slices, ...(input.maxYears === undefined ? {} : { maxYears: input.maxYears }) });
    } catch (error) {
      // Name the capacitor too: "slice 2 … above the part's rated 85 °C" is about one part of several.
      if (error instanceof DomainError && error.field?.startsWith('rated')) {
        throw new DomainError(error.code, `capacitor ${i + 1}: ${error.message}`, `capacitors[${i}].${error.field}`);
      }
      if (error instanceof DomainError && error.code === 'above-rated-temperature') {
        throw new DomainError(error.code, `capacitor ${i + 1}: ${error.message}`, error.field);
      }
      throw error;
    }
  });
}

/** recapDueWithProfile from the lives profileLives gave: the due date and advice counted from `from`. */
export function recapDueFromLives(input: { from: string; lives: readonly ProfileLife[]; asOf: string; leadMonths?: number }): RecapDue {
  parsePlainDate(input?.asOf, 'asOf');
  const from = profileStart(input.from, input.asOf);
  requireCapacitors(input.lives);
  return dueFromLives(from, input.lives, input.asOf, input.leadMonths);
}

/** recapDue with the cabinet's temperature profile instead of one temperature (see profileLife). */
export function recapDueWithProfile(input: ProfileRecapInput): RecapDue {
  parsePlainDate(input?.asOf, 'asOf');
  const from = profileStart(input.from, input.asOf);
  return dueFromLives(from, profileLives(input), input.asOf, input.leadMonths);
}
