// On every request: who is signed in, in which company, with which role — read from the database,
// never trusted from the token.
import type { RequestHandler } from 'express';
import { getSession, type ExpressAuthConfig } from '@auth/express';
import type { Db } from '@bumperline/db/client';
import { listCompaniesOf, loadSession } from '@bumperline/db/queries/identity';
import '../http/context.ts';

export function loadActor(db: Db, authConfig: ExpressAuthConfig): RequestHandler {
  return async (req, _res, next) => {
    if (!req.headers.cookie?.includes('authjs.session-token')) return next();
    const session = (await getSession(req, authConfig).catch(() => null)) as { sid?: string } | null;
    if (!session?.sid) return next();
    const row = await loadSession(db, session.sid);
    if (!row) return next();
    const companies = await listCompaniesOf(db, row.user.id);
    const active = companies.find((c) => c.id === row.session.activeTenantId) ?? companies[0];
    req.actor = {
      userId: row.user.id,
      sessionId: row.session.id,
      email: row.user.email,
      name: row.user.name,
      tenantId: active?.id ?? null,
      role: active?.role ?? null,
      isPlatformAdmin: row.adminActive === true,
    };
    next();
  };
}
