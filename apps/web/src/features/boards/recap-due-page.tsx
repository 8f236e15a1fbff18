// Every board of the company ranked by the life its electrolytics have left: overdue first, with what to do, then
// the ones coming due; boards whose date code must be settled last. Filtered by status and paged in the address bar:
// the server ranks every board and sends one page with the counts of the whole company.
import { ChevronLeft, ChevronRight } from 'lucide-react';
import { Link, useSearchParams } from 'react-router-dom';
import { RECAP_FLEET_PAGE, recapStatuses, type RecapStatus } from '@bumperline/contracts/bench-vocabulary';
import type { RecapFleet, RecapFleetRow } from '@bumperline/contracts/boards';
import { useRecapDue } from '../../api/boards.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { FilterSelect } from '../../components/filter-select.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { recapAdvice, recapLine, recapStatusLabels, RecapStatusBadge } from '../../components/recap-status-badge.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { useListParams } from '../../components/use-list-params.ts';
import { formatDate } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { recapStatusFilter } from './boards-queries.ts';

const countWords = { overdue: 'overdue', 'due-soon': 'due soon', ok: 'not due yet', unknown: 'with a date code to settle' } as const;

export function RecapDuePage() {
  const [sp] = useSearchParams();
  const list = useListParams('rank', statusKey);
  const status = recapStatusFilter(sp);
  const fleet = useRecapDue(status, list.params.cursor);
  const locale = useLocaleSettings();
  const counts: Partial<RecapFleet['counts']> = fleet.data?.counts ?? {};

  return (
    <>
      <PageHeader
        title="Recap due"
        subtitle={
          fleet.data
            ? `Every board ranked by the life left in its electrolytics, as of ${formatDate(fleet.data.asOf, locale)}: overdue first.`
            : 'Every board ranked by the life left in its electrolytics: overdue first.'
        }
      />
      <div className="mb-4 flex flex-wrap items-center gap-x-6 gap-y-3">
        <FilterSelect
          label="Status"
          value={status ?? ''}
          anyLabel="All boards"
          wide
          onChange={(v) => list.setFilter('status', v)}
          options={recapStatuses.map((s) => ({ value: s, label: `${recapStatusLabels[s]} (${counts[s] ?? 0})` }))}
        />
        {fleet.data && (
          <p className="text-sm text-ink-soft">
            {(['overdue', 'due-soon', 'ok', 'unknown'] as const)
              .filter((s) => counts[s])
              .map((s) => `${counts[s]} ${countWords[s]}`)
              .join(' · ')}
          </p>
        )}
      </div>
      <section className="card" aria-label="Boards by recap due">
        {fleet.isLoading ? (
          <Loading />
        ) : fleet.error || !fleet.data ? (
          <ErrorState error={fleet.error} onRetry={() => fleet.refetch()} />
        ) : fleet.data.items.length === 0 ? (
          <Empty title={status ? `No boards with “${recapStatusLabels[status].toLowerCase()}”.` : 'No boards recorded yet.'}>
            <p className="max-w-prose text-sm">Boards are added on each game’s page, under Boards.</p>
          </Empty>
        ) : (
          <>
            <ol className="divide-y divide-paper-line">
              {fleet.data.items.map((row) => (
                <FleetLine key={row.boardInstanceId} row={row} />
              ))}
            </ol>
            <nav aria-label="Pages" className="flex flex-wrap items-center justify-end gap-x-4 gap-y-2 border-t border-paper-line pt-3">
              <p className="mr-auto text-sm text-ink-soft">{pagePosition(fleet.data, status, pagesBefore(list.params))}</p>
              <div className="flex gap-2">
                <button type="button" className="btn-secondary" onClick={list.prevPage} disabled={!list.params.cursor}>
                  <ChevronLeft aria-hidden className="size-4" /> Previous
                </button>
                <button
                  type="button"
                  className="btn-secondary"
                  onClick={() => fleet.data?.nextCursor && list.nextPage(fleet.data.nextCursor)}
                  disabled={!fleet.data.nextCursor}
                >
                  Next <ChevronRight aria-hidden className="size-4" />
                </button>
              </div>
            </nav>
          </>
        )}
      </section>
    </>
  );
}

const statusKey = ['status'] as const;

/** The trail keeps the cursors of the pages before this one but the first (which has none), so it is one short. */
const pagesBefore = (p: { cursor: string | undefined; trail: string[] }) => (p.cursor ? p.trail.length + 1 : 0);

/** "Boards 51–100 of 4,550": the pages before this one are full ones (the server's page size). */
function pagePosition(data: RecapFleet, status: RecapStatus | undefined, pagesBefore: number) {
  const total = status ? data.counts[status] : Object.values(data.counts).reduce((a, b) => a + b, 0) - data.counts['no-electrolytics'];
  const first = pagesBefore * RECAP_FLEET_PAGE + 1;
  const last = first + data.items.length - 1;
  const n = new Intl.NumberFormat();
  return `Boards ${n.format(first)}–${n.format(last)} of ${n.format(total)}`;
}

function FleetLine({ row }: { row: RecapFleetRow }) {
  const locale = useLocaleSettings();
  const r = row.recap;
  const advice = recapAdvice(r, locale);
  return (
    <li className="grid gap-2 py-3 md:grid-cols-[minmax(16rem,2fr)_3fr]">
      <div>
        <Link className="link" to={paths.boardInstance(row.boardInstanceId)}>
          {row.boardName}
          {row.serial ? ` ${row.serial}` : ''}
        </Link>
        <p className="text-sm text-ink-soft">
          {row.gameId ? (
            <Link className="inline-block min-h-6 py-0.5 underline" to={paths.game(row.gameId)}>
              {row.gameLabel}
            </Link>
          ) : (
            'On the shelf'
          )}
          {row.venueId && (
            <>
              {' · '}
              <Link className="inline-block min-h-6 py-0.5 underline" to={paths.venue(row.venueId)}>
                {row.venueName}
              </Link>
            </>
          )}
        </p>
      </div>
      <div>
        <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
          <RecapStatusBadge status={r.status} />
          {r.status === 'overdue' && advice ? (
            <span className="font-semibold text-down">{advice}</span>
          ) : (
            <>
              <span className="font-semibold">{recapLine(r, locale)}</span>
              {r.limitingDesignator && (
                <span className="text-sm text-ink-soft">
                  {r.limitingDesignator} ({r.limitingRating}) lasts {r.lifeYears?.toFixed(1)} years here
                </span>
              )}
            </>
          )}
        </p>
        {r.status !== 'overdue' && advice && <p className="mt-1 text-sm font-semibold text-shop">{advice}</p>}
        {r.defaultProfile && r.dueDate && (
          <p className="mt-1 text-xs text-ink-muted">Assumed cabinet day: the game has no temperature profile.</p>
        )}
      </div>
    </li>
  );
}
