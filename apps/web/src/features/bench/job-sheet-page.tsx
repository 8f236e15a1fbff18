// The bench job sheet: a printable record of the job (black on white, no navigation when printed) with every
// step, the cautions acknowledged, readings with their windows, deviations and verdicts in words, the fuse and
// power checks, diode sets, parts used, photos, and who did it when. The PDF comes from the API.
import { useMemo } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ArrowLeft, FileDown, Printer } from 'lucide-react';
import type { BenchJob } from '@bumperline/contracts/bench-jobs';
import { cautions } from '@bumperline/contracts/bench-cautions';
import { stepRecordLabels } from '@bumperline/contracts/bench-vocabulary';
import { ErrorState, Loading } from '../../components/states.tsx';
import { useBenchJob } from '../../api/bench-jobs.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { formatDateTime } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { readJobParts } from './job-parts.ts';
import { stepProgress } from './draft.ts';
import { describeOutOfTolerance, fromDraft, fromEvaluation, inPartsListOrder, outOfTolerance, type SheetReading } from './sheet-results.ts';
import { watts } from './record-power.tsx';
import { VerdictBadge, verdictOfReading } from '../../components/verdict-badge.tsx';

export function JobSheetPage() {
  const { id = '' } = useParams();
  const job = useBenchJob(id);
  if (job.isLoading) return <Loading />;
  if (job.error || !job.data) return <ErrorState error={job.error} onRetry={() => job.refetch()} />;
  return <Sheet job={job.data} />;
}

const cell = 'border border-paper-line px-2 py-1.5 text-left align-top print:border-black';

function readingVerdict(r: SheetReading) {
  return <VerdictBadge verdict={verdictOfReading(r)} />;
}

