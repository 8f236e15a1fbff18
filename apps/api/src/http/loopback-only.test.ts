import type { Request, Response } from 'express';
import { describe, expect, it } from 'vitest';
import { NotFoundError } from './errors.ts';
import { isLoopback, loopbackOnly } from './loopback-only.ts';

const request = (remoteAddress: string, headers: Record<string, string> = {}) =>
  ({ socket: { remoteAddress }, headers }) as unknown as Request;
const passes = (req: Request) => {
  let passed = false;
  void loopbackOnly(req, {} as Response, () => {
    passed = true;
  });
  return passed;
};

describe('loopbackOnly', () => {
  it('lets a browser on this machine through', () => {
    expect(passes(request('127.0.0.1'))).toBe(true);
    expect(passes(request('::1'))).toBe(true);
    expect(passes(request('::ffff:127.0.0.1'))).toBe(true);
  });

  it('answers anyone else, or anything through a proxy, as not found', () => {
    expect(() => passes(request('203.0.113.7'))).toThrow(NotFoundError);
    expect(() => passes(request('::ffff:10.0.0.2'))).toThrow(NotFoundError);
    expect(() => passes(request('127.0.0.1', { 'x-forwarded-for': '198.51.100.4' }))).toThrow(NotFoundError);
    expect(() => passes(request('127.0.0.1', { forwarded: 'for=198.51.100.4' }))).toThrow(NotFoundError);
    expect(isLoopback(undefined)).toBe(false);
  });
});
