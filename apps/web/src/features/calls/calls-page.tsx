// Dispatch: open calls in a table and on a map side by side, with their age against the response target.
import { Link } from 'react-router-dom';
import type { ServiceCall } from '@bumperline/contracts/calls';
import { callRef, callStateLabels, callStates, problemKinds, problemLabels } from '@bumperline/contracts/call-vocabulary';
import { DataTable, type Column } from '../../components/data-table.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { CallStateBadge } from '../../components/call-state-badge.tsx';
import { TargetClock, useNow } from '../../components/target-clock.tsx';
import { CallsMap } from '../../components/calls-map.tsx';
import { pagedTableProps, useListParams } from '../../components/use-list-params.ts';
import { FilterSelect } from '../../components/filter-select.tsx';
import { paths } from '../../lib/paths.ts';
import { allCalls, useCalls, useTechnicians } from '../../api/calls.ts';
import { useSettings } from '../../api/settings.ts';
import { useVenues } from '../../api/venues.ts';
import { useCan } from '../../api/use-can.ts';
import { callsDefaultSort, callsFilterKeys, callsMapQuery, callsTableQuery, venueFilterQuery, type CallsSort } from './calls-queries.ts';

const columns: Column<ServiceCall, CallsSort>[] = [
  {
    header: 'Call',
    cell: (c) => (
      <Link className="link" to={paths.call(c.id)}>
        {c.gameTitle}
        <span className="block text-sm font-normal text-ink-muted tabular">Call {callRef(c.id)}</span>
      </Link>
    ),
    csv: (c) => `${callRef(c.id)} ${c.gameTitle}`,
  },
  { header: 'Venue', cell: (c) => c.venueName ?? '—', csv: (c) => c.venueName },
  { header: 'Problem', cell: (c) => problemLabels[c.problem], csv: (c) => problemLabels[c.problem], className: 'hidden 2xl:table-cell' },
  { header: 'State', cell: (c) => <CallStateBadge state={c.state} />, csv: (c) => callStateLabels[c.state] },
  {
    header: 'Open for',
    sort: 'targetAt',
    cell: (c) => <TargetClock openedAt={c.openedAt} targetAt={c.targetAt} stoppedAt={c.fixedAt ?? c.closedAt} />,
    csv: (c) => c.openedAt,
  },
  {
    header: 'Technician',
    cell: (c) => c.technicianName ?? <span className="font-semibold text-down">Nobody yet</span>,
    csv: (c) => c.technicianName,
  },
];

export function CallsPage() {
  const list = useListParams<CallsSort>(callsDefaultSort, callsFilterKeys);
  const { params, extras } = list;
  const canDispatch = useCan('calls:dispatch');
  const query = callsTableQuery(params, extras);
  const calls = useCalls(query);
  // When the table's first page already holds every matching call (the usual case), the map shows that page
  // and no second list is asked for; otherwise the map asks for its own (up to 200).
  const tableHoldsAll = !query.cursor && !!calls.data && !calls.isPlaceholderData && !calls.data.nextCursor;
  const mapCalls = useCalls(callsMapQuery(query), !!calls.data && !calls.isPlaceholderData && !tableHoldsAll);
  const mapItems = (tableHoldsAll ? calls.data : (mapCalls.data ?? calls.data))?.items ?? [];
  const settings = useSettings();
  const venues = useVenues(venueFilterQuery);
  const technicians = useTechnicians(canDispatch);
  const now = useNow();
  const points = mapItems
    .filter((c) => c.latitude !== null && c.longitude !== null)
    .map((c) => ({
      id: c.id,
      lat: c.latitude!,
      lon: c.longitude!,
      title: `${c.gameTitle} (${callRef(c.id)})`,
      subtitle: c.venueName ?? '',
      state: c.state,
      late: !c.fixedAt && Date.parse(c.targetAt) < now,
      href: paths.call(c.id),
    }));

  return (
    <>
      <PageHeader title="Calls" subtitle="Every open service call, oldest against its target first." />
      <div className="grid gap-4 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <DataTable
          caption="Service calls"
          columns={columns}
          {...pagedTableProps(list, calls)}
          rowKey={(c) => c.id}
          searchLabel="Search by game, venue, serial or note"
          exportAll={() => allCalls({ ...query, cursor: undefined } as never)}
          exportName="service-calls"
          emptyTitle={
            extras.state || extras.venueId || extras.problem || extras.technicianId || params.q
              ? 'No call matches these filters.'
              : 'No open calls. Every game is up.'
          }
          filters={
            <div className="flex flex-wrap gap-2">
              <FilterSelect
                label="State"
                wide
                anyLabel="All open"
                value={extras.state ?? ''}
                onChange={(v) => list.setFilter('state', v)}
                options={[
                  ...callStates.map((s) => ({ value: s, label: callStateLabels[s] })),
                  { value: 'all', label: 'Any, including closed' },
                ]}
              />
              <FilterSelect
                label="Venue"
                value={extras.venueId ?? ''}
                onChange={(v) => list.setFilter('venueId', v)}
                options={(venues.data?.items ?? []).map((v) => ({ value: v.id, label: v.name }))}
              />
              <FilterSelect
                label="Problem"
                value={extras.problem ?? ''}
                onChange={(v) => list.setFilter('problem', v)}
                options={problemKinds.map((k) => ({ value: k, label: problemLabels[k] }))}
              />
              <FilterSelect
                label="Technician"
                anyLabel="Anyone"
                value={extras.technicianId ?? ''}
                onChange={(v) => list.setFilter('technicianId', v)}
                options={[
                  { value: 'none', label: 'Nobody yet' },
                  { value: 'me', label: 'Me' },
                  ...(technicians.data?.items ?? []).map((t) => ({ value: t.userId, label: t.name })),
                ]}
              />
            </div>
          }
        />
        <section
          className="card h-[28rem] p-2 xl:sticky xl:top-4 xl:h-[calc(100vh-12rem)]"
          aria-label="Map of the calls matching the filters"
        >
          <CallsMap points={points} tileUrl={settings.data?.mapTileUrl ?? ''} label="Map of the calls matching the filters" />
        </section>
      </div>
    </>
  );
}
