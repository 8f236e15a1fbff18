// The demo's developer pages show every e-mail and text the app sent (sign-in links among them), so they
// answer only a browser on this machine: the connection must come from loopback and must not have passed
// through a proxy (a proxy on this machine would make every visitor look local).
import type { RequestHandler } from 'express';
import { NotFoundError } from './errors.ts';

const LOOPBACK = /^(127\.\d+\.\d+\.\d+|::1|::ffff:127\.\d+\.\d+\.\d+)$/;

export function isLoopback(address: string | undefined): boolean {
  return !!address && LOOPBACK.test(address);
}

export const loopbackOnly: RequestHandler = (req, _res, next) => {
  const proxied = req.headers['x-forwarded-for'] !== undefined || req.headers.forwarded !== undefined;
  // Not found rather than forbidden: from outside, these pages do not exist.
  if (proxied || !isLoopback(req.socket.remoteAddress)) throw new NotFoundError();
  next();
};
