import { spawn } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createClient } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { PROJECT_ROOT, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let client: ApiClient;
let carId: string;
beforeAll(async () => {
  server = await startServer();
  client = (await signedInClient(server.baseUrl, { team: 'Backup Crew' })).client;
  carId = (await client.post('/api/cars', { name: 'Backup car' })).body.id;
});
afterAll(() => server?.stop());

function run(script: string, args: string[], env: Record<string, string>): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', script, ...args], {
      cwd: PROJECT_ROOT,
      env: { PATH: process.env.PATH, HOME: process.env.HOME, ...env },
    });
    let out = '';
    child.stdout.on('data', (c) => (out += c));
    child.stderr.on('data', (c) => (out += c));
    child.on('exit', (code) => (code === 0 ? resolve(out) : reject(new Error(out))));
  });
}

async function counts(url: string): Promise<{ runs: number; integrity: string }> {
  const db = createClient({ url });
  const runs = Number((await db.execute('SELECT count(*) AS n FROM runs')).rows[0]?.n);
  const integrity = String((await db.execute('PRAGMA integrity_check')).rows[0]?.integrity_check);
  db.close();
  return { runs, integrity };
}

describe('npm run db:backup and db:restore', () => {
  it('copies the live database during writes and restores it into an empty folder with every count equal', async () => {
    let stop = false;
    let acknowledged = 0;
    const writers = Array.from({ length: 4 }, async (_, w) => {
      for (let i = 0; !stop && i < 2000; i += 1) {
        const answer = await client.post('/api/runs', {
          carId,
          at: new Date(Date.UTC(2026, 0, 1) + (w * 10_000 + i) * 60_000).toISOString(),
        });
        if (answer.status === 201) acknowledged += 1;
      }
    });
    await new Promise((r) => setTimeout(r, 700));
    const backupDir = mkdtempSync(join(tmpdir(), 'lashline-backup-'));
    const output = await run('scripts/db-backup.ts', [backupDir], {
      DATABASE_URL: server.databaseUrl,
      DATA_DIR: server.dataDir,
    });
    stop = true;
    await Promise.all(writers);
    const folder = /Backup written to (\S+):/.exec(output)![1]!;
    const backedUp = await counts(`file:${join(folder, 'lashline.db')}`);
    expect(backedUp.integrity).toBe('ok');
    expect(backedUp.runs).toBeGreaterThan(0);
    expect(backedUp.runs).toBeLessThanOrEqual(acknowledged);

    const empty = mkdtempSync(join(tmpdir(), 'lashline-restored-'));
    await run('scripts/db-restore.ts', [folder], {
      DATABASE_URL: `file:${join(empty, 'lashline.db')}`,
      DATA_DIR: empty,
    });
    const restored = await startServer({ dataDir: empty });
    try {
      const restoredCounts = await counts(restored.databaseUrl);
      expect(restoredCounts).toEqual(backedUp);
      const health = await fetch(`${restored.baseUrl}/api/health`).then((r) => r.json());
      expect(health.database).toBe('reachable');
    } finally {
      await restored.stop();
    }
    // Restoring over a live database needs --force.
    await expect(
      run('scripts/db-restore.ts', [folder], { DATABASE_URL: server.databaseUrl, DATA_DIR: server.dataDir }),
    ).rejects.toThrow(/--force/);
  }, 90_000);
});
