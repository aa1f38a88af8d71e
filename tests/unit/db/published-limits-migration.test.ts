import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createClient } from '@libsql/client';
import { drizzle } from 'drizzle-orm/libsql';
import { migrate } from 'drizzle-orm/libsql/migrator';
import { afterAll, describe, expect, it } from 'vitest';

// The custom migration that carries today's profiles over to limits as published, run by the real migrator on a
// database that held profiles before it: everything up to it first, then rows as the old code stored them, then
// the rest.
const work = mkdtempSync(join(tmpdir(), 'lashline-published-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** A copy of drizzle/ whose journal stops before the migration with `tag`. */
function migrationsBefore(tag: string): string {
  const folder = join(work, 'before');
  cpSync('drizzle', folder, { recursive: true });
  const journalPath = join(folder, 'meta', '_journal.json');
  const journal = JSON.parse(readFileSync(journalPath, 'utf8')) as { entries: { tag: string }[] };
  const at = journal.entries.findIndex((e) => e.tag === tag);
  expect(at).toBeGreaterThan(0);
  writeFileSync(journalPath, JSON.stringify({ ...journal, entries: journal.entries.slice(0, at) }));
  return folder;
}

describe('the published-limits migration', () => {
  it('gives a profile at the defaults both printed figures and a team’s own figures in mm and N·m', async () => {
    const client = createClient({ url: `file:${join(work, 'db.sqlite')}` });
    const db = drizzle(client);
    await migrate(db, { migrationsFolder: migrationsBefore('0011_published-limits') });
    await client.execute(`INSERT INTO teams (id, name, created_at) VALUES ('t1', 'Team', 0)`);
    const insert = (id: string, values: object) =>
      client.execute({
        sql: `INSERT INTO tolerance_profile_versions (id, team_id, profile_id, version, name, "values", created_at)
              VALUES (?, 't1', ?, 1, 'P', ?, 0)`,
        args: [id, id, JSON.stringify(values)],
      });
    // As the old code stored them: the default figures in mm and N·m (TRADE.md: S, GM 1996, Ford 1997, GM 7-1/2 in)
    const defaults = {
      backlashMin: 0.13,
      backlashMax: 0.23,
      maxSpread: 0.05,
      runoutMax: 0.076,
      pinionPreloadNew: { min: 2.7, max: 3.6 },
      pinionPreloadUsed: { min: 1, max: 1.4 },
      hubPreloadCheck: true,
      lifeLimitRuns: 50,
      nearShare: 0.1,
    };
    await insert('default', defaults);
    await insert('own', { ...defaults, backlashMin: 0.1, pinionPreloadUsed: { min: 1.1, max: 1.7 } });
    await migrate(db, { migrationsFolder: 'drizzle' });
    const rows = await client.execute(`SELECT id, "values" FROM tolerance_profile_versions ORDER BY id`);
    const published = Object.fromEntries(rows.rows.map((r) => [String(r.id), JSON.parse(String(r.values)).published]));
    expect(published.default).toEqual({
      backlashMin: { mm: '0.13', in: '0.005' },
      backlashMax: { mm: '0.23', in: '0.009' },
      maxSpread: { mm: '0.05', in: '0.002' },
      runoutMax: { mm: '0.076', in: '0.003' },
      pinionPreloadNew: { min: { 'N-m': '2.7', 'lbf-in': '24' }, max: { 'N-m': '3.6', 'lbf-in': '32' } },
      pinionPreloadUsed: { min: { 'N-m': '1.0', 'lbf-in': '8' }, max: { 'N-m': '1.4', 'lbf-in': '12' } },
    });
    expect(published.own.backlashMin).toEqual({ mm: '0.1' });
    expect(published.own.backlashMax).toEqual({ mm: '0.23', in: '0.009' });
    expect(published.own.pinionPreloadUsed).toEqual({ min: { 'N-m': '1.1' }, max: { 'N-m': '1.7' } });
    client.close();
  });
});
