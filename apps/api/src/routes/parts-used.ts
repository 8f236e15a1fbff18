// Parts used on a service call or a work order: record one (off the person's van, or a stock the office names)
// and list a job's parts. No delete: a part that went back unused is transferred back to a stock.
import { Router } from 'express';
import { partsUsedInput } from '@bumperline/contracts/parts-used';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped } from '../http/guards.ts';
import { partsUsedOn, recordPartUsed } from '../services/parts-used.ts';

export function partsUsedRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();
  const jobs = [
    { path: '/calls/:id/parts-used', kind: 'call' },
    { path: '/work-orders/:id/parts-used', kind: 'workOrder' },
  ] as const;
  for (const { path, kind } of jobs) {
    r.get(
      path,
      scoped('stock:read', ({ tx, req }) => partsUsedOn(tx, { kind, id: idParam(req) })),
    );
    r.post(
      path,
      scoped(
        'stock:move',
        ({ tx, req, actor }) => recordPartUsed(tx, actor, { kind, id: idParam(req) }, parse(partsUsedInput, req.body)),
        201,
      ),
    );
  }
  return r;
}
