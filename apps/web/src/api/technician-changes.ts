// The technician's queued changes: each kind's request is registered once as mutation defaults (by mutation key), so
// a change queued offline and restored after a reload still knows how to send itself. They go out one at a time in
// the order they were queued (one scope), each with the Idempotency-Key made when it was queued, so a repeat over a
// flaky connection is applied once. A refusal moves the change to the failed list (lib/failed-changes.ts) for the
// technician to decide on; no answer at all keeps it queued.
import { MutationObserver, useMutationState, useQueryClient, type Mutation, type QueryClient } from '@tanstack/react-query';
import { ApiError, api } from '../lib/api-client.ts';
import { failedChanges } from '../lib/failed-changes.ts';
import { dropQueuedPhoto, readQueuedPhoto } from '../lib/queued-photos.ts';
import {
  decideAfterFailure,
  followOwnChanges,
  inQueueOrder,
  noteOwnChange,
  queueChange,
  rebased,
  versionedTarget,
  type ChangeKind,
  type NewChange,
  type OwnVersions,
  type QueuedChange,
} from '../lib/queued-change.ts';

export const CHANGES_SCOPE = 'technician-changes';
export const changeKeys = {
  all: ['technician-changes'] as const,
  kind: (kind: ChangeKind) => ['technician-changes', kind] as const,
};

const changeKinds: readonly ChangeKind[] = [
  'work-order-done',
  'work-order-skip',
  'work-order-move',
  'parts-used',
  'meter-reading',
  'call-transition',
  'call-note',
  'call-photo',
];

/** The request each kind makes (the endpoints of work orders, parts used, meters and calls). */
function requestFor(c: QueuedChange): { path: string; body: unknown } {
  switch (c.kind) {
    case 'work-order-done':
      return {
        path: `/api/work-orders/${c.workOrderId}/done`,
        body: { version: c.version, labourMinutes: c.labourMinutes, note: c.note, readings: c.readings },
      };
    case 'work-order-skip':
      return { path: `/api/work-orders/${c.workOrderId}/skip`, body: { version: c.version, reason: c.reason } };
    case 'work-order-move':
      return { path: `/api/work-orders/${c.workOrderId}/move`, body: { version: c.version, plannedOn: c.plannedOn } };
    case 'parts-used':
      return {
        path: `/api/${c.on === 'call' ? 'calls' : 'work-orders'}/${c.id}/parts-used`,
        body: { cataloguePartId: c.cataloguePartId, quantity: c.quantity },
      };
    case 'meter-reading':
      return { path: `/api/games/${c.gameId}/meter-readings`, body: { meter: c.meter, reading: c.reading, rolledOver: c.rolledOver } };
    case 'call-transition':
      return {
        path: `/api/calls/${c.callId}/transition`,
        body: { to: c.to, version: c.version, ...(c.note ? { note: c.note } : {}) },
      };
    case 'call-note':
      return { path: `/api/calls/${c.callId}/notes`, body: { note: c.note } };
    case 'call-photo':
      // The picture is read from IndexedDB at send time (photoForm).
      return { path: `/api/calls/${c.callId}/photos`, body: undefined };
  }
}

/** The queued photo as the form the API takes; gone from this phone (storage cleared) is a refusal, not a retry. */
async function photoForm(photoKey: string): Promise<FormData> {
  const photo = await readQueuedPhoto(photoKey);
  if (!photo) {
    throw new ApiError({
      type: 'about:blank',
      title: 'Photo not on this phone',
      status: 410,
      detail: 'The photo is no longer on this phone.',
    });
  }
  const form = new FormData();
  form.append('photo', photo, 'photo.jpg');
  return form;
}

/** Versions this phone's own changes moved records to, so a second change to the same record follows the first. */
const ownVersions: OwnVersions = new Map();

export async function sendChange(change: QueuedChange): Promise<unknown> {
  const c = followOwnChanges(change, ownVersions);
  const { path, body } = requestFor(c);
  const sent = c.kind === 'call-photo' ? await photoForm(c.photoKey) : body;
  const answer = await api<unknown>('POST', path, { body: sent, headers: { 'Idempotency-Key': c.key } });
  if (c.kind === 'call-photo') await dropQueuedPhoto(c.photoKey);
  const target = versionedTarget(c);
  const version = (answer as { version?: unknown } | undefined)?.version;
  if (target && typeof version === 'number') noteOwnChange(ownVersions, target.id, target.version, version);
  return answer;
}

