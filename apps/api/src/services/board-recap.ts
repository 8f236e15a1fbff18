// When a board is due for a recap, worked out by the domain (capacitor-life.ts) from its electrolytics, its game's
// cabinet profile and the date the clock runs from (its last recap, or else the date its date code reads as).
import type { RecapEstimate } from '@bumperline/contracts/boards';
import { profileLives, recapDueFromLives, type ProfileLife } from '@bumperline/domain/components/capacitor-life';
import { DomainError } from '@bumperline/domain/errors';

export interface CabinetSliceRow {
  hours: number;
  temperatureC: number;
}

/**
 * Our assumption for a game whose cabinet nobody has profiled: powered 10 hours a day, the first 4 at 35 °C while
 * the bar is quiet and the last 6 at 45 °C once the room and the cabinet have warmed up (common practice for a
 * game in a bar; not a published figure). The screens say when it is used.
 */
export const DEFAULT_CABINET_SLICES: readonly CabinetSliceRow[] = [
  { hours: 4, temperatureC: 35 },
  { hours: 6, temperatureC: 45 },
];

export interface ElectrolyticRow {
  designator: string;
  ratedTemperatureC: number | null;
  ratedLifeHours: number | null;
}

export interface RecapSubject {
  dateCode: string;
  madeOn: string | null;
  dateCodeFlag: string | null;
  lastRecapOn: string | null;
}

const hoursFormat = new Intl.NumberFormat('en-US');

/** A capacitor's rating as the trade says it: "85 °C, 2,000 h". */
export function ratingText(c: { ratedTemperatureC: number; ratedLifeHours: number }): string {
  return `${c.ratedTemperatureC} °C, ${hoursFormat.format(c.ratedLifeHours)} h`;
}

const listNames = (names: string[]) =>
  names.length <= 3 ? names.join(', ') : `${names.slice(0, 3).join(', ')} and ${names.length - 3} more`;

function cannotTell(
  status: 'unknown' | 'no-electrolytics',
  message: string,
  recommendation: string | null,
  defaultProfile: boolean,
): RecapEstimate {
  return {
    status,
    countedFrom: null,
    countedFromDate: null,
    dueDate: null,
    lifeYears: null,
    monthsUntilDue: null,
    limitingDesignator: null,
    limitingRating: null,
    message,
    recommendation,
    defaultProfile,
  };
}

/** Each rated electrolytic's life in the cabinet (the domain's profileLives, or a list's remembered answer). */
export type LivesInCabinet = (
  capacitors: readonly { ratedTemperatureC: number; ratedLifeHours: number }[],
  slices: readonly CabinetSliceRow[],
) => ProfileLife[];

const livesInCabinet: LivesInCabinet = (capacitors, slices) => profileLives({ capacitors, slices });

/**
 * The lives of each board design's electrolytics per cabinet day, worked out once for a whole list: the boards of
 * one design in cabinets with the same day (or with none, the assumed day) share them, and working them out is most
 * of the cost of judging a board. A refusal (a cabinet hotter than a part's rating) is remembered too.
 */
export function rememberedLives(): (boardId: string) => LivesInCabinet {
  const known = new Map<string, ProfileLife[] | Error>();
  return (boardId) => (capacitors, slices) => {
    const key = `${boardId} ${slices.map((s) => `${s.hours}h@${s.temperatureC}`).join(',')}`;
    let lives = known.get(key);
    if (lives === undefined) {
      try {
        lives = livesInCabinet(capacitors, slices);
      } catch (err) {
        if (!(err instanceof Error)) throw err;
        lives = err;
      }
      known.set(key, lives);
    }
    if (lives instanceof Error) throw lives;
    return lives;
  };
}

/**
 * The board's recap estimate as of `today` (the company's date). A board whose date is unknown or reads two ways
 * is "unknown" with what to settle: the date is never guessed. `lives` gives the electrolytics' lives in the cabinet;
 * a list of many boards passes one that remembers them per board (rememberedLives).
 */
export function estimateRecap(
  board: RecapSubject,
  electrolytics: readonly ElectrolyticRow[],
  profile: { slices: readonly CabinetSliceRow[]; isDefault: boolean },
  today: string,
  lives: LivesInCabinet = livesInCabinet,
): RecapEstimate {
  const defaultProfile = profile.isDefault;
  if (electrolytics.length === 0) {
    return cannotTell('no-electrolytics', 'no electrolytic capacitors on the parts list: nothing to recap', null, defaultProfile);
  }
  const rated = electrolytics.filter(
    (c): c is ElectrolyticRow & { ratedTemperatureC: number; ratedLifeHours: number } =>
      c.ratedTemperatureC !== null && c.ratedLifeHours !== null,
  );
  const unrated = electrolytics.filter((c) => !rated.includes(c as (typeof rated)[number])).map((c) => c.designator);
  if (rated.length === 0) {
    return cannotTell(
      'unknown',
      `the parts list gives no rated temperature and life for ${listNames(unrated)}`,
      'add each electrolytic’s rated temperature and life to the parts list',
      defaultProfile,
    );
  }

  let countedFrom: 'last-recap' | 'date-code';
  let start: string;
  if (board.lastRecapOn) {
    countedFrom = 'last-recap';
    start = board.lastRecapOn;
  } else if (board.madeOn) {
    countedFrom = 'date-code';
    start = board.madeOn;
  } else if (board.dateCodeFlag) {
    return cannotTell('unknown', `the date code reads two ways: ${board.dateCodeFlag}`, 'settle the date code', defaultProfile);
  } else {
    return cannotTell(
      'unknown',
      board.dateCode ? `the date code "${board.dateCode}" gives no date` : 'no date code and no recap on record',
      'settle the date code: enter it as printed on the board, or the date of its last recap',
      defaultProfile,
    );
  }

  let due;
  try {
    due = recapDueFromLives({ from: start, lives: lives(rated, profile.slices), asOf: today });
  } catch (err) {
    // A cabinet hotter than a part's rating, or a start after today: say so rather than guess a date.
    if (err instanceof DomainError) {
      // The domain counts capacitors from 1 in our list; say which part by its designator.
      const message = err.message.replace(/^capacitor (\d+): /, (whole, n: string) => `${rated[Number(n) - 1]?.designator ?? whole}: `);
      return cannotTell('unknown', message, null, defaultProfile);
    }
    throw err;
  }
  const limiting = rated[due.limitingCapacitor]!;
  const limitingRating = ratingText(limiting);
  const unratedNote = unrated.length ? ` (${listNames(unrated)} not counted: no rated temperature and life on the parts list)` : '';
  return {
    status: due.status,
    countedFrom,
    countedFromDate: start,
    dueDate: due.dueDate,
    lifeYears: due.lifeYears,
    monthsUntilDue: due.monthsUntilDue,
    limitingDesignator: limiting.designator,
    limitingRating,
    message: `${due.message}${unratedNote}`,
    recommendation:
      due.status === 'overdue'
        ? `recap now: overdue since ${due.dueDate} — ${limiting.designator} (${limitingRating}) sets the date`
        : null,
    defaultProfile,
  };
}
