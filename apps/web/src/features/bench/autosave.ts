// The bench job's autosave: what the screen shows (mine), what the server last agreed to (base, at `version`),
// and what to do when a save fails. A pure reducer decides every move; `createAutosave` only adds the timers
// and the request. Nothing is ever overwritten silently: a 409 stops saving until the technician chooses.
import type { BenchJobDraft } from '@bumperline/contracts/bench-vocabulary';
import { unsentChanges, type UnsentChange } from './unsent-changes.ts';

export type SaveStatus =
  /** Nothing unsent. */
  | { kind: 'saved' }
  /** Edits waiting for the typing to pause. */
  | { kind: 'pending' }
  | { kind: 'saving' }
  /** The last send did not reach the server (no connection, or the server failed): retrying. */
  | { kind: 'retrying'; attempt: number; reason: 'offline' | 'server' }
  /** The server refused the draft itself (a 400): kept here, not retried until the next edit. */
  | { kind: 'refused'; message: string }
  /** Someone saved from another device since this one last loaded: waiting for a choice. */
  | { kind: 'conflict' };

export interface Conflict {
  theirs: BenchJobDraft;
  version: number;
}

export interface AutosaveState {
  /** What the screen shows, with every keystroke. */
  draft: BenchJobDraft;
  /** The draft as the server holds it at `version`. */
  base: BenchJobDraft;
  version: number;
  status: SaveStatus;
  /** When the server last accepted a save (ISO time), or null when not since this screen opened. */
  savedAt: string | null;
  /** Counts local edits, so a save that returns after more typing knows it is not the last word. */
  edits: number;
  /** The save on its way: which edit it carries and what it sent. */
  sending: { edits: number; draft: BenchJobDraft } | null;
  /** Sends in a row that did not reach the server (sets the back-off). */
  failedSends: number;
  conflict: Conflict | null;
  /** After loading the other device's draft: what this device had typed that is not in it, to re-enter. */
  leftOver: UnsentChange[] | null;
}

export type AutosaveEvent =
  | { type: 'edited'; draft: BenchJobDraft }
  | { type: 'sent' }
  | { type: 'saved'; version: number; at: string }
  | { type: 'unreachable'; reason: 'offline' | 'server' }
  | { type: 'refused'; message: string }
  | { type: 'conflict'; theirs: BenchJobDraft; version: number }
  | { type: 'loadTheirs' }
  | { type: 'keepMine' }
  | { type: 'dismissLeftOver' };

export function initialAutosave(draft: BenchJobDraft, version: number, savedAt: string | null = null): AutosaveState {
  return {
    draft,
    base: draft,
    version,
    status: { kind: 'saved' },
    savedAt,
    edits: 0,
    sending: null,
    failedSends: 0,
    conflict: null,
    leftOver: null,
  };
}

/** Unsent edits exist (typed, not yet accepted by the server). */
export function hasUnsent(state: AutosaveState): boolean {
  return state.draft !== state.base;
}

/** The request to make now, or null when nothing should be sent (already sending, in conflict, nothing new). */
export function nextSend(state: AutosaveState): { draft: BenchJobDraft; version: number } | null {
  if (state.sending || state.conflict) return null;
  if (state.status.kind !== 'pending' && state.status.kind !== 'retrying') return null;
  return { draft: state.draft, version: state.version };
}

export function autosaveReducer(state: AutosaveState, event: AutosaveEvent): AutosaveState {
  switch (event.type) {
    case 'edited': {
      const edits = state.edits + 1;
      // While a conflict waits for a choice, keep typing locally but send nothing.
      if (state.conflict) return { ...state, draft: event.draft, edits };
      const status: SaveStatus = state.sending ? { kind: 'saving' } : { kind: 'pending' };
      return { ...state, draft: event.draft, edits, status };
    }
    case 'sent': {
      const send = nextSend(state);
      if (!send) return state;
      return { ...state, status: { kind: 'saving' }, sending: { edits: state.edits, draft: send.draft } };
    }
    case 'saved': {
      if (!state.sending) return state;
      const typedSince = state.edits > state.sending.edits;
      return {
        ...state,
        base: state.sending.draft,
        // A draft identical to what was sent is the one the server has: say "saved" without a copy.
        draft: typedSince ? state.draft : state.sending.draft,
        version: event.version,
        savedAt: event.at,
        sending: null,
        failedSends: 0,
        status: typedSince ? { kind: 'pending' } : { kind: 'saved' },
      };
    }
    case 'unreachable': {
      if (!state.sending) return state;
      const attempt = state.failedSends + 1;
      return { ...state, sending: null, failedSends: attempt, status: { kind: 'retrying', attempt, reason: event.reason } };
    }
    case 'refused': {
      if (!state.sending) return state;
      const typedSince = state.edits > state.sending.edits;
      // Typing since may already have fixed what was refused: try again after the pause.
      return {
        ...state,
        sending: null,
        failedSends: 0,
        status: typedSince ? { kind: 'pending' } : { kind: 'refused', message: event.message },
      };
    }
    case 'conflict':
      return {
        ...state,
        sending: null,
        status: { kind: 'conflict' },
        conflict: { theirs: event.theirs, version: event.version },
      };
    case 'loadTheirs': {
      if (!state.conflict) return state;
      const { theirs, version } = state.conflict;
      const leftOver = unsentChanges(state.base, state.draft, theirs);
      return {
        ...state,
        draft: theirs,
        base: theirs,
        version,
        conflict: null,
        status: { kind: 'saved' },
        leftOver: leftOver.length ? leftOver : null,
      };
    }
    case 'keepMine': {
      if (!state.conflict) return state;
      // The technician chose to replace the other device's draft: send mine against their version.
      return { ...state, base: state.conflict.theirs, version: state.conflict.version, conflict: null, status: { kind: 'pending' } };
    }
    case 'dismissLeftOver':
      return { ...state, leftOver: null };
  }
}

