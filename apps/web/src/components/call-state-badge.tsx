// A call's state as a word with an icon; colour only supports the word.
import { CircleCheck, CircleDashed, Clock, Hammer, Package, Truck, UserCheck, Wrench, XCircle } from 'lucide-react';
import { callStateLabels, type CallState } from '@bumperline/contracts/call-vocabulary';

const look: Record<CallState, { className: string; Icon: typeof Clock }> = {
  reported: { className: 'bg-down-tint text-down', Icon: CircleDashed },
  assigned: { className: 'bg-attention-tint text-attention', Icon: UserCheck },
  on_the_way: { className: 'bg-attention-tint text-attention', Icon: Truck },
  on_site: { className: 'bg-attention-tint text-attention', Icon: Hammer },
  waiting_parts: { className: 'bg-attention-tint text-attention', Icon: Package },
  at_shop: { className: 'bg-shop-tint text-shop', Icon: Wrench },
  fixed: { className: 'bg-running-tint text-running', Icon: CircleCheck },
  closed: { className: 'bg-paper-dim text-ink-soft', Icon: CircleCheck },
  cancelled: { className: 'bg-paper-dim text-ink-soft', Icon: XCircle },
};

export function CallStateBadge({ state }: { state: CallState }) {
  const { className, Icon } = look[state];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full px-2.5 py-0.5 text-sm font-semibold whitespace-nowrap ${className}`}>
      <Icon aria-hidden className="size-4" />
      {callStateLabels[state]}
    </span>
  );
}
