import { describe, expect, it } from 'vitest';
import { formatDuration } from './target-clock.tsx';

describe('formatDuration', () => {
  it('reads as minutes, then hours and minutes, then days and hours', () => {
    expect(formatDuration(59 * 60_000)).toBe('59 min');
    expect(formatDuration((2 * 60 + 5) * 60_000)).toBe('2 h 5 min');
    expect(formatDuration(50 * 3600_000)).toBe('2 d 2 h');
    expect(formatDuration(-5)).toBe('0 min');
  });
});
