// One bench job, phone first: the steps in order with progress; each step's instructions, cautions (acknowledged
// before "Done"), and what it records, judged live by the domain as it is typed. The draft saves itself; finishing
// asks the server to judge it all again, and its field problems are shown where they belong.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { ChevronLeft, ChevronRight, FileText, Flag, ListOrdered } from 'lucide-react';
import type { BenchJob } from '@bumperline/contracts/bench-jobs';
import { stepRecordLabels, type BenchJobDraft, type BenchStep } from '@bumperline/contracts/bench-vocabulary';
import { partsForStep } from '@bumperline/domain/components/bench-judgement';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading } from '../../components/states.tsx';
import { useBenchJob, useFinishBenchJob } from '../../api/bench-jobs.ts';
import { useCan } from '../../api/use-can.ts';
import { useLocaleSettings } from '../../api/me.ts';
import { ApiError } from '../../lib/api-client.ts';
import { formatDateTime } from '../../lib/format.ts';
import { paths } from '../../lib/paths.ts';
import { useAutosave, useAutosaveState } from './use-autosave.ts';
import { readJobParts, type JobPart } from './job-parts.ts';
import { progressCount, stepProgress, updateStep } from './draft.ts';
import { fieldDomId, placeProblems, stepOfField, type PlacedProblems } from './field-problems.ts';
import { FINISH_STEP, StepList } from './step-list.tsx';
import { ConflictPanel, LeftOverPanel, SaveStatus } from './save-status.tsx';
import { CautionList } from './caution-list.tsx';
import { AcknowledgeCautions, StepDone } from './step-sign-off.tsx';
import { ReadingsRecord } from './record-readings.tsx';
import { DiodesRecord } from './record-diodes.tsx';
import { FusesRecord } from './record-fuses.tsx';
import { PowerRecord } from './record-power.tsx';
import { PartsUsedRecord } from './record-parts-used.tsx';
import { CheckRecord, NoteRecord } from './record-check.tsx';
import { StepPhotos } from './step-photos.tsx';
import { recordHints } from './words.ts';
import type { RecordProps } from './record-props.ts';

export function BenchJobPage() {
  const { id = '' } = useParams();
  const job = useBenchJob(id);
  // Resuming on another device starts from the server's draft, never from a copy this browser kept.
  if (job.isLoading || (job.data && !job.isFetchedAfterMount && job.isFetching)) return <Loading label="Loading the bench job…" />;
  if (job.error || !job.data) return <ErrorState error={job.error} onRetry={() => job.refetch()} />;
  return <JobScreen key={job.data.id} job={job.data} />;
}

const noProblems: PlacedProblems = { byField: {}, countByStep: {}, first: null, unplaced: [] };

