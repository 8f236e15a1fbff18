import { Link } from 'react-router-dom';
import { Plus } from 'lucide-react';
import type { Venue } from '@bumperline/contracts/venues';
import { DataTable, type Column } from '../../components/data-table.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { pagedTableProps, useListParams } from '../../components/use-list-params.ts';
import { paths } from '../../lib/paths.ts';
import { useCan } from '../../api/use-can.ts';
import { allVenues, useVenues } from '../../api/venues.ts';

type Sort = 'name' | 'city' | 'createdAt';

const columns: Column<Venue, Sort>[] = [
  {
    header: 'Venue',
    sort: 'name',
    cell: (v) => (
      <Link className="link" to={paths.venue(v.id)}>
        {v.name}
      </Link>
    ),
    csv: (v) => v.name,
  },
  { header: 'Address', cell: (v) => v.addressLine, csv: (v) => v.addressLine, className: 'hidden md:table-cell' },
  { header: 'City', sort: 'city', cell: (v) => v.city, csv: (v) => v.city },
  { header: 'Games', cell: (v) => v.gameCount, csv: (v) => v.gameCount, className: 'text-right' },
  { header: 'Contact', cell: (v) => v.contactName || '—', csv: (v) => v.contactName, className: 'hidden lg:table-cell' },
];

export function VenuesPage() {
  const list = useListParams<Sort>('name', ['retired']);
  const { params } = list;
  const includeRetired = list.extras.retired === 'yes';
  const query = {
    q: params.q || undefined,
    sort: params.sort,
    order: params.order,
    cursor: params.cursor,
    limit: 25,
    includeRetired: includeRetired ? ('true' as const) : undefined,
  };
  const venues = useVenues(query);
  const canWrite = useCan('venues:write');

  return (
    <>
      <PageHeader
        title="Venues"
        subtitle="Bars, alleys and arcades where your games are on location."
        actions={
          canWrite && (
            <Link to={paths.newVenue} className="btn-primary">
              <Plus aria-hidden className="size-4" /> Add venue
            </Link>
          )
        }
      />
      <DataTable
        caption="Venues"
        columns={columns}
        {...pagedTableProps(list, venues)}
        rowKey={(v) => v.id}
        searchLabel="Search venues by name, street or city"
        exportAll={() => allVenues({ q: query.q, sort: query.sort, order: query.order, includeRetired: query.includeRetired })}
        exportName="venues"
        emptyTitle={params.q ? 'No venue matches that search.' : 'No venues yet.'}
        emptyHint={
          canWrite && !params.q ? (
            <Link className="link" to={paths.newVenue}>
              Add the first venue
            </Link>
          ) : undefined
        }
        filters={
          <label className="flex min-h-11 items-center gap-2 font-semibold">
            <input
              type="checkbox"
              className="size-5"
              checked={includeRetired}
              onChange={(e) => list.setFilter('retired', e.target.checked ? 'yes' : '')}
            />
            Show retired
          </label>
        }
      />
    </>
  );
}
