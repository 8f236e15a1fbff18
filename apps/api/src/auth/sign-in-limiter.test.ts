import { describe, expect, it } from 'vitest';
import { memoryCounter } from '../http/rate-limit-counter.ts';
import { SignInLimiter } from './sign-in-limiter.ts';

const limits = { perAccount: 3, accountWindowMs: 1000, perAddress: 5, addressWindowMs: 1000 };

describe('SignInLimiter', () => {
  it('pauses an account after its limit of attempts from any mix of addresses', async () => {
    const l = new SignInLimiter(
      memoryCounter(() => 0),
      limits,
    );
    expect([await l.attempt('a@x', '1'), await l.attempt('a@x', '2'), await l.attempt('a@x', '3')]).toEqual([
      'allowed',
      'allowed',
      'allowed',
    ]);
    expect(await l.attempt('a@x', '4')).toBe('account-paused');
    expect(await l.attempt('b@x', '4')).toBe('allowed');
  });

  it('limits one address across accounts', async () => {
    const l = new SignInLimiter(
      memoryCounter(() => 0),
      limits,
    );
    for (const account of ['a@x', 'b@x', 'c@x', 'd@x', 'e@x']) expect(await l.attempt(account, '9')).toBe('allowed');
    expect(await l.attempt('f@x', '9')).toBe('too-many-attempts');
    expect(await l.attempt('f@x', '8')).toBe('allowed');
  });

  it('does not count an attempt refused for its address against the account', async () => {
    const l = new SignInLimiter(
      memoryCounter(() => 0),
      { ...limits, perAddress: 1 },
    );
    expect(await l.attempt('a@x', '9')).toBe('allowed');
    for (let i = 0; i < 5; i++) expect(await l.attempt('owner@x', '9')).toBe('too-many-attempts');
    expect(await l.attempt('owner@x', '8')).toBe('allowed');
  });

  it('forgets a success: the address counts only failures, the account starts again', async () => {
    const l = new SignInLimiter(
      memoryCounter(() => 0),
      limits,
    );
    for (let i = 0; i < 10; i++) {
      expect(await l.attempt('a@x', '1')).toBe('allowed');
      await l.succeeded('a@x', '1');
    }
    expect(await l.attempt('b@x', '1')).toBe('allowed');
  });

  it('lifts an account pause when the person proves the address, and after the window', async () => {
    let now = 0;
    const l = new SignInLimiter(
      memoryCounter(() => now),
      limits,
    );
    for (let i = 0; i < 3; i++) await l.attempt('a@x', String(i));
    expect(await l.attempt('a@x', '7')).toBe('account-paused');
    await l.addressProven('a@x');
    expect(await l.attempt('a@x', '7')).toBe('allowed');
    for (let i = 0; i < 3; i++) await l.attempt('a@x', String(i));
    expect(await l.attempt('a@x', '7')).toBe('account-paused');
    now = 1500;
    expect(await l.attempt('a@x', '7')).toBe('allowed');
  });
});
