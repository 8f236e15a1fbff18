// The bench screens' hints on what a step records (its name in words is stepRecordLabels, shared with the job sheet).
import type { StepRecordKind } from '@bumperline/contracts/bench-vocabulary';

/** What the technician does on a step of each kind, said under its title. */
export const recordHints: Record<StepRecordKind, string> = {
  check: '',
  readings: 'Read each part with the meter and type the value as the meter shows it (570, 4.63k, 1M2).',
  diode_set: 'Diode test range: type the volts shown, or OL when nothing conducts.',
  fuse: 'Type the marking of the fuse you fitted, as printed (T2.5A 250V).',
  power: 'With the board running, measure the volts across each resistor.',
  parts_used: 'List each part you fitted, from the parts list or in your own words.',
  photo: '',
  note: 'Write what you found.',
};
