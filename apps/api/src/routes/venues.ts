import { Router } from 'express';
import { venueContactInput, venueInput, venueListQuery, venueUpdate } from '@bumperline/contracts/venues';
import { getVenue, insertVenue, listVenues, updateVenue } from '@bumperline/db/queries/venues';
import { recordAudit } from '@bumperline/db/queries/audit';
import { linkVenueContact, listVenueContactMembers, listVenueContacts, unlinkVenueContact } from '@bumperline/db/queries/venue-contacts';
import { ConflictError, NotFoundError, ValidationError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped } from '../http/guards.ts';

export function venuesRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();

  r.get(
    '/',
    scoped('venues:read', ({ tx, req }) => listVenues(tx, parse(venueListQuery, req.query))),
  );

  r.get(
    '/:id',
    scoped('venues:read', async ({ tx, req }) => {
      const venue = await getVenue(tx, idParam(req));
      if (!venue) throw new NotFoundError('venue');
      return venue;
    }),
  );

  r.post(
    '/',
    scoped(
      'venues:write',
      async ({ tx, req, actor }) => {
        const input = parse(venueInput, req.body);
        const id = await insertVenue(tx, input);
        const venue = await getVenue(tx, id);
        await recordAudit(tx, { actorUserId: actor.userId, action: 'create', entity: 'venue', entityId: id, after: venue });
        return venue;
      },
      201,
    ),
  );

  r.patch(
    '/:id',
    scoped('venues:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const { version, ...patch } = parse(venueUpdate, req.body);
      const before = await getVenue(tx, id);
      if (!before) throw new NotFoundError('venue');
      if (!(await updateVenue(tx, id, version, patch))) {
        throw new ConflictError('Someone else changed this venue since you opened it. Review the current values and try again.', before);
      }
      const after = await getVenue(tx, id);
      await recordAudit(tx, { actorUserId: actor.userId, action: 'update', entity: 'venue', entityId: id, before, after });
      return after;
    }),
  );

  // Retiring keeps the venue and its history; it only leaves the active lists.
  r.post(
    '/:id/retire',
    scoped('venues:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const before = await getVenue(tx, id);
      if (!before) throw new NotFoundError('venue');
      if (before.retiredAt) return before;
      await updateVenue(tx, id, before.version, { retiredAt: new Date() });
      const after = await getVenue(tx, id);
      await recordAudit(tx, { actorUserId: actor.userId, action: 'retire', entity: 'venue', entityId: id, before, after });
      return after;
    }),
  );

  // Venue contacts: the people who see this venue in their venue view.
  r.get(
    '/:id/contacts',
    scoped('venues:read', async ({ tx, req }) => {
      const id = idParam(req);
      if (!(await getVenue(tx, id))) throw new NotFoundError('venue');
      return { items: await listVenueContacts(tx, id), candidates: await listVenueContactMembers(tx) };
    }),
  );

  r.post(
    '/:id/contacts',
    scoped(
      'venues:write',
      async ({ tx, req, actor }) => {
        const id = idParam(req);
        const { userId } = parse(venueContactInput, req.body);
        if (!(await getVenue(tx, id))) throw new NotFoundError('venue');
        if (!(await listVenueContactMembers(tx)).some((m) => m.userId === userId)) {
          throw new ValidationError([{ field: 'userId', message: 'is not a venue contact of this company' }]);
        }
        await linkVenueContact(tx, id, userId);
        await recordAudit(tx, {
          actorUserId: actor.userId,
          action: 'update',
          entity: 'venue',
          entityId: id,
          after: { contactAdded: userId },
        });
        return { items: await listVenueContacts(tx, id) };
      },
      201,
    ),
  );

  r.delete(
    '/:id/contacts/:userId',
    scoped('venues:write', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const userId = idParam(req, 'userId');
      if (!(await unlinkVenueContact(tx, id, userId))) throw new NotFoundError('venue contact');
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'update',
        entity: 'venue',
        entityId: id,
        before: { contactRemoved: userId },
      });
      return undefined;
    }),
  );

  return r;
}