function JobScreen({ job }: { job: BenchJob }) {
  const locale = useLocaleSettings();
  const canWork = useCan('bench:work');
  const autosave = useAutosave(job);
  const state = useAutosaveState(autosave);
  const finished = job.state === 'finished';
  const readOnly = finished || !canWork;
  // A finished job shows what the server holds; an open one what is typed here.
  const draft = finished ? job.draft : state.draft;
  const parts = useMemo(() => readJobParts(job.parts), [job.parts]);
  const designatorOf = useCallback((partId: string) => parts.find((p) => p.id === partId)?.line.designator ?? 'a part', [parts]);
  const stepParts = useMemo(() => new Map(job.steps.map((s) => [s.key, partsForStep(s, parts)])), [job.steps, parts]);
  const stepKeys = useMemo(() => job.steps.map((s) => s.key), [job.steps]);
  const partsStepKey = job.steps.find((s) => s.record === 'parts_used')?.key ?? FINISH_STEP;

  const [search, setSearch] = useSearchParams();
  const phoneStepList = useRef<HTMLDetailsElement>(null);
  const firstOpen = job.steps.find((s) => !job.draft.steps[s.key]?.done)?.key ?? FINISH_STEP;
  const requested = search.get('step');
  const current = requested && (stepKeys.includes(requested) || requested === FINISH_STEP) ? requested : firstOpen;
  const open = useCallback(
    (key: string) => {
      setSearch((s) => {
        const next = new URLSearchParams(s);
        next.set('step', key);
        return next;
      });
      // On a phone the list folds away again once a step is chosen, so the step is what shows.
      if (phoneStepList.current) phoneStepList.current.open = false;
      window.scrollTo({ top: 0 });
    },
    [setSearch],
  );

  const [problems, setProblems] = useState<PlacedProblems>(noProblems);
  const [finishMessage, setFinishMessage] = useState<string | null>(null);
  const scrollTarget = useRef<string | null>(null);
  const finish = useFinishBenchJob(job.id);

  const edit = useCallback((change: (d: BenchJobDraft) => BenchJobDraft) => autosave.edit(change(autosave.getState().draft)), [autosave]);

  // After a refused finish, the first problem's input is scrolled to and focused once its step is on screen.
  useEffect(() => {
    const target = scrollTarget.current;
    if (!target) return;
    const el = document.getElementById(fieldDomId(target));
    if (!el) return;
    scrollTarget.current = null;
    el.scrollIntoView({ block: 'center' });
    el.focus({ preventScroll: true });
  }, [current, problems]);

  async function onFinish() {
    setFinishMessage(null);
    const saved = await autosave.flush();
    if (!saved) {
      setFinishMessage('The draft is not saved yet, so the job cannot be finished: see the message at the top of the screen.');
      return;
    }
    finish.mutate(autosave.getState().version, {
      onSuccess: () => setProblems(noProblems),
      onError: (err) => {
        if (err instanceof ApiError && err.status === 400 && err.problem.errors?.length) {
          const placed = placeProblems(err.problem.errors, stepKeys);
          setProblems(placed);
          const count = err.problem.errors.length;
          setFinishMessage(`Not finished: ${count} ${count === 1 ? 'thing needs' : 'things need'} fixing. Your entries are kept.`);
          if (placed.first) {
            scrollTarget.current = placed.first.field;
            const step = stepOfField(placed.first.field) ?? partsStepKey;
            if (step !== current) open(step);
          }
        } else if (err instanceof ApiError && err.status === 409) {
          setFinishMessage(`${err.message} Reload the page to see the job as it now is.`);
        } else setFinishMessage(err instanceof ApiError ? err.message : 'That did not work. Try again.');
      },
    });
  }

  const progress = progressCount(draft, stepKeys);
  const stepIndex = stepKeys.indexOf(current);
  const step = job.steps[stepIndex];
  const prevKey = stepIndex > 0 ? stepKeys[stepIndex - 1] : current === FINISH_STEP ? stepKeys[stepKeys.length - 1] : undefined;
  const nextKey = stepIndex >= 0 ? (stepKeys[stepIndex + 1] ?? FINISH_STEP) : undefined;

  return (
    <div>
      <PageHeader
        title={`Bench job · ${job.boardName}`}
        subtitle={
          // Each separator stays at the end of the item before it, so a wrapped line never starts with one.
          <span className="inline-flex flex-wrap items-center gap-x-2">
            {[
              job.gameId && job.gameLabel ? (
                <Link key="game" className="link" to={paths.game(job.gameId)}>
                  {job.gameLabel}
                </Link>
              ) : null,
              <Link key="board" className="link" to={paths.boardInstance(job.boardInstanceId)}>
                {job.boardSerial ? `Board ${job.boardSerial}` : 'The board'}
              </Link>,
              <span key="template">{job.templateName}</span>,
              job.serviceCallId ? (
                <Link key="call" className="link" to={paths.call(job.serviceCallId)}>
                  The service call
                </Link>
              ) : null,
            ]
              .filter((item) => item !== null)
              .map((item, i, items) => (
                <span key={item.key}>
                  {item}
                  {i < items.length - 1 && <span aria-hidden> ·</span>}
                </span>
              ))}
          </span>
        }
        actions={
          finished ? (
            <Link className="btn-primary" to={paths.benchJobSheet(job.id)}>
              <FileText aria-hidden className="size-4" /> Job sheet
            </Link>
          ) : undefined
        }
      />

      {finished && (
        <p className="mb-4 rounded-md border-2 border-running bg-running-tint p-3 font-semibold text-running">
          Finished{job.finishedBy ? ` by ${job.finishedBy}` : ''} {formatDateTime(job.finishedAt, locale)}. This job can no longer be
          changed.{' '}
          <Link className="link" to={paths.benchJobSheet(job.id)}>
            See the job sheet
          </Link>
        </p>
      )}
      {!finished && !canWork && (
        <p className="mb-4 rounded-md bg-paper-dim p-3 font-semibold">You can read this job; your role cannot record on it.</p>
      )}

      <div className="mb-4 grid gap-3">
        {!finished && <ConflictPanel autosave={autosave} state={state} />}
        {!finished && <LeftOverPanel autosave={autosave} state={state} steps={job.steps} designatorOf={designatorOf} />}
      </div>

      <div className="grid gap-4 lg:grid-cols-[20rem_minmax(0,1fr)] lg:items-start">
        <nav aria-label="Steps" className="grid gap-2 lg:sticky lg:top-4">
          <div className="card grid gap-2 p-3">
            <label htmlFor="bench-progress" className="flex items-center justify-between font-bold">
              <span>Progress</span>
              <span className="tabular">
                {progress.done} of {progress.total} steps done
              </span>
            </label>
            <progress
              id="bench-progress"
              className="h-3 w-full overflow-hidden rounded-full [&::-moz-progress-bar]:bg-running [&::-webkit-progress-bar]:bg-paper-line [&::-webkit-progress-value]:bg-running"
              max={progress.total || 1}
              value={progress.done}
            />
          </div>
          {/* On a phone the list folds away under the progress; on a wide screen it stays open beside the step. */}
          <details ref={phoneStepList} className="card p-2 lg:hidden">
            <summary className="flex min-h-11 cursor-pointer items-center gap-2 px-2 font-bold">
              <ListOrdered aria-hidden className="size-5" /> All steps
            </summary>
            <StepList
              steps={job.steps}
              draft={draft}
              current={current}
              problemCounts={problems.countByStep}
              onOpen={open}
              finishLabel={finished ? 'Finished' : 'Finish the job'}
            />
          </details>
          <div className="card hidden p-2 lg:block">
            <StepList
              steps={job.steps}
              draft={draft}
              current={current}
              problemCounts={problems.countByStep}
              onOpen={open}
              finishLabel={finished ? 'Finished' : 'Finish the job'}
            />
          </div>
        </nav>

        <div className="grid min-w-0 gap-4">
          {finishMessage && (
            <p role="alert" className="rounded-md border-2 border-down bg-down-tint p-3 font-semibold text-down">
              {finishMessage}
            </p>
          )}
          {problems.unplaced.length > 0 && (
            <ul role="alert" className="rounded-md border-2 border-down bg-down-tint p-3 font-semibold text-down">
              {problems.unplaced.map((p, i) => (
                <li key={i}>{p.message}</li>
              ))}
            </ul>
          )}
          {step ? (
            <StepCard
              key={step.key}
              job={job}
              step={step}
              index={stepIndex}
              draft={draft}
              parts={stepParts.get(step.key) ?? []}
              boardParts={parts}
              readOnly={readOnly}
              problems={problems.byField}
              edit={edit}
            />
          ) : (
            <FinishCard
              job={job}
              draft={draft}
              boardParts={parts}
              readOnly={readOnly}
              problems={problems}
              edit={edit}
              showPartsUsed={partsStepKey === FINISH_STEP}
              progress={progress}
              finishing={finish.isPending}
              onFinish={onFinish}
            />
          )}
        </div>
      </div>

      {/* Within thumb's reach on a phone: previous, where the draft stands, next. */}
      <div className="sticky bottom-0 z-20 -mx-4 mt-4 border-t border-paper-line bg-white px-3 py-2 shadow-[0_-2px_8px_rgba(20,33,61,0.08)] print:hidden">
        <div className="mx-auto flex max-w-[96rem] items-center justify-between gap-2">
          <button
            type="button"
            className="btn-secondary shrink-0 px-3"
            disabled={!prevKey}
            onClick={() => prevKey && open(prevKey)}
            aria-label="Previous step"
          >
            <ChevronLeft aria-hidden className="size-5" />
            <span className="hidden sm:inline">Previous</span>
          </button>
          <div className="min-w-0 flex-1">
            {finished ? (
              <p className="text-center text-sm font-bold">Finished</p>
            ) : (
              <SaveStatus state={state} locale={locale} onRetry={() => autosave.retryNow()} />
            )}
          </div>
          {nextKey ? (
            <button type="button" className="btn-primary shrink-0 px-3" onClick={() => open(nextKey)}>
              {nextKey === FINISH_STEP ? (finished ? 'Summary' : 'Finish') : 'Next'}
              {nextKey === FINISH_STEP ? <Flag aria-hidden className="size-5" /> : <ChevronRight aria-hidden className="size-5" />}
            </button>
          ) : (
            <span className="w-11" />
          )}
        </div>
      </div>
    </div>
  );
}

