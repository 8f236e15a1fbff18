// The calendar part of a care plan, chosen in plain words: a first date and time, how often, on which days, and when
// it ends. The RFC 5545 rule is written from the choices by the domain and never shown; the words it reads as and the
// next five dates (in the company's time zone) follow every change, and a schedule that never falls on a date says so.
import { useMemo } from 'react';
import type { Weekday } from '@bumperline/domain/schedules/recurrence-rule';
import {
  describeRule,
  MONTH_NAMES,
  POSITION_NAMES,
  ruleFromChoices,
  ruleOccurs,
  upcomingOccurrences,
  WEEKDAY_NAMES,
  type Position,
  type PositionDay,
  type RuleChoices,
} from '@bumperline/domain/schedules/rule-wording';
import { inputClass } from '../../components/field.tsx';
import type { LocaleSettings } from '../../lib/format.ts';

const WEEKDAYS = Object.keys(WEEKDAY_NAMES) as Weekday[];
const POSITIONS: Position[] = [1, 2, 3, 4, -1];

export interface RuleState {
  /** "2027-01-26" */
  startDate: string;
  /** "09:00" */
  startTime: string;
  choices: RuleChoices;
}

export interface RuleOutcome {
  rule: string | null;
  ruleStart: string;
  /** What is wrong, in words; null when the rule is good. */
  problem: string | null;
}

/** The rule the choices make, or what is wrong with them (checked here as the API checks it). */
export function ruleOutcome(state: RuleState, timeZone: string): RuleOutcome {
  const ruleStart = `${state.startDate}T${state.startTime}`;
  if (!/^\d{4}-\d{2}-\d{2}$/.test(state.startDate) || !/^\d{2}:\d{2}$/.test(state.startTime)) {
    return { rule: null, ruleStart, problem: 'Choose the first date and the time of day.' };
  }
  try {
    const rule = ruleFromChoices(state.choices);
    if (!ruleOccurs(rule, { start: ruleStart, timeZone }))
      return { rule, ruleStart, problem: 'This schedule never falls on a date: choose another day or end.' };
    return { rule, ruleStart, problem: null };
  } catch (err) {
    return { rule: null, ruleStart, problem: err instanceof Error ? err.message : 'These choices do not make a schedule.' };
  }
}

/** "Tue, Dec 29, 2026, 9:00 AM": the weekday matters when the rule is about weekdays. */
function dateWithWeekday(at: Date, locale: LocaleSettings): string {
  return new Intl.DateTimeFormat(locale.locale, {
    weekday: 'short',
    year: 'numeric',
    month: 'short',
    day: 'numeric',
    hour: 'numeric',
    minute: '2-digit',
    timeZone: locale.timeZone,
  }).format(at);
}

const unitWords: Record<RuleChoices['every'], [string, string]> = {
  day: ['day', 'days'],
  week: ['week', 'weeks'],
  month: ['month', 'months'],
  year: ['year', 'years'],
};

