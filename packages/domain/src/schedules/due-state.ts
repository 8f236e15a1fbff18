/** How urgent a piece of recurring work is. */
export type DueState = 'overdue' | 'due-soon' | 'ok';

const URGENCY: Readonly<Record<DueState, number>> = { overdue: 2, 'due-soon': 1, ok: 0 };

export function moreUrgent(a: DueState, b: DueState): DueState {
  return URGENCY[a] >= URGENCY[b] ? a : b;
}

export function urgency(state: DueState): number {
  return URGENCY[state];
}
