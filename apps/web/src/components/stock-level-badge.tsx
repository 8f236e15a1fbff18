// Whether a part's stock is low: a word and an icon beside the colour, never colour alone.
import { CircleCheck, CircleMinus, PackageX, TriangleAlert } from 'lucide-react';

export type StockState = 'low' | 'empty' | 'ok' | 'unwatched';

/** Empty: nothing there; low: at or below the reorder point; ok: above it; unwatched: no reorder point here. */
export function stockState(quantity: number, reorderPoint: number | null): StockState {
  if (quantity <= 0) return 'empty';
  if (reorderPoint === null) return 'unwatched';
  return quantity <= reorderPoint ? 'low' : 'ok';
}

const styles: Record<StockState, { label: string; className: string; Icon: typeof CircleCheck }> = {
  empty: { label: 'None left', className: 'bg-down-tint text-down', Icon: PackageX },
  low: { label: 'Low — reorder', className: 'bg-attention-tint text-attention', Icon: TriangleAlert },
  ok: { label: 'In stock', className: 'bg-running-tint text-running', Icon: CircleCheck },
  unwatched: { label: 'No reorder point', className: 'bg-paper-dim text-ink-soft', Icon: CircleMinus },
};

export function StockLevelBadge({ quantity, reorderPoint }: { quantity: number; reorderPoint: number | null }) {
  const { label, className, Icon } = styles[stockState(quantity, reorderPoint)];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full px-2.5 py-0.5 text-sm font-semibold whitespace-nowrap ${className}`}>
      <Icon aria-hidden className="size-4" />
      {label}
    </span>
  );
}
