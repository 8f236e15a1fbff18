// What to order: every part at or below its reorder point, grouped by supplier with each order's total, and the
// whole list as a CSV file to send on.
import { Link } from 'react-router-dom';
import { Download, TriangleAlert } from 'lucide-react';
import { useReorderList } from '../../api/stock.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { formatMoney } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { formatQuantity } from '../../lib/quantity-entry.ts';
import { reorderCsv } from './reorder-csv.ts';

function download(csv: string) {
  const url = URL.createObjectURL(new Blob([csv], { type: 'text/csv;charset=utf-8' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = `what-to-order-${new Date().toISOString().slice(0, 10)}.csv`;
  a.click();
  URL.revokeObjectURL(url);
}

export function ReorderPage() {
  const list = useReorderList();
  const locale = useLocaleSettings();
  const groups = list.data?.groups ?? [];
  return (
    <>
      <p className="mb-2">
        <Link className="link" to={paths.stock}>
          ← Stock
        </Link>
      </p>
      <PageHeader
        title="What to order"
        subtitle="Every part at or below its reorder point, by supplier."
        actions={
          groups.length > 0 && (
            <button type="button" className="btn-secondary" onClick={() => list.data && download(reorderCsv(list.data))}>
              <Download aria-hidden className="size-4" /> Download CSV
            </button>
          )
        }
      />
      {list.isLoading ? (
        <Loading />
      ) : list.error ? (
        <ErrorState error={list.error} onRetry={() => void list.refetch()} />
      ) : groups.length === 0 ? (
        <Empty title="Nothing to order: every watched part is above its reorder point." />
      ) : (
        <div className="grid gap-5">
          {groups.map((g) => (
            <section key={g.supplier} className="card" aria-labelledby={`supplier-${g.supplier || 'none'}`}>
              <h2
                id={`supplier-${g.supplier || 'none'}`}
                className="mb-2 flex flex-wrap items-baseline justify-between gap-2 text-lg font-bold"
              >
                <span>{g.supplier || 'No supplier named'}</span>
                <span className="tabular text-base">Total {formatMoney(g.totalCents, locale)}</span>
              </h2>
              <table className="w-full">
                <caption className="sr-only">To order from {g.supplier || 'no supplier named'}</caption>
                <thead>
                  <tr className="text-left text-sm text-ink-soft">
                    <th className="py-1">Part</th>
                    <th className="hidden py-1 md:table-cell">Stock</th>
                    <th className="py-1 text-right">Held / reorder at</th>
                    <th className="py-1 text-right">Order</th>
                    <th className="py-1 text-right">Cost</th>
                  </tr>
                </thead>
                <tbody>
                  {g.lines.map((l) => (
                    <tr key={`${l.locationId}-${l.cataloguePartId}`} className="border-t border-paper-line">
                      <td className="py-2">
                        <Link className="link" to={paths.part(l.cataloguePartId)}>
                          {l.partNumber}
                        </Link>
                        <span className="block text-sm text-ink-soft">{l.description}</span>
                      </td>
                      <td className="hidden py-2 md:table-cell">{l.locationName}</td>
                      <td className="py-2 text-right">
                        <span className="inline-flex items-center gap-1 font-semibold text-attention">
                          <TriangleAlert aria-hidden className="size-4" />
                          {formatQuantity(l.quantity, l.unit)} / {formatQuantity(l.reorderPoint, l.unit)}
                        </span>
                      </td>
                      <td className="py-2 text-right tabular">{formatQuantity(l.orderQuantity, l.unit)}</td>
                      <td className="py-2 text-right tabular">{formatMoney(l.lineCostCents, locale)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </section>
          ))}
        </div>
      )}
    </>
  );
}
