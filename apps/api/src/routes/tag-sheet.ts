// Game tags for staff: a venue's printable sheet of QR tags, and replacing a game's tag (the old sticker
// stops working at once, e.g. after it was photographed and abused, or the cabinet moved).
import { Router } from 'express';
import { getTagState, listVenueTags, newTagToken } from '@bumperline/db/queries/game-tags';
import { updateGame } from '@bumperline/db/queries/games';
import { getVenue } from '@bumperline/db/queries/venues';
import { recordAudit } from '@bumperline/db/queries/audit';
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
      const rows = await listVenueTags(tx, venue.id);
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
      const game = await getTagState(tx, id);
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
