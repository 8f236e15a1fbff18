// A board fitted in a game: its facts (serial, date code as printed, last recap), when it is due for a recap and
// why, its parts list with every reading taken on each part (a small chart and the same numbers as a table), and
// its bench jobs.
import { lazy, Suspense, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ChevronRight, CircleHelp, ClipboardList, Pencil, Wrench } from 'lucide-react';
import { partKindLabels } from '@bumperline/contracts/bench-vocabulary';
import type { BoardInstance, BoardPage as BoardPageData, BoardPartHistory } from '@bumperline/contracts/boards';
import { useBoardPage, useEditBoard } from '../../api/boards.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { useCan } from '../../api/use-can.ts';
import { BoardFactsFields, boardFactsOf, boardFactsProblems } from '../../components/board-facts-fields.tsx';
import { Field, inputClass } from '../../components/field.tsx';
import { PageHeader } from '../../components/page-header.tsx';
import { recapAdvice, recapLine, RecapStatusBadge } from '../../components/recap-status-badge.tsx';
import { Empty, ErrorState, Loading } from '../../components/states.tsx';
import { VerdictBadge, verdictOfReading } from '../../components/verdict-badge.tsx';
import { ApiError } from '../../lib/api-client.ts';
import { formatDate, formatDateTime, type LocaleSettings } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { formatDeviation, formatReadingValue } from './reading-format.ts';

// recharts comes with the first chart, not with the page.
const ReadingChart = lazy(() => import('./reading-chart.tsx'));

export function BoardPage() {
  const { id = '' } = useParams();
  const page = useBoardPage(id);
  const canWork = useCan('bench:work');

  if (page.isLoading) return <Loading />;
  if (page.error || !page.data) return <ErrorState error={page.error} onRetry={() => page.refetch()} />;
  const { instance: b } = page.data;

  return (
    <>
      <PageHeader
        title={`${b.boardName}${b.serial ? ` ${b.serial}` : ''}`}
        subtitle={
          <span className="inline-flex flex-wrap items-center gap-2">
            <RecapStatusBadge status={b.recap.status} />
            {b.gameId ? (
              <>
                {b.model.maker} · in{' '}
                <Link className="link" to={paths.game(b.gameId)}>
                  {b.gameLabel}
                </Link>
              </>
            ) : (
              `${b.model.maker} ${b.model.title} · on the shelf`
            )}
          </span>
        }
        actions={
          canWork && (
            <Link className="btn-primary" to={paths.newBenchJob(b.id)}>
              <Wrench aria-hidden className="size-4" /> Start bench job
            </Link>
          )
        }
      />
      {/* minmax(0, 1fr): a wide readings table scrolls inside its card instead of widening the page on a phone. */}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-4 lg:grid-cols-3">
        <BoardFacts board={b} />
        <RecapCard board={b} />
        <PartsHistory parts={page.data.parts} />
        <BenchJobs jobs={page.data.benchJobs} />
      </div>
    </>
  );
}

