// What every "what the step records" section gets from the job screen.
import type { BenchJobDraft, BenchStep, BenchStepProgress } from '@bumperline/contracts/bench-vocabulary';
import type { JobPart } from './job-parts.ts';

export interface RecordProps {
  step: BenchStep;
  progress: BenchStepProgress;
  /** The parts this step concerns (partsForStep), in parts-list order. */
  parts: readonly JobPart[];
  readOnly: boolean;
  /** The server's field problems from the last finish, by field name. */
  problems: Readonly<Record<string, string>>;
  /** Applies a change to the draft (the autosave sends it after a pause). */
  edit: (change: (draft: BenchJobDraft) => BenchJobDraft) => void;
}

/** What each part's row on a step gets: the part, its field name (problems and focus go by it), and how to edit. */
export interface PartRowProps {
  part: JobPart;
  field: string;
  /** The server's problem with this field, if any. */
  problem: string | undefined;
  readOnly: boolean;
  stepKey: string;
  edit: RecordProps['edit'];
}
