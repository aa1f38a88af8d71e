import { spawn, type ChildProcess } from 'node:child_process';
import { createClient, type Client } from '@libsql/client';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

/**
 * Starts the real built server (dist/server/entry.mjs) on a free port with a fresh SQLite file
 * that the real migrator made (scripts/prepare.ts, the same step `npm start` runs).
 */

export const PROJECT_ROOT = resolve(import.meta.dirname, '../..');

/** The built server; LASHLINE_DIST points elsewhere (`astro build --outDir …`) so two builds can coexist. */
export const SERVER_ENTRY = join(resolve(PROJECT_ROOT, process.env.LASHLINE_DIST ?? 'dist'), 'server', 'entry.mjs');
/** What `npm start` serves with: the built app behind the security-header wrapper. */
const SERVE_SCRIPT = join(PROJECT_ROOT, 'scripts', 'serve.mjs');

export interface RunningServer {
  baseUrl: string;
  port: number;
  dataDir: string;
  databaseUrl: string;
  output: () => string;
  /** The server process's id (the current one, after a restart), e.g. to read /proc/<pid>/status. */
  pid: () => number | undefined;
  stop: () => Promise<void>;
  /** SIGKILL, as a crash or the OOM killer would: no shutdown code runs. */
  kill: () => Promise<void>;
  /** Stops the server (if still running) and starts it again on the same port, folder and database; after kill(), a restart from a crash. */
  restart: () => Promise<void>;
}

export interface ServerOptions {
  demo?: boolean;
  env?: Record<string, string>;
  /** Reuse this data folder (and its database) instead of a fresh one. */
  dataDir?: string;
}

/** A TCP port nobody is listening on right now. */
export function findFreePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => resolvePort(port));
    });
  });
}

function runToEnd(command: string, args: string[], env: NodeJS.ProcessEnv): Promise<string> {
  return new Promise((resolveRun, reject) => {
    const child = spawn(command, args, { cwd: PROJECT_ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    child.stdout.on('data', (chunk) => (out += chunk));
    child.stderr.on('data', (chunk) => (out += chunk));
    child.on('exit', (code) =>
      code === 0 ? resolveRun(out) : reject(new Error(`${command} ${args.join(' ')} failed:\n${out}`)),
    );
  });
}

async function waitForHealth(baseUrl: string, child: ChildProcess, output: () => string): Promise<void> {
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${output()}`);
    try {
      const response = await fetch(`${baseUrl}/api/health`);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`server did not become healthy:\n${output()}`);
}

/** Prepares a database and starts the server; call `stop()` in afterAll. */
export async function startServer(options: ServerOptions = {}): Promise<RunningServer> {
  const dataDir = options.dataDir ?? mkdtempSync(join(tmpdir(), 'lashline-test-'));
  const port = await findFreePort();
  const databaseUrl = `file:${join(dataDir, 'lashline.db')}`;
  const env: NodeJS.ProcessEnv = {
    PATH: process.env.PATH,
    HOME: process.env.HOME,
    NODE_ENV: 'production',
    ASTRO_TELEMETRY_DISABLED: '1',
    DATABASE_URL: databaseUrl,
    DATA_DIR: dataDir,
    LASHLINE_DIST: resolve(PROJECT_ROOT, process.env.LASHLINE_DIST ?? 'dist'),
    HOST: '127.0.0.1',
    PORT: String(port),
    LASHLINE_DEMO: options.demo ? 'on' : 'off',
    MAIL_CATCHER: 'off',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: '9',
    ...options.env,
  };
  // An empty value in options.env removes the variable (e.g. SMTP_HOST: '' to use the built-in mail catcher).
  for (const [name, value] of Object.entries(env)) if (value === '') delete env[name];
  await runToEnd(process.execPath, ['--import', 'tsx', 'scripts/prepare.ts'], env);
  let log = '';
  let child: ChildProcess;
  const baseUrl = `http://127.0.0.1:${port}`;
  const launch = async (): Promise<void> => {
    child = spawn(process.execPath, [SERVE_SCRIPT], { cwd: PROJECT_ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
    child.stdout?.on('data', (chunk) => (log += chunk));
    child.stderr?.on('data', (chunk) => (log += chunk));
    await waitForHealth(baseUrl, child, () => log);
  };
  const end = (signal: NodeJS.Signals) =>
    new Promise<void>((resolveEnd) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolveEnd();
      child.once('exit', () => resolveEnd());
      child.kill(signal);
    });
  await launch();
  return {
    baseUrl,
    port,
    dataDir,
    databaseUrl,
    output: () => log,
    pid: () => child.pid,
    kill: () => end('SIGKILL'),
    restart: async () => {
      await end('SIGTERM');
      await launch();
    },
    stop: async () => {
      await end('SIGTERM');
      if (!options.dataDir) rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/**
 * A direct handle on a test server's database file, for what a test must see or set behind the API's back.
 * It waits for the server's own writes (busy timeout) instead of failing with SQLITE_BUSY.
 */
export async function openDatabase(databaseUrl: string): Promise<Client> {
  const db = createClient({ url: databaseUrl });
  await db.execute('PRAGMA busy_timeout = 10000');
  return db;
}
