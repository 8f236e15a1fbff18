import { describe, expect, it } from 'vitest';
import { memoryCounter } from '../http/rate-limit-counter.ts';
import { SignInLimiter } from './sign-in-limiter.ts';

describe('SignInLimiter', () => {
  it('refuses the attempt after the limit within the window, per e-mail and address', async () => {
    let now = 0;
    const l = new SignInLimiter(
      memoryCounter(() => now),
      3,
      1000,
    );
    expect([await l.allow('a@x', '1'), await l.allow('a@x', '1'), await l.allow('a@x', '1')]).toEqual([true, true, true]);
    now = 10;
    expect(await l.allow('a@x', '1')).toBe(false);
    expect(await l.allow('b@x', '1')).toBe(true);
    expect(await l.allow('a@x', '2')).toBe(true);
  });
  it('starts again after the window and after a success', async () => {
    let now = 0;
    const l = new SignInLimiter(
      memoryCounter(() => now),
      1,
      1000,
    );
    expect(await l.allow('a@x', '1')).toBe(true);
    now = 500;
    expect(await l.allow('a@x', '1')).toBe(false);
    now = 1500;
    expect(await l.allow('a@x', '1')).toBe(true);
    await l.reset('a@x', '1');
    expect(await l.allow('a@x', '1')).toBe(true);
  });
});
