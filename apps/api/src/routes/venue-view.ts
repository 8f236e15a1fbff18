// What a venue contact sees: their venues' games with status, the calls on them, and reporting a problem.
import { Router } from 'express';
import { venueReportInput } from '@bumperline/contracts/venue-view';
import { getCall, listCalls } from '@bumperline/db/queries/calls';
import { getGameVenueId, listGamesAtVenues } from '@bumperline/db/queries/games';
import { venueIdsOfContact } from '@bumperline/db/queries/venue-contacts';
import { listVenueSummaries } from '@bumperline/db/queries/venues';
import { ValidationError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import type { makeScoped } from '../http/guards.ts';
import { openCall } from '../services/service-calls.ts';

export function venueViewRouter(deps: { scoped: ReturnType<typeof makeScoped>; appOrigin: string }): Router {
  const { scoped, appOrigin } = deps;
  const r = Router();

  r.get(
    '/',
    scoped('venue-view', async ({ tx, actor }) => {
      const venueIds = await venueIdsOfContact(tx, actor.userId);
      const myVenues = await listVenueSummaries(tx, venueIds);
      const myGames = await listGamesAtVenues(tx, venueIds);
      const open = await listCalls(tx, { state: 'open', sort: 'openedAt', order: 'desc', limit: 100, onlyVenueIds: venueIds });
      const past = await listCalls(tx, { state: 'all', sort: 'openedAt', order: 'desc', limit: 30, onlyVenueIds: venueIds });
      const strip = <T extends { technicianId?: unknown; reporterWantsSms?: unknown }>(c: T) => ({
        ...c,
        technicianId: undefined,
        reporterWantsSms: undefined,
      });
      return {
        venues: myVenues,
        games: myGames,
        openCalls: open.items.map(strip),
        pastCalls: past.items.filter((c) => c.state === 'closed' || c.state === 'cancelled').map(strip),
      };
    }),
  );

  r.post(
    '/calls',
    scoped(
      'venue-view',
      async ({ tx, req, actor }) => {
        const input = parse(venueReportInput, req.body);
        const venueIds = await venueIdsOfContact(tx, actor.userId);
        const venueId = await getGameVenueId(tx, input.gameId);
        if (!venueId || !venueIds.includes(venueId))
          throw new ValidationError([{ field: 'gameId', message: 'is not a game at your venue' }]);
        const opened = await openCall(tx, {
          ...input,
          source: 'venue_view',
          actor: { userId: actor.userId, role: actor.role, label: actor.name },
          appOrigin,
        });
        const call = await getCall(tx, opened.callId);
        return { id: call!.id, state: call!.state, joined: opened.joined };
      },
      201,
    ),
  );
  return r;
}
