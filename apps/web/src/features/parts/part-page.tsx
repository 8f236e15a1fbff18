// One catalogue part: what it is and costs, where it is kept (with each stock's reorder point), the parts-list
// entries it fits, and every movement. The office edits or retires it here.
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Archive, Pencil, X } from 'lucide-react';
import { partKindLabels } from '@bumperline/contracts/bench-vocabulary';
import { stockUnitLabels } from '@bumperline/contracts/stock-vocabulary';
import { usePart, useRetirePart } from '../../api/parts-catalogue.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useCan } from '../../api/use-can.ts';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading, Empty } from '../../components/states.tsx';
import { StockLevelBadge } from '../../components/stock-level-badge.tsx';
import { StockMovementsList } from '../../components/stock-movements-list.tsx';
import { formatDate, formatMoney } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { formatQuantity } from '../../lib/quantity-entry.ts';
import { PartForm } from './part-form.tsx';
import { PartFitsSection } from './part-fits-section.tsx';

export function PartPage() {
  const { id = '' } = useParams();
  const detail = usePart(id);
  const retire = useRetirePart(id);
  const canManage = useCan('stock:manage');
  const locale = useLocaleSettings();
  const [editing, setEditing] = useState(false);

  if (detail.isLoading) return <Loading />;
  if (detail.error || !detail.data) return <ErrorState error={detail.error} onRetry={() => void detail.refetch()} />;
  const { part, holdings, fits } = detail.data;

  return (
    <>
      <p className="mb-2">
        <Link className="link" to={paths.parts}>
          ← Parts
        </Link>
      </p>
      <PageHeader
        title={part.partNumber}
        subtitle={
          <>
            {part.description}
            {part.retiredAt && <span className="ml-2 font-semibold">(retired {formatDate(part.retiredAt, locale)})</span>}
          </>
        }
        actions={
          canManage &&
          !part.retiredAt && (
            <>
              <button type="button" className="btn-secondary" onClick={() => setEditing(!editing)} aria-expanded={editing}>
                {editing ? <X aria-hidden className="size-4" /> : <Pencil aria-hidden className="size-4" />} {editing ? 'Close' : 'Edit'}
              </button>
              <button
                type="button"
                className="btn-danger"
                disabled={retire.isPending}
                onClick={() => {
                  if (window.confirm(`Retire ${part.partNumber}? Its stock and history stay; it leaves the lists and pickers.`))
                    retire.mutate();
                }}
              >
                <Archive aria-hidden className="size-4" /> Retire
              </button>
            </>
          )
        }
      />
      {editing && (
        <div className="mb-5">
          <PartForm key={part.version} part={part} onDone={() => setEditing(false)} />
        </div>
      )}
      <div className="grid gap-5 lg:grid-cols-2">
        <section className="card" aria-labelledby="facts-heading">
          <h2 id="facts-heading" className="mb-2 text-lg font-bold">
            The part
          </h2>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="font-semibold text-ink-soft">Kind</dt>
            <dd>{partKindLabels[part.kind]}</dd>
            <dt className="font-semibold text-ink-soft">Counted in</dt>
            <dd>{stockUnitLabels[part.unit]}</dd>
            <dt className="font-semibold text-ink-soft">Unit cost</dt>
            <dd className="tabular">{formatMoney(part.unitCostCents, locale)}</dd>
            <dt className="font-semibold text-ink-soft">Supplier</dt>
            <dd>{part.supplier || '—'}</dd>
            <dt className="font-semibold text-ink-soft">Held in all</dt>
            <dd className="tabular">{formatQuantity(part.totalQuantity, part.unit)}</dd>
            {part.notes && (
              <>
                <dt className="font-semibold text-ink-soft">Notes</dt>
                <dd>{part.notes}</dd>
              </>
            )}
          </dl>
        </section>
        <section className="card" aria-labelledby="held-heading">
          <h2 id="held-heading" className="mb-2 text-lg font-bold">
            Where it is kept
          </h2>
          {holdings.length === 0 ? (
            <Empty title="Not kept anywhere yet." />
          ) : (
            <table className="w-full">
              <caption className="sr-only">Stocks holding {part.partNumber}</caption>
              <thead>
                <tr className="text-left text-sm text-ink-soft">
                  <th className="py-1">Stock</th>
                  <th className="py-1 text-right">Held</th>
                  <th className="px-2 py-1 text-right">Reorder at</th>
                  <th className="px-2 py-1">State</th>
                </tr>
              </thead>
              <tbody>
                {holdings.map((h) => (
                  <tr key={h.locationId} className="border-t border-paper-line">
                    <td className="py-2">
                      <Link className="link" to={paths.stockLocation(h.locationId)}>
                        {h.locationName}
                      </Link>
                    </td>
                    <td className="py-2 text-right">{formatQuantity(h.quantity, part.unit)}</td>
                    <td className="px-2 py-2 text-right">{h.reorderPoint === null ? '—' : formatQuantity(h.reorderPoint, part.unit)}</td>
                    <td className="px-2 py-2">
                      <StockLevelBadge quantity={h.quantity} reorderPoint={h.reorderPoint} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
        <div className="lg:col-span-2">
          <PartFitsSection partId={part.id} fits={fits} canManage={canManage} />
        </div>
        <section className="card lg:col-span-2" aria-labelledby="moves-heading">
          <h2 id="moves-heading" className="mb-2 text-lg font-bold">
            Movements
          </h2>
          <StockMovementsList cataloguePartId={part.id} />
        </section>
      </div>
    </>
  );
}
