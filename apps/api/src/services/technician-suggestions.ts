// Which technicians to suggest for a call: ranked by the domain module on distance from their home base,
// skills for the game's kind, and open load. Technicians without a home base are listed, unranked, last.
import { rankTechnicians } from '@bumperline/domain/travel/technician-ranking';
import type { Tx } from '@bumperline/db/client';
import { getCall } from '@bumperline/db/queries/calls';
import { listTechnicians } from '@bumperline/db/queries/technicians';
import { NotFound } from './workflow-errors.ts';

/** Calls a technician can carry before the ranking counts them as full (common practice for a route tech's day). */
const OPEN_CALL_CAPACITY = 6;

export async function suggestTechnicians(tx: Tx, callId: string) {
  const call = await getCall(tx, callId);
  if (!call) throw new NotFound('service call');
  const techs = await listTechnicians(tx);
  const located = techs.filter((t) => t.homeLatitude !== null && t.homeLongitude !== null);
  const ranks =
    call.latitude !== null && call.longitude !== null
      ? rankTechnicians(
          { location: { lat: call.latitude, lon: call.longitude }, requiredSkills: [call.gameKind] },
          located.map((t) => ({
            id: t.userId,
            location: { lat: t.homeLatitude!, lon: t.homeLongitude! },
            skills: t.skills,
            openJobs: t.openCalls,
            capacity: OPEN_CALL_CAPACITY,
          })),
          { missingSkill: 'penalise' },
        )
      : [];
  const byId = new Map(ranks.map((x) => [x.id, x]));
  const items = techs
    .map((t) => ({
      userId: t.userId,
      name: t.name,
      skills: t.skills,
      openCalls: t.openCalls,
      hasPhone: !!t.phone,
      rank: byId.get(t.userId) ?? null,
    }))
    .sort((a, b) => (b.rank?.score ?? -1) - (a.rank?.score ?? -1));
  return { items };
}