function BoardFacts({ board: b }: { board: BoardInstance }) {
  const locale = useLocaleSettings();
  const canWrite = useCan('boards:write');
  const [editing, setEditing] = useState(false);
  return (
    <section className="card" aria-labelledby="board-facts">
      <div className="mb-3 flex items-center justify-between gap-2">
        <h2 id="board-facts" className="text-lg font-bold">
          The board
        </h2>
        {canWrite && !editing && (
          <button type="button" className="btn-secondary" onClick={() => setEditing(true)}>
            <Pencil aria-hidden className="size-4" /> Edit
          </button>
        )}
      </div>
      {editing ? (
        <EditBoardForm board={b} onDone={() => setEditing(false)} />
      ) : (
        <>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2">
            <dt className="font-semibold">Part number</dt>
            <dd className="tabular">{b.boardPartNumber || '—'}</dd>
            <dt className="font-semibold">Serial</dt>
            <dd className="tabular">{b.serial || '—'}</dd>
            <dt className="font-semibold">Date code</dt>
            <dd>
              <span className="tabular">{b.dateCode || '—'}</span>
              {b.madeOn && <span className="text-ink-muted"> — made {formatDate(b.madeOn, locale)}</span>}
            </dd>
            <dt className="font-semibold">Last recap</dt>
            <dd>{b.lastRecapOn ? formatDate(b.lastRecapOn, locale) : 'none on record'}</dd>
          </dl>
          {b.dateCodeFlag && (
            <p className="mt-3 flex items-start gap-2 rounded-md bg-shop-tint p-2 text-sm font-semibold text-shop">
              <CircleHelp aria-hidden className="mt-0.5 size-4 shrink-0" />
              <span>The date code reads two ways: {b.dateCodeFlag}.</span>
            </p>
          )}
          {b.notes && <p className="mt-3 rounded-md bg-brass-light p-2 text-sm">{b.notes}</p>}
        </>
      )}
    </section>
  );
}

function EditBoardForm({ board: b, onDone }: { board: BoardInstance; onDone: () => void }) {
  const edit = useEditBoard(b.id);
  const [facts, setFacts] = useState(() => boardFactsOf(b));
  const [notes, setNotes] = useState(b.notes);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  return (
    <form
      className="grid gap-3"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        setFormError(null);
        const problems = boardFactsProblems(facts);
        setErrors(problems);
        if (Object.keys(problems).length) return;
        edit.mutate(
          { version: b.version, ...facts, lastRecapOn: facts.lastRecapOn || null, notes },
          {
            onSuccess: onDone,
            onError: (err) => {
              if (err instanceof ApiError && err.status === 409) setFormError(`${err.message} Your changes are still in the form.`);
              else if (err instanceof ApiError && err.problem.errors?.length) setErrors(err.fieldErrors());
              else setFormError(err instanceof ApiError ? err.message : 'Could not save the board.');
            },
          },
        );
      }}
    >
      <BoardFactsFields facts={facts} errors={errors} onChange={setFacts} />
      <Field label="Notes" error={errors.notes}>
        {(p) => (
          <textarea {...p} className={inputClass} rows={3} maxLength={2000} value={notes} onChange={(e) => setNotes(e.target.value)} />
        )}
      </Field>
      {formError && (
        <p role="alert" className="font-semibold text-down">
          {formError}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={edit.isPending}>
          Save
        </button>
        <button type="button" className="btn-secondary" onClick={onDone}>
          Cancel
        </button>
      </div>
    </form>
  );
}

function RecapCard({ board: b }: { board: BoardInstance }) {
  const locale = useLocaleSettings();
  const r = b.recap;
  const advice = recapAdvice(r, locale);
  return (
    <section className="card lg:col-span-2" aria-labelledby="board-recap">
      <h2 id="board-recap" className="mb-3 text-lg font-bold">
        Recap
      </h2>
      <p className="flex flex-wrap items-center gap-2 text-lg font-semibold">
        <RecapStatusBadge status={r.status} /> {recapLine(r, locale)}
      </p>
      {advice && (
        <p className={`mt-2 rounded-md p-2 font-semibold ${r.status === 'overdue' ? 'bg-down-tint text-down' : 'bg-shop-tint text-shop'}`}>
          {advice}
        </p>
      )}
      {r.dueDate && (
        <dl className="mt-3 grid gap-x-4 gap-y-2 sm:grid-cols-[auto_1fr]">
          <dt className="font-semibold">Sets the date</dt>
          <dd>
            {r.limitingDesignator} ({r.limitingRating}): expected life {r.lifeYears?.toFixed(1)} years in this cabinet
          </dd>
          <dt className="font-semibold">Counted from</dt>
          <dd>
            {r.countedFrom === 'last-recap' ? 'the last recap' : 'the date code'}, {formatDate(r.countedFromDate, locale)}
          </dd>
        </dl>
      )}
      <p className="mt-3 text-sm text-ink-soft">
        {r.defaultProfile ? (
          <>
            The cabinet has no temperature profile yet, so this uses our assumed day for a game in a bar.{' '}
            {b.gameId && (
              <Link className="link" to={paths.game(b.gameId)}>
                Set the cabinet’s own on the game’s page
              </Link>
            )}
            .
          </>
        ) : (
          <>Worked out with the cabinet’s own temperature profile (set on the game’s page).</>
        )}{' '}
        Each electrolytic’s life doubles for every 10 °C it runs below its rating; the makers cap any estimate at 15 years.
      </p>
    </section>
  );
}

