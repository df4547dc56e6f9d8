import { randomBytes } from 'node:crypto';
import { mkdir, readdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { StoredMessage } from './stored-message.ts';

const ID_PATTERN = /^\d{13}-\d{4}-[0-9a-f]{6}$/;

let lastMillis = 0;
let sequence = 0;

/** Ids sort by arrival (time, then a per-millisecond counter), so newest-first is a reverse sort. */
export function newMessageId(now = Date.now()): string {
  sequence = now === lastMillis ? sequence + 1 : 0;
  lastMillis = now;
  return `${String(now).padStart(13, '0')}-${String(sequence).padStart(4, '0')}-${randomBytes(3).toString('hex')}`;
}

function isMessageId(id: string): boolean {
  return ID_PATTERN.test(id);
}

/**
 * Messages as one JSON file each in a folder, read from disk on every call, so they survive
 * restarts and any process (the app's mail log, a test) sees the same messages.
 */
export class MessageStore {
  constructor(readonly dir: string) {}

  async open(): Promise<void> {
    await mkdir(this.dir, { recursive: true });
  }

  async save(message: StoredMessage): Promise<void> {
    const file = join(this.dir, `${message.id}.json`);
    // Written beside and renamed into place, so a reader never sees half a message.
    const partial = `${file}.partial`;
    await writeFile(partial, JSON.stringify(message));
    await rename(partial, file);
  }

  private async ids(): Promise<string[]> {
    const names = await readdir(this.dir).catch((error: NodeJS.ErrnoException) => {
      if (error.code === 'ENOENT') return [];
      throw error;
    });
    return names
      .filter((name) => name.endsWith('.json'))
      .map((name) => name.slice(0, -'.json'.length))
      .filter(isMessageId)
      .sort()
      .reverse();
  }

  async get(id: string): Promise<StoredMessage | null> {
    if (!isMessageId(id)) return null;
    const file = join(this.dir, `${id}.json`);
    let text: string;
    try {
      text = await readFile(file, 'utf8');
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw error;
    }
    try {
      return JSON.parse(text) as StoredMessage;
    } catch (error) {
      throw new Error(`The stored message ${file} is not valid JSON (${(error as Error).message}); delete the file or clear the catcher.`);
    }
  }

  /** All messages, newest first. */
  async list(): Promise<StoredMessage[]> {
    const messages = await Promise.all((await this.ids()).map((id) => this.get(id)));
    return messages.filter((message): message is StoredMessage => message !== null);
  }

  async remove(id: string): Promise<boolean> {
    if (!isMessageId(id) || (await this.get(id)) === null) return false;
    await rm(join(this.dir, `${id}.json`), { force: true });
    return true;
  }

  /** Deletes every message and returns how many there were. */
  async clear(): Promise<number> {
    const ids = await this.ids();
    await Promise.all(ids.map((id) => rm(join(this.dir, `${id}.json`), { force: true })));
    return ids.length;
  }
}
