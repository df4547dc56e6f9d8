/**
 * Where uploaded bytes live, behind three calls. The folder store below suits
 * one machine; when the app runs on several, an S3-compatible store can
 * implement the same interface and nothing else changes.
 */
import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';

export interface UploadStore {
  /** Writes new bytes; refuses to overwrite an existing key. */
  put(key: string, bytes: Uint8Array): Promise<void>;
  /** The bytes, or null when nothing is stored under the key. */
  get(key: string): Promise<Uint8Array<ArrayBuffer> | null>;
  /** Deletes the bytes; removing a missing key is not an error. */
  remove(key: string): Promise<void>;
}

const KEY = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/** Storage keys are random, never derived from anything the uploader sent. */
export function newStorageKey(): string {
  return randomUUID();
}

export function folderStore(folder: string): UploadStore {
  const root = path.resolve(folder);
  // Only well-formed keys map to a path, so no key can name a file outside the folder.
  const pathOf = (key: string) => {
    if (!KEY.test(key)) throw new Error(`Not a storage key: ${JSON.stringify(key)}`);
    return path.join(root, key);
  };
  return {
    async put(key, bytes) {
      const file = pathOf(key);
      await mkdir(root, { recursive: true, mode: 0o700 });
      try {
        await writeFile(file, bytes, { flag: 'wx', mode: 0o600 });
      } catch (error) {
        // 'wx' fails before writing when the key exists; any later failure may leave a partial file.
        if ((error as NodeJS.ErrnoException).code !== 'EEXIST') await rm(file, { force: true });
        throw error;
      }
    },
    async get(key) {
      try {
        return new Uint8Array(await readFile(pathOf(key)));
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw error;
      }
    },
    async remove(key) {
      await rm(pathOf(key), { force: true });
    },
  };
}