function failureOf(error: unknown) {
  if (error instanceof ApiError) {
    const fields = (error.problem.errors ?? []).map((e) => `${e.field} ${e.message}`).join('; ');
    return decideAfterFailure({ status: error.status, message: fields || error.message, current: error.problem.current });
  }
  return decideAfterFailure({ status: 0, message: String(error) });
}

/** The screens' data the changes touch: the day, its work orders and calls, the van, the games' meters. */
const touched = [['route-days'], ['work-orders'], ['calls'], ['stock'], ['parts-used'], ['meters'], ['games']] as const;

/** Registers every kind's request and behaviour; must run before queued changes are restored. */
export function registerTechnicianChanges(qc: QueryClient): void {
  for (const kind of changeKinds) {
    qc.setMutationDefaults(changeKeys.kind(kind), {
      mutationFn: (change: QueuedChange) => sendChange(change),
      scope: { id: CHANGES_SCOPE },
      networkMode: 'online',
      // No answer: try again (paused while offline) — the key makes a repeat harmless. A refusal is for the technician.
      retry: (_count, error) => failureOf(error).action === 'retry',
      retryDelay: (attempt) => Math.min(30_000, 1_000 * 2 ** attempt),
      onError: (error, change: QueuedChange) => {
        const decision = failureOf(error);
        if (decision.action !== 'retry') failedChanges.add({ ...decision, change, failedAt: new Date().toISOString() });
      },
      onSuccess: () => Promise.all(touched.map((queryKey) => qc.invalidateQueries({ queryKey: [...queryKey] }))),
    });
  }
}

/** Queues a change (sent now when online, later when not) and returns it with its key. */
export function enqueueChange(qc: QueryClient, change: NewChange | QueuedChange): QueuedChange {
  const queued = 'key' in change ? change : queueChange(change);
  const observer = new MutationObserver<unknown, unknown, QueuedChange>(qc, { mutationKey: changeKeys.kind(queued.kind) });
  // Failures are handled by the defaults (failed list or retry); nothing for the caller to catch.
  observer.mutate(queued).catch(() => undefined);
  return queued;
}

export function useEnqueueChange(): (change: NewChange) => QueuedChange {
  const qc = useQueryClient();
  return (change) => enqueueChange(qc, change);
}

/** The technician drops a change the office refused (and the photo it would have sent). */
export function dropChange(change: QueuedChange): void {
  failedChanges.remove(change.key);
  if (change.kind === 'call-photo') void dropQueuedPhoto(change.photoKey);
}

/** Sends a change the office refused again, based on the version it has now (same key: the refusal was not kept). */
export function sendAgain(qc: QueryClient, change: QueuedChange, currentVersion: number | null): void {
  failedChanges.remove(change.key);
  enqueueChange(qc, currentVersion === null ? change : rebased(change, currentVersion));
}

export interface PendingChange {
  change: QueuedChange;
  /** Waiting for a connection (not being sent right now). */
  paused: boolean;
  attempts: number;
}

const isPending = (m: Mutation) => m.state.status === 'pending';

/** Changes not yet answered by the office, in the order they will be sent. */
export function usePendingChanges(): PendingChange[] {
  const rows = useMutationState({
    filters: { mutationKey: changeKeys.all, predicate: isPending },
    select: (m): PendingChange => ({
      change: m.state.variables as QueuedChange,
      paused: m.state.isPaused,
      attempts: m.state.failureCount,
    }),
  });
  return inQueueOrder(rows.map((r) => ({ ...r, queuedAt: r.change.queuedAt }))).map(({ change, paused, attempts }) => ({
    change,
    paused,
    attempts,
  }));
}

/** Whether a change is one of the technician's queued changes (for the offline store's filter). */
export const isQueuedChange = (m: Mutation) => m.options.mutationKey?.[0] === changeKeys.all[0] && isPending(m);
