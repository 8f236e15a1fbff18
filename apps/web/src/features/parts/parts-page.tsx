// The parts catalogue: every part the company stocks, searchable by number or description, filtered by kind,
// sorted and paged, with what it costs and how many are held in all.
import { useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Plus, X } from 'lucide-react';
import type { CataloguePart } from '@bumperline/contracts/parts-catalogue';
import { partKindLabels, partKinds } from '@bumperline/contracts/bench-vocabulary';
import { allParts, useParts } from '../../api/parts-catalogue.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useCan } from '../../api/use-can.ts';
import { DataTable, type Column } from '../../components/data-table.tsx';
import { FilterSelect } from '../../components/filter-select.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { pagedTableProps, useListParams } from '../../components/use-list-params.ts';
import { formatMoney, type LocaleSettings } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { formatQuantity } from '../../lib/quantity-entry.ts';
import { PartForm } from './part-form.tsx';
import { partsListQuery, type PartSort } from './parts-queries.ts';

const columns = (locale: LocaleSettings | undefined): Column<CataloguePart, PartSort>[] => [
  {
    header: 'Part number',
    sort: 'partNumber',
    cell: (p) => (
      <Link className="link" to={paths.part(p.id)}>
        {p.partNumber}
      </Link>
    ),
    csv: (p) => p.partNumber,
  },
  { header: 'Description', sort: 'description', cell: (p) => p.description, csv: (p) => p.description },
  { header: 'Kind', cell: (p) => partKindLabels[p.kind], csv: (p) => partKindLabels[p.kind], className: 'hidden lg:table-cell' },
  {
    header: 'Unit cost',
    cell: (p) => formatMoney(p.unitCostCents, locale),
    csv: (p) => (p.unitCostCents / 100).toFixed(2),
    className: 'text-right',
  },
  { header: 'Held', cell: (p) => formatQuantity(p.totalQuantity, p.unit), csv: (p) => p.totalQuantity, className: 'text-right' },
  { header: 'Supplier', cell: (p) => p.supplier || '—', csv: (p) => p.supplier, className: 'hidden md:table-cell' },
];

export function PartsPage() {
  const list = useListParams<PartSort>('partNumber', ['kind', 'retired']);
  const [sp] = useSearchParams();
  const query = partsListQuery(sp);
  const parts = useParts(query);
  const canManage = useCan('stock:manage');
  const locale = useLocaleSettings();
  const navigate = useNavigate();
  const [adding, setAdding] = useState(false);

  return (
    <>
      <PageHeader
        title="Parts"
        subtitle="The parts catalogue: what you buy, what it costs, how many you hold."
        actions={
          <>
            <Link to={paths.stock} className="btn-secondary">
              Stock
            </Link>
            {canManage && (
              <button type="button" className="btn-primary" onClick={() => setAdding(!adding)} aria-expanded={adding}>
                {adding ? <X aria-hidden className="size-4" /> : <Plus aria-hidden className="size-4" />} {adding ? 'Close' : 'Add part'}
              </button>
            )}
          </>
        }
      />
      {adding && (
        <div className="mb-5">
          <PartForm onDone={(part) => navigate(paths.part(part.id))} />
        </div>
      )}
      <DataTable
        caption="Parts"
        columns={columns(locale)}
        {...pagedTableProps(list, parts)}
        rowKey={(p) => p.id}
        searchLabel="Search parts by number or description"
        exportAll={() =>
          allParts({ q: query.q, sort: query.sort, order: query.order, kind: query.kind, includeRetired: query.includeRetired })
        }
        exportName="parts"
        emptyTitle={query.q || query.kind ? 'No part matches that search.' : 'No parts in the catalogue yet.'}
        filters={
          <>
            <FilterSelect
              label="Kind"
              value={list.extras.kind ?? ''}
              onChange={(v) => list.setFilter('kind', v)}
              options={partKinds.map((k) => ({ value: k, label: partKindLabels[k] }))}
            />
            <label className="flex min-h-11 items-center gap-2 font-semibold">
              <input
                type="checkbox"
                className="size-5"
                checked={list.extras.retired === 'yes'}
                onChange={(e) => list.setFilter('retired', e.target.checked ? 'yes' : '')}
              />
              Show retired
            </label>
          </>
        }
      />
    </>
  );
}