function PartsHistory({ parts }: { parts: BoardPartHistory[] }) {
  // The parts that were measured come first, each with its chart; the rest of the list is folded away below.
  const read = parts.filter((p) => p.readings.length > 0);
  const unread = parts.filter((p) => p.readings.length === 0);
  return (
    <section className="card lg:col-span-3" aria-labelledby="board-parts">
      <h2 id="board-parts" className="mb-3 text-lg font-bold">
        Parts and their readings
      </h2>
      {parts.length === 0 ? (
        <Empty title="This board’s parts list is empty." />
      ) : (
        <>
          {read.length === 0 ? (
            <p className="text-ink-soft">No readings on this board yet: they are recorded by its bench jobs.</p>
          ) : (
            <ul className="divide-y divide-paper-line">
              {read.map((p) => (
                <PartLine key={p.partId} part={p} />
              ))}
            </ul>
          )}
          {unread.length > 0 && (
            <details className="group mt-3 border-t border-paper-line pt-2" open={read.length === 0}>
              <summary className="inline-flex min-h-11 cursor-pointer items-center gap-1 font-semibold">
                <ChevronRight aria-hidden className="size-4 transition-transform group-open:rotate-90" />
                {read.length === 0 ? `The parts list (${unread.length})` : `${unread.length} more parts without readings`}
              </summary>
              <ul className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2 lg:grid-cols-3">
                {unread.map((p) => (
                  <li key={p.partId}>
                    <strong className="tabular">{p.designator}</strong> <span className="text-ink-muted">{partKindLabels[p.kind]}</span>{' '}
                    <span className="tabular">{partHeading(p)}</span>
                    {p.removed && <span className="text-attention"> (taken off the list)</span>}
                  </li>
                ))}
              </ul>
            </details>
          )}
        </>
      )}
    </section>
  );
}

function partHeading(p: BoardPartHistory) {
  // "10%" reads as ±10 %; "+80/-20%" and "J" are shown as written.
  return [p.value, p.tolerance && (/^\d/.test(p.tolerance) ? `±${p.tolerance}` : p.tolerance), p.rating].filter(Boolean).join(' · ');
}

function PartLine({ part: p }: { part: BoardPartHistory }) {
  const locale = useLocaleSettings();
  const latest = p.readings[p.readings.length - 1];
  const charted = p.readings.some((r) => r.measured !== null);
  return (
    <li className="py-3">
      <div className={charted ? 'grid gap-3 md:grid-cols-[minmax(14rem,1fr)_2fr]' : ''}>
        <div>
          <p className="flex flex-wrap items-baseline gap-x-2">
            <strong className="text-lg tabular">{p.designator}</strong>
            <span className="text-sm text-ink-muted">{partKindLabels[p.kind]}</span>
            <span className="tabular">{partHeading(p)}</span>
            {p.removed && <span className="text-sm font-semibold text-attention">taken off the parts list</span>}
          </p>
          {latest && (
            <p className="mt-1 flex flex-wrap items-center gap-x-2 text-sm">
              <span>Latest:</span>
              <strong className="tabular">
                {latest.measured !== null ? formatReadingValue(latest.measured, latest.unit) : latest.measuredText}
              </strong>
              <VerdictBadge verdict={verdictOfReading(latest)} />
              {latest.deviationPercent !== null && (
                <span className="tabular text-ink-soft">{formatDeviation(latest.deviationPercent)}</span>
              )}
              <span className="text-ink-muted">{formatDate(latest.takenAt, locale)}</span>
            </p>
          )}
        </div>
        {charted && (
          <Suspense fallback={<div className="h-36 w-full rounded-md bg-paper-dim" aria-hidden />}>
            <ReadingChart readings={p.readings} designator={p.designator} />
          </Suspense>
        )}
      </div>
      {p.readings.length > 0 && <ReadingsTable part={p} locale={locale} />}
    </li>
  );
}

