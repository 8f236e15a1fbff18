import { describe, expect, it } from 'vitest';
import { SignInLimiter } from './sign-in-limiter.ts';

describe('SignInLimiter', () => {
  it('refuses the attempt after the limit within the window, per e-mail and address', () => {
    const l = new SignInLimiter(3, 1000);
    expect([1, 2, 3].map(() => l.allow('a@x', '1', 0))).toEqual([true, true, true]);
    expect(l.allow('a@x', '1', 10)).toBe(false);
    expect(l.allow('b@x', '1', 10)).toBe(true);
    expect(l.allow('a@x', '2', 10)).toBe(true);
  });
  it('forgets attempts older than the window and after a success', () => {
    const l = new SignInLimiter(1, 1000);
    expect(l.allow('a@x', '1', 0)).toBe(true);
    expect(l.allow('a@x', '1', 500)).toBe(false);
    expect(l.allow('a@x', '1', 1500)).toBe(true);
    l.reset('a@x', '1');
    expect(l.allow('a@x', '1', 1600)).toBe(true);
  });
});