function StepCard({
  job,
  step,
  index,
  draft,
  parts,
  boardParts,
  readOnly,
  problems,
  edit,
}: {
  job: BenchJob;
  step: BenchStep;
  index: number;
  draft: BenchJobDraft;
  parts: readonly JobPart[];
  boardParts: readonly JobPart[];
  readOnly: boolean;
  problems: Readonly<Record<string, string>>;
  edit: RecordProps['edit'];
}) {
  const progress = stepProgress(draft, step.key);
  const props: RecordProps = { step, progress, parts, readOnly, problems, edit };
  const signOff = {
    step,
    progress,
    readOnly,
    problems,
    onChange: (change: Partial<typeof progress>) => edit((d) => updateStep(d, step.key, () => change)),
  };
  return (
    <section className="card grid gap-4" aria-labelledby="step-title">
      <header className="grid gap-1">
        <p className="text-sm font-bold tracking-wide text-ink-muted uppercase">
          Step {index + 1} of {job.steps.length} · {stepRecordLabels[step.record]}
        </p>
        <h2 id="step-title" className="text-xl font-extrabold">
          {step.title}
        </h2>
      </header>
      {step.instructions && <p className="whitespace-pre-line">{step.instructions}</p>}
      <CautionList kinds={step.cautions} />
      <AcknowledgeCautions {...signOff} />
      <div className="grid gap-3">
        {!readOnly && recordHints[step.record] && <p className="text-sm text-ink-soft">{recordHints[step.record]}</p>}
        {step.record === 'readings' && <ReadingsRecord {...props} />}
        {step.record === 'diode_set' && <DiodesRecord {...props} />}
        {step.record === 'fuse' && <FusesRecord {...props} />}
        {step.record === 'power' && <PowerRecord {...props} />}
        {step.record === 'check' && <CheckRecord {...props} />}
        {step.record === 'parts_used' && (
          <PartsUsedRecord
            partsUsed={draft.partsUsed}
            boardInstanceId={job.boardInstanceId}
            boardParts={boardParts}
            stepParts={parts}
            readOnly={readOnly}
            problems={problems}
            edit={edit}
          />
        )}
        <StepPhotos
          jobId={job.id}
          stepKey={step.key}
          stepTitle={step.title}
          photos={job.photos}
          readOnly={readOnly}
          main={step.record === 'photo'}
          serverProblem={problems[`steps.${step.key}.photos`]}
        />
        <NoteRecord {...props} main={step.record === 'note'} />
      </div>
      <StepDone {...signOff} />
    </section>
  );
}

