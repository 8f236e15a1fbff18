// Queued changes the office turned down, kept until the technician decides: a conflict (the office changed the
// record meanwhile) waits for "Send mine again" or "Drop mine"; a refusal shows its reason. Nothing leaves this list
// by itself. The offline store saves it with the rest of the phone's state.
import { useSyncExternalStore } from 'react';
import type { FailureDecision, QueuedChange } from './queued-change.ts';

export type FailedChange = {
  change: QueuedChange;
  failedAt: string;
} & Exclude<FailureDecision, { action: 'retry' }>;

let failed: readonly FailedChange[] = [];
const listeners = new Set<() => void>();

function publish(next: readonly FailedChange[]) {
  failed = next;
  for (const l of listeners) l();
}

export const failedChanges = {
  all: (): readonly FailedChange[] => failed,
  add(entry: FailedChange) {
    publish([...failed.filter((f) => f.change.key !== entry.change.key), entry]);
  },
  remove(key: string) {
    publish(failed.filter((f) => f.change.key !== key));
  },
  replaceAll(entries: readonly FailedChange[]) {
    publish(entries);
  },
  subscribe(listener: () => void): () => void {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
};

export function useFailedChanges(): readonly FailedChange[] {
  return useSyncExternalStore(failedChanges.subscribe, failedChanges.all, failedChanges.all);
}
