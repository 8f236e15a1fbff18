import { describe, expect, it } from 'vitest';
import {
  changeLine,
  decideAfterFailure,
  followOwnChanges,
  inQueueOrder,
  noteOwnChange,
  queueChange,
  rebased,
  type OwnVersions,
  type QueuedChange,
} from './queued-change.ts';

const label = { what: 'Done: Monthly clean', where: 'Lucky Star Tavern' };
const done = (version: number): QueuedChange =>
  queueChange(
    { kind: 'work-order-done', workOrderId: 'wo-1', version, labourMinutes: 45, note: '', readings: [], label },
    new Date('2026-12-03T16:42:00Z'),
    () => 'key-00000001',
  );

describe('queueChange', () => {
  it('gives each change its key and the time it was queued, once', () => {
    let n = 0;
    const make = () => `key-${++n}`.padEnd(12, '0');
    const a = queueChange({ kind: 'call-note', callId: 'c1', note: 'fuse F3 blown', label }, new Date('2026-12-03T10:00:00Z'), make);
    const b = queueChange({ kind: 'call-note', callId: 'c1', note: 'replaced', label }, new Date('2026-12-03T10:01:00Z'), make);
    expect(a.key).not.toBe(b.key);
    expect(a.queuedAt).toBe('2026-12-03T10:00:00.000Z');
  });
});

describe('inQueueOrder', () => {
  it('sends changes in the order they were queued, whatever order they are listed in', () => {
    const at = (iso: string, note: string) =>
      queueChange({ kind: 'call-note', callId: 'c', note, label }, new Date(iso), () => `key-${note}-000000`);
    const list = [at('2026-12-03T10:05:00Z', 'third'), at('2026-12-03T10:00:00Z', 'first'), at('2026-12-03T10:01:00Z', 'second')];
    expect(inQueueOrder(list).map((c) => (c as { note: string }).note)).toEqual(['first', 'second', 'third']);
  });
});

describe('decideAfterFailure', () => {
  it('keeps a change queued when there was no answer or the server could not take it', () => {
    for (const status of [0, 500, 502, 503, 408, 429]) expect(decideAfterFailure({ status, message: 'x' }).action).toBe('retry');
  });

  it('turns a 409 carrying the record as it now is into a conflict for the technician, with the version', () => {
    const current = { id: 'wo-1', version: 4, plannedOn: '2026-12-04' };
    expect(decideAfterFailure({ status: 409, message: 'changed', current })).toEqual({
      action: 'conflict',
      message: 'changed',
      current,
      currentVersion: 4,
    });
  });

  it('treats a 409 without the current record (done twice, not enough on the van) and other 4xx as refused', () => {
    expect(decideAfterFailure({ status: 409, message: 'only 3 on the van' })).toEqual({ action: 'refused', message: 'only 3 on the van' });
    expect(decideAfterFailure({ status: 400, message: 'bad' }).action).toBe('refused');
    expect(decideAfterFailure({ status: 404, message: 'gone' }).action).toBe('refused');
  });
});

describe('rebased', () => {
  it('moves a versioned change to the version the office has now, keeping its key', () => {
    const change = done(2);
    const again = rebased(change, 5);
    expect(again).toMatchObject({ version: 5, key: change.key, labourMinutes: 45 });
  });

  it('leaves a change without a version as it is', () => {
    const note = queueChange({ kind: 'call-note', callId: 'c', note: 'n', label });
    expect(rebased(note, 9)).toEqual(note);
  });
});

describe('followOwnChanges', () => {
  it("follows the phone's own earlier changes to the same record, step by step", () => {
    const own: OwnVersions = new Map();
    noteOwnChange(own, 'wo-1', 2, 3);
    noteOwnChange(own, 'wo-1', 3, 4);
    expect(followOwnChanges(done(2), own)).toMatchObject({ version: 4 });
  });

  it("never moves past a version the phone did not make (the office's change stays a conflict)", () => {
    const own: OwnVersions = new Map();
    noteOwnChange(own, 'wo-1', 2, 3);
    expect(followOwnChanges(done(5), own)).toMatchObject({ version: 5 });
    expect(followOwnChanges(done(2), new Map())).toMatchObject({ version: 2 });
  });

  it('stops on a loop instead of spinning', () => {
    const own: OwnVersions = new Map();
    noteOwnChange(own, 'wo-1', 2, 3);
    noteOwnChange(own, 'wo-1', 3, 2);
    expect([2, 3]).toContain(
      followOwnChanges(done(2), own).kind === 'work-order-done' ? (followOwnChanges(done(2), own) as { version: number }).version : -1,
    );
  });
});

describe('changeLine', () => {
  it('says what and where', () => {
    expect(changeLine(done(1))).toBe('Done: Monthly clean — Lucky Star Tavern');
    expect(changeLine({ label: { what: 'Plays meter read', where: '' } })).toBe('Plays meter read');
  });
});
