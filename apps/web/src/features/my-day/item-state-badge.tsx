// An item's state on the day in words with an icon — and, for a change not yet sent, that it is not sent yet.
import { CircleCheck, CircleDashed, CloudUpload, SkipForward, Wrench } from 'lucide-react';
import { callStateLabels, type CallState } from '@bumperline/contracts/call-vocabulary';
import { workOrderStateLabels, type WorkOrderState } from '@bumperline/contracts/care-vocabulary';
import type { ItemView } from './day-overlay.ts';

function words(kind: ItemView['kind'], state: string): string {
  if (kind === 'service_call') return callStateLabels[state as CallState] ?? state;
  if (kind === 'work_order') return workOrderStateLabels[state as WorkOrderState] ?? state;
  return state === 'finished' ? 'Finished' : 'In progress';
}

const doneStates = new Set(['done', 'fixed', 'closed', 'finished']);

export function ItemStateBadge({ item }: { item: ItemView }) {
  const state = item.pendingState ?? item.state;
  const Icon = doneStates.has(state) ? CircleCheck : state === 'skipped' ? SkipForward : item.kind === 'bench_job' ? Wrench : CircleDashed;
  const tone = doneStates.has(state)
    ? 'bg-running-tint text-running'
    : state === 'skipped'
      ? 'bg-paper-dim text-ink-soft'
      : 'bg-attention-tint text-attention';
  return (
    <span className="inline-flex flex-wrap items-center gap-1">
      <span className={`inline-flex items-center gap-1 rounded-full px-2.5 py-0.5 text-sm font-semibold whitespace-nowrap ${tone}`}>
        <Icon aria-hidden className="size-4" />
        {words(item.kind, state)}
      </span>
      {(item.pendingState || item.pendingMoveTo) && (
        <span className="inline-flex items-center gap-1 rounded-full border border-attention px-2 py-0.5 text-sm font-semibold whitespace-nowrap text-attention">
          <CloudUpload aria-hidden className="size-4" />
          {item.pendingMoveTo ? `Moved to ${item.pendingMoveTo} — not sent yet` : 'Not sent yet'}
        </span>
      )}
    </span>
  );
}
