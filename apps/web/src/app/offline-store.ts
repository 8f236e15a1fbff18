// The phone's own copy of what a technician needs without signal (lib/offline-set.ts), their queued changes and the
// ones the office turned down, in IndexedDB under the signed-in person's id. Restored before the first screen, saved
// shortly after every change to the cache. Another person's copy is never restored; signing out or switching company
// deletes it.
import { dehydrate, hydrate, onlineManager, type DehydratedState, type QueryClient } from '@tanstack/react-query';
import { createStore, del, get, set, type UseStore } from 'idb-keyval';
import type { Me } from '@bumperline/contracts/auth';
import { isQueuedChange, registerTechnicianChanges } from '../api/technician-changes.ts';
import { failedChanges, type FailedChange } from '../lib/failed-changes.ts';
import { forgetQueuedPhotos } from '../lib/queued-photos.ts';
import { isOfflineQueryKey, offlineKeyPrefixes } from '../lib/offline-set.ts';

/** Changing what is saved (or its shape) means older copies are not read. */
const FORMAT = 1;
/** A kept answer older than this is not shown (queued changes are kept however old: they are never dropped silently). */
const KEEP_ANSWERS_MS = 7 * 24 * 60 * 60 * 1000;
/** Whose copy the phone holds: restored at start, before anyone has been asked who is signed in. */
const OWNER_KEY = 'bumperline-offline-owner';
const SAVE_AFTER_MS = 200;

interface Owner {
  userId: string;
  tenantId: string;
}

interface SavedCopy extends Owner {
  format: typeof FORMAT;
  savedAt: number;
  state: DehydratedState;
  failed: readonly FailedChange[];
}

let store: UseStore | undefined;
const idb = () => (store ??= createStore('bumperline-offline', 'copies'));

function readOwner(): Owner | undefined {
  try {
    const raw = localStorage.getItem(OWNER_KEY);
    const owner = raw ? (JSON.parse(raw) as Partial<Owner>) : undefined;
    return owner?.userId && owner.tenantId ? { userId: owner.userId, tenantId: owner.tenantId } : undefined;
  } catch {
    return undefined;
  }
}

function ownerOf(me: Me | null | undefined): Owner | undefined {
  return me?.user && me.company ? { userId: me.user.id, tenantId: me.company.id } : undefined;
}

const sameOwner = (a: Owner | undefined, b: Owner | undefined) => !!a && !!b && a.userId === b.userId && a.tenantId === b.tenantId;

/** The state worth keeping: the offline set's answers and the queued changes, without error objects (not storable). */
function snapshot(qc: QueryClient): DehydratedState {
  const state = dehydrate(qc, {
    shouldDehydrateQuery: (q) => q.state.status === 'success' && isOfflineQueryKey(q.queryKey),
    shouldDehydrateMutation: isQueuedChange,
  });
  return {
    queries: state.queries.map((q) => ({ ...q, state: { ...q.state, error: null, fetchFailureReason: null, fetchStatus: 'idle' } })),
    mutations: state.mutations.map((m) => ({ ...m, state: { ...m.state, error: null, failureReason: null } })),
  };
}

async function restore(qc: QueryClient): Promise<void> {
  const owner = readOwner();
  if (!owner) return;
  const saved = await get<SavedCopy>(owner.userId, idb());
  if (!saved || saved.format !== FORMAT || !sameOwner(saved, owner)) return;
  const now = Date.now();
  hydrate(qc, { ...saved.state, queries: saved.state.queries.filter((q) => now - q.state.dataUpdatedAt < KEEP_ANSWERS_MS) });
  failedChanges.replaceAll(saved.failed);
}

/** Deletes the signed-in person's copy (sign-out, company switch) and forgets whose it was. */
export async function forgetOfflineCopy(): Promise<void> {
  const owner = readOwner();
  localStorage.removeItem(OWNER_KEY);
  failedChanges.replaceAll([]);
  if (owner) await del(owner.userId, idb()).catch(() => undefined);
  await forgetQueuedPhotos();
}

/**
 * Someone else (or the same person in another company) is signed in now: what the phone held is not theirs. It
 * leaves the screen and the queue; the earlier person's saved copy stays under their own id, untouched.
 */
function handOver(qc: QueryClient, to: Owner) {
  qc.getMutationCache()
    .getAll()
    .filter(isQueuedChange)
    .forEach((m) => qc.getMutationCache().remove(m));
  qc.removeQueries({ predicate: (q) => q.queryKey[0] !== 'me' && isOfflineQueryKey(q.queryKey) });
  failedChanges.replaceAll([]);
  localStorage.setItem(OWNER_KEY, JSON.stringify(to));
}

function save(qc: QueryClient): Promise<void> {
  const owner = ownerOf(qc.getQueryData<Me | null>(['me']));
  if (!owner) return Promise.resolve();
  const previous = readOwner();
  if (!previous) localStorage.setItem(OWNER_KEY, JSON.stringify(owner));
  else if (!sameOwner(owner, previous)) handOver(qc, owner);
  const copy: SavedCopy = { format: FORMAT, ...owner, savedAt: Date.now(), state: snapshot(qc), failed: failedChanges.all() };
  return set(owner.userId, copy, idb());
}

/** Everything the phone's offline copy needs, before the first screen renders. Resolves even if IndexedDB fails. */
export async function startOfflineStore(qc: QueryClient): Promise<void> {
  // A kept answer must outlive the default five minutes without a screen, or it would vanish from the copy.
  for (const prefix of offlineKeyPrefixes) qc.setQueryDefaults([...prefix], { gcTime: KEEP_ANSWERS_MS });
  qc.setQueryDefaults(['games', 'list'], { gcTime: KEEP_ANSWERS_MS });
  registerTechnicianChanges(qc);
  // The cache only hears online/offline events; a page opened without signal must know it from the start, or it
  // would try (and fail) every queued change before pausing them.
  onlineManager.setOnline(navigator.onLine);
  await Promise.race([restore(qc).catch(() => undefined), new Promise((resolve) => setTimeout(resolve, 2_000))]);
  void qc.resumePausedMutations();

  let timer: ReturnType<typeof setTimeout> | undefined;
  const later = () => {
    clearTimeout(timer);
    timer = setTimeout(() => void save(qc).catch(() => undefined), SAVE_AFTER_MS);
  };
  qc.getQueryCache().subscribe((e) => {
    if (e.type === 'updated' || e.type === 'removed') later();
  });
  qc.getMutationCache().subscribe(later);
  failedChanges.subscribe(later);
}
