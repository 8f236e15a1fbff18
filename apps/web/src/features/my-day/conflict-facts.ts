// Both sides of a conflict in words: what the office has now (the record the 409 carried) and what the phone sent.
import { callStateLabels, type CallState } from '@bumperline/contracts/call-vocabulary';
import { workOrderStateLabels, type WorkOrderState } from '@bumperline/contracts/care-vocabulary';
import { formatMinutes } from '../../lib/duration-entry.ts';
import type { QueuedChange } from '../../lib/queued-change.ts';

export type Fact = [label: string, value: string];

/** The office's record as it is now: its state, day and technician where it has them. */
export function officeFacts(current: unknown): Fact[] {
  if (!current || typeof current !== 'object') return [];
  const c = current as {
    state?: string;
    plannedOn?: string | null;
    technician?: { name?: string } | null;
    skipReason?: string | null;
    note?: string | null;
    updatedAt?: string;
  };
  const facts: Fact[] = [];
  if (c.state) {
    const label = (workOrderStateLabels as Record<string, string>)[c.state] ?? callStateLabels[c.state as CallState] ?? c.state;
    facts.push(['State', label]);
  }
  if (c.plannedOn !== undefined) facts.push(['Planned for', c.plannedOn ?? 'no day']);
  if (c.technician !== undefined) facts.push(['Technician', c.technician?.name ?? 'nobody']);
  if (c.skipReason) facts.push(['Skipped because', c.skipReason]);
  if (c.note) facts.push(['Note', c.note]);
  return facts;
}

export function sentFacts(change: QueuedChange): Fact[] {
  switch (change.kind) {
    case 'work-order-done':
      return [
        ['State', (workOrderStateLabels as Record<WorkOrderState, string>).done],
        ['Time on site', formatMinutes(change.labourMinutes)],
        ...change.readings.map((r): Fact => [
          `${r.meter === 'plays' ? 'Plays' : r.meter === 'hours' ? 'Hours' : r.meter} meter`,
          String(r.reading),
        ]),
        ...(change.note ? [['Note', change.note] as Fact] : []),
      ];
    case 'work-order-skip':
      return [
        ['State', workOrderStateLabels.skipped],
        ['Skipped because', change.reason],
      ];
    case 'work-order-move':
      return [['Planned for', change.plannedOn]];
    case 'call-transition':
      return [['State', callStateLabels[change.to]]];
    case 'call-note':
      return [['Note', change.note]];
    case 'call-photo':
      return [['Photo', 'one photo of the game']];
    case 'parts-used':
      return [['Quantity', String(change.quantity)]];
    case 'meter-reading':
      return [[`${change.meter} meter`, String(change.reading)]];
  }
}
