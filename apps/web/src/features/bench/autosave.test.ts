import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { BenchJobDraft } from '@bumperline/contracts/bench-vocabulary';
import {
  autosaveReducer,
  createAutosave,
  hasUnsent,
  initialAutosave,
  nextSend,
  retryDelayMs,
  type AutosaveState,
  type SaveOutcome,
} from './autosave.ts';
import { emptyDraft, setReading, stepProgress } from './draft.ts';

const R12 = 'part-r12';
const typed = (draft: BenchJobDraft, text: string) => setReading(draft, 'measure', R12, { text });
const readingOf = (draft: BenchJobDraft) => stepProgress(draft, 'measure').readings[R12]?.text;

describe('autosave reducer', () => {
  it('waits for the pause, sends with the version it started from, then says saved', () => {
    let s = initialAutosave(emptyDraft(), 3);
    expect(nextSend(s)).toBeNull();
    s = autosaveReducer(s, { type: 'edited', draft: typed(s.draft, '570') });
    expect(s.status.kind).toBe('pending');
    expect(nextSend(s)).toEqual({ draft: s.draft, version: 3 });
    s = autosaveReducer(s, { type: 'sent' });
    expect(s.status.kind).toBe('saving');
    expect(nextSend(s)).toBeNull();
    s = autosaveReducer(s, { type: 'saved', version: 4, at: '2027-01-05T10:42:00Z' });
    expect(s.status.kind).toBe('saved');
    expect(s.version).toBe(4);
    expect(s.savedAt).toBe('2027-01-05T10:42:00Z');
    expect(hasUnsent(s)).toBe(false);
  });

  it('keeps typing made while a save was on its way, and sends it next with the new version', () => {
    let s = initialAutosave(emptyDraft(), 1);
    s = autosaveReducer(s, { type: 'edited', draft: typed(s.draft, '57') });
    s = autosaveReducer(s, { type: 'sent' });
    s = autosaveReducer(s, { type: 'edited', draft: typed(s.draft, '570') });
    s = autosaveReducer(s, { type: 'saved', version: 2, at: '2027-01-05T10:42:00Z' });
    expect(readingOf(s.draft)).toBe('570');
    expect(readingOf(s.base)).toBe('57');
    expect(s.status.kind).toBe('pending');
    expect(nextSend(s)).toEqual({ draft: s.draft, version: 2 });
  });

  it('retries when the server cannot be reached, counting attempts, and never drops the text', () => {
    let s = initialAutosave(emptyDraft(), 1);
    s = autosaveReducer(s, { type: 'edited', draft: typed(s.draft, '570') });
    s = autosaveReducer(s, { type: 'sent' });
    s = autosaveReducer(s, { type: 'unreachable', reason: 'offline' });
    expect(s.status).toEqual({ kind: 'retrying', attempt: 1, reason: 'offline' });
    s = autosaveReducer(autosaveReducer(s, { type: 'sent' }), { type: 'unreachable', reason: 'offline' });
    expect(s.status).toEqual({ kind: 'retrying', attempt: 2, reason: 'offline' });
    expect(readingOf(s.draft)).toBe('570');
    expect(nextSend(s)?.version).toBe(1);
  });

  it('on a conflict sends nothing more, keeps my typing, and loads theirs only when asked, listing what I had typed', () => {
    const base = typed(emptyDraft(), '560');
    let s = initialAutosave(base, 5);
    s = autosaveReducer(s, { type: 'edited', draft: typed(s.draft, '571') });
    s = autosaveReducer(s, { type: 'sent' });
    const theirs = typed(base, '590');
    s = autosaveReducer(s, { type: 'conflict', theirs, version: 7 });
    expect(s.status.kind).toBe('conflict');
    expect(readingOf(s.draft)).toBe('571');
    // More typing during the conflict stays here and is not sent.
    s = autosaveReducer(s, { type: 'edited', draft: typed(s.draft, '572') });
    expect(nextSend(s)).toBeNull();
    expect(readingOf(s.draft)).toBe('572');

    s = autosaveReducer(s, { type: 'loadTheirs' });
    expect(readingOf(s.draft)).toBe('590');
    expect(s.version).toBe(7);
    expect(s.status.kind).toBe('saved');
    expect(s.leftOver).toEqual([{ what: 'reading', stepKey: 'measure', partId: R12, leg: null, mine: '572', theirs: '590' }]);
    s = autosaveReducer(s, { type: 'dismissLeftOver' });
    expect(s.leftOver).toBeNull();
  });

  it('"keep mine" sends my draft against their version, by choice only', () => {
    let s = initialAutosave(emptyDraft(), 5);
    s = autosaveReducer(s, { type: 'edited', draft: typed(s.draft, '571') });
    s = autosaveReducer(s, { type: 'sent' });
    s = autosaveReducer(s, { type: 'conflict', theirs: typed(emptyDraft(), '590'), version: 7 });
    s = autosaveReducer(s, { type: 'keepMine' });
    expect(nextSend(s)).toEqual({ draft: s.draft, version: 7 });
    expect(readingOf(s.draft)).toBe('571');
  });

  it('holds a refused draft until the next edit', () => {
    let s = initialAutosave(emptyDraft(), 1);
    s = autosaveReducer(s, { type: 'edited', draft: typed(s.draft, 'x'.repeat(5000)) });
    s = autosaveReducer(s, { type: 'sent' });
    s = autosaveReducer(s, { type: 'refused', message: 'too long' });
    expect(s.status).toEqual({ kind: 'refused', message: 'too long' });
    expect(nextSend(s)).toBeNull();
    s = autosaveReducer(s, { type: 'edited', draft: typed(s.draft, '570') });
    expect(nextSend(s)).not.toBeNull();
  });

  it('ignores a result that answers no request', () => {
    const s: AutosaveState = initialAutosave(emptyDraft(), 1);
    expect(autosaveReducer(s, { type: 'saved', version: 9, at: 'x' })).toBe(s);
    expect(autosaveReducer(s, { type: 'unreachable', reason: 'offline' })).toBe(s);
  });

  it('backs off from 2 s to at most 30 s', () => {
    expect([1, 2, 3, 4, 5, 9].map(retryDelayMs)).toEqual([2000, 4000, 8000, 16000, 30000, 30000]);
  });
});

