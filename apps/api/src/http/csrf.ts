// Auth.js guards only its own POSTs. Our state-changing API routes also refuse cross-site requests:
// SameSite=Lax cookies, plus this check that the Origin (when sent) is our own and that a custom
// header is present, which a cross-site form cannot add without a CORS preflight we never grant.
import type { RequestHandler } from 'express';
import { HttpError } from './errors.ts';

export const CSRF_HEADER = 'x-requested-with';

/** The host of an http(s) Origin header; undefined for "null" or anything that is not such a URL. */
export function hostOf(origin: string): string | undefined {
  if (!URL.canParse(origin)) return undefined;
  const url = new URL(origin);
  return url.protocol === 'http:' || url.protocol === 'https:' ? url.host : undefined;
}

export function csrfGuard(appOrigin: string): RequestHandler {
  const allowed = new Set([new URL(appOrigin).origin]);
  return (req, _res, next) => {
    if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return next();
    const origin = req.headers.origin;
    // "null" (sandboxed frames, file: pages) and anything that is not a URL are not our origin either.
    const host = origin === undefined ? undefined : hostOf(origin);
    const sameHost = host !== undefined && !!req.headers.host && host === req.headers.host;
    if (origin !== undefined && !allowed.has(origin) && !sameHost) {
      throw new HttpError(
        403,
        'Cross-site request refused',
        'This request came from another site.',
        [{ field: 'header:origin', message: 'is not this site' }],
        'csrf',
      );
    }
    if (req.headers[CSRF_HEADER] !== 'bumperline') {
      throw new HttpError(
        403,
        'Missing request header',
        `State-changing requests must send the header X-Requested-With: bumperline.`,
        [{ field: 'header:x-requested-with', message: 'is required' }],
        'csrf',
      );
    }
    next();
  };
}
