import { randomUUID } from 'node:crypto';
import { mkdir, open, readdir, readFile, rename, stat, unlink } from 'node:fs/promises';
import { join } from 'node:path';
import { assertObjectKey, type ObjectStorage, type StoredObject } from './types';

const CONTENT_TYPES: Record<string, string> = { jpg: 'image/jpeg', webp: 'image/webp' };
const TEMP_SUFFIX = '.partial';
const STALE_TEMP_MS = 60 * 60 * 1000;

const isMissing = (error: unknown) => (error as NodeJS.ErrnoException).code === 'ENOENT';

/**
 * Objects as files in one folder outside the web root (`DATA_DIR/photos`). A write goes to a
 * temporary name in the same folder, is flushed to disk, then renamed: rename is atomic within a
 * file system, so a crash leaves at most a `.partial` file, never a half photo under its real name.
 * The content type follows from the key's extension, which the server chose.
 */
export function createFilesystemStorage(folder: string): ObjectStorage {
  let ready: Promise<void> | undefined;
  const ensureFolder = () =>
    (ready ??= mkdir(folder, { recursive: true, mode: 0o700 }).then(() => removeStaleTemporaries(folder)));

  return {
    kind: 'filesystem',
    async put(key, bytes) {
      assertObjectKey(key);
      await ensureFolder();
      const temporary = join(folder, `.${key}.${randomUUID()}${TEMP_SUFFIX}`);
      try {
        const file = await open(temporary, 'wx', 0o600);
        try {
          await file.writeFile(bytes);
          await file.sync();
        } finally {
          await file.close();
        }
        await rename(temporary, join(folder, key));
      } catch (error) {
        await unlink(temporary).catch(() => undefined);
        throw error;
      }
    },
    async get(key): Promise<StoredObject | null> {
      assertObjectKey(key);
      try {
        const bytes = await readFile(join(folder, key));
        const extension = key.slice(key.lastIndexOf('.') + 1);
        return {
          // readFile's Buffer is never backed by a SharedArrayBuffer.
          body: new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength),
          contentType: CONTENT_TYPES[extension] ?? 'application/octet-stream',
          size: bytes.byteLength,
        };
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async delete(key) {
      assertObjectKey(key);
      await unlink(join(folder, key)).catch((error: unknown) => {
        if (!isMissing(error)) throw error;
      });
    },
  };
}

/** Temporaries older than an hour belong to a write that a crash interrupted. */
async function removeStaleTemporaries(folder: string): Promise<void> {
  const names = (await readdir(folder)).filter((name) => name.endsWith(TEMP_SUFFIX));
  for (const name of names) {
    const path = join(folder, name);
    const info = await stat(path).catch(() => null);
    if (info && Date.now() - info.mtimeMs > STALE_TEMP_MS) await unlink(path).catch(() => undefined);
  }
}
