import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type * as clientModule from '../../../src/db/client';
import type * as limitModule from '../../../src/lib/server/reset-limit';

/**
 * The limit on password-reset and verification-link requests (the shared attempt table), on a real SQLite file made by the
 * real migrations, with the time passed in: per address and per client, a sliding window, nothing
 * written for a refused request, and a Retry-After that says when the first place frees.
 */

let folder: string;
let database: typeof clientModule;
let limit: typeof limitModule;

beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'lashline-reset-limit-'));
  // Before the imports: the database module reads DATABASE_URL once.
  vi.stubEnv('DATABASE_URL', `file:${join(folder, 'limit.db')}`);
  database = await import('../../../src/db/client');
  const { applyMigrations } = await import('../../../src/db/migrate');
  await applyMigrations(await database.getDb());
  limit = await import('../../../src/lib/server/reset-limit');
});
afterAll(() => {
  database?.closeDatabase();
  vi.unstubAllEnvs();
  rmSync(folder, { recursive: true, force: true });
});

const HOUR = 60 * 60_000;
const start = new Date('2026-12-05T10:00:00Z');
const at = (ms: number) => new Date(start.getTime() + ms);

async function take(email: string, clientAddress: string, now: Date): Promise<{ ok: true } | { retryAfter: number }> {
  try {
    await database.write((tx) => limit.takeMailLinkAllowance(tx, { kind: 'reset', email, clientAddress }, now));
    return { ok: true };
  } catch (error) {
    const refusal = error as { status?: number; headers?: Record<string, string> };
    expect(refusal.status).toBe(429);
    return { retryAfter: Number(refusal.headers?.['Retry-After']) };
  }
}

async function countRows(): Promise<number> {
  const db = await database.getDb();
  return Number(
    (await db.get<{ n: number }>(sql`SELECT count(*) AS n FROM limit_attempts WHERE kind LIKE 'mail-link-%'`))?.n,
  );
}

describe('the mail-link counter', () => {
  it('allows 3 an hour per address, then says when the oldest leaves the window', async () => {
    expect(limit.MAIL_LINK_LIMITS.perAddress.max).toBe(3);
    for (const minute of [0, 10, 20])
      expect(await take('a@example.test', '10.0.0.1', at(minute * 60_000))).toEqual({ ok: true });
    const rows = await countRows();
    // 30 minutes in: the request at minute 0 frees its place at minute 60, 30 minutes from now.
    expect(await take('a@example.test', '10.0.0.2', at(30 * 60_000))).toEqual({ retryAfter: 30 * 60 });
    expect(await countRows()).toBe(rows);
    // Just past the hour the first request has left the window.
    expect(await take('a@example.test', '10.0.0.3', at(HOUR + 1))).toEqual({ ok: true });
    // Another address is counted on its own.
    expect(await take('b@example.test', '10.0.0.1', at(HOUR + 2))).toEqual({ ok: true });
  });

  it('allows 20 an hour per client whatever addresses it names', async () => {
    const base = 5 * HOUR;
    for (let i = 0; i < limit.MAIL_LINK_LIMITS.perClient.max; i += 1)
      expect(await take(`spray-${i}@example.test`, '10.9.9.9', at(base + i))).toEqual({ ok: true });
    const refused = await take('one-more@example.test', '10.9.9.9', at(base + 1000));
    expect(refused).toEqual({ retryAfter: Math.ceil((HOUR - 1000) / 1000) });
    expect(await take('one-more@example.test', '10.9.9.10', at(base + 1000))).toEqual({ ok: true });
  });

  it('forgets requests older than the window as new ones come', async () => {
    await take('late@example.test', '10.1.1.1', at(50 * HOUR));
    const db = await database.getDb();
    const oldest = Number(
      (await db.get<{ at: number }>(sql`SELECT min(at) AS at FROM limit_attempts WHERE kind LIKE 'mail-link-%'`))?.at,
    );
    expect(oldest).toBeGreaterThan(at(49 * HOUR).getTime());
  });
});
