// Work orders: care-plan work by due date — overdue, due soon, later — filterable by technician and venue, and what
// was done or skipped; searchable by title or game, paged and exportable.
import { Link, useSearchParams } from 'react-router-dom';
import { dueStateLabels, dueStates, workOrderStateLabels, workOrderStates } from '@bumperline/contracts/care-vocabulary';
import type { WorkOrder } from '@bumperline/contracts/work-orders';
import { listWorkOrders, useWorkOrders } from '../../api/work-orders.ts';
import { useTechnicians } from '../../api/calls.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useCan } from '../../api/use-can.ts';
import { useVenues } from '../../api/venues.ts';
import { DataTable, type Column } from '../../components/data-table.tsx';
import { WorkOrderStateBadge } from '../../components/due-state-badge.tsx';
import { FilterSelect } from '../../components/filter-select.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { pagedTableProps, useListParams } from '../../components/use-list-params.ts';
import { formatDate, formatDateTime, type LocaleSettings } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { workOrderFilterKeys, workOrdersListQuery } from './work-orders-queries.ts';

const columns = (locale: LocaleSettings | undefined): Column<WorkOrder, 'dueAt'>[] => [
  {
    header: 'Work',
    cell: (o) => (
      <Link className="link" to={paths.workOrder(o.id)}>
        {o.title}
      </Link>
    ),
    csv: (o) => o.title,
  },
  { header: 'Game', cell: (o) => `${o.game.modelTitle} (${o.game.serial})`, csv: (o) => `${o.game.modelTitle} (${o.game.serial})` },
  {
    header: 'Venue',
    cell: (o) => o.game.venue?.name ?? 'In storage',
    csv: (o) => o.game.venue?.name ?? '',
    className: 'hidden md:table-cell',
  },
  { header: 'Due', sort: 'dueAt', cell: (o) => formatDateTime(o.dueAt, locale), csv: (o) => o.dueAt },
  { header: 'State', cell: (o) => <WorkOrderStateBadge state={o.state} dueState={o.dueState} />, csv: (o) => o.dueState ?? o.state },
  { header: 'Planned', cell: (o) => formatDate(o.plannedOn, locale), csv: (o) => o.plannedOn ?? '', className: 'hidden lg:table-cell' },
  {
    header: 'Technician',
    cell: (o) => o.technician?.name ?? 'Nobody yet',
    csv: (o) => o.technician?.name ?? '',
    className: 'hidden lg:table-cell',
  },
];

async function allWorkOrders(q: ReturnType<typeof workOrdersListQuery>): Promise<WorkOrder[]> {
  const out: WorkOrder[] = [];
  let cursor: string | undefined;
  do {
    const page = await listWorkOrders({ ...q, cursor, limit: 200 });
    out.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor);
  return out;
}

export function WorkOrdersPage() {
  const list = useListParams<'dueAt'>('dueAt', workOrderFilterKeys);
  const [sp] = useSearchParams();
  const query = workOrdersListQuery(sp);
  const orders = useWorkOrders(query);
  const locale = useLocaleSettings();
  const isOffice = useCan('work-orders:plan');
  const technicians = useTechnicians(isOffice);
  const venues = useVenues({ limit: 200, sort: 'name', order: 'asc' });
  const tab = (due: string) => {
    const on = (list.extras.due ?? '') === due && (list.extras.state || 'open') === 'open';
    return (
      <button
        key={due || 'all'}
        type="button"
        aria-pressed={on}
        className={`min-h-11 rounded-md border px-4 font-semibold ${on ? 'border-ink bg-ink text-white' : 'border-paper-line bg-white text-ink'}`}
        onClick={() => {
          list.setFilter('state', '');
          list.setFilter('due', due);
        }}
      >
        {due ? dueStateLabels[due as keyof typeof dueStateLabels] : 'All open'}
      </button>
    );
  };
  return (
    <>
      <PageHeader
        title="Work orders"
        subtitle="Care-plan work as it falls due. Done and skipped work stays as each game’s history."
        actions={
          <Link to={paths.carePlans} className="btn-secondary">
            Care plans
          </Link>
        }
      />
      <div className="mb-3 flex flex-wrap gap-2" role="group" aria-label="Show open work">
        {['', ...dueStates].map(tab)}
      </div>
      <DataTable
        caption="Work orders"
        columns={columns(locale)}
        {...pagedTableProps(list, orders)}
        rowKey={(o) => o.id}
        searchLabel="Search by work, game or serial"
        exportAll={() => allWorkOrders(query)}
        exportName="work-orders"
        emptyTitle={
          query.state === 'open'
            ? query.due
              ? `Nothing ${dueStateLabels[query.due].toLowerCase()}.`
              : 'No open work orders.'
            : 'No work orders here.'
        }
        emptyHint={query.state === 'open' ? <p>Work orders appear when a care plan’s work falls due.</p> : undefined}
        filters={
          <>
            <FilterSelect
              label="State"
              value={list.extras.state ?? ''}
              onChange={(v) => list.setFilter('state', v)}
              anyLabel="To do"
              options={workOrderStates.filter((s) => s !== 'open').map((s) => ({ value: s, label: workOrderStateLabels[s] }))}
            />
            {isOffice ? (
              <FilterSelect
                label="Technician"
                value={list.extras.technicianId ?? ''}
                onChange={(v) => list.setFilter('technicianId', v)}
                options={[
                  { value: 'none', label: 'Nobody yet' },
                  ...(technicians.data?.items ?? []).map((t) => ({ value: t.userId, label: t.name })),
                ]}
              />
            ) : (
              <FilterSelect
                label="Technician"
                value={list.extras.technicianId ?? ''}
                onChange={(v) => list.setFilter('technicianId', v)}
                options={[{ value: 'me', label: 'Mine' }]}
              />
            )}
            <FilterSelect
              label="Venue"
              value={list.extras.venueId ?? ''}
              onChange={(v) => list.setFilter('venueId', v)}
              options={(venues.data?.items ?? []).map((v) => ({ value: v.id, label: v.name }))}
            />
          </>
        }
      />
    </>
  );
}
