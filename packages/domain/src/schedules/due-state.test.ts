import { describe, expect, it } from 'vitest';
import { moreUrgent } from './due-state.ts';

describe('moreUrgent', () => {
  it('orders overdue above due-soon above ok', () => {
    expect(moreUrgent('ok', 'due-soon')).toBe('due-soon');
    expect(moreUrgent('overdue', 'due-soon')).toBe('overdue');
    expect(moreUrgent('ok', 'ok')).toBe('ok');
  });
});
