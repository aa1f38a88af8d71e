import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createClient } from '@libsql/client';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type * as clientModule from '../../../src/db/client';
import { holdWriteLock } from '../../helpers/lock-holder';

/**
 * The known pitfalls of the libSQL client on an embedded file, against src/db/client.ts itself:
 * its transaction() leaves the next statement on a fresh connection without the busy timeout, and
 * leaves the old connection open; a statement that failed with SQLITE_BUSY poisons its connection's
 * next COMMIT. So: a write waits out another process's lock, a failed transaction never keeps the
 * write lock, no connection piles up, and every write of the process goes through one queue, in order.
 */

// Loaded after DATABASE_URL is set for this file; only its type is imported above.
type ClientModule = typeof clientModule;

let folder: string;
let databaseUrl: string;
let database: ClientModule;

const insert = (n: number) => (tx: Parameters<Parameters<ClientModule['write']>[0]>[0]) =>
  tx.run(sql`INSERT INTO items (n) VALUES (${n})`);

async function countItems(): Promise<number> {
  const db = await database.getDb();
  const row = await db.get<{ n: number }>(sql`SELECT count(*) AS n FROM items`);
  return Number(row?.n);
}

/** Whether another connection can take the write lock right now (no waiting: busy_timeout 0). */
async function otherConnectionCanLock(): Promise<boolean> {
  const other = createClient({ url: databaseUrl });
  try {
    await other.execute('BEGIN IMMEDIATE');
    await other.execute('ROLLBACK');
    return true;
  } catch (error) {
    if (/SQLITE_BUSY|database is locked/i.test(String(error))) return false;
    throw error;
  } finally {
    other.close();
  }
}

beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'lashline-db-client-'));
  databaseUrl = `file:${join(folder, 'pitfalls.db')}`;
  // Before the import: the module reads DATABASE_URL once, and vitest gives each file its own modules.
  vi.stubEnv('DATABASE_URL', databaseUrl);
  database = await import('../../../src/db/client');
  const { client } = await database.openDatabase();
  await client.execute('CREATE TABLE items (seq INTEGER PRIMARY KEY AUTOINCREMENT, n INTEGER NOT NULL UNIQUE)');
});

afterAll(() => {
  database?.closeDatabase();
  vi.unstubAllEnvs();
  rmSync(folder, { recursive: true, force: true });
});

describe('the database module on an embedded file', () => {
  it('opens one client however many callers ask at once', async () => {
    database.closeDatabase();
    const opened = await Promise.all(Array.from({ length: 5 }, () => database.openDatabase()));
    expect(new Set(opened.map((connection) => connection.client)).size).toBe(1);
  });

  it('waits for a lock another process holds, in the write after a transaction', async () => {
    await database.write(insert(1));
    const held = await holdWriteLock(databaseUrl, 1000);
    const started = Date.now();
    // After a transaction through the libSQL client's own transaction(), the next statement runs on
    // a fresh connection without the busy timeout: BEGIN IMMEDIATE would fail at once with SQLITE_BUSY.
    await database.write(insert(2));
    const waited = Date.now() - started;
    await held.released;
    expect(waited).toBeGreaterThan(500);
    expect(waited).toBeLessThan(4500);
    expect(await countItems()).toBe(2);
  });

  it('keeps waiting across several transactions in a row', async () => {
    for (let round = 0; round < 3; round += 1) {
      const held = await holdWriteLock(databaseUrl, 300);
      await database.write(insert(100 + round));
      await held.released;
    }
    expect(await countItems()).toBe(5);
  });

  it('releases the write lock when the work throws', async () => {
    await expect(
      database.write(async (tx) => {
        await insert(200)(tx);
        throw new Error('the work failed half-way');
      }),
    ).rejects.toThrow('the work failed half-way');
    expect(await otherConnectionCanLock()).toBe(true);
    expect(await countItems()).toBe(5);
  });

  it('releases the write lock when a statement fails inside the transaction', async () => {
    const failed = await database.write(insert(1)).then(
      () => null,
      (error: Error) => error,
    );
    expect(String(failed?.cause ?? failed)).toMatch(/UNIQUE|constraint/i);
    expect(await otherConnectionCanLock()).toBe(true);
    await database.write(insert(201));
    expect(await countItems()).toBe(6);
  });

  it('holds no lock after a busy error, and the next write succeeds', { timeout: 20_000 }, async () => {
    // Longer than the module's 5 s busy timeout, so the write gives up with SQLITE_BUSY.
    const held = await holdWriteLock(databaseUrl, 6500);
    await expect(database.write(insert(300))).rejects.toThrow(/SQLITE_BUSY|locked/i);
    await held.released;
    expect(await otherConnectionCanLock()).toBe(true);
    await database.write(insert(301));
    expect(await countItems()).toBe(7);
  });

  it('leaves no connection open behind a write (no file descriptors pile up)', async () => {
    const openFiles = () => readdirSync('/proc/self/fd').length;
    await database.write(insert(400));
    const before = openFiles();
    for (let i = 0; i < 200; i += 1) await database.write(insert(401 + i));
    expect(openFiles() - before).toBeLessThan(10);
  });

  it('runs 100 concurrent writes one after another, in the order they were asked for', async () => {
    await database.write((tx) => tx.run(sql`DELETE FROM items`));
    const finished: number[] = [];
    const results = await Promise.allSettled(
      Array.from({ length: 100 }, (_, i) =>
        database
          .write(async (tx) => {
            // A read and a yield inside each transaction: interleaving would show here.
            await tx.get(sql`SELECT count(*) FROM items`);
            await new Promise((resolve) => setImmediate(resolve));
            await insert(i)(tx);
            return i;
          })
          .then((i) => finished.push(i)),
      ),
    );
    expect(results.filter((r) => r.status === 'rejected')).toEqual([]);
    const expected = Array.from({ length: 100 }, (_, i) => i);
    expect(finished).toEqual(expected);
    const db = await database.getDb();
    const rows = await db.all<{ n: number }>(sql`SELECT n FROM items ORDER BY seq`);
    expect(rows.map((row) => Number(row.n))).toEqual(expected);
  });
});
