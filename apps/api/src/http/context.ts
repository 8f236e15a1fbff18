// What a request knows about who is asking, read from the database on every request.
import type { SessionActor } from '@bumperline/db/queries/identity';

/** The session's person, company and role, as the one sign-in statement reads them (auth/load-actor.ts). */
export type Actor = SessionActor;

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      actor?: Actor;
    }
  }
}
