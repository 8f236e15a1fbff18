// Route wrappers that check the signed-in person and their role (from the one permission table),
// then run the handler in a transaction scoped to their company.
import type { Request, RequestHandler, Response } from 'express';
import { can, type Permission } from '@bumperline/contracts/roles';
import { withScope, type Db, type Tx } from '@bumperline/db/client';
import { ForbiddenError, UnauthorizedError } from './errors.ts';
import { applyOnce, idempotencyKeyOf, REPLAYED_HEADER, type Answer } from './idempotency.ts';
import type { Actor } from './context.ts';

export type TenantActor = Actor & { tenantId: string; role: NonNullable<Actor['role']> };

export interface ScopedContext {
  tx: Tx;
  actor: TenantActor;
  req: Request;
  res: Response;
  /** Work that must wait until the transaction has committed (sending mail): never call a provider inside it. */
  afterCommit(fn: () => Promise<void>): void;
}

export function requireActor(req: Request): Actor {
  if (!req.actor) throw new UnauthorizedError();
  return req.actor;
}

export function requirePermission(req: Request, permission: Permission): TenantActor {
  const actor = requireActor(req);
  if (!actor.tenantId || !actor.role) throw new ForbiddenError('You do not belong to an operator company yet.');
  if (!can(actor.role, permission)) throw new ForbiddenError();
  return actor as TenantActor;
}

/** A route handler built by `scoped`, carrying the permission it checks (read by the permissions test). */
export type GuardedHandler = RequestHandler & { permission: Permission };

/**
 * A handler that needs `permission` in the current company. Whatever it returns is sent as JSON
 * (with `status`), after its transaction has committed.
 */
export function makeScoped(db: Db) {
  return function scoped<T>(permission: Permission, handler: (ctx: ScopedContext) => Promise<T>, status = 200): GuardedHandler {
    const guarded: RequestHandler = async (req, res) => {
      const actor = requirePermission(req, permission);
      const key = idempotencyKeyOf(req);
      const later: (() => Promise<void>)[] = [];
      const answer = await withScope(db, { tenantId: actor.tenantId, userId: actor.userId }, async (tx) => {
        const run = async (): Promise<Answer> => {
          const result = await handler({ tx, actor, req, res, afterCommit: (fn) => later.push(fn) });
          // A handler that wrote its own answer (a file) has nothing to replay but its status.
          if (res.headersSent) return { status: res.statusCode, body: null };
          return result === undefined ? { status: 204, body: null } : { status, body: result };
        };
        // A change sent with an Idempotency-Key is applied once; a repeat gets the first answer (idempotency.ts).
        return key ? applyOnce(tx, req, actor, key, run) : { ...(await run()), replayed: false };
      });
      for (const fn of later) await fn().catch((err: unknown) => req.log?.error({ err }, 'after-commit work failed'));
      if (!res.headersSent) {
        if (answer.replayed) res.set(REPLAYED_HEADER, 'true');
        if (answer.status === 204) res.status(204).end();
        else res.status(answer.status).json(answer.body);
      }
    };
    return Object.assign(guarded, { permission });
  };
}
