// One stock (a warehouse or a van): what it holds with reorder points (the office edits them in place), the forms
// that move stock in and out and count it, and its movements.
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Pencil } from 'lucide-react';
import type { StockLevel } from '@bumperline/contracts/stock';
import { allStockLevels, useStockLevels, useStockLocation, useStockLocations } from '../../api/stock.ts';
import { useMe } from '../../api/me.ts';
import { useCan } from '../../api/use-can.ts';
import { DataTable, type Column } from '../../components/data-table.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading } from '../../components/states.tsx';
import { StockLevelBadge } from '../../components/stock-level-badge.tsx';
import { StockMovementsList } from '../../components/stock-movements-list.tsx';
import { CountForm, ReceiveForm, TransferForm } from '../../components/stock-move-forms.tsx';
import { useListParams } from '../../components/use-list-params.ts';
import { paths } from '../../lib/paths.ts';
import { formatQuantity } from '../../lib/quantity-entry.ts';
import { ReorderPointEditor } from './reorder-point-editor.tsx';

type Sort = 'partNumber';

export function StockLocationPage() {
  const { id = '' } = useParams();
  const location = useStockLocation(id);
  const locations = useStockLocations();
  const me = useMe();
  const canManage = useCan('stock:manage');
  const list = useListParams<Sort>('partNumber', ['low']);
  const { params } = list;
  const query = {
    limit: 50,
    ...(params.q ? { q: params.q } : {}),
    ...(params.order === 'desc' ? { order: 'desc' as const } : {}),
    ...(params.cursor ? { cursor: params.cursor } : {}),
    ...(list.extras.low === 'yes' ? { low: 'true' as const } : {}),
  };
  const levels = useStockLevels(id, query);
  const [editing, setEditing] = useState<string | null>(null);

  if (location.isLoading) return <Loading />;
  if (location.error || !location.data) return <ErrorState error={location.error} onRetry={() => void location.refetch()} />;
  const l = location.data;
  const ownVan = l.kind === 'van' && l.technicianId === me.data?.user.id;
  const canMove = canManage || ownVan;

  const columns: Column<StockLevel, Sort>[] = [
    {
      header: 'Part',
      sort: 'partNumber',
      cell: (v) => (
        <Link className="link" to={paths.part(v.cataloguePartId)}>
          {v.partNumber}
        </Link>
      ),
      csv: (v) => v.partNumber,
    },
    { header: 'Description', cell: (v) => v.description, csv: (v) => v.description, className: 'hidden md:table-cell' },
    { header: 'Held', cell: (v) => formatQuantity(v.quantity, v.unit), csv: (v) => v.quantity, className: 'text-right' },
    {
      header: 'Reorder at / order',
      cell: (v) =>
        editing === v.cataloguePartId ? (
          <ReorderPointEditor level={v} onDone={() => setEditing(null)} />
        ) : (
          <span className="inline-flex items-center gap-2">
            <span className="tabular">
              {v.reorderPoint === null ? '—' : formatQuantity(v.reorderPoint, v.unit)} /{' '}
              {v.reorderQuantity === null ? '—' : formatQuantity(v.reorderQuantity, v.unit)}
            </span>
            {canManage && (
              <button
                type="button"
                className="btn-secondary min-h-9 px-2"
                onClick={() => setEditing(v.cataloguePartId)}
                aria-label={`Edit the reorder point of ${v.partNumber}`}
              >
                <Pencil aria-hidden className="size-4" />
              </button>
            )}
          </span>
        ),
      csv: (v) => v.reorderPoint,
    },
    {
      header: 'State',
      cell: (v) => <StockLevelBadge quantity={v.quantity} reorderPoint={v.reorderPoint} />,
      csv: (v) => (v.low ? 'low' : ''),
    },
  ];

  return (
    <>
      <p className="mb-2">
        <Link className="link" to={paths.stock}>
          ← Stock
        </Link>
      </p>
      <PageHeader title={l.name} subtitle={l.kind === 'van' ? `Van${l.technicianName ? ` of ${l.technicianName}` : ''}` : 'Warehouse'} />
      <DataTable
        caption={`What ${l.name} holds`}
        columns={columns}
        rows={levels.data?.items}
        rowKey={(v) => v.cataloguePartId}
        isLoading={levels.isLoading}
        error={levels.error}
        onRetry={() => void levels.refetch()}
        search={params.q}
        onSearch={list.setSearch}
        searchLabel="Search by part number or description"
        sort={params.sort}
        order={params.order}
        onSort={list.toggleSort}
        onSortSet={list.setSort}
        hasPrev={params.trail.length > 0 || !!params.cursor}
        hasNext={!!levels.data?.nextCursor}
        onPrev={list.prevPage}
        onNext={() => levels.data?.nextCursor && list.nextPage(levels.data.nextCursor)}
        exportAll={() =>
          allStockLevels(id, { ...(params.q ? { q: params.q } : {}), ...(list.extras.low === 'yes' ? { low: 'true' } : {}) })
        }
        exportName={`stock-${l.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}`}
        emptyTitle={params.q || list.extras.low ? 'Nothing here matches.' : 'Nothing held here yet.'}
        filters={
          <label className="flex min-h-11 items-center gap-2 font-semibold">
            <input
              type="checkbox"
              className="size-5"
              checked={list.extras.low === 'yes'}
              onChange={(e) => list.setFilter('low', e.target.checked ? 'yes' : '')}
            />
            Only low
          </label>
        }
      />
      {canMove && (
        <div className="mt-5 grid gap-4 lg:grid-cols-3">
          {canManage && <ReceiveForm location={l} />}
          <TransferForm
            key={`${l.id}-${locations.data?.items.length ?? 0}`}
            locations={locations.data?.items ?? []}
            from={l}
            title={`Move from ${l.name}`}
          />
          <CountForm location={l} />
        </div>
      )}
      <section className="card mt-5" aria-labelledby="moves-heading">
        <h2 id="moves-heading" className="mb-2 text-lg font-bold">
          Movements
        </h2>
        <StockMovementsList locationId={l.id} />
      </section>
    </>
  );
}
