// Van stock, on the technician's phone: what is on their van (low parts first, each with a word and an icon), a
// count, and a transfer from the warehouse. Big targets for one hand in a dark bar.
import { useState } from 'react';
import { ArrowRightLeft, ClipboardCheck, Truck } from 'lucide-react';
import type { StockLevel } from '@bumperline/contracts/stock';
import { useMakeMyVan, useMyVan, useStockLocations } from '../../api/stock.ts';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { StockLevelBadge, stockState } from '../../components/stock-level-badge.tsx';
import { CountForm, TransferForm } from '../../components/stock-move-forms.tsx';
import { formatQuantity } from '../../lib/quantity-entry.ts';

const urgency = { empty: 0, low: 1, ok: 2, unwatched: 3 } as const;
const byUrgency = (a: StockLevel, b: StockLevel) =>
  urgency[stockState(a.quantity, a.reorderPoint)] - urgency[stockState(b.quantity, b.reorderPoint)] ||
  a.partNumber.localeCompare(b.partNumber);

type Panel = 'count' | 'transfer' | null;

export function VanPage() {
  const van = useMyVan();
  const locations = useStockLocations();
  const make = useMakeMyVan();
  const [panel, setPanel] = useState<Panel>(null);

  if (van.isLoading) return <Loading label="Loading your van…" />;
  if (van.error || !van.data) return <ErrorState error={van.error} onRetry={() => void van.refetch()} />;
  const { location, levels } = van.data;

  if (!location) {
    return (
      <div className="mx-auto grid max-w-lg gap-4">
        <h1 className="text-2xl font-extrabold">Van stock</h1>
        <Empty title="You have no van stock yet.">
          <p>Start one to move parts from the warehouse onto your van.</p>
          <button type="button" className="btn-primary min-h-12 text-lg" disabled={make.isPending} onClick={() => make.mutate()}>
            <Truck aria-hidden className="size-5" /> Start my van stock
          </button>
        </Empty>
      </div>
    );
  }

  const toggle = (p: Panel) => setPanel(panel === p ? null : p);
  const sorted = [...levels].sort(byUrgency);
  const lowCount = levels.filter((l) => l.low || l.quantity <= 0).length;
  return (
    <div className="mx-auto grid max-w-lg gap-4">
      <header>
        <h1 className="text-2xl font-extrabold">Van stock</h1>
        <p className="text-ink-soft">
          {location.name} · {levels.length} {levels.length === 1 ? 'part' : 'parts'}
          {lowCount > 0 ? ` · ${lowCount} low or out` : ''}
        </p>
      </header>
      <div className="grid grid-cols-2 gap-3">
        <button type="button" className="btn-primary min-h-14 text-lg" aria-expanded={panel === 'count'} onClick={() => toggle('count')}>
          <ClipboardCheck aria-hidden className="size-6" /> Count
        </button>
        <button
          type="button"
          className="btn-secondary min-h-14 text-lg"
          aria-expanded={panel === 'transfer'}
          onClick={() => toggle('transfer')}
        >
          <ArrowRightLeft aria-hidden className="size-6" /> Get parts
        </button>
      </div>
      {panel === 'count' && <CountForm location={location} large />}
      {panel === 'transfer' &&
        (locations.isLoading ? (
          <Loading />
        ) : (
          <TransferForm
            locations={(locations.data?.items ?? []).filter((l) => l.kind === 'warehouse' || l.id === location.id)}
            to={location}
            large
            title="Get parts from the warehouse"
          />
        ))}
      {sorted.length === 0 ? (
        <Empty title="Nothing on your van yet.">
          <p>Use “Get parts” to move parts from the warehouse.</p>
        </Empty>
      ) : (
        <ul className="grid gap-2" aria-label="On your van">
          {sorted.map((l) => (
            <li key={l.cataloguePartId} className="card flex min-h-16 items-center justify-between gap-3 p-3">
              <span className="grid">
                <span className="text-lg font-bold">{l.partNumber}</span>
                <span className="text-sm text-ink-soft">{l.description}</span>
                <span className="mt-1">
                  <StockLevelBadge quantity={l.quantity} reorderPoint={l.reorderPoint} />
                </span>
              </span>
              <span className="tabular text-2xl font-extrabold" aria-label={`${formatQuantity(l.quantity, l.unit)} on the van`}>
                {formatQuantity(l.quantity, l.unit)}
              </span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
