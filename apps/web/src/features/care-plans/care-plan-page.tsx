// One care plan: what it does, when it falls due (in plain words), the games it covers with when each is next due,
// and its work orders.
import { Link, useParams } from 'react-router-dom';
import { Archive, Pencil } from 'lucide-react';
import { dueReasonLabels } from '@bumperline/contracts/care-vocabulary';
import { useCarePlan, useRetireCarePlan } from '../../api/care-plans.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useCan } from '../../api/use-can.ts';
import { DueStateBadge } from '../../components/due-state-badge.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { WorkOrdersList } from '../../components/work-orders-section.tsx';
import { formatDays, formatMinutes } from '../../lib/duration-entry.ts';
import { formatDate, formatDateTime } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { dueWords } from './care-plans-page.tsx';

export function CarePlanPage() {
  const { id = '' } = useParams();
  const plan = useCarePlan(id);
  const locale = useLocaleSettings();
  const canWrite = useCan('care-plans:write');
  const retire = useRetireCarePlan(id);
  if (plan.isLoading) return <Loading label="Loading the care plan…" />;
  if (plan.error) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  const p = plan.data!;
  return (
    <>
      <PageHeader
        title={p.name}
        subtitle={p.retiredAt ? `Retired ${formatDate(p.retiredAt, locale)}: it makes no new work orders.` : dueWords(p)}
        actions={
          canWrite && !p.retiredAt ? (
            <>
              <Link to={paths.editCarePlan(p.id)} className="btn-secondary">
                <Pencil aria-hidden className="size-4" /> Edit
              </Link>
              <button
                type="button"
                className="btn-danger"
                disabled={retire.isPending}
                onClick={() => {
                  if (window.confirm('Retire this care plan? It will make no new work orders; open ones stay.')) retire.mutate(p.version);
                }}
              >
                <Archive aria-hidden className="size-4" /> Retire
              </button>
            </>
          ) : undefined
        }
      />
      <div className="grid gap-5 lg:grid-cols-2">
        <section className="card" aria-labelledby="plan-what">
          <h2 id="plan-what" className="mb-2 text-lg font-bold">
            What to do
          </h2>
          {p.benchTemplate ? (
            <p>
              A bench job from the template{' '}
              <Link className="link" to={paths.benchTemplate(p.benchTemplate.id)}>
                {p.benchTemplate.name}
              </Link>
              .
            </p>
          ) : (
            <ol className="list-inside list-decimal">
              {p.tasks.map((t, i) => (
                <li key={i}>{t}</li>
              ))}
            </ol>
          )}
          <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="font-semibold">Covers</dt>
            <dd>{p.model ? `Every ${p.model.title} (${p.model.maker})` : p.game ? `${p.game.modelTitle} (${p.game.serial})` : '—'}</dd>
            <dt className="font-semibold">Time on site</dt>
            <dd>{formatMinutes(p.onSiteMinutes)}</dd>
            <dt className="font-semibold">Skills</dt>
            <dd>{p.skills.length ? p.skills.join(', ') : 'None in particular'}</dd>
            <dt className="font-semibold">Work order made</dt>
            <dd>{formatDays(p.leadDays)} before it is due</dd>
            <dt className="font-semibold">Usual technician</dt>
            <dd>{p.technician?.name ?? 'The nearest with the skills'}</dd>
          </dl>
        </section>
        <section className="card" aria-labelledby="plan-games">
          <h2 id="plan-games" className="mb-2 text-lg font-bold">
            Games ({p.gamesTotal})
          </h2>
          {p.games.length === 0 ? (
            <Empty title="No games are covered yet." />
          ) : (
            <ul>
              {p.games.map((g) => (
                <li
                  key={g.id}
                  className="flex flex-wrap items-center justify-between gap-2 border-t border-paper-line py-2 first:border-t-0"
                >
                  <div>
                    <Link className="link" to={paths.game(g.id)}>
                      {g.modelTitle} ({g.serial})
                    </Link>
                    <p className="text-sm text-ink-soft">
                      {g.venue?.name ?? 'In storage'}
                      {g.dueAt
                        ? ` · next due ${formatDateTime(g.dueAt, locale)}${g.dueReason ? ` (${dueReasonLabels[g.dueReason].toLowerCase()})` : ''}`
                        : ' · no due date yet'}
                      {g.openWorkOrderId && (
                        <>
                          {' · '}
                          <Link className="link" to={paths.workOrder(g.openWorkOrderId)}>
                            open work order
                          </Link>
                        </>
                      )}
                    </p>
                  </div>
                  {g.dueState && <DueStateBadge state={g.dueState} />}
                </li>
              ))}
            </ul>
          )}
          {p.gamesTotal > p.games.length && <p className="mt-2 text-sm text-ink-soft">The first {p.games.length} by serial are shown.</p>}
        </section>
      </div>
      <section className="card mt-5" aria-labelledby="plan-orders">
        <h2 id="plan-orders" className="mb-2 text-lg font-bold">
          Open work orders
        </h2>
        <WorkOrdersList query={{ state: 'open', carePlanId: p.id, limit: 50 }} empty="No open work orders from this plan." showGame />
      </section>
    </>
  );
}
