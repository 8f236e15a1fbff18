// The bench: open bench jobs (mine first), the ones finished lately, and the templates jobs are opened from.
import { Link } from 'react-router-dom';
import { CircuitBoard, FileText, Plus } from 'lucide-react';
import type { BenchJobSummary } from '@bumperline/contracts/bench-jobs';
import { PageHeader } from '../../components/page-header.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { useBenchJobs } from '../../api/bench-jobs.ts';
import { useBenchTemplates } from '../../api/bench-templates.ts';
import { useCan } from '../../api/use-can.ts';
import { useLocaleSettings, useMe } from '../../api/me.ts';
import { formatDateTime } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { finishedJobsQuery, openJobsQuery } from './bench-queries.ts';

export function BenchPage() {
  return (
    <>
      <PageHeader title="Bench" subtitle="Board overhauls step by step, with every reading judged against the parts list as it is typed." />
      <div className="grid gap-6 lg:grid-cols-2 lg:items-start">
        <div className="grid gap-6">
          <OpenJobs />
          <FinishedJobs />
        </div>
        <TemplatesSection />
      </div>
    </>
  );
}

function JobItem({ job, mine }: { job: BenchJobSummary; mine: boolean }) {
  const locale = useLocaleSettings();
  const finished = job.state === 'finished';
  return (
    <li className="grid gap-1 rounded-md border border-paper-line p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <Link className="link text-lg" to={finished ? paths.benchJobSheet(job.id) : paths.benchJob(job.id)}>
          {job.boardName}
          {job.boardSerial ? ` · ${job.boardSerial}` : ''}
        </Link>
        {mine && <span className="rounded bg-brass-light px-1.5 text-sm font-bold text-brass">Yours</span>}
      </div>
      <p className="text-ink-soft">
        {job.gameLabel ?? 'Not in a game'} · {job.templateName}
      </p>
      <p className="text-sm text-ink-muted">
        {finished
          ? `Finished${job.finishedBy ? ` by ${job.finishedBy}` : ''} ${formatDateTime(job.finishedAt, locale)}`
          : `Opened${mine ? ' by you' : job.openedBy ? ` by ${job.openedBy}` : ''} ${formatDateTime(job.openedAt, locale)}`}
      </p>
      {finished && (
        <p className="text-sm">
          <Link className="link" to={paths.benchJob(job.id)}>
            Steps as recorded
          </Link>
        </p>
      )}
    </li>
  );
}

function OpenJobs() {
  const me = useMe();
  const jobs = useBenchJobs(openJobsQuery);
  const myId = me.data?.user.id;
  const isMine = (job: BenchJobSummary) => !!myId && job.openedByUserId === myId;
  // The technician's own jobs come first (a stable sort keeps the newest first within each group).
  const items = [...(jobs.data?.items ?? [])].sort((a, b) => Number(isMine(b)) - Number(isMine(a)));
  return (
    <section className="card grid gap-3" aria-labelledby="open-jobs">
      <h2 id="open-jobs" className="flex items-center gap-2 text-lg font-bold">
        <CircuitBoard aria-hidden className="size-5" /> Open bench jobs
      </h2>
      {jobs.isLoading ? (
        <Loading />
      ) : jobs.error ? (
        <ErrorState error={jobs.error} onRetry={() => jobs.refetch()} />
      ) : !items.length ? (
        <Empty title="No bench job is open.">
          <p>Start one from a board on a game’s page, or from a service call.</p>
        </Empty>
      ) : (
        <ul className="grid gap-2">
          {items.map((job) => (
            <JobItem key={job.id} job={job} mine={isMine(job)} />
          ))}
        </ul>
      )}
    </section>
  );
}

function FinishedJobs() {
  const jobs = useBenchJobs(finishedJobsQuery);
  return (
    <section className="card grid gap-3" aria-labelledby="finished-jobs">
      <h2 id="finished-jobs" className="text-lg font-bold">
        Finished lately
      </h2>
      {jobs.isLoading ? (
        <Loading />
      ) : jobs.error ? (
        <ErrorState error={jobs.error} onRetry={() => jobs.refetch()} />
      ) : !jobs.data?.items.length ? (
        <Empty title="No bench job finished yet." />
      ) : (
        <ul className="grid gap-2">
          {jobs.data.items.map((job) => (
            <JobItem key={job.id} job={job} mine={false} />
          ))}
        </ul>
      )}
    </section>
  );
}

export function TemplatesSection() {
  const templates = useBenchTemplates();
  const canWrite = useCan('bench-templates:write');
  return (
    <section className="card grid gap-3" aria-labelledby="templates">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="templates" className="text-lg font-bold">
          Templates
        </h2>
        {canWrite && (
          <Link className="btn-secondary" to={paths.newBenchTemplate()}>
            <Plus aria-hidden className="size-4" /> New template
          </Link>
        )}
      </div>
      {templates.isLoading ? (
        <Loading />
      ) : templates.error ? (
        <ErrorState error={templates.error} onRetry={() => templates.refetch()} />
      ) : !templates.data?.items.length ? (
        <Empty title="No templates yet." />
      ) : (
        <ul className="grid gap-2">
          {templates.data.items.map((t) => (
            <li key={t.id} className="grid gap-1 rounded-md border border-paper-line p-3">
              <Link className="link text-lg" to={paths.benchTemplate(t.id)}>
                {t.name}
              </Link>
              {t.description && <p className="text-ink-soft">{t.description}</p>}
              <p className="flex flex-wrap items-center gap-x-3 text-sm text-ink-muted">
                <span>
                  {t.stepCount} {t.stepCount === 1 ? 'step' : 'steps'}
                </span>
                <a
                  className="link inline-flex items-center gap-1"
                  href={paths.benchTemplateSheetPdf(t.id)}
                  target="_blank"
                  rel="noreferrer"
                >
                  <FileText aria-hidden className="size-4" /> Blank sheet (PDF)
                </a>
              </p>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** The templates alone, for a link straight to them. */
export function BenchTemplatesPage() {
  return (
    <div className="grid max-w-3xl gap-4">
      <PageHeader
        title="Bench-job templates"
        subtitle={
          <Link className="link" to={paths.bench}>
            Bench
          </Link>
        }
      />
      <TemplatesSection />
    </div>
  );
}