export function RuleEditor(p: { value: RuleState; onChange: (next: RuleState) => void; locale: LocaleSettings; serverError?: string }) {
  const { value, onChange, locale } = p;
  const c = value.choices;
  const set = (patch: Partial<RuleChoices>) => onChange({ ...value, choices: { ...c, ...patch } });
  const outcome = ruleOutcome(value, locale.timeZone);
  const words = outcome.rule && !outcome.problem ? describeRule(outcome.rule, outcome.ruleStart) : null;
  const next = useMemo(
    () =>
      outcome.rule && !outcome.problem
        ? upcomingOccurrences(outcome.rule, { start: outcome.ruleStart, timeZone: locale.timeZone }, new Date(), 5)
        : [],
    [outcome.rule, outcome.problem, outcome.ruleStart, locale.timeZone],
  );
  const problem = outcome.problem ?? p.serverError ?? null;

  return (
    <fieldset className="flex flex-col gap-4 rounded-md border border-paper-line p-4" aria-describedby="rule-words">
      <legend className="px-1 font-bold">Calendar</legend>
      <div className="flex flex-wrap gap-4">
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Starting on</span>
          <input
            type="date"
            className={`${inputClass} w-auto max-w-fit`}
            value={value.startDate}
            onChange={(e) => onChange({ ...value, startDate: e.target.value })}
          />
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-semibold">At</span>
          <input
            type="time"
            className={`${inputClass} w-auto max-w-fit`}
            value={value.startTime}
            onChange={(e) => onChange({ ...value, startTime: e.target.value })}
          />
        </label>
      </div>

      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1">
          <span className="font-semibold">Repeat every</span>
          <input
            type="number"
            min={1}
            max={999}
            className={`${inputClass} w-24 max-w-24`}
            value={c.interval}
            onChange={(e) => set({ interval: Math.max(1, Math.floor(Number(e.target.value) || 1)) })}
          />
        </label>
        <label className="flex flex-col gap-1">
          <span className="sr-only">Unit</span>
          <select
            aria-label="Unit"
            className={`${inputClass} w-auto max-w-fit`}
            value={c.every}
            onChange={(e) => set({ every: e.target.value as RuleChoices['every'] })}
          >
            {(Object.keys(unitWords) as RuleChoices['every'][]).map((u) => (
              <option key={u} value={u}>
                {unitWords[u][c.interval === 1 ? 0 : 1]}
              </option>
            ))}
          </select>
        </label>
      </div>

      {c.every === 'week' && (
        <fieldset>
          <legend className="mb-1 font-semibold">On</legend>
          <div className="flex flex-wrap gap-2">
            {WEEKDAYS.map((d) => {
              const on = c.weekdays.includes(d);
              return (
                <button
                  key={d}
                  type="button"
                  aria-pressed={on}
                  className={`min-h-11 min-w-14 rounded-md border px-3 font-semibold ${on ? 'border-ink bg-ink text-white' : 'border-paper-line bg-white text-ink'}`}
                  onClick={() => set({ weekdays: on ? c.weekdays.filter((x) => x !== d) : [...c.weekdays, d] })}
                >
                  {WEEKDAY_NAMES[d].slice(0, 3)}
                </button>
              );
            })}
          </div>
        </fieldset>
      )}

      {(c.every === 'month' || c.every === 'year') && (
        <fieldset className="flex flex-col gap-2">
          <legend className="sr-only">On which day</legend>
          {c.every === 'year' && (
            <label className="flex items-center gap-2">
              <span>In</span>
              <select
                className={`${inputClass} w-auto max-w-fit`}
                value={c.month}
                onChange={(e) => set({ month: Number(e.target.value) })}
                aria-label="Month"
              >
                {MONTH_NAMES.map((m, i) => (
                  <option key={m} value={i + 1}>
                    {m}
                  </option>
                ))}
              </select>
            </label>
          )}
          <div className="flex flex-wrap items-center gap-2">
            <label className="flex min-h-11 items-center gap-2">
              <input
                type="radio"
                className="size-5"
                name="monthly-by"
                checked={c.monthlyBy === 'day-of-month'}
                onChange={() => set({ monthlyBy: 'day-of-month' })}
              />
              On day
            </label>
            <select
              className={`${inputClass} w-auto max-w-fit`}
              aria-label="Day of the month"
              value={c.monthDay}
              disabled={c.monthlyBy !== 'day-of-month'}
              onChange={(e) => set({ monthDay: Number(e.target.value) })}
            >
              {Array.from({ length: 31 }, (_, i) => i + 1).map((d) => (
                <option key={d} value={d}>
                  {d}
                </option>
              ))}
              <option value={-1}>the last day</option>
            </select>
          </div>
          <div className="flex flex-wrap items-center gap-2">
            <label className="flex min-h-11 items-center gap-2">
              <input
                type="radio"
                className="size-5"
                name="monthly-by"
                checked={c.monthlyBy === 'position'}
                onChange={() => set({ monthlyBy: 'position' })}
              />
              On the
            </label>
            <select
              className={`${inputClass} w-auto max-w-fit`}
              aria-label="Which one"
              value={c.position}
              disabled={c.monthlyBy !== 'position'}
              onChange={(e) => set({ position: Number(e.target.value) as Position })}
            >
              {POSITIONS.map((n) => (
                <option key={n} value={n}>
                  {POSITION_NAMES[n]}
                </option>
              ))}
            </select>
            <select
              className={`${inputClass} w-auto max-w-fit`}
              aria-label="Which day"
              value={c.positionDay}
              disabled={c.monthlyBy !== 'position'}
              onChange={(e) => set({ positionDay: e.target.value as PositionDay })}
            >
              {WEEKDAYS.map((d) => (
                <option key={d} value={d}>
                  {WEEKDAY_NAMES[d]}
                </option>
              ))}
              <option value="weekday">weekday (Mon–Fri)</option>
              <option value="day">day</option>
            </select>
          </div>
        </fieldset>
      )}

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Ends</legend>
        <label className="flex min-h-11 items-center gap-2">
          <input type="radio" className="size-5" name="rule-end" checked={c.end === 'never'} onChange={() => set({ end: 'never' })} />
          Never
        </label>
        <div className="flex flex-wrap items-center gap-2">
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" className="size-5" name="rule-end" checked={c.end === 'after'} onChange={() => set({ end: 'after' })} />
            After
          </label>
          <input
            type="number"
            min={1}
            aria-label="How many times"
            className={`${inputClass} w-24 max-w-24`}
            disabled={c.end !== 'after'}
            value={c.times}
            onChange={(e) => set({ times: Math.max(1, Math.floor(Number(e.target.value) || 1)) })}
          />
          <span>times</span>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" className="size-5" name="rule-end" checked={c.end === 'until'} onChange={() => set({ end: 'until' })} />
            On
          </label>
          <input
            type="date"
            aria-label="Last date"
            className={`${inputClass} w-auto max-w-fit`}
            disabled={c.end !== 'until'}
            value={c.until}
            onChange={(e) => set({ until: e.target.value })}
          />
        </div>
      </fieldset>

      <div id="rule-words" aria-live="polite" className="rounded-md bg-paper-dim p-3">
        {problem ? (
          <p className="font-semibold text-down" role="alert">
            {problem}
          </p>
        ) : (
          <>
            <p className="font-bold">{words}</p>
            <p className="mt-2 text-sm font-semibold text-ink-soft">Next dates</p>
            <ol className="list-inside list-decimal tabular-nums">
              {next.map((o) => (
                <li key={o.at.toISOString()}>{dateWithWeekday(o.at, locale)}</li>
              ))}
            </ol>
            {next.length < 5 && (
              <p className="text-sm text-ink-soft">{next.length === 0 ? 'No dates from today on.' : 'No more dates after these.'}</p>
            )}
          </>
        )}
      </div>
    </fieldset>
  );
}
