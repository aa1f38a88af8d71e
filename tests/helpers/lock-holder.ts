import { spawn } from 'node:child_process';
import { PROJECT_ROOT } from './server';

/**
 * Holds SQLite's write lock on a database file from ANOTHER process for `holdMs`, as a backup
 * script or a second server would. It has to be another process: the libSQL client waits for a
 * busy lock synchronously, so a holder in this process could never run its release while a
 * `write()` here is waiting.
 */

const HOLDER = `
import { createClient } from '@libsql/client';
const [url, holdMs] = process.argv.slice(1);
const client = createClient({ url });
await client.execute('BEGIN IMMEDIATE');
process.stdout.write('locked\\n');
await new Promise((resolve) => setTimeout(resolve, Number(holdMs)));
await client.execute('COMMIT');
client.close();
process.stdout.write('released\\n');
`;

export interface HeldLock {
  /** Resolves when the holder has committed and exited. */
  released: Promise<void>;
}

/** Resolves once the other process holds the lock (BEGIN IMMEDIATE succeeded). */
export function holdWriteLock(databaseUrl: string, holdMs: number): Promise<HeldLock> {
  return new Promise((resolveHeld, reject) => {
    const child = spawn(process.execPath, ['--input-type=module', '-e', HOLDER, databaseUrl, String(holdMs)], {
      cwd: PROJECT_ROOT,
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    let held = false;
    const released = new Promise<void>((resolveReleased, rejectReleased) => {
      child.on('exit', (code) =>
        code === 0 ? resolveReleased() : rejectReleased(new Error(`lock holder exited ${code}: ${out}`)),
      );
    });
    released.catch(() => undefined);
    child.stdout.on('data', (chunk) => {
      out += chunk;
      if (!held && out.includes('locked')) {
        held = true;
        resolveHeld({ released });
      }
    });
    child.stderr.on('data', (chunk) => (out += chunk));
    child.on('exit', (code) => {
      if (!held) reject(new Error(`lock holder exited ${code} before locking: ${out}`));
    });
  });
}
