import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { createClient } from '@libsql/client';
import { drizzle } from 'drizzle-orm/libsql';
import { migrate } from 'drizzle-orm/libsql/migrator';
import { afterAll, describe, expect, it } from 'vitest';

/**
 * The data migration that takes storage keys out of the audit entries written before issue 15: a
 * database migrated up to just before it, with a photo's audit entries as addPhoto and deletePhoto
 * wrote them, then the migration itself.
 */

const folder = mkdtempSync(join(tmpdir(), 'lashline-audit-keys-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('the audit-without-storage-keys migration', () => {
  it('removes storageKey and thumbnailKey from photo audit entries and leaves the rest', async () => {
    const migrations = join(folder, 'drizzle');
    cpSync(resolve('drizzle'), migrations, { recursive: true });
    const journalPath = join(migrations, 'meta', '_journal.json');
    const journal = JSON.parse(readFileSync(journalPath, 'utf8')) as { entries: { tag: string }[] };
    const mine = journal.entries.findIndex((entry) => entry.tag.endsWith('audit-without-storage-keys'));
    expect(mine).toBeGreaterThan(0);
    writeFileSync(journalPath, JSON.stringify({ ...journal, entries: journal.entries.slice(0, mine) }));

    const client = createClient({ url: `file:${join(folder, 'db.sqlite')}` });
    const db = drizzle(client);
    await migrate(db, { migrationsFolder: migrations });
    const row = { id: 'p1', storageKey: 'a.jpg', thumbnailKey: 'b.jpg', side: 'drive' };
    await client.execute({
      sql: `INSERT INTO audit_events (id, action, record_type, record_id, before, after) VALUES
        ('a1', 'create', 'inspection-photo', 'p1', NULL, ?), ('a2', 'delete', 'inspection-photo', 'p1', ?, NULL),
        ('a3', 'create', 'car', 'c1', NULL, '{"name":"storageKey stays in text"}')`,
      args: [JSON.stringify(row), JSON.stringify(row)],
    });

    writeFileSync(journalPath, JSON.stringify(journal));
    await migrate(db, { migrationsFolder: migrations });
    const rows = (await client.execute('SELECT id, before, after FROM audit_events ORDER BY id')).rows;
    expect(JSON.parse(String(rows[0]!.after))).toEqual({ id: 'p1', side: 'drive' });
    expect(JSON.parse(String(rows[1]!.before))).toEqual({ id: 'p1', side: 'drive' });
    expect(rows[1]!.after).toBeNull();
    expect(JSON.parse(String(rows[2]!.after))).toEqual({ name: 'storageKey stays in text' });
    client.close();
  });
});
