// On every request: who is signed in, in which company, with which role — read from the database,
// never trusted from the token. One cookie decryption with a key derived at start-up, then one statement.
import type { RequestHandler } from 'express';
import type { Db } from '@bumperline/db/client';
import { loadSessionActor } from '@bumperline/db/queries/identity';
import { UUID } from '../http/params.ts';
import type { SessionCookieReader } from './session-cookie.ts';
import '../http/context.ts';

export function loadActor(db: Db, cookies: SessionCookieReader): RequestHandler {
  return async (req, _res, next) => {
    const sid = await cookies.sessionId(req.headers.cookie);
    if (!sid || !UUID.test(sid)) return next();
    const actor = await loadSessionActor(db, sid);
    if (actor) req.actor = actor;
    next();
  };
}
