// Where photos live: a folder outside the web root in development (S3-compatible storage in production
// would implement the same two calls). Keys are random, never taken from the uploaded file's name.
import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { randomUUID } from 'node:crypto';

export interface PhotoStore {
  write(bytes: Buffer, extension: string): Promise<string>;
  read(key: string): Promise<Buffer>;
  /** Removes a stored file (when the report it belonged to was not saved after all). */
  remove(key: string): Promise<void>;
}

export function folderPhotoStore(root: string): PhotoStore {
  return {
    async write(bytes, extension) {
      const key = `${randomUUID()}.${extension.replace(/[^a-z0-9]/gi, '')}`;
      const dir = path.join(root, key.slice(0, 2));
      await mkdir(dir, { recursive: true });
      await writeFile(path.join(dir, key), bytes, { mode: 0o600 });
      return key;
    },
    async read(key) {
      return readFile(fileOf(root, key));
    },
    async remove(key) {
      await rm(fileOf(root, key), { force: true });
    },
  };
}

function fileOf(root: string, key: string): string {
  if (!/^[0-9a-f-]{36}\.[a-z0-9]+$/i.test(key)) throw new Error('bad photo key');
  return path.join(root, key.slice(0, 2), key);
}
