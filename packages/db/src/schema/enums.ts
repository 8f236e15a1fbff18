// Closed sets of values. Each is a text column limited by a CHECK constraint, not a PostgreSQL enum:
// under row-level security the planner uses an index or the column's statistics only for comparisons
// marked leakproof, and text equality is leakproof while enum equality is not — with enums, a filter
// such as `state in (…)` scanned every company's rows. The values come from the shared contracts, so
// the API, the web app and the schema cannot drift apart.
import { sql } from 'drizzle-orm';
import { check, text, type AnyPgColumn } from 'drizzle-orm/pg-core';
import { roles } from '@bumperline/contracts/roles';
import { gameKinds, gameStatuses } from '@bumperline/contracts/games';
import { callStates, problemKinds, severities } from '@bumperline/contracts/calls';
import { benchJobOrigins, benchJobStates, partKinds, readingVerdicts } from '@bumperline/contracts/bench-vocabulary';
import { carePlanScopes, dueReasons, meterKinds, meterReadingSources, workOrderStates } from '@bumperline/contracts/care-vocabulary';
import { keepCostSources, stockLocationKinds, stockMovementReasons, stockUnits } from '@bumperline/contracts/stock-vocabulary';

type Values = readonly [string, ...string[]];

function valueSet<const T extends Values>(values: T) {
  return {
    values,
    /** The text column, typed to the set's values. */
    column: (name: string) => text(name, { enum: values as unknown as [T[number], ...T[number][]] }),
    /** The CHECK constraint that keeps the column inside the set (NULL passes: nullability is the column's). */
    check: (constraintName: string, column: AnyPgColumn) =>
      check(
        constraintName,
        sql`${sql.identifier(column.name)} in (${sql.raw(values.map((v) => `'${v.replace(/'/g, "''")}'`).join(', '))})`,
      ),
  };
}

export const memberRole = valueSet(roles);
export const gameKind = valueSet(gameKinds);
export const gameStatus = valueSet(gameStatuses);

export const problemKind = valueSet(problemKinds);
export const callSeverity = valueSet(severities);
export const callState = valueSet(callStates);
export const callSource = valueSet(['game_tag', 'venue_view', 'staff']);
export const outboxChannel = valueSet(['sms', 'email']);
export const outboxStatus = valueSet(['pending', 'sending', 'sent', 'failed', 'blocked']);

export const partKind = valueSet(partKinds);
export const benchJobState = valueSet(benchJobStates);
export const benchJobOrigin = valueSet(benchJobOrigins);
export const readingVerdict = valueSet(readingVerdicts);

export const carePlanScope = valueSet(carePlanScopes);
export const dueReason = valueSet(dueReasons);
export const workOrderState = valueSet(workOrderStates);
export const meterKind = valueSet(meterKinds);
export const meterReadingSource = valueSet(meterReadingSources);

export const stockLocationKind = valueSet(stockLocationKinds);
export const stockUnit = valueSet(stockUnits);
export const stockMovementReason = valueSet(stockMovementReasons);
export const keepCostSource = valueSet(keepCostSources);
