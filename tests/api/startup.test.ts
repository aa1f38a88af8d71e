import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PROJECT_ROOT } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';

/**
 * `npm start` runs scripts/prepare.ts before the server: migrations, the session secret and the demo seed.
 * With a reachable mail server configured, that step must still end by itself (the demo's reviews queue
 * notices; the server's outbox worker sends them, not the prepare step).
 */

let smtp: SmtpFake;
let folder: string;

beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  folder = mkdtempSync(join(tmpdir(), 'lashline-prepare-'));
});
afterAll(async () => {
  await smtp?.stop();
  rmSync(folder, { recursive: true, force: true });
});

function runPrepare(env: Record<string, string>): Promise<{ code: number | null; output: string; ms: number }> {
  const started = Date.now();
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/prepare.ts'], {
      cwd: PROJECT_ROOT,
      env: { PATH: process.env.PATH, HOME: process.env.HOME, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout.on('data', (chunk) => (output += chunk));
    child.stderr.on('data', (chunk) => (output += chunk));
    // Far longer than the step needs; a step that hangs is killed and reported as such.
    const guard = setTimeout(() => child.kill('SIGKILL'), 60_000);
    child.on('exit', (code) => {
      clearTimeout(guard);
      resolve({ code, output, ms: Date.now() - started });
    });
  });
}

describe('the prepare step of npm start', () => {
  it('loads the demo into an empty database and exits with a reachable mail server configured', async () => {
    const result = await runPrepare({
      DATABASE_URL: `file:${join(folder, 'lashline.db')}`,
      DATA_DIR: folder,
      LASHLINE_DEMO: 'on',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(smtp.port),
    });
    expect(result.output).toContain('Demo scenario loaded');
    expect(result.code).toBe(0);
    // The queued notices wait for the server's worker: the prepare step sent nothing.
    expect(smtp.received).toHaveLength(0);
  }, 90_000);
});
