// Every board of the company ranked by the life its electrolytics have left: overdue first, with what to do, then
// the ones coming due; boards whose date code must be settled last. Filtered by status in the address bar.
import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { recapStatuses } from '@bumperline/contracts/bench-vocabulary';
import type { RecapFleetRow } from '@bumperline/contracts/boards';
import { useRecapDue } from '../../api/boards.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { FilterSelect } from '../../components/filter-select.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { recapAdvice, recapLine, recapStatusLabels, RecapStatusBadge } from '../../components/recap-status-badge.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { formatDate } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { recapStatusFilter } from './boards-queries.ts';

const PAGE = 100;

const countWords = { overdue: 'overdue', 'due-soon': 'due soon', ok: 'not due yet', unknown: 'with a date code to settle' } as const;

export function RecapDuePage() {
  const [sp, setSp] = useSearchParams();
  const status = recapStatusFilter(sp);
  const fleet = useRecapDue(status);
  const locale = useLocaleSettings();
  const [shown, setShown] = useState(PAGE);
  const counts = fleet.data?.counts ?? {};

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
          onChange={(v) => {
            setShown(PAGE);
            setSp(v ? { status: v } : {}, { replace: true });
          }}
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
              {fleet.data.items.slice(0, shown).map((row) => (
                <FleetLine key={row.boardInstanceId} row={row} />
              ))}
            </ol>
            {fleet.data.items.length > shown && (
              <button type="button" className="btn-secondary mt-3" onClick={() => setShown((n) => n + PAGE)}>
                Show {Math.min(PAGE, fleet.data.items.length - shown)} more of {fleet.data.items.length - shown}
              </button>
            )}
          </>
        )}
      </section>
    </>
  );
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
