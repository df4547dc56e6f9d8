import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { folderStore, newStorageKey } from '../../../../src/lib/platform/uploads/store';

const parent = mkdtempSync(path.join(tmpdir(), 'rw-store-'));
const folder = path.join(parent, 'uploads');
const store = folderStore(folder);
const bytes = new Uint8Array([1, 2, 3]);

describe('folder upload store', () => {
  test('creates its folder, then puts, gets and removes bytes', async () => {
    const key = newStorageKey();
    await store.put(key, bytes);
    expect(readdirSync(folder)).toEqual([key]);
    expect(await store.get(key)).toEqual(bytes);
    await store.remove(key);
    expect(await store.get(key)).toBeNull();
    await store.remove(key);
  });

  test('never overwrites a stored key', async () => {
    const key = newStorageKey();
    await store.put(key, bytes);
    await expect(store.put(key, new Uint8Array([9]))).rejects.toMatchObject({ code: 'EEXIST' });
    expect(await store.get(key)).toEqual(bytes);
  });

  test('keys are fresh random UUIDs', () => {
    const keys = new Set(Array.from({ length: 1000 }, newStorageKey));
    expect(keys.size).toBe(1000);
    for (const key of keys) expect(key).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
  });

  test.each(['../escape', '/etc/passwd', 'a/b', '', 'report.pdf'])(
    'a key that is not a storage key (%j) is refused before touching the disk',
    async (key) => {
      await expect(store.put(key, bytes)).rejects.toThrow('Not a storage key');
      await expect(store.get(key)).rejects.toThrow('Not a storage key');
      await expect(store.remove(key)).rejects.toThrow('Not a storage key');
      expect(readdirSync(parent)).toEqual(['uploads']);
    },
  );
});
