// What a venue contact sees: their venues' games with status, the calls on them, and reporting a problem.
import { Router } from 'express';
import { and, eq, inArray, isNull } from 'drizzle-orm';
import { z } from 'zod';
import { problemKinds } from '@bumperline/contracts/calls';
import { shortText, uuid } from '@bumperline/contracts/common';
import { getCall, listCalls, venueIdsOfContact } from '@bumperline/db/queries/calls';
import { gameModels, games, venues } from '@bumperline/db/schema/index';
import { currentTenant } from '@bumperline/db/schema/rls';
import { ValidationError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import type { makeScoped } from '../http/guards.ts';
import { openCall } from '../services/service-calls.ts';

const venueReport = z.strictObject({ gameId: uuid, problem: z.enum(problemKinds), note: shortText(1000).default('') });

export function venueViewRouter(deps: { scoped: ReturnType<typeof makeScoped>; appOrigin: string }): Router {
  const { scoped, appOrigin } = deps;
  const r = Router();

  r.get(
    '/',
    scoped('venue-view', async ({ tx, actor }) => {
      const venueIds = await venueIdsOfContact(tx, actor.userId);
      const myVenues = venueIds.length
        ? await tx
            .select({ id: venues.id, name: venues.name, addressLine: venues.addressLine, city: venues.city })
            .from(venues)
            .where(and(eq(venues.tenantId, currentTenant), inArray(venues.id, venueIds)))
        : [];
      const myGames = venueIds.length
        ? await tx
            .select({
              id: games.id,
              venueId: games.venueId,
              serial: games.serial,
              status: games.status,
              title: gameModels.title,
              kind: gameModels.kind,
            })
            .from(games)
            .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
            .where(and(eq(games.tenantId, currentTenant), inArray(games.venueId, venueIds), isNull(games.retiredAt)))
            .orderBy(gameModels.title)
        : [];
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
        const input = parse(venueReport, req.body);
        const venueIds = await venueIdsOfContact(tx, actor.userId);
        const [game] = await tx
          .select({ venueId: games.venueId })
          .from(games)
          .where(and(eq(games.tenantId, currentTenant), eq(games.id, input.gameId)));
        if (!game?.venueId || !venueIds.includes(game.venueId))
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
