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
  const today = parsePlainDate(input?.asOf, 'asOf');
  const made = parseManufactureDate(input.manufactured, input.asOf);
  if (!Array.isArray(input.capacitors) || input.capacitors.length === 0) {
    throw new DomainError('missing-input', 'give at least one capacitor to judge the board by', 'capacitors');
  }
  const leadMonths = input.leadMonths === undefined ? 6 : requireNonNegative(input.leadMonths, 'leadMonths');

  const lives = input.capacitors.map((cap) =>
    calendarLife({ ...cap, hoursPerDay: input.hoursPerDay, ...(input.maxYears === undefined ? {} : { maxYears: input.maxYears }) }),
  );
  let limiting = 0;
  lives.forEach((life, i) => {
    if (life.years < (lives[limiting]?.years ?? Infinity)) limiting = i;
  });
  const lifeYears = lives[limiting]?.years ?? 0;

  // A part of a day rounds down (3,555.6 days → 3,555): the due date must not be later than the life allows, and
  // a recap a day early is better than a day late.
  const due = parsePlainDate(made.date) + Math.floor(lives[limiting]?.days ?? 0);
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
    manufactured: made.date,
    dueDate,
    status,
    limitingCapacitor: limiting,
    lifeYears: roundToSignificant(lifeYears, 12),
    monthsUntilDue,
    message,
  };
}
