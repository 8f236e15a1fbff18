// Care plans: every plan of the company by name, searchable and paged, with what it covers and when it falls due.
import { Link, useSearchParams } from 'react-router-dom';
import { Plus } from 'lucide-react';
import type { CarePlan } from '@bumperline/contracts/care-plans';
import { listCarePlans, useCarePlans } from '../../api/care-plans.ts';
import { useCan } from '../../api/use-can.ts';
import { DataTable, type Column } from '../../components/data-table.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { pagedTableProps, useListParams } from '../../components/use-list-params.ts';
import { formatMinutes } from '../../lib/duration-entry.ts';
import { paths } from '../../lib/paths.ts';
import { carePlansListQuery, type CarePlanSort } from './care-plans-queries.ts';

const count = new Intl.NumberFormat('en-US');

/** When a plan falls due, in words: its calendar, plays, hours and capacitor life, whichever comes first. */
export function dueWords(p: CarePlan): string {
  const parts = [
    p.ruleWording,
    p.playsEvery !== null ? `every ${count.format(p.playsEvery)} plays` : null,
    p.hoursEvery !== null ? `every ${count.format(p.hoursEvery)} power-on hours` : null,
    p.byCapacitorLife ? 'when capacitors near end of life' : null,
  ].filter((x): x is string => !!x);
  return parts.join('; or ');
}

const covers = (p: CarePlan) => (p.model ? `Every ${p.model.title}` : p.game ? `${p.game.modelTitle} (${p.game.serial})` : '—');

const columns: Column<CarePlan, CarePlanSort>[] = [
  {
    header: 'Name',
    sort: 'name',
    cell: (p) => (
      <Link className="link" to={paths.carePlan(p.id)}>
        {p.name}
      </Link>
    ),
    csv: (p) => p.name,
  },
  { header: 'Covers', cell: covers, csv: covers },
  { header: 'Falls due', cell: dueWords, csv: dueWords, className: 'hidden md:table-cell' },
  { header: 'On site', cell: (p) => formatMinutes(p.onSiteMinutes), csv: (p) => p.onSiteMinutes, className: 'hidden lg:table-cell' },
  {
    header: 'Usual technician',
    cell: (p) => p.technician?.name ?? 'Nearest with the skills',
    csv: (p) => p.technician?.name ?? '',
    className: 'hidden lg:table-cell',
  },
];

async function allCarePlans(q: ReturnType<typeof carePlansListQuery>): Promise<CarePlan[]> {
  const out: CarePlan[] = [];
  let cursor: string | undefined;
  do {
    const page = await listCarePlans({ ...q, cursor, limit: 200 });
    out.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor);
  return out;
}

export function CarePlansPage() {
  const list = useListParams<CarePlanSort>('name', ['retired']);
  const [sp] = useSearchParams();
  const query = carePlansListQuery(sp);
  const plans = useCarePlans(query);
  const canWrite = useCan('care-plans:write');
  return (
    <>
      <PageHeader
        title="Care plans"
        subtitle="Recurring preventive work: what to do, for which games, and when it falls due."
        actions={
          <>
            <Link to={paths.workOrders} className="btn-secondary">
              Work orders
            </Link>
            {canWrite && (
              <Link to={paths.newCarePlan} className="btn-primary">
                <Plus aria-hidden className="size-4" /> New care plan
              </Link>
            )}
          </>
        }
      />
      <DataTable
        caption="Care plans"
        columns={columns}
        {...pagedTableProps(list, plans)}
        rowKey={(p) => p.id}
        searchLabel="Search care plans by name"
        exportAll={() => allCarePlans(query)}
        exportName="care-plans"
        emptyTitle={query.q ? 'No care plan matches that search.' : 'No care plans yet.'}
        filters={
          <label className="flex min-h-11 items-center gap-2 font-semibold">
            <input
              type="checkbox"
              className="size-5"
              checked={list.extras.retired === 'yes'}
              onChange={(e) => list.setFilter('retired', e.target.checked ? 'yes' : '')}
            />
            Show retired
          </label>
        }
      />
    </>
  );
}
