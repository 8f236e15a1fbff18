// Game tags for staff: a venue's printable sheet of QR tags, and replacing a game's tag (the old sticker
// stops working at once, e.g. after it was photographed and abused, or the cabinet moved).
import { Router } from 'express';
import { and, asc, eq, isNull } from 'drizzle-orm';
import { newTagToken, updateGame } from '@bumperline/db/queries/games';
import { getVenue } from '@bumperline/db/queries/venues';
import { recordAudit } from '@bumperline/db/queries/audit';
import { gameModels, games } from '@bumperline/db/schema/index';
import { currentTenant } from '@bumperline/db/schema/rls';
import { ConflictError, NotFoundError } from '../http/errors.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped } from '../http/guards.ts';
import { appLink } from '../services/links.ts';
import { tagSheetPage } from '../public-pages/tag-sheet-page.ts';

const tagUrl = (appOrigin: string, token: string) => appLink(appOrigin, `/t/${token}`);
/** The audit log shows that the tag changed, not the secret itself. */
const tagHint = (token: string) => `…${token.slice(-4)}`;

export function tagSheetRouter(deps: { scoped: ReturnType<typeof makeScoped>; appOrigin: string }): Router {
  const { scoped, appOrigin } = deps;
  const r = Router();

  r.get(
    '/venues/:id/tag-sheet',
    scoped('venues:read', async ({ tx, req, res }) => {
      const venue = await getVenue(tx, idParam(req));
      if (!venue) throw new NotFoundError('venue');
      const rows = await tx
        .select({ title: gameModels.title, serial: games.serial, tagToken: games.tagToken })
        .from(games)
        .innerJoin(gameModels, and(eq(gameModels.tenantId, games.tenantId), eq(gameModels.id, games.modelId)))
        .where(and(eq(games.tenantId, currentTenant), eq(games.venueId, venue.id), isNull(games.retiredAt)))
        .orderBy(asc(gameModels.title), asc(games.serial));
      const page = await tagSheetPage({
        venueName: venue.name,
        tags: rows.map((g) => ({ title: g.title, serial: g.serial, url: tagUrl(appOrigin, g.tagToken) })),
      });
      res.status(200).type('html').set('Cache-Control', 'no-store').send(page);
      return undefined;
    }),
  );

  r.post(
    '/games/:id/regenerate-tag',
    scoped('games:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const [game] = await tx
        .select({ tagToken: games.tagToken, version: games.version, retiredAt: games.retiredAt })
        .from(games)
        .where(and(eq(games.tenantId, currentTenant), eq(games.id, id)));
      if (!game) throw new NotFoundError('game');
      if (game.retiredAt) throw new ConflictError('This game is retired; its tag stays inactive.');
      const tagToken = newTagToken();
      if (!(await updateGame(tx, id, game.version, { tagToken }))) {
        throw new ConflictError('Someone else changed this game at the same moment. Try again.');
      }
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'regenerate-tag',
        entity: 'game',
        entityId: id,
        before: { tag: tagHint(game.tagToken) },
        after: { tag: tagHint(tagToken) },
      });
      return { gameId: id, tagUrl: tagUrl(appOrigin, tagToken) };
    }),
  );

  return r;
}