function FinishCard({
  job,
  draft,
  boardParts,
  readOnly,
  problems,
  edit,
  showPartsUsed,
  progress,
  finishing,
  onFinish,
}: {
  job: BenchJob;
  draft: BenchJobDraft;
  boardParts: readonly JobPart[];
  readOnly: boolean;
  problems: PlacedProblems;
  edit: RecordProps['edit'];
  showPartsUsed: boolean;
  progress: { done: number; total: number };
  finishing: boolean;
  onFinish: () => void;
}) {
  const notDone = job.steps.filter((s) => !draft.steps[s.key]?.done);
  const finished = job.state === 'finished';
  return (
    <section className="card grid gap-4" aria-labelledby="finish-title">
      <h2 id="finish-title" className="text-xl font-extrabold">
        {finished ? 'Finished' : 'Finish the job'}
      </h2>
      {showPartsUsed && (
        <div className="grid gap-2">
          <h3 className="font-bold">Parts used</h3>
          <PartsUsedRecord
            partsUsed={draft.partsUsed}
            boardInstanceId={job.boardInstanceId}
            boardParts={boardParts}
            stepParts={[]}
            readOnly={readOnly}
            problems={problems.byField}
            edit={edit}
          />
        </div>
      )}
      {finished ? (
        <p>
          {progress.done} of {progress.total} steps were ticked done.
          {notDone.length > 0 && ` Not done: ${notDone.map((s) => s.title).join(', ')}.`}
        </p>
      ) : (
        <>
          <p>
            {progress.done} of {progress.total} steps ticked done.
            {notDone.length > 0 && ` Still open: ${notDone.map((s) => s.title).join(', ')}.`}
          </p>
          <p className="text-ink-soft">
            Finishing checks every reading, fuse and power check again and writes the readings into the board’s history. A finished job
            cannot be changed.
          </p>
          {!readOnly && (
            <button type="button" className="btn-primary min-h-14 text-lg" disabled={finishing} onClick={onFinish}>
              <Flag aria-hidden className="size-5" />
              {finishing ? 'Finishing…' : 'Finish the job'}
            </button>
          )}
        </>
      )}
    </section>
  );
}
