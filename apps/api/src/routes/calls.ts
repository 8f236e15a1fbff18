// Service calls for staff: the dispatch list, a call with its timeline, opening, moving, assigning.
import { Router } from 'express';
import {
  answerInput,
  assignInput,
  callListQuery,
  noteInput,
  openCallInput,
  severityInput,
  transitionInput,
} from '@bumperline/contracts/calls';
import { can } from '@bumperline/contracts/roles';
import { maskAddress } from '@bumperline/contracts/phone';
import { getCall, getCallRow, listCalls, updateCall } from '@bumperline/db/queries/calls';
import { insertEvent, listEvents } from '@bumperline/db/queries/call-events';
import { getPhoto, listPhotos } from '@bumperline/db/queries/call-photos';
import { listCallMessages } from '@bumperline/db/queries/outbox';
import { listTechnicians } from '@bumperline/db/queries/technicians';
import { ConflictError, NotFoundError } from '../http/errors.ts';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import type { makeScoped, TenantActor } from '../http/guards.ts';
import { takePhoto, takenPhoto } from '../http/photo-upload.ts';
import { answerAssignment, assignCall, openCall, transitionCall, type CallActor } from '../services/service-calls.ts';
import { addStaffPhoto } from '../services/call-photos.ts';
import type { PhotoStore } from '../services/photo-store.ts';
import { suggestTechnicians } from '../services/technician-suggestions.ts';

const actorOf = (a: TenantActor): CallActor => ({ userId: a.userId, role: a.role, label: a.name });

export function callsRouter(deps: { scoped: ReturnType<typeof makeScoped>; appOrigin: string; photos: PhotoStore }): Router {
  const { scoped, appOrigin, photos } = deps;
  const r = Router();

  r.get(
    '/',
    scoped('calls:read', ({ tx, req, actor }) => {
      const q = parse(callListQuery, req.query);
      return listCalls(tx, { ...q, technicianId: q.technicianId === 'me' ? actor.userId : q.technicianId });
    }),
  );

  r.post(
    '/',
    scoped(
      'calls:open',
      async ({ tx, req, actor }) => {
        const input = parse(openCallInput, req.body);
        const opened = await openCall(tx, { ...input, source: 'staff', actor: actorOf(actor), appOrigin });
        return { ...(await getCall(tx, opened.callId)), joined: opened.joined };
      },
      201,
    ),
  );

  r.get(
    '/:id',
    scoped('calls:read', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const call = await getCall(tx, id);
      if (!call) throw new NotFoundError('service call');
      // One transaction is one connection: its queries run one after another.
      const events = await listEvents(tx, id);
      const sent = await listCallMessages(tx, id);
      const messages = can(actor.role, 'calls:contacts') ? sent : sent.map((m) => ({ ...m, toAddress: maskAddress(m.toAddress) }));
      const photoList = await listPhotos(tx, id);
      return { call, events, messages, photos: photoList };
    }),
  );

  // Technicians ranked for this call: distance from their home base, skills, open load.
  r.get(
    '/:id/technicians',
    scoped('calls:dispatch', ({ tx, req }) => suggestTechnicians(tx, idParam(req))),
  );

  r.post(
    '/:id/assign',
    scoped('calls:dispatch', async ({ tx, req, actor }) => {
      const input = parse(assignInput, req.body);
      return assignCall(tx, { callId: idParam(req), ...input, actor: actorOf(actor), appOrigin });
    }),
  );

  r.post(
    '/:id/transition',
    scoped('calls:work', async ({ tx, req, actor }) => {
      const input = parse(transitionInput, req.body);
      return transitionCall(tx, { callId: idParam(req), ...input, actor: actorOf(actor), appOrigin });
    }),
  );

  r.post(
    '/:id/answer',
    scoped('calls:work', async ({ tx, req, actor }) => {
      const { accept } = parse(answerInput, req.body);
      return answerAssignment(tx, { callId: idParam(req), technicianId: actor.userId, accept, actor: actorOf(actor) });
    }),
  );

  r.post(
    '/:id/severity',
    scoped('calls:dispatch', async ({ tx, req, actor }) => {
      const id = idParam(req);
      const { severity, version } = parse(severityInput, req.body);
      const before = await getCallRow(tx, id);
      if (!before) throw new NotFoundError('service call');
      if (!(await updateCall(tx, id, version, { severity })))
        throw new ConflictError('This call changed since you opened it.', await getCall(tx, id));
      await insertEvent(tx, {
        callId: id,
        kind: 'note',
        actorUserId: actor.userId,
        actorLabel: actor.name,
        detail: { severity: { from: before.severity, to: severity } },
      });
      return getCall(tx, id);
    }),
  );

  r.post(
    '/:id/notes',
    scoped(
      'calls:work',
      async ({ tx, req, actor }) => {
        const id = idParam(req);
        const { note } = parse(noteInput, req.body);
        if (!(await getCallRow(tx, id))) throw new NotFoundError('service call');
        await insertEvent(tx, { callId: id, kind: 'note', actorUserId: actor.userId, actorLabel: actor.name, detail: { note } });
        return { ok: true };
      },
      201,
    ),
  );

  // A photo from the technician's phone, often queued without signal and sent later with its Idempotency-Key.
  r.post(
    '/:id/photos',
    takePhoto('calls:work'),
    scoped(
      'calls:work',
      ({ tx, req, res, actor }) => addStaffPhoto(tx, photos, { callId: idParam(req), photo: takenPhoto(res), actor: actorOf(actor) }),
      201,
    ),
  );

  r.get(
    '/:id/photos/:photoId',
    scoped('calls:read', async ({ tx, req, res }) => {
      const photo = await getPhoto(tx, idParam(req, 'photoId'));
      if (!photo || photo.callId !== idParam(req)) throw new NotFoundError('photo');
      const thumb = req.query.size === 'thumb';
      res.type(thumb ? 'image/webp' : photo.contentType);
      res.setHeader('Cache-Control', 'private, max-age=3600');
      res.send(await photos.read(thumb ? photo.thumbKey : photo.storageKey));
      return undefined;
    }),
  );

  return r;
}

export function techniciansRouter(scoped: ReturnType<typeof makeScoped>): Router {
  const r = Router();
  r.get(
    '/',
    scoped('calls:dispatch', async ({ tx }) => ({ items: await listTechnicians(tx) })),
  );
  return r;
}
