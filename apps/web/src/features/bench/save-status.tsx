// Where the draft stands ("Saved 10:42", "Saving…", "Not saved — offline, retrying"), the choice when another
// device saved first, and what this device had typed once the other device's draft is loaded.
import { CloudCheck, CloudOff, Loader2, TriangleAlert } from 'lucide-react';
import type { BenchStep } from '@bumperline/contracts/bench-vocabulary';
import type { LocaleSettings } from '../../lib/format.ts';
import type { Autosave, AutosaveState } from './autosave.ts';
import { unsentLabel } from './unsent-labels.ts';

function timeOf(iso: string, locale: LocaleSettings | undefined) {
  return new Intl.DateTimeFormat(locale?.locale ?? 'en-US', { timeStyle: 'short', timeZone: locale?.timeZone }).format(new Date(iso));
}

export function SaveStatus({ state, locale, onRetry }: { state: AutosaveState; locale?: LocaleSettings; onRetry: () => void }) {
  const conflict = state.status.kind === 'conflict';
  const s = state.status;
  let icon = <CloudCheck aria-hidden className="size-5 text-running" />;
  let text = state.savedAt ? `Saved ${timeOf(state.savedAt, locale)}` : 'Saved';
  let retry = false;
  if (s.kind === 'pending' || s.kind === 'saving') {
    icon = <Loader2 aria-hidden className="size-5 animate-spin" />;
    text = 'Saving…';
  } else if (s.kind === 'retrying') {
    icon = <CloudOff aria-hidden className="size-5 text-down" />;
    text = s.reason === 'offline' ? 'Not saved — offline, retrying' : 'Not saved — the server did not answer, retrying';
    retry = true;
  } else if (s.kind === 'refused') {
    icon = <TriangleAlert aria-hidden className="size-5 text-down" />;
    text = `Not saved — ${s.message}`;
  } else if (s.kind === 'conflict') {
    icon = <TriangleAlert aria-hidden className="size-5 text-down" />;
    text = 'Not saved — changed on another device';
  }
  return (
    <div className="flex min-w-0 items-center gap-2">
      <p
        role="status"
        className={`flex min-w-0 items-center gap-1.5 text-sm font-bold ${s.kind === 'saved' || s.kind === 'pending' || s.kind === 'saving' ? 'text-ink' : 'text-down'}`}
      >
        {icon}
        <span className="min-w-0">{text}</span>
      </p>
      {retry && (
        <button type="button" className="min-h-11 shrink-0 rounded-md px-2 text-sm font-bold underline" onClick={onRetry}>
          Retry now
        </button>
      )}
      {conflict && (
        <button
          type="button"
          className="min-h-11 shrink-0 rounded-md px-2 text-sm font-bold underline"
          // The choice sits at the top of the job; the technician may be far down a long list of readings.
          onClick={() => {
            const panel = document.getElementById(CONFLICT_PANEL_ID);
            panel?.scrollIntoView({ block: 'start' });
            panel?.focus({ preventScroll: true });
          }}
        >
          Choose
        </button>
      )}
    </div>
  );
}

const CONFLICT_PANEL_ID = 'bench-conflict';

export function ConflictPanel({ autosave, state }: { autosave: Autosave; state: AutosaveState }) {
  if (!state.conflict) return null;
  return (
    <section
      id={CONFLICT_PANEL_ID}
      tabIndex={-1}
      role="alert"
      aria-labelledby="conflict-title"
      className="grid gap-3 rounded-lg border-2 border-down bg-down-tint p-4"
    >
      <h2 id="conflict-title" className="flex items-center gap-2 text-lg font-extrabold text-down">
        <TriangleAlert aria-hidden className="size-5" /> Changed on another device
      </h2>
      <p>
        Someone saved this job from another device after this screen loaded it. Nothing has been overwritten: your typing is still here, and
        theirs is kept. Choose which to go on with.
      </p>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn-primary" onClick={() => autosave.dispatch({ type: 'loadTheirs' })}>
          Load theirs (your typing is listed to re-enter)
        </button>
        <button type="button" className="btn-danger" onClick={() => autosave.dispatch({ type: 'keepMine' })}>
          Keep mine and replace theirs
        </button>
      </div>
    </section>
  );
}

export function LeftOverPanel({
  autosave,
  state,
  steps,
  designatorOf,
}: {
  autosave: Autosave;
  state: AutosaveState;
  steps: readonly BenchStep[];
  designatorOf: (partId: string) => string;
}) {
  if (!state.leftOver) return null;
  return (
    <section aria-labelledby="left-over-title" className="grid gap-2 rounded-lg border-2 border-attention bg-attention-tint p-4">
      <h2 id="left-over-title" className="text-lg font-extrabold">
        What you typed here that is not in theirs
      </h2>
      <p>Their draft is loaded. Re-enter anything of yours that should stay:</p>
      <ul className="grid gap-1">
        {state.leftOver.map((c, i) => (
          <li key={i} className="rounded-md bg-white p-2">
            <span className="font-semibold">{unsentLabel(c, steps, designatorOf)}</span>: you typed{' '}
            <strong className="tabular">“{c.mine || '(empty)'}”</strong>
            {c.theirs ? (
              <>
                {' '}
                — theirs: <span className="tabular">“{c.theirs}”</span>
              </>
            ) : null}
          </li>
        ))}
      </ul>
      <button type="button" className="btn-secondary justify-self-start" onClick={() => autosave.dispatch({ type: 'dismissLeftOver' })}>
        Done re-entering
      </button>
    </section>
  );
}