function ReadingsTable({ part: p, locale }: { part: BoardPartHistory; locale: LocaleSettings | undefined }) {
  return (
    <details className="group mt-2">
      <summary className="inline-flex min-h-11 cursor-pointer items-center gap-1 text-sm font-semibold">
        <ChevronRight aria-hidden className="size-4 transition-transform group-open:rotate-90" />
        {p.designator}: all {p.readings.length} reading{p.readings.length === 1 ? '' : 's'} as a table
      </summary>
      {/* Focusable, so a keyboard can scroll the table sideways on a narrow screen. */}
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={`Readings of ${p.designator}`}>
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Readings of {p.designator}, oldest first</caption>
          <thead className="bg-paper-dim text-ink-soft">
            <tr>
              <th scope="col" className="px-2 py-1">
                Taken
              </th>
              <th scope="col" className="px-2 py-1">
                Read
              </th>
              <th scope="col" className="px-2 py-1">
                Verdict
              </th>
              <th scope="col" className="px-2 py-1">
                Allowed
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Deviation
              </th>
              <th scope="col" className="px-2 py-1">
                Bench job
              </th>
            </tr>
          </thead>
          <tbody>
            {p.readings.map((r) => (
              <tr key={r.id} className="border-t border-paper-line">
                <td className="px-2 py-1 whitespace-nowrap">{formatDateTime(r.takenAt, locale)}</td>
                <td className="px-2 py-1 tabular whitespace-nowrap">
                  {r.measured !== null ? formatReadingValue(r.measured, r.unit) : r.measuredText}
                  {r.inCircuit && <span className="text-ink-muted"> (in circuit)</span>}
                </td>
                <td className="px-2 py-1">
                  <VerdictBadge verdict={verdictOfReading(r)} />
                </td>
                <td className="px-2 py-1 tabular whitespace-nowrap">
                  {r.min !== null && r.max !== null ? `${formatReadingValue(r.min, r.unit)} – ${formatReadingValue(r.max, r.unit)}` : '—'}
                </td>
                <td className="px-2 py-1 text-right tabular">{formatDeviation(r.deviationPercent) || '—'}</td>
                <td className="px-2 py-1">
                  {r.benchJobId ? (
                    <Link className="link" to={paths.benchJob(r.benchJobId)}>
                      Open
                    </Link>
                  ) : (
                    '—'
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}

function BenchJobs({ jobs }: { jobs: BoardPageData['benchJobs'] }) {
  const locale = useLocaleSettings();
  return (
    <section className="card lg:col-span-3" aria-labelledby="board-jobs">
      <h2 id="board-jobs" className="mb-3 flex items-center gap-2 text-lg font-bold">
        <ClipboardList aria-hidden className="size-5" /> Bench jobs
      </h2>
      {jobs.length === 0 ? (
        <Empty title="No bench jobs on this board yet." />
      ) : (
        <ul className="divide-y divide-paper-line">
          {jobs.map((j) => (
            <li key={j.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <Link className="link" to={paths.benchJob(j.id)}>
                {j.templateName}
              </Link>
              <span className="text-sm text-ink-soft">
                {j.state === 'finished' && j.finishedAt
                  ? `Finished ${formatDate(j.finishedAt, locale)}`
                  : `In progress since ${formatDate(j.openedAt, locale)}`}
              </span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
