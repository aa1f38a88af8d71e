import { cpSync, existsSync, mkdirSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { createClient } from '@libsql/client';
import { readEnvironment } from '../../environment';
import { fileUrlToAbsolute } from '../../db/client';

/**
 * Backups of the embedded database: VACUUM INTO writes a consistent copy of the live file (a
 * read snapshot, so writers carry on), and the photo folder is copied beside it. Photos in an
 * S3 bucket stay there; the manifest says so.
 */
export interface BackupResult {
  folder: string;
  databaseFile: string;
  photos: number;
  tables: Record<string, number>;
}

function databasePath(url: string): string {
  if (!url.startsWith('file:'))
    throw new Error('Backups here cover the embedded SQLite file; back a libSQL server up with its own tools.');
  return fileUrlToAbsolute(url).slice('file:'.length);
}

async function countTables(file: string): Promise<Record<string, number>> {
  const db = createClient({ url: `file:${file}` });
  try {
    const names = (
      await db.execute("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name")
    ).rows.map((r) => r.name as string);
    const counts: Record<string, number> = {};
    for (const name of names)
      counts[name] = Number((await db.execute(`SELECT count(*) AS n FROM "${name}"`)).rows[0]?.n ?? 0);
    return counts;
  } finally {
    db.close();
  }
}

/** Writes a backup folder under `destination` (default DATA_DIR/backups) and answers what is in it. */
export async function backupDatabase(destination?: string): Promise<BackupResult> {
  const env = readEnvironment();
  const source = databasePath(env.DATABASE_URL);
  const stamp = new Date().toISOString().replace(/[:.]/g, '-');
  const folder = resolve(destination ?? join(env.DATA_DIR, 'backups'), `lashline-${stamp}`);
  mkdirSync(folder, { recursive: true });
  const databaseFile = join(folder, 'lashline.db');
  const db = createClient({ url: `file:${source}` });
  try {
    await db.execute('PRAGMA busy_timeout = 10000');
    await db.execute({ sql: 'VACUUM INTO ?', args: [databaseFile] });
  } finally {
    db.close();
  }
  const photosFrom = resolve(env.DATA_DIR, 'photos');
  let photos = 0;
  if (existsSync(photosFrom)) {
    // Only finished photos: temporary names are half-written uploads.
    const names = readdirSync(photosFrom).filter((name) => /^[0-9a-f-]{36}\.(jpg|webp)$/.test(name));
    mkdirSync(join(folder, 'photos'), { recursive: true });
    for (const name of names) cpSync(join(photosFrom, name), join(folder, 'photos', name));
    photos = names.length;
  }
  const tables = await countTables(databaseFile);
  writeFileSync(
    join(folder, 'manifest.json'),
    `${JSON.stringify({ format: 'lashline-backup', createdAt: new Date().toISOString(), source: basename(source), photos, photoStorage: env.S3_BUCKET ? `bucket ${env.S3_BUCKET} (not copied)` : 'folder', tables }, null, 2)}\n`,
  );
  return { folder, databaseFile, photos, tables };
}

/** Restores a backup folder (or a bare .db file) into DATABASE_URL and DATA_DIR; refuses to overwrite a database unless forced. */
export async function restoreDatabase(from: string, force = false): Promise<BackupResult> {
  const env = readEnvironment();
  const target = databasePath(env.DATABASE_URL);
  const source = resolve(from);
  const isFolder = statSync(source).isDirectory();
  const databaseFile = isFolder ? join(source, 'lashline.db') : source;
  if (!existsSync(databaseFile))
    throw new Error(`No database in ${source}: expected lashline.db from npm run db:backup.`);
  if (existsSync(target) && statSync(target).size > 0 && !force)
    throw new Error(`${target} exists; stop the server and pass --force to replace it.`);
  for (const suffix of ['', '-wal', '-shm']) rmSync(`${target}${suffix}`, { force: true });
  cpSync(databaseFile, target);
  let photos = 0;
  const photosFrom = join(source, 'photos');
  if (isFolder && existsSync(photosFrom)) {
    const photosTo = resolve(env.DATA_DIR, 'photos');
    mkdirSync(photosTo, { recursive: true });
    for (const name of readdirSync(photosFrom)) {
      cpSync(join(photosFrom, name), join(photosTo, name));
      photos += 1;
    }
  }
  return { folder: source, databaseFile: target, photos, tables: await countTables(target) };
}
