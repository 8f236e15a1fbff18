// What a request knows about who is asking, read from the database on every request.
import type { Role } from '@bumperline/contracts/roles';

export interface Actor {
  userId: string;
  sessionId: string;
  email: string;
  name: string;
  tenantId: string | null;
  role: Role | null;
  isPlatformAdmin: boolean;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      actor?: Actor;
    }
  }
}