describe('createAutosave', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  function harness(outcomes: SaveOutcome[]) {
    const sent: { text: string | undefined; version: number }[] = [];
    const save = vi.fn(async (draft: BenchJobDraft, version: number) => {
      sent.push({ text: readingOf(draft), version });
      return outcomes.shift() ?? { kind: 'saved' as const, version: version + 1, at: '2027-01-05T10:42:00Z' };
    });
    const autosave = createAutosave(initialAutosave(emptyDraft(), 1), { save, debounceMs: 800 });
    return { autosave, save, sent };
  }

  it('sends once, 800 ms after the last keystroke', async () => {
    const { autosave, sent } = harness([]);
    for (const text of ['5', '57', '570']) {
      autosave.edit(typed(autosave.getState().draft, text));
      await vi.advanceTimersByTimeAsync(300);
    }
    expect(sent).toEqual([]);
    await vi.advanceTimersByTimeAsync(600);
    expect(sent).toEqual([{ text: '570', version: 1 }]);
    expect(autosave.getState().status.kind).toBe('saved');
  });

  it('retries an offline save on its own with back-off, then succeeds', async () => {
    const { autosave, sent } = harness([{ kind: 'unreachable', reason: 'offline' }]);
    autosave.edit(typed(autosave.getState().draft, '570'));
    await vi.advanceTimersByTimeAsync(800);
    expect(autosave.getState().status).toEqual({ kind: 'retrying', attempt: 1, reason: 'offline' });
    await vi.advanceTimersByTimeAsync(1999);
    expect(sent).toHaveLength(1);
    await vi.advanceTimersByTimeAsync(1);
    expect(sent).toHaveLength(2);
    expect(autosave.getState().status.kind).toBe('saved');
  });

  it('does not retry after a conflict; flush reports it cannot finish', async () => {
    const { autosave, sent } = harness([{ kind: 'conflict', theirs: typed(emptyDraft(), '590'), version: 4 }]);
    autosave.edit(typed(autosave.getState().draft, '570'));
    await vi.advanceTimersByTimeAsync(800);
    expect(autosave.getState().status.kind).toBe('conflict');
    await vi.advanceTimersByTimeAsync(60_000);
    expect(sent).toHaveLength(1);
    await expect(autosave.flush()).resolves.toBe(false);
  });

  it('flush sends pending typing at once and resolves when the server holds it', async () => {
    const { autosave, sent } = harness([]);
    autosave.edit(typed(autosave.getState().draft, '570'));
    await expect(autosave.flush()).resolves.toBe(true);
    expect(sent).toEqual([{ text: '570', version: 1 }]);
    expect(autosave.getState().version).toBe(2);
  });
});
