// A part's or a stock's movements, newest first, a page at a time: what moved, from where to where, who and when;
// a count shows what the stock said and what was counted.
import { useState } from 'react';
import { ArrowRight, ChevronLeft, ChevronRight } from 'lucide-react';
import type { StockMovement } from '@bumperline/contracts/stock';
import { stockMovementReasonLabels } from '@bumperline/contracts/stock-vocabulary';
import { useStockMovements } from '../api/stock.ts';
import { useLocaleSettings } from '../api/me.ts';
import { formatDateTime } from '../lib/format.ts';
import { formatQuantity } from '../lib/quantity-entry.ts';
import { Empty, ErrorState, Loading } from './states.tsx';

function what(m: StockMovement): string {
  if (m.reason === 'counted') {
    const diff = m.difference ?? 0;
    const sign = diff > 0 ? '+' : diff < 0 ? '−' : '±';
    return `Counted ${formatQuantity(m.countedQuantity ?? 0, m.unit)} (the stock said ${formatQuantity(m.expectedQuantity ?? 0, m.unit)}: ${sign}${formatQuantity(Math.abs(diff), m.unit)})`;
  }
  return `${stockMovementReasonLabels[m.reason]}: ${formatQuantity(m.quantity, m.unit)}`;
}

export function StockMovementsList({ cataloguePartId, locationId }: { cataloguePartId?: string; locationId?: string }) {
  const locale = useLocaleSettings();
  const [trail, setTrail] = useState<(string | undefined)[]>([]);
  const [cursor, setCursor] = useState<string | undefined>(undefined);
  const movements = useStockMovements({
    limit: 20,
    ...(cataloguePartId ? { cataloguePartId } : { locationId }),
    ...(cursor ? { cursor } : {}),
  });
  if (movements.isLoading) return <Loading label="Loading movements…" />;
  if (movements.error) return <ErrorState error={movements.error} onRetry={() => void movements.refetch()} />;
  const items = movements.data?.items ?? [];
  if (items.length === 0 && !cursor) return <Empty title="Nothing has moved yet." />;
  return (
    <div className="grid gap-2">
      <ul className="divide-y divide-paper-line" aria-label="Movements">
        {items.map((m) => (
          <li key={m.id} className="grid gap-0.5 py-2">
            <span className="font-semibold">{what(m)}</span>
            <span className="flex flex-wrap items-center gap-1 text-sm text-ink-soft">
              {!cataloguePartId && <span className="font-semibold text-ink">{m.partNumber}</span>}
              {m.fromLocationName && <span>{m.fromLocationName}</span>}
              {m.fromLocationName && m.toLocationName && <ArrowRight aria-label="to" className="size-4" />}
              {m.toLocationName && <span>{m.toLocationName}</span>}
              {m.reason === 'used' && <span>(on a job)</span>}
              <span>· {formatDateTime(m.at, locale)}</span>
              {m.byName && <span>· {m.byName}</span>}
              {m.note && <span>· “{m.note}”</span>}
            </span>
          </li>
        ))}
      </ul>
      <div className="flex gap-2">
        <button
          type="button"
          className="btn-secondary"
          disabled={trail.length === 0}
          onClick={() => {
            const prev = [...trail];
            setCursor(prev.pop());
            setTrail(prev);
          }}
        >
          <ChevronLeft aria-hidden className="size-4" /> Newer
        </button>
        <button
          type="button"
          className="btn-secondary"
          disabled={!movements.data?.nextCursor}
          onClick={() => {
            setTrail([...trail, cursor]);
            setCursor(movements.data?.nextCursor ?? undefined);
          }}
        >
          Older <ChevronRight aria-hidden className="size-4" />
        </button>
      </div>
    </div>
  );
}
