// Writes a job's keep cost: its parts at cost (as each kind of job records them) and its labour at the company's
// rate as it is today, so a later change of rate leaves past costs alone. One row per job; done again, it is replaced.
import type { Tx } from '@bumperline/db/client';
import { listJobPartsAtCost, upsertKeepCost, type KeepCostSource } from '@bumperline/db/queries/keep-costs';
import { getSettings } from '@bumperline/db/queries/settings';
import { listEvents } from '@bumperline/db/queries/call-events';
import { keepCost } from '@bumperline/domain/money/keep-cost';

export async function recordKeepCost(
  tx: Tx,
  p: { source: KeepCostSource; sourceId: string; gameId: string; labourMinutes: number; technicianId: string | null },
) {
  const settings = await getSettings(tx);
  const parts = await listJobPartsAtCost(tx, p.source, p.sourceId);
  const cost = keepCost({ parts, labourMinutes: p.labourMinutes, hourlyRateCents: settings.labourRateCents });
  await upsertKeepCost(tx, {
    gameId: p.gameId,
    source: p.source,
    sourceId: p.sourceId,
    partsCents: cost.partsCents,
    labourMinutes: p.labourMinutes,
    labourRateCents: settings.labourRateCents,
    labourCents: cost.labourCents,
    technicianId: p.technicianId,
  });
  return cost;
}

/**
 * A fixed service call's keep cost: labour is the time on site, from the technician's arrival (the last move to
 * "on site" in its timeline) to the fix; without an arrival on record it is 0 minutes.
 */
export async function recordServiceCallKeepCost(tx: Tx, p: { callId: string; gameId: string; technicianId: string | null; fixedAt: Date }) {
  const events = await listEvents(tx, p.callId);
  const arrived = events.filter((e) => e.toState === 'on_site').at(-1);
  const minutes = arrived ? Math.max(0, Math.round((p.fixedAt.getTime() - arrived.at.getTime()) / 60_000)) : 0;
  return recordKeepCost(tx, {
    source: 'service_call',
    sourceId: p.callId,
    gameId: p.gameId,
    labourMinutes: minutes,
    technicianId: p.technicianId,
  });
}
