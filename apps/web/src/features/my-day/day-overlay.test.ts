import { describe, expect, it } from 'vitest';
import type { RouteStopItem } from '@bumperline/contracts/route-days';
import { queueChange } from '../../lib/queued-change.ts';
import { openCount, overlayStopItems } from './day-overlay.ts';

const game = { id: 'g1', serial: 'SN-1', modelTitle: 'Comet Rally' };
const item = (kind: RouteStopItem['kind'], id: string, state: string): RouteStopItem => ({
  kind,
  id,
  title: id,
  game,
  state,
  severity: null,
  onSiteMinutes: 30,
  version: 3,
  carriedOverFrom: null,
});
const label = { what: 'x', where: 'y' };

describe('overlayStopItems', () => {
  it('shows a work order done offline as done, a call moved on site as on site, and leaves the others as saved', () => {
    const items = [item('work_order', 'wo1', 'open'), item('service_call', 'c1', 'assigned'), item('work_order', 'wo2', 'open')];
    const pending = [
      queueChange({ kind: 'work-order-done', workOrderId: 'wo1', version: 3, labourMinutes: 45, note: '', readings: [], label }),
      queueChange({ kind: 'call-transition', callId: 'c1', version: 3, to: 'on_site', label }),
    ];
    const view = overlayStopItems(items, pending);
    expect(view.map((i) => [i.id, i.pendingState])).toEqual([
      ['wo1', 'done'],
      ['c1', 'on_site'],
      ['wo2', null],
    ]);
    expect(openCount(view)).toBe(2);
  });

  it('counts a skipped or moved work order as no longer to do here', () => {
    const items = [item('work_order', 'wo1', 'open'), item('work_order', 'wo2', 'open')];
    const view = overlayStopItems(items, [
      queueChange({ kind: 'work-order-skip', workOrderId: 'wo1', version: 3, reason: 'venue closed', label }),
      queueChange({ kind: 'work-order-move', workOrderId: 'wo2', version: 3, plannedOn: '2026-12-04', label }),
    ]);
    expect(view[1]!.pendingMoveTo).toBe('2026-12-04');
    expect(openCount(view)).toBe(0);
  });

  it('ignores changes to other records', () => {
    const view = overlayStopItems(
      [item('work_order', 'wo1', 'open')],
      [
        queueChange({ kind: 'work-order-done', workOrderId: 'other', version: 1, labourMinutes: 5, note: '', readings: [], label }),
        queueChange({ kind: 'call-note', callId: 'wo1', note: 'n', label }),
      ],
    );
    expect(view[0]!.pendingState).toBeNull();
    expect(openCount(view)).toBe(1);
  });
});
