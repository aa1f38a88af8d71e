import { randomUUID } from 'node:crypto';
import { mkdtempSync, readdirSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createFilesystemStorage } from '../../../../src/lib/server/storage/filesystem';

let root: string;
let folder: string;
beforeEach(() => {
  root = mkdtempSync(join(tmpdir(), 'lashline-storage-'));
  folder = join(root, 'photos');
});
afterEach(() => rmSync(root, { recursive: true, force: true }));

const key = (extension = 'jpg') => `${randomUUID()}.${extension}`;

describe('the embedded photo storage', () => {
  it('stores, reads back and deletes an object, with the type its extension names', async () => {
    const storage = createFilesystemStorage(folder);
    const [jpeg, webp] = [key(), key('webp')];
    await storage.put(jpeg, new Uint8Array([1, 2, 3]), 'image/jpeg');
    await storage.put(webp, new Uint8Array([4]), 'image/webp');
    const read = await storage.get(jpeg);
    expect(read?.contentType).toBe('image/jpeg');
    expect([...(read?.body as Uint8Array)]).toEqual([1, 2, 3]);
    expect((await storage.get(webp))?.contentType).toBe('image/webp');
    await storage.delete(jpeg);
    expect(await storage.get(jpeg)).toBeNull();
    expect(readdirSync(folder)).toEqual([webp]);
  });

  it('leaves no temporary file behind, only the object under its own name', async () => {
    const storage = createFilesystemStorage(folder);
    const name = key();
    await storage.put(name, new Uint8Array(256 * 1024), 'image/jpeg');
    expect(readdirSync(folder)).toEqual([name]);
  });

  it('answers null for a missing object and accepts deleting one', async () => {
    const storage = createFilesystemStorage(folder);
    expect(await storage.get(key())).toBeNull();
    await expect(storage.delete(key())).resolves.toBeUndefined();
  });

  it('refuses every key the server could not have made (paths, other extensions)', async () => {
    const storage = createFilesystemStorage(folder);
    for (const bad of [
      '../escape.jpg',
      `../${randomUUID()}.jpg`,
      `${randomUUID()}.jpg/..`,
      'photo.jpg',
      `${randomUUID()}.html`,
      `${randomUUID().toUpperCase()}.jpg`,
    ]) {
      await expect(storage.put(bad, new Uint8Array([1]), 'image/jpeg')).rejects.toThrow(/Refusing storage key/);
      await expect(storage.get(bad)).rejects.toThrow(/Refusing storage key/);
      await expect(storage.delete(bad)).rejects.toThrow(/Refusing storage key/);
    }
  });

  it('sweeps temporaries that an interrupted write left more than an hour ago, and keeps fresh ones', async () => {
    await createFilesystemStorage(folder).put(key(), new Uint8Array([1]), 'image/jpeg');
    const stale = join(folder, `.${key()}.${randomUUID()}.partial`);
    const fresh = join(folder, `.${key()}.${randomUUID()}.partial`);
    writeFileSync(stale, 'half a photo');
    writeFileSync(fresh, 'a write in progress');
    const twoHoursAgo = new Date(Date.now() - 2 * 60 * 60 * 1000);
    utimesSync(stale, twoHoursAgo, twoHoursAgo);
    await createFilesystemStorage(folder).put(key(), new Uint8Array([2]), 'image/jpeg');
    const names = readdirSync(folder);
    expect(names.filter((name) => name.endsWith('.partial'))).toEqual([fresh.slice(folder.length + 1)]);
  });
});
