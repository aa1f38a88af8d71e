import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { createClient, type Client } from '@libsql/client';
import { drizzle, type LibSQLDatabase } from 'drizzle-orm/libsql';
import { readEnvironment } from '../environment';
import * as schema from './schema';

/**
 * The one module that knows where the database lives (DATABASE_URL, DATABASE_AUTH_TOKEN).
 *
 * On an embedded file it turns on WAL and a busy timeout. The libSQL client opens a fresh
 * connection after every transaction and never carries PRAGMAs over, so every write goes through
 * `write()`: one queue in this process (no two write transactions ever race for the lock), and the
 * PRAGMAs are applied again to the connection the client opens next.
 */

export type Database = LibSQLDatabase<typeof schema>;
export type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];

const BUSY_TIMEOUT_MS = 5000;

interface Connection {
  client: Client;
  db: Database;
  embedded: boolean;
  url: string;
}

let connection: Connection | undefined;
let writeQueue: Promise<unknown> = Promise.resolve();

/** Turns a `file:` URL with a relative path into one with an absolute path, creating its folder. */
export function fileUrlToAbsolute(url: string): string {
  const path = url.slice('file:'.length);
  if (path === ':memory:') return url;
  const absolute = resolve(path);
  mkdirSync(dirname(absolute), { recursive: true });
  return `file:${absolute}`;
}

async function configureEmbeddedConnection(client: Client): Promise<void> {
  await client.execute(`PRAGMA busy_timeout = ${BUSY_TIMEOUT_MS}`);
  await client.execute('PRAGMA foreign_keys = ON');
}

/** Opens (once) and returns the database connection for this process. */
export async function openDatabase(): Promise<Connection> {
  if (connection) return connection;
  const env = readEnvironment();
  const embedded = env.DATABASE_URL.startsWith('file:');
  const url = embedded ? fileUrlToAbsolute(env.DATABASE_URL) : env.DATABASE_URL;
  const client = createClient({ url, authToken: embedded ? undefined : env.DATABASE_AUTH_TOKEN });
  if (embedded) {
    await client.execute('PRAGMA journal_mode = WAL');
    await configureEmbeddedConnection(client);
  }
  connection = { client, db: drizzle(client, { schema }), embedded, url };
  return connection;
}

/** The Drizzle handle for reads. Writes go through `write()`. */
export async function getDb(): Promise<Database> {
  return (await openDatabase()).db;
}

/**
 * Runs `work` in one write transaction, after every earlier write of this process has ended.
 * The transaction always ends: committed when `work` resolves, rolled back when it throws.
 */
export function write<T>(work: (tx: Transaction) => Promise<T>): Promise<T> {
  const run = async (): Promise<T> => {
    const { client, db, embedded } = await openDatabase();
    try {
      return await db.transaction(work);
    } finally {
      if (embedded) await configureEmbeddedConnection(client);
    }
  };
  const result = writeQueue.then(run, run);
  writeQueue = result.catch(() => undefined);
  return result;
}

/** Closes the connection (tests and command-line scripts). */
export function closeDatabase(): void {
  connection?.client.close();
  connection = undefined;
}
