// Photos taken without signal wait here (IndexedDB, one entry per photo) until their queued change sends them: the
// queued change itself carries only the key, so it stays small in the offline copy and survives a reload.
import { clear, createStore, del, get, set, type UseStore } from 'idb-keyval';

let store: UseStore | undefined;
// Opened on first use: IndexedDB is not there in every test environment.
const idb = () => (store ??= createStore('bumperline-photos', 'queued'));

export const newPhotoKey = (): string => `call-photo-${crypto.randomUUID()}`;

export function keepQueuedPhoto(key: string, photo: Blob): Promise<void> {
  return set(key, photo, idb());
}

export function readQueuedPhoto(key: string): Promise<Blob | undefined> {
  return get<Blob>(key, idb());
}

/** After the office has the photo, or when the technician drops its change. */
export function dropQueuedPhoto(key: string): Promise<void> {
  return del(key, idb()).catch(() => undefined);
}

/** Sign-out or company switch: the photos waiting on this phone went with the copy they belonged to. */
export function forgetQueuedPhotos(): Promise<void> {
  return clear(idb()).catch(() => undefined);
}
