// The company's dispatch settings: response targets per severity, warning lead, map tiles, dispatch phone.
import { Router } from 'express';
import { z } from 'zod';
import { getSettings, updateSettings } from '@bumperline/db/queries/calls';
import { recordAudit } from '@bumperline/db/queries/audit';
import { phoneNumber } from '@bumperline/contracts/phone';
import { parse } from '../http/validate.ts';
import type { makeScoped } from '../http/guards.ts';

const minutes = z
  .number()
  .int()
  .min(5, { error: 'must be at least 5 minutes' })
  .max(60 * 24 * 30);
export const settingsUpdate = z.strictObject({
  responseTargets: z.strictObject({ down: minutes, fault: minutes, cosmetic: minutes }).optional(),
  warnBeforeMinutes: z
    .number()
    .int()
    .min(0)
    .max(24 * 60)
    .optional(),
  mapTileUrl: z
    .union([
      z.literal(''),
      z
        .string()
        .url()
        .max(300)
        .regex(/^https?:\/\//, { error: 'must start with https:// or http://' })
        .regex(/\{z\}.*\{x\}.*\{y\}/, { error: 'must contain {z}, {x} and {y}' }),
    ])
    .optional(),
  dispatchPhone: z.union([z.literal(''), phoneNumber]).optional(),
});

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
