import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { sql } from 'drizzle-orm';
import { migrate } from 'drizzle-orm/libsql/migrator';
import type { Database } from './client';

/**
 * The folder of generated migrations. Found by walking up from this module (which lives in src/db
 * when run by tsx and in dist/server/chunks when built), so the server may start from any folder.
 */
export function findMigrationsFolder(start = dirname(fileURLToPath(import.meta.url))): string {
  for (let dir = start; ; dir = dirname(dir)) {
    const candidate = join(dir, 'drizzle');
    if (existsSync(join(candidate, 'meta', '_journal.json'))) return candidate;
    if (dirname(dir) === dir) return resolve('drizzle');
  }
}

/** Applies every migration in drizzle/ that the database has not seen yet. */
export async function applyMigrations(db: Database): Promise<void> {
  await migrate(db, { migrationsFolder: findMigrationsFolder() });
}

/** Counts the migrations recorded as applied (0 for a database never migrated). */
export async function countAppliedMigrations(db: Database): Promise<number> {
  const table = await db.get<{ n: number }>(
    sql`SELECT count(*) AS n FROM sqlite_master WHERE type = 'table' AND name = '__drizzle_migrations'`,
  );
  if (!table || Number(table.n) === 0) return 0;
  const row = await db.get<{ n: number }>(sql`SELECT count(*) AS n FROM __drizzle_migrations`);
  return Number(row?.n ?? 0);
}
