// Start a bench job on one board in a game (from the game, the board or a service call): pick the template,
// open, and go straight to the job. A job already open on this board is offered first.
import { useState } from 'react';
import { Link, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { CircuitBoard } from 'lucide-react';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { useBoardPage } from '../../api/boards.ts';
import { useBenchJobs, useOpenBenchJob } from '../../api/bench-jobs.ts';
import { useBenchTemplates } from '../../api/bench-templates.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { ApiError } from '../../lib/api-client.ts';
import { formatDateTime } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { openJobsOnBoardQuery } from './bench-queries.ts';

export function NewBenchJobPage() {
  const { boardInstanceId = '' } = useParams();
  const [search] = useSearchParams();
  const serviceCallId = search.get('call');
  const navigate = useNavigate();
  const locale = useLocaleSettings();
  const board = useBoardPage(boardInstanceId);
  const templates = useBenchTemplates();
  const openJobs = useBenchJobs(openJobsOnBoardQuery(boardInstanceId));
  const openJob = useOpenBenchJob();
  const [templateId, setTemplateId] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  if (board.isLoading || templates.isLoading) return <Loading />;
  if (board.error || !board.data) return <ErrorState error={board.error} onRetry={() => board.refetch()} />;
  if (templates.error || !templates.data) return <ErrorState error={templates.error} onRetry={() => templates.refetch()} />;
  const instance = board.data.instance;
  const items = templates.data.items;
  // When there is only one template, it is already picked.
  const chosen = templateId ?? (items.length === 1 ? items[0]!.id : null);

  return (
    <div className="grid max-w-2xl gap-4">
      <PageHeader
        title="Start a bench job"
        subtitle={
          <span className="inline-flex flex-wrap gap-x-2">
            <Link className="link" to={paths.boardInstance(instance.id)}>
              {instance.boardName}
            </Link>
            {instance.serial && <span>· serial {instance.serial}</span>}
            {instance.gameId && instance.gameLabel && (
              <span>
                in{' '}
                <Link className="link" to={paths.game(instance.gameId)}>
                  {instance.gameLabel}
                </Link>
              </span>
            )}
          </span>
        }
      />
      {!!openJobs.data?.items.length && (
        <section className="card grid gap-2 border-2 border-attention" aria-labelledby="already-open">
          <h2 id="already-open" className="text-lg font-bold">
            Already open on this board
          </h2>
          <ul className="grid gap-1">
            {openJobs.data.items.map((j) => (
              <li key={j.id}>
                <Link className="link" to={paths.benchJob(j.id)}>
                  {j.templateName}
                </Link>{' '}
                <span className="text-ink-soft">
                  opened{j.openedBy ? ` by ${j.openedBy}` : ''} {formatDateTime(j.openedAt, locale)}
                </span>
              </li>
            ))}
          </ul>
        </section>
      )}
      <form
        className="card grid gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (!chosen) return setProblem('Pick a template first.');
          setProblem(null);
          openJob.mutate(
            { boardInstanceId, templateId: chosen, ...(serviceCallId ? { serviceCallId } : {}) },
            {
              onSuccess: (job) => navigate(paths.benchJob(job.id)),
              onError: (err) =>
                setProblem(
                  err instanceof ApiError
                    ? err.problem.errors?.map((x) => x.message).join(' ') || err.message
                    : 'That did not work. Try again.',
                ),
            },
          );
        }}
      >
        {items.length === 0 ? (
          <Empty title="No bench-job templates yet.">
            <Link className="link" to={paths.newBenchTemplate()}>
              Write one first
            </Link>
          </Empty>
        ) : (
          <fieldset className="grid gap-2">
            <legend className="mb-1 text-lg font-bold">Template</legend>
            {items.map((t) => (
              <label
                key={t.id}
                className={`flex min-h-14 cursor-pointer items-start gap-3 rounded-md border-2 p-3 ${chosen === t.id ? 'border-ink bg-paper-dim' : 'border-paper-line'}`}
              >
                <input
                  type="radio"
                  name="template"
                  className="mt-1 size-5 shrink-0 accent-ink"
                  checked={chosen === t.id}
                  onChange={() => setTemplateId(t.id)}
                />
                <span className="grid">
                  <span className="font-bold">{t.name}</span>
                  <span className="text-sm text-ink-soft">
                    {t.stepCount} steps{t.description ? ` · ${t.description}` : ''}
                  </span>
                </span>
              </label>
            ))}
          </fieldset>
        )}
        {serviceCallId && <p className="text-sm text-ink-soft">The job will be linked to the service call it was started from.</p>}
        {problem && (
          <p role="alert" className="font-semibold text-down">
            {problem}
          </p>
        )}
        <button type="submit" className="btn-primary min-h-14 text-lg" disabled={openJob.isPending || !items.length}>
          <CircuitBoard aria-hidden className="size-5" /> {openJob.isPending ? 'Opening…' : 'Open the bench job'}
        </button>
      </form>
    </div>
  );
}
