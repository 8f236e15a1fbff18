// The job screen's autosave, wired to the API: PUT the draft with its version after a pause in typing, retry
// when the connection comes back, stop on a 409 until the technician chooses (autosave.ts decides every move).
import { useEffect, useState, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { BenchJob } from '@bumperline/contracts/bench-jobs';
import { rememberSavedDraft, saveBenchDraft } from '../../api/bench-jobs.ts';
import { ApiError } from '../../lib/api-client.ts';
import { createAutosave, initialAutosave, type Autosave, type SaveOutcome } from './autosave.ts';

async function saveOutcome(jobId: string, draft: BenchJob['draft'], version: number): Promise<SaveOutcome> {
  try {
    const saved = await saveBenchDraft(jobId, version, draft);
    return { kind: 'saved', version: saved.version, at: saved.savedAt };
  } catch (err) {
    if (!(err instanceof ApiError)) return { kind: 'unreachable', reason: 'server' };
    if (err.status === 0) return { kind: 'unreachable', reason: 'offline' };
    if (err.status === 409) {
      const current = err.problem.current as Partial<BenchJob> | undefined;
      if (current?.draft && typeof current.version === 'number')
        return { kind: 'conflict', theirs: current.draft, version: current.version };
      // A conflict without the job as it now is (finished elsewhere, say): read it.
      return { kind: 'refused', message: err.message };
    }
    if (err.status >= 500 || err.status === 429) return { kind: 'unreachable', reason: 'server' };
    const fields = (err.problem.errors ?? []).map((e) => `${e.field} ${e.message}`).join('; ');
    return { kind: 'refused', message: fields || err.message };
  }
}

export function useAutosave(job: BenchJob): Autosave {
  const qc = useQueryClient();
  // One controller per job screen; a new job id (navigating between jobs) makes a new one.
  const [autosave] = useState(() =>
    createAutosave(initialAutosave(job.draft, job.version, job.updatedAt), {
      save: async (draft, version) => {
        const outcome = await saveOutcome(job.id, draft, version);
        if (outcome.kind === 'saved') rememberSavedDraft(qc, job.id, draft, { version: outcome.version, savedAt: outcome.at });
        return outcome;
      },
    }),
  );

  useEffect(() => {
    const online = () => autosave.retryNow();
    window.addEventListener('online', online);
    // Leaving the page with unsent typing: the browser asks first.
    const beforeUnload = (e: BeforeUnloadEvent) => {
      const s = autosave.getState();
      if (s.draft !== s.base) e.preventDefault();
    };
    window.addEventListener('beforeunload', beforeUnload);
    // A phone switching apps or locking may never come back to this page: send now rather than after the pause.
    const hidden = () => {
      if (document.visibilityState === 'hidden') autosave.retryNow();
    };
    document.addEventListener('visibilitychange', hidden);
    return () => {
      window.removeEventListener('online', online);
      window.removeEventListener('beforeunload', beforeUnload);
      document.removeEventListener('visibilitychange', hidden);
    };
  }, [autosave]);

  // Leaving the screen inside the app: send what is unsent now. A save that cannot get through keeps retrying
  // after the screen is gone, so no keystroke is lost to a dead spot in the workshop.
  useEffect(
    () => () => {
      void autosave.flush();
    },
    [autosave],
  );

  return autosave;
}

export function useAutosaveState(autosave: Autosave) {
  return useSyncExternalStore(autosave.subscribe, autosave.getState);
}
