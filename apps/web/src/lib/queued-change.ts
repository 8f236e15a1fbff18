// A change the technician made on the phone, queued until it reaches the office: what it is (kind and payload), the
// key that makes a repeat harmless (Idempotency-Key, made when it was queued), the version it was based on, and the
// words that name it in the "not sent yet" list. Pure: no React, no network — the queue itself is in
// api/technician-changes.ts.
import type { CallState } from '@bumperline/contracts/call-vocabulary';
import type { MeterKind } from '@bumperline/contracts/care-vocabulary';

/** What the list says about a change: "Done: Monthly clean" at "Lucky Star Tavern". */
export interface ChangeLabel {
  what: string;
  where: string;
}

interface Base {
  /** The Idempotency-Key: made once when queued, sent with every attempt. */
  key: string;
  queuedAt: string;
  label: ChangeLabel;
}

export type QueuedChange = Base &
  (
    | {
        kind: 'work-order-done';
        workOrderId: string;
        version: number;
        labourMinutes: number;
        note: string;
        readings: { meter: MeterKind; reading: number; rolledOver: boolean }[];
      }
    | { kind: 'work-order-skip'; workOrderId: string; version: number; reason: string }
    | { kind: 'work-order-move'; workOrderId: string; version: number; plannedOn: string }
    | { kind: 'parts-used'; on: 'work-order' | 'call'; id: string; cataloguePartId: string; quantity: number }
    | { kind: 'meter-reading'; gameId: string; meter: MeterKind; reading: number; rolledOver: boolean }
    | { kind: 'call-transition'; callId: string; version: number; to: CallState; note?: string }
    | { kind: 'call-note'; callId: string; note: string }
    /** A photo of the game; the picture itself waits in IndexedDB under `photoKey` (lib/queued-photos.ts). */
    | { kind: 'call-photo'; callId: string; photoKey: string }
  );

export type ChangeKind = QueuedChange['kind'];
export type ChangeOf<K extends ChangeKind> = Extract<QueuedChange, { kind: K }>;
/** What a screen hands the queue; the key and the time are added when it is queued. */
export type NewChange = QueuedChange extends infer C ? (C extends QueuedChange ? Omit<C, 'key' | 'queuedAt'> : never) : never;

export function queueChange(change: NewChange, now = new Date(), makeKey: () => string = () => crypto.randomUUID()): QueuedChange {
  return { ...change, key: makeKey(), queuedAt: now.toISOString() } as QueuedChange;
}

/** The record a change is about, with its version, when it has one (changes to it are refused on a stale version). */
export function versionedTarget(change: QueuedChange): { id: string; version: number } | undefined {
  switch (change.kind) {
    case 'work-order-done':
    case 'work-order-skip':
    case 'work-order-move':
      return { id: change.workOrderId, version: change.version };
    case 'call-transition':
      return { id: change.callId, version: change.version };
    default:
      return undefined;
  }
}

/** The same change based on another version (the office's, after a conflict the technician chose to override). */
export function rebased<C extends QueuedChange>(change: C, version: number): C {
  return versionedTarget(change) ? { ...change, version } : change;
}

/**
 * Versions the phone's own earlier changes moved a record to: record id → (version sent → version it became).
 * A later change queued against the version before our own change is ours to follow, not a conflict with the office.
 */
export type OwnVersions = Map<string, Map<number, number>>;

export function noteOwnChange(own: OwnVersions, id: string, from: number, to: number): void {
  const steps = own.get(id) ?? new Map<number, number>();
  steps.set(from, to);
  own.set(id, steps);
}

/** The change with its version moved past the phone's own earlier changes to the same record (never past the office's). */
export function followOwnChanges<C extends QueuedChange>(change: C, own: OwnVersions): C {
  const target = versionedTarget(change);
  const steps = target && own.get(target.id);
  if (!target || !steps) return change;
  let version = target.version;
  const seen = new Set<number>();
  while (steps.has(version) && !seen.has(version)) {
    seen.add(version);
    version = steps.get(version)!;
  }
  return rebased(change, version);
}

/** What a failed attempt means for the change. */
export type FailureDecision =
  /** No answer (offline, dropped connection, server unreachable): keep it queued and try again. */
  | { action: 'retry' }
  /** The office changed the record meanwhile: show both and let the technician send theirs again or drop it. */
  | { action: 'conflict'; message: string; current: unknown; currentVersion: number | null }
  /** Refused for good (bad input, no longer allowed, gone): show why; the technician drops it or re-enters it. */
  | { action: 'refused'; message: string };

export interface FailureFacts {
  status: number;
  message: string;
  current?: unknown;
}

export function decideAfterFailure(failure: FailureFacts): FailureDecision {
  // 0: no answer; 5xx and 408/429: the server could not take it now. Both can succeed later unchanged.
  if (failure.status === 0 || failure.status >= 500 || failure.status === 408 || failure.status === 429) return { action: 'retry' };
  if (failure.status === 409 && failure.current && typeof failure.current === 'object') {
    const v = (failure.current as { version?: unknown }).version;
    return { action: 'conflict', message: failure.message, current: failure.current, currentVersion: typeof v === 'number' ? v : null };
  }
  return { action: 'refused', message: failure.message };
}

/** "queued 10:42" in the company's time zone. */
export function queuedAtText(change: Pick<QueuedChange, 'queuedAt'>, locale: string, timeZone: string): string {
  return new Intl.DateTimeFormat(locale, { hour: '2-digit', minute: '2-digit', hour12: false, timeZone }).format(new Date(change.queuedAt));
}

/** The line in the "not sent yet" list: "Done: Monthly clean — Lucky Star Tavern". */
export function changeLine(change: Pick<QueuedChange, 'label'>): string {
  return change.label.where ? `${change.label.what} — ${change.label.where}` : change.label.what;
}

/** Changes in the order they must reach the office: the order they were queued in. */
export function inQueueOrder<C extends Pick<QueuedChange, 'queuedAt'>>(changes: readonly C[]): C[] {
  return [...changes].sort((a, b) => a.queuedAt.localeCompare(b.queuedAt));
}
