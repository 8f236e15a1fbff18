// A game's or a venue's care-plan work: open work by due date, and (for a game) what was done or skipped.
import { Link } from 'react-router-dom';
import type { WorkOrder, WorkOrderListQuery } from '@bumperline/contracts/work-orders';
import { useWorkOrders } from '../api/work-orders.ts';
import { useLocaleSettings } from '../api/me.ts';
import { formatDate, formatDateTime, type LocaleSettings } from '../lib/format.ts';
import { paths } from '../lib/paths.ts';
import { WorkOrderStateBadge } from './due-state-badge.tsx';
import { Empty, ErrorState, Loading } from './states.tsx';

function Row({ order, locale, showGame }: { order: WorkOrder; locale: LocaleSettings | undefined; showGame: boolean }) {
  return (
    <li className="flex flex-wrap items-center justify-between gap-2 border-t border-paper-line py-2 first:border-t-0">
      <div>
        <Link className="link" to={paths.workOrder(order.id)}>
          {order.title}
        </Link>
        <p className="text-sm text-ink-soft">
          {showGame ? `${order.game.modelTitle} (${order.game.serial}) · ` : ''}
          {order.state === 'open'
            ? `Due ${formatDateTime(order.dueAt, locale)}${order.plannedOn ? ` · planned ${formatDate(order.plannedOn, locale)}` : ''}${order.technician ? ` · ${order.technician.name}` : ' · no technician yet'}`
            : `${order.state === 'done' ? 'Done' : 'Skipped'} ${formatDate(order.closedAt, locale)}${order.skipReason ? `: ${order.skipReason}` : ''}`}
        </p>
      </div>
      <WorkOrderStateBadge state={order.state} dueState={order.dueState} />
    </li>
  );
}

/** Work orders matching `query`, each with its state and due date. */
export function WorkOrdersList({ query, empty, showGame }: { query: WorkOrderListQuery; empty: string; showGame: boolean }) {
  const orders = useWorkOrders(query);
  const locale = useLocaleSettings();
  if (orders.isLoading) return <Loading label="Loading work orders…" />;
  if (orders.error) return <ErrorState error={orders.error} onRetry={() => void orders.refetch()} />;
  const items = orders.data?.items ?? [];
  if (items.length === 0) return <Empty title={empty} />;
  return (
    <ul>
      {items.map((o) => (
        <Row key={o.id} order={o} locale={locale} showGame={showGame} />
      ))}
    </ul>
  );
}

export function WorkOrdersSection({ gameId, venueId }: { gameId?: string; venueId?: string }) {
  return (
    <section className="card" aria-labelledby="work-orders-heading">
      <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="work-orders-heading" className="text-lg font-bold">
          Care-plan work
        </h2>
        <Link className="link" to={`${paths.workOrders}?${new URLSearchParams(gameId ? { gameId } : { venueId: venueId ?? '' })}`}>
          All work orders
        </Link>
      </div>
      <WorkOrdersList query={{ state: 'open', gameId, venueId, limit: 10 }} empty="No care-plan work open." showGame={!gameId} />
      {gameId && (
        <>
          <h3 className="mt-4 mb-1 font-bold">Done lately</h3>
          <WorkOrdersList
            query={{ state: 'done', gameId, order: 'desc', limit: 5 }}
            empty="Nothing done from a care plan yet."
            showGame={false}
          />
        </>
      )}
    </section>
  );
}
