import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { LocalFileStorage, newStorageKey, StorageKeyError } from '../src/storage/storage';

const dir = mkdtempSync(join(tmpdir(), 'gloaming-storage-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('local file storage', () => {
  const storage = new LocalFileStorage(dir);

  it('stores, reads, sizes and deletes by key', async () => {
    const key = newStorageKey('org/abc/photos', 'jpg');
    expect(key).toMatch(/^org\/abc\/photos\/[0-9a-f-]{36}\.jpg$/);
    await storage.put(key, Buffer.from('hello'));
    expect((await storage.get(key)).toString()).toBe('hello');
    expect(await storage.size(key)).toBe(5);
    await storage.delete(key);
    await expect(storage.get(key)).rejects.toThrow();
  });

  it('refuses keys that could escape the storage folder', async () => {
    for (const bad of ['../etc/passwd', 'org/../../x', '/abs', 'UPPER/case', 'a\\b', '']) {
      await expect(storage.put(bad, Buffer.from('x'))).rejects.toBeInstanceOf(StorageKeyError);
    }
  });

  it('never uses a user-supplied extension unsafely', () => {
    expect(newStorageKey('p', '../../sh')).toMatch(/^p\/[0-9a-f-]{36}\.sh$/);
  });
});
