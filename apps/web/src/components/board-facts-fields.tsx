// What is printed on a board and when it was last recapped, as form fields: for fitting a board in a game (the
// game's page) and for correcting it (the board's page). The date code is checked as typed by the domain code the
// API runs again on save.
import { dateCodeProblem } from '../lib/date-code-check.ts';
import { Field, inputClass } from './field.tsx';

export interface BoardFactsDraft {
  serial: string;
  dateCode: string;
  /** YYYY-MM-DD, or '' for none on record. */
  lastRecapOn: string;
}

export const boardFactsOf = (b: { serial: string; dateCode: string; lastRecapOn: string | null }): BoardFactsDraft => ({
  serial: b.serial,
  dateCode: b.dateCode,
  lastRecapOn: b.lastRecapOn ?? '',
});

/** The fields' problems found before anything is sent (an impossible week, a date code after today). */
export function boardFactsProblems(facts: BoardFactsDraft): Record<string, string> {
  const codeProblem = dateCodeProblem(facts.dateCode);
  return codeProblem ? { dateCode: codeProblem } : {};
}

export function BoardFactsFields({
  facts,
  errors,
  onChange,
}: {
  facts: BoardFactsDraft;
  errors: Readonly<Record<string, string>>;
  onChange: (facts: BoardFactsDraft) => void;
}) {
  return (
    <>
      <Field label="Serial" error={errors.serial}>
        {(p) => (
          <input
            {...p}
            className={inputClass}
            value={facts.serial}
            maxLength={60}
            autoComplete="off"
            onChange={(e) => onChange({ ...facts, serial: e.target.value })}
          />
        )}
      </Field>
      <Field
        label="Date code as printed"
        error={errors.dateCode}
        hint="8934 (year and week), 1989-W34 or 1989-08. A code that reads two ways is saved and flagged; settle it by writing 20W12 (week 12 of 2020) or 2012-01."
      >
        {(p) => (
          <input
            {...p}
            className={inputClass}
            value={facts.dateCode}
            maxLength={40}
            autoComplete="off"
            onChange={(e) => onChange({ ...facts, dateCode: e.target.value })}
          />
        )}
      </Field>
      <Field label="Last recap (if any)" error={errors.lastRecapOn}>
        {(p) => (
          <input
            {...p}
            type="date"
            className={inputClass}
            value={facts.lastRecapOn}
            onChange={(e) => onChange({ ...facts, lastRecapOn: e.target.value })}
          />
        )}
      </Field>
    </>
  );
}