function Sheet({ job }: { job: BenchJob }) {
  const locale = useLocaleSettings();
  const parts = useMemo(() => readJobParts(job.parts), [job.parts]);
  const results = useMemo(
    () => inPartsListOrder(job.evaluation ? fromEvaluation(job.evaluation) : fromDraft(job, parts), parts),
    [job, parts],
  );
  const out = outOfTolerance(results);
  const indicative = results.readings.filter((r) => r.indicative);
  const partOf = (partId: string) => parts.find((p) => p.id === partId);
  const finished = job.state === 'finished';

  return (
    <article className="mx-auto grid max-w-4xl gap-5 bg-white p-4 text-ink shadow-sm sm:p-6 print:max-w-none print:p-0 print:text-black print:shadow-none">
      <div className="flex flex-wrap gap-2 print:hidden">
        <Link className="btn-secondary" to={paths.benchJob(job.id)}>
          <ArrowLeft aria-hidden className="size-4" /> The job
        </Link>
        <button type="button" className="btn-primary" onClick={() => window.print()}>
          <Printer aria-hidden className="size-4" /> Print
        </button>
        <a className="btn-secondary" href={paths.benchJobSheetPdf(job.id)} target="_blank" rel="noreferrer">
          <FileDown aria-hidden className="size-4" /> PDF
        </a>
      </div>

      <header className="grid gap-1 border-b-2 border-ink pb-3 print:border-black">
        <p className="text-sm font-bold tracking-wide text-ink-muted uppercase print:text-black">Bench job sheet</p>
        <h1 className="text-2xl font-extrabold">
          {job.boardName}
          {job.boardSerial && (
            <>
              {' '}
              <span className="whitespace-nowrap">· serial {job.boardSerial}</span>
            </>
          )}
        </h1>
        <p>
          {job.gameLabel ?? 'Not in a game'} · {job.templateName}
        </p>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="font-semibold">Opened</dt>
          <dd>
            {formatDateTime(job.openedAt, locale)}
            {job.openedBy ? ` by ${job.openedBy}` : ''}
          </dd>
          <dt className="font-semibold">Finished</dt>
          <dd>
            {finished
              ? `${formatDateTime(job.finishedAt, locale)}${job.finishedBy ? ` by ${job.finishedBy}` : ''}`
              : 'Not yet — in progress'}
          </dd>
        </dl>
        {!finished && (
          <p className="font-semibold text-attention print:text-black">This job is still open: the sheet shows what is recorded so far.</p>
        )}
      </header>

      <section aria-labelledby="sheet-summary" className="grid gap-1">
        <h2 id="sheet-summary" className="text-lg font-bold">
          Out of tolerance
        </h2>
        {out.length === 0 ? (
          <p>No part read outside its tolerance window.</p>
        ) : (
          <ul className="grid gap-1">
            {out.map((r) => (
              <li key={`${r.stepKey}-${r.partId}`} className="font-semibold text-down print:text-black">
                {describeOutOfTolerance(r)} — out of tolerance
              </li>
            ))}
          </ul>
        )}
        {indicative.length > 0 && (
          <p className="text-sm">
            Indicative only (low in circuit, to be read again out of circuit): {indicative.map((r) => r.designator).join(', ')}.
          </p>
        )}
      </section>

      <ol className="grid gap-4">
        {job.steps.map((step, i) => {
          const p = stepProgress(job.draft, step.key);
          const readings = results.readings.filter((r) => r.stepKey === step.key);
          const fuses = results.fuses.filter((f) => f.stepKey === step.key);
          const power = results.power.filter((x) => x.stepKey === step.key);
          const photos = job.photos.filter((x) => x.stepKey === step.key);
          return (
            <li key={step.key} className="grid gap-2 break-inside-avoid border-t border-paper-line pt-3 print:border-black">
              <h2 className="flex flex-wrap items-baseline justify-between gap-2 text-lg font-bold">
                <span>
                  {i + 1}. {step.title}
                </span>
                <span className="text-base">{p.done ? '☑ Done' : '☐ Not done'}</span>
              </h2>
              <p className="text-sm text-ink-soft print:text-black">Records: {stepRecordLabels[step.record]}</p>
              {step.cautions.length > 0 && (
                <p className="text-sm">
                  <span className="font-semibold">Cautions:</span> {step.cautions.map((c) => cautions[c].title).join(', ')} —{' '}
                  {p.acknowledged ? 'read and acknowledged' : 'NOT acknowledged'}
                </p>
              )}
              {step.record === 'check' && (
                <p>
                  <span className="font-semibold">Answer:</span> {p.answer === 'yes' ? 'Yes' : p.answer === 'no' ? 'No' : '—'}
                </p>
              )}
              {readings.length > 0 && (
                <div className="overflow-x-auto">
                  <table className="w-full border-collapse text-sm">
                    <caption className="sr-only">Readings on {step.title}</caption>
                    <thead>
                      <tr>
                        <th className={cell}>Part</th>
                        <th className={cell}>Reading</th>
                        <th className={cell}>Window</th>
                        <th className={cell}>Verdict</th>
                      </tr>
                    </thead>
                    <tbody>
                      {readings.map((r) => {
                        const part = partOf(r.partId);
                        return (
                          <tr key={r.partId}>
                            <th scope="row" className={`${cell} font-normal`}>
                              <span className="block font-bold">{r.designator}</span>
                              {part && <span className="block">{[part.line.value, part.line.tolerance].filter(Boolean).join(' ')}</span>}
                            </th>
                            <td className={`${cell} tabular`}>
                              <span className="block">{r.measuredText}</span>
                              {r.deviationText && <span className="block">{r.deviationText}</span>}
                              {r.inCircuit && <span className="block">in circuit</span>}
                            </td>
                            <td className={`${cell} tabular`}>{r.windowText ?? '—'}</td>
                            <td className={cell}>
                              {readingVerdict(r)}
                              {r.verdict !== 'pass' && !r.indicative && <span className="block font-semibold">Out of tolerance</span>}
                              {r.indicative && <span className="block">Indicative — lift a leg and read again</span>}
                              {r.windowText === null && r.note && <span className="block">{r.note}</span>}
                            </td>
                          </tr>
                        );
                      })}
                    </tbody>
                  </table>
                </div>
              )}
              {fuses.length > 0 && (
                <div className="overflow-x-auto">
                  <table className="w-full border-collapse text-sm">
                    <caption className="sr-only">Fuses on {step.title}</caption>
                    <thead>
                      <tr>
                        <th className={cell}>Fuse</th>
                        <th className={cell}>Circuit needs</th>
                        <th className={cell}>Fitted</th>
                        <th className={cell}>Verdict</th>
                      </tr>
                    </thead>
                    <tbody>
                      {fuses.map((f) => (
                        <tr key={f.partId}>
                          <th scope="row" className={`${cell} font-bold`}>
                            {f.designator}
                          </th>
                          <td className={`${cell} tabular`}>{f.specified}</td>
                          <td className={`${cell} tabular`}>{f.fitted}</td>
                          <td className={cell}>
                            <VerdictBadge verdict={f.accepted ? 'accepted' : 'refused'} />
                            {f.reasons.map((reason) => (
                              <span key={reason} className="block">
                                {reason}
                              </span>
                            ))}
                          </td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
              )}
              {power.length > 0 && (
                <div className="overflow-x-auto">
                  <table className="w-full border-collapse text-sm">
                    <caption className="sr-only">Power checks on {step.title}</caption>
                    <thead>
                      <tr>
                        <th className={cell}>Resistor</th>
                        <th className={cell}>Volts across</th>
                        <th className={cell}>Dissipates</th>
                        <th className={cell}>Verdict</th>
                      </tr>
                    </thead>
                    <tbody>
                      {power.map((x) => (
                        <tr key={x.partId}>
                          <th scope="row" className={`${cell} font-bold`}>
                            {x.designator}
                          </th>
                          <td className={`${cell} tabular`}>{x.voltsText}</td>
                          <td className={`${cell} tabular`}>
                            <span className="block">{watts(x.watts)}</span>
                            {x.ratingWatts !== null && <span className="block">rated {watts(x.ratingWatts)}</span>}
                            {x.allowedWatts !== null && <span className="block">allowed {watts(x.allowedWatts)}</span>}
                          </td>
                          <td className={cell}>
                            <VerdictBadge verdict={x.undersized ? 'undersized' : 'ok'} />
                            <span className="block">{x.message}</span>
                          </td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
              )}
              {p.note && (
                <p className="whitespace-pre-line">
                  <span className="font-semibold">Note:</span> {p.note}
                </p>
              )}
              {photos.length > 0 && (
                <ul className="flex flex-wrap gap-2">
                  {photos.map((photo, n) => (
                    <li key={photo.id}>
                      <img
                        src={photo.thumbUrl}
                        alt={`Photo ${n + 1} on “${step.title}”`}
                        className="size-28 border border-paper-line object-cover"
                      />
                    </li>
                  ))}
                </ul>
              )}
            </li>
          );
        })}
      </ol>

      <section aria-labelledby="sheet-parts" className="grid gap-2 border-t-2 border-ink pt-3 print:border-black">
        <h2 id="sheet-parts" className="text-lg font-bold">
          Parts used
        </h2>
        {job.draft.partsUsed.length === 0 ? (
          <p>None recorded.</p>
        ) : (
          <table className="w-full border-collapse text-sm">
            <thead>
              <tr>
                <th className={cell}>Part</th>
                <th className={cell}>Replaces</th>
                <th className={`${cell} text-right`}>Quantity</th>
              </tr>
            </thead>
            <tbody>
              {job.draft.partsUsed.map((u, i) => (
                <tr key={i}>
                  <td className={cell}>{u.description}</td>
                  <td className={cell}>{u.partId ? (partOf(u.partId)?.line.designator ?? '—') : '—'}</td>
                  <td className={`${cell} text-right tabular`}>{u.quantity}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      <footer className="text-sm text-ink-soft print:text-black">
        Printed from Bumperline. Cautions shown on the job are reminders; local codes and licensed practice rule.
      </footer>
    </article>
  );
}
