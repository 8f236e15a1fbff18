// How urgent open care-plan work is, and a work order's state: a word and an icon beside the colour, never colour alone.
import { CalendarCheck, CalendarClock, CircleCheck, CircleSlash, OctagonExclamationPoint } from 'lucide-react';
import { dueStateLabels, workOrderStateLabels, type DueStateName, type WorkOrderState } from '@bumperline/contracts/care-vocabulary';

const dueStyles: Record<DueStateName, { className: string; Icon: typeof CircleCheck }> = {
  overdue: { className: 'bg-down-tint text-down', Icon: OctagonExclamationPoint },
  due_soon: { className: 'bg-attention-tint text-attention', Icon: CalendarClock },
  later: { className: 'bg-running-tint text-running', Icon: CalendarCheck },
};

const badge = 'inline-flex items-center gap-1 rounded-full px-2.5 py-0.5 text-sm font-semibold whitespace-nowrap';

export function DueStateBadge({ state }: { state: DueStateName }) {
  const { className, Icon } = dueStyles[state];
  return (
    <span className={`${badge} ${className}`}>
      <Icon aria-hidden className="size-4" />
      {dueStateLabels[state]}
    </span>
  );
}

/** Open work shows how urgent it is; closed work shows that it was done or skipped. */
export function WorkOrderStateBadge({ state, dueState }: { state: WorkOrderState; dueState: DueStateName | null }) {
  if (state === 'open' && dueState) return <DueStateBadge state={dueState} />;
  if (state === 'done')
    return (
      <span className={`${badge} bg-running-tint text-running`}>
        <CircleCheck aria-hidden className="size-4" />
        {workOrderStateLabels.done}
      </span>
    );
  return (
    <span className={`${badge} bg-paper-dim text-ink-soft`}>
      <CircleSlash aria-hidden className="size-4" />
      {workOrderStateLabels[state]}
    </span>
  );
}
