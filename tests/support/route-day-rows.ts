// Route-day rows made fresh for one probe of an endpoint that changes a day (a kept order, a moved stop): a date no
// other probe used, and a stop on it — a new game at the company's first venue with an open work order planned there.
import { randomBytes } from 'node:crypto';
import { games, workOrders } from '@bumperline/db/schema/index';
import type { TestDatabase } from './database.ts';
import type { FullCompany } from './full-company.ts';

let dayCounter = 0;
/** A date in 2030 (far from every fixture's own) that no other probe of this file has used. */
export function freshRouteDay(): string {
  const at = new Date(Date.UTC(2030, 0, 1) + dayCounter++ * 86_400_000);
  return at.toISOString().slice(0, 10);
}

/** A stop on the technician's `day`: its venue (the company's first) and the work order that makes it. */
export async function freshPlannedStop(
  db: TestDatabase,
  company: FullCompany,
  day: string,
): Promise<{ venueId: string; workOrderId: string }> {
  const venueId = company.venueIds[0]!;
  const [game] = await db.owner
    .insert(games)
    .values({
      tenantId: company.tenantId,
      modelId: company.modelId,
      venueId,
      serial: `SN-${randomBytes(4).toString('hex')}`,
      tagToken: randomBytes(16).toString('base64url'),
    })
    .returning({ id: games.id });
  const [order] = await db.owner
    .insert(workOrders)
    .values({
      tenantId: company.tenantId,
      carePlanId: company.care.carePlanId,
      gameId: game!.id,
      dueAt: new Date(`${day}T15:00:00Z`),
      dueReason: 'plays',
      title: 'Monthly clean and check',
      onSiteMinutes: 45,
      technicianId: company.technician.id,
      plannedOn: day,
    })
    .returning({ id: workOrders.id });
  return { venueId, workOrderId: order!.id };
}
