import { describe, expect, it } from 'vitest';
import { isOfflineQueryKey } from './offline-set.ts';

describe('isOfflineQueryKey', () => {
  it.each([
    [['me']],
    [['route-days', 'my-day', '']],
    [['route-days', 'my-day', '2026-12-03']],
    [['games', 'detail', 'g1']],
    [['games', 'list', { venueId: 'v1', sort: 'title' }]],
    [['boards', 'game', 'g1']],
    [['parts-lists', 'board', 'b1']],
    [['work-orders', 'detail', 'w1']],
    [['stock', 'my-van']],
  ])('keeps the technician offline set: %j', (key) => {
    expect(isOfflineQueryKey(key)).toBe(true);
  });

  it.each([
    [['route-days', 'board', '2026-12-03']],
    [['route-days', 'day', 'tech-2', '2026-12-03']],
    [['games', 'list', { sort: 'title' }]],
    [['games', 'summary']],
    [['calls', 'list', {}]],
    [['team']],
    [['activity']],
    [['parts-lists', 'overview']],
    [['mine']],
    [[]],
  ])("never writes the office's lists or another technician's day to the phone: %j", (key) => {
    expect(isOfflineQueryKey(key)).toBe(false);
  });
});
