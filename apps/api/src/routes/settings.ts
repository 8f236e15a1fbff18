// The company's dispatch settings: response targets per severity, warning lead, map tiles, dispatch phone.
import { Router } from 'express';
import { getSettings, updateSettings } from '@bumperline/db/queries/settings';
import { recordAudit } from '@bumperline/db/queries/audit';
import { settingsUpdate } from '@bumperline/contracts/settings';
import { parse } from '../http/validate.ts';
import type { makeScoped } from '../http/guards.ts';

export function settingsRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();
  r.get(
    '/',
    scoped('calls:read', ({ tx }) => getSettings(tx)),
  );
  r.patch(
    '/',
    scoped('settings:manage', async ({ tx, req, actor }) => {
      const patch = parse(settingsUpdate, req.body);
      const before = await getSettings(tx);
      const after = await updateSettings(tx, patch);
      await recordAudit(tx, { actorUserId: actor.userId, action: 'update', entity: 'settings', entityId: actor.tenantId, before, after });
      return after;
    }),
  );
  return r;
}
