// A photo a staff member adds to a service call (the technician at the game, often queued on a phone without signal).
import type { Tx } from '@bumperline/db/client';
import { getCallRow } from '@bumperline/db/queries/calls';
import { listPhotos } from '@bumperline/db/queries/call-photos';
import type { CallPhoto } from '@bumperline/contracts/calls';
import { ConflictError, NotFoundError } from '../http/errors.ts';
import { savePhoto, type PreparedPhoto } from './photo-intake.ts';
import type { PhotoStore } from './photo-store.ts';
import type { CallActor } from './service-calls.ts';

/** A call that is over takes no more photos: the record of the repair is settled. */
const FINISHED = new Set(['closed', 'cancelled']);

export async function addStaffPhoto(
  tx: Tx,
  store: PhotoStore,
  p: { callId: string; photo: PreparedPhoto; actor: CallActor },
): Promise<{ photoId: string; photo: CallPhoto }> {
  const call = await getCallRow(tx, p.callId);
  if (!call) throw new NotFoundError('service call');
  if (FINISHED.has(call.state)) {
    throw new ConflictError(`This call is ${call.state}; it takes no more photos.`, undefined, [
      { field: 'state', message: `is ${call.state}; a finished call takes no more photos` },
    ]);
  }
  const written: string[] = [];
  try {
    const photoId = await savePhoto(tx, store, {
      callId: p.callId,
      photo: p.photo,
      uploadedBy: 'staff',
      actorUserId: p.actor.userId,
      actorLabel: p.actor.label,
      written,
    });
    const photo = (await listPhotos(tx, p.callId)).find((row) => row.id === photoId)!;
    return { photoId, photo: { ...photo, createdAt: photo.createdAt.toISOString() } };
  } catch (err) {
    // Nothing of a photo that was not recorded may stay on disk.
    await Promise.all(written.map((key) => store.remove(key).catch(() => {})));
    throw err;
  }
}
