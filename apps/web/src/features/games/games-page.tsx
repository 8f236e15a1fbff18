import { Link } from 'react-router-dom';
import { Plus } from 'lucide-react';
import type { Game } from '@bumperline/contracts/games';
import { gameKindLabels, gameKinds, gameStatusLabels, gameStatuses } from '@bumperline/contracts/game-vocabulary';
import { DataTable, type Column } from '../../components/data-table.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { GameStatusBadge } from '../../components/game-status-badge.tsx';
import { pagedTableProps, useListParams } from '../../components/use-list-params.ts';
import { FilterSelect } from '../../components/filter-select.tsx';
import { paths } from '../../lib/paths.ts';
import { useCan } from '../../api/use-can.ts';
import { allGames, useGames } from '../../api/games.ts';

type Sort = 'title' | 'serial' | 'status' | 'venue' | 'createdAt';

const columns: Column<Game, Sort>[] = [
  {
    header: 'Game',
    sort: 'title',
    cell: (g) => (
      <Link className="link" to={paths.game(g.id)}>
        {g.model.title}
      </Link>
    ),
    csv: (g) => g.model.title,
  },
  { header: 'Maker', cell: (g) => g.model.maker, csv: (g) => g.model.maker, className: 'hidden lg:table-cell' },
  { header: 'Kind', cell: (g) => gameKindLabels[g.model.kind], csv: (g) => g.model.kind, className: 'hidden md:table-cell' },
  { header: 'Serial', sort: 'serial', cell: (g) => <span className="tabular">{g.serial}</span>, csv: (g) => g.serial },
  {
    header: 'Venue',
    sort: 'venue',
    cell: (g) => g.venueName ?? <span className="text-ink-muted">Not placed</span>,
    csv: (g) => g.venueName,
  },
  { header: 'Status', sort: 'status', cell: (g) => <GameStatusBadge status={g.status} />, csv: (g) => gameStatusLabels[g.status] },
];

export function GamesPage() {
  const list = useListParams<Sort>('title', ['status', 'kind']);
  const { params, extras } = list;
  const query = {
    q: params.q || undefined,
    sort: params.sort,
    order: params.order,
    cursor: params.cursor,
    limit: 25,
    status: (extras.status || undefined) as Game['status'] | undefined,
    kind: (extras.kind || undefined) as Game['model']['kind'] | undefined,
  };
  const games = useGames(query);
  const canWrite = useCan('games:write');

  return (
    <>
      <PageHeader
        title="Games"
        subtitle="Every cabinet on location or at the shop."
        actions={
          canWrite && (
            <Link to={paths.newGame} className="btn-primary">
              <Plus aria-hidden className="size-4" /> Add game
            </Link>
          )
        }
      />
      <DataTable
        caption="Games"
        columns={columns}
        {...pagedTableProps(list, games)}
        rowKey={(g) => g.id}
        searchLabel="Search by title, maker, serial or venue"
        exportAll={() => allGames({ q: query.q, sort: query.sort, order: query.order, status: query.status, kind: query.kind })}
        exportName="games"
        emptyTitle={params.q || extras.status || extras.kind ? 'No game matches these filters.' : 'No games yet.'}
        filters={
          <>
            <FilterSelect
              label="Status"
              wide
              value={extras.status ?? ''}
              onChange={(v) => list.setFilter('status', v)}
              options={gameStatuses.map((s) => ({ value: s, label: gameStatusLabels[s] }))}
            />
            <FilterSelect
              label="Kind"
              wide
              value={extras.kind ?? ''}
              onChange={(v) => list.setFilter('kind', v)}
              options={gameKinds.map((k) => ({ value: k, label: gameKindLabels[k] }))}
            />
          </>
        }
      />
    </>
  );
}
