import type { APIRoute } from 'astro';
import { sql } from 'drizzle-orm';
import { getDb } from '../../db/client';
import { countAppliedMigrations } from '../../db/migrate';
import { json } from '../../lib/server/http';

/** Liveness for people and monitors: the database answers, and how many migrations it has. */
export const GET: APIRoute = async () => {
  try {
    const db = await getDb();
    await db.get(sql`SELECT 1`);
    return json({ status: 'ok', database: 'reachable', migrationsApplied: await countAppliedMigrations(db) });
  } catch (error) {
    return json({ status: 'failing', database: 'unreachable', error: { message: (error as Error).message } }, 503);
  }
};
