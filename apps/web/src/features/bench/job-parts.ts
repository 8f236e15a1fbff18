// The board's parts list as the bench judges it: each line read once by the domain (the same reading the server
// does on finish). A line that does not read still shows, with the domain's message, so nothing is hidden.
import type { BenchJobPart } from '@bumperline/contracts/bench-jobs';
import type { BenchPart } from '@bumperline/domain/components/bench-judgement';
import { readPartEntry } from '@bumperline/domain/components/parts-list-entry';
import { isDomainError } from '@bumperline/domain/errors';

export interface JobPart extends BenchPart {
  /** The line as written on the parts list. */
  line: BenchJobPart;
  /** Why the line could not be read (the part then takes no judged reading). */
  lineProblem: string | null;
}

export function readJobParts(parts: readonly BenchJobPart[]): JobPart[] {
  return parts.map((line) => {
    try {
      const spec = readPartEntry({
        designator: line.designator,
        kind: line.kind,
        value: line.value,
        tolerance: line.tolerance,
        rating: line.rating,
        ratedTemperatureC: line.ratedTemperatureC,
        ratedLifeHours: line.ratedLifeHours,
        notes: line.notes,
      });
      return { ...spec, id: line.id, line, lineProblem: null };
    } catch (err) {
      if (!isDomainError(err)) throw err;
      return {
        id: line.id,
        line,
        lineProblem: `the parts list line for ${line.designator} does not read: ${err.message}`,
        designator: line.designator.trim().toUpperCase(),
        kind: line.kind,
        nominal: null,
        unit: null,
        tolerance: null,
        fuse: null,
        ratingWatts: null,
        ratingVolts: null,
        ratedTemperatureC: line.ratedTemperatureC,
        ratedLifeHours: line.ratedLifeHours,
      };
    }
  });
}

/** "4k7 · 5 % · 1/4 W": the line's value, tolerance and rating as written. */
export function writtenValue(line: BenchJobPart): string {
  return [line.value, line.tolerance, line.rating]
    .map((s) => s.trim())
    .filter(Boolean)
    .join(' · ');
}