/** Time to wait before retry `attempt` (1, 2, …): 2 s doubling to at most 30 s. */
export function retryDelayMs(attempt: number): number {
  return Math.min(30_000, 2_000 * 2 ** Math.max(0, attempt - 1));
}

export type SaveOutcome =
  | { kind: 'saved'; version: number; at: string }
  | { kind: 'unreachable'; reason: 'offline' | 'server' }
  | { kind: 'refused'; message: string }
  | { kind: 'conflict'; theirs: BenchJobDraft; version: number };

export interface AutosaveDeps {
  save: (draft: BenchJobDraft, version: number) => Promise<SaveOutcome>;
  /** Pause after the last keystroke before saving. */
  debounceMs?: number;
  setTimer?: (fn: () => void, ms: number) => unknown;
  clearTimer?: (handle: unknown) => void;
}

export interface Autosave {
  getState(): AutosaveState;
  subscribe(listener: () => void): () => void;
  edit(draft: BenchJobDraft): void;
  dispatch(event: Extract<AutosaveEvent, { type: 'loadTheirs' | 'keepMine' | 'dismissLeftOver' }>): void;
  /** Send now (the connection came back, or the technician asked). */
  retryNow(): void;
  /** Sends what is unsent and resolves true once the server holds everything typed, false if it cannot. */
  flush(): Promise<boolean>;
  stop(): void;
}

export const AUTOSAVE_DEBOUNCE_MS = 800;

export function createAutosave(initial: AutosaveState, deps: AutosaveDeps): Autosave {
  const debounceMs = deps.debounceMs ?? AUTOSAVE_DEBOUNCE_MS;
  const setTimer = deps.setTimer ?? ((fn, ms) => setTimeout(fn, ms));
  const clearTimer = deps.clearTimer ?? ((h) => clearTimeout(h as ReturnType<typeof setTimeout>));
  let state = initial;
  let timer: unknown = null;
  let stopped = false;
  const listeners = new Set<() => void>();
  const settledWaiters = new Set<() => void>();

  function apply(event: AutosaveEvent) {
    const next = autosaveReducer(state, event);
    if (next === state) return;
    state = next;
    listeners.forEach((l) => l());
    if (!state.sending) settledWaiters.forEach((w) => w());
  }

  function schedule(ms: number) {
    if (timer !== null) clearTimer(timer);
    timer = setTimer(() => {
      timer = null;
      void send();
    }, ms);
  }

  function afterOutcome() {
    if (stopped) return;
    if (state.status.kind === 'pending') schedule(debounceMs);
    else if (state.status.kind === 'retrying') schedule(retryDelayMs(state.status.attempt));
  }

  async function send() {
    if (stopped) return;
    const request = nextSend(state);
    if (!request) return;
    apply({ type: 'sent' });
    let outcome: SaveOutcome;
    try {
      outcome = await deps.save(request.draft, request.version);
    } catch {
      outcome = { kind: 'unreachable', reason: 'server' };
    }
    if (stopped) return;
    if (outcome.kind === 'saved') apply({ type: 'saved', version: outcome.version, at: outcome.at });
    else if (outcome.kind === 'unreachable') apply({ type: 'unreachable', reason: outcome.reason });
    else if (outcome.kind === 'refused') apply({ type: 'refused', message: outcome.message });
    else apply({ type: 'conflict', theirs: outcome.theirs, version: outcome.version });
    afterOutcome();
  }

  function waitUntilSettled(): Promise<void> {
    if (!state.sending) return Promise.resolve();
    return new Promise((resolve) => {
      const done = () => {
        settledWaiters.delete(done);
        resolve();
      };
      settledWaiters.add(done);
    });
  }

  return {
    getState: () => state,
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    edit(draft) {
      apply({ type: 'edited', draft });
      if (!state.sending && !state.conflict) schedule(debounceMs);
    },
    dispatch(event) {
      apply(event);
      if (event.type === 'keepMine') void send();
    },
    retryNow() {
      if (timer !== null) clearTimer(timer);
      timer = null;
      void send();
    },
    async flush() {
      // At most a few rounds: one in flight, then what was typed meanwhile.
      for (let round = 0; round < 3; round++) {
        await waitUntilSettled();
        if (!hasUnsent(state) && state.status.kind === 'saved') return true;
        if (state.status.kind === 'conflict' || state.status.kind === 'refused') return false;
        if (state.status.kind === 'retrying' && round > 0) return false;
        if (timer !== null) clearTimer(timer);
        timer = null;
        await send();
      }
      return !hasUnsent(state) && state.status.kind === 'saved';
    },
    stop() {
      stopped = true;
      if (timer !== null) clearTimer(timer);
      listeners.clear();
    },
  };
}
