import { AsyncLocalStorage } from 'node:async_hooks';
import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { createClient, type Client } from '@libsql/client';
import type { Logger } from 'drizzle-orm';
import { drizzle, type LibSQLDatabase } from 'drizzle-orm/libsql';
import { readEnvironment } from '../environment';
import * as schema from './schema';

/**
 * The one module that knows where the database lives (DATABASE_URL, DATABASE_AUTH_TOKEN).
 *
 * On an embedded file it turns on WAL and a busy timeout, and keeps two connections: one for reads,
 * and one that only `write()` uses, one transaction at a time (a queue in this process, so no two
 * write transactions ever race for the lock). The libSQL client's own `transaction()` hands its
 * connection to the transaction, never closes it, and opens a fresh one without the PRAGMAs: a file
 * descriptor pair and a connection opened per write. `write()` runs BEGIN IMMEDIATE … COMMIT on its
 * own connection instead, which keeps its PRAGMAs for good.
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

interface Writer {
  client: Client;
  db: Database;
}

// Test-only: with LASHLINE_COUNT_QUERIES=1 in the environment when this module loads, every statement
// either connection sends is counted for the `countQueries()` call it runs inside (an async context, so
// work running beside it is not counted). Without it no logger is installed and nothing is counted.
const queryCounts = new AsyncLocalStorage<{ queries: number }>();
const COUNTING = process.env.LASHLINE_COUNT_QUERIES === '1';
const countingLogger: Logger = {
  logQuery() {
    const counter = queryCounts.getStore();
    if (counter) counter.queries += 1;
  },
};
const drizzleOptions = COUNTING ? { schema, logger: countingLogger } : { schema };

/**
 * Test-only: runs `work` and answers how many statements it sent to the database, reads and writes.
 * Needs LASHLINE_COUNT_QUERIES=1 set before this module loads (tests stub it before their import).
 */
export async function countQueries<T>(work: () => Promise<T>): Promise<{ result: T; queries: number }> {
  if (!COUNTING) throw new Error('countQueries needs LASHLINE_COUNT_QUERIES=1 set before src/db/client.ts loads.');
  const counter = { queries: 0 };
  const result = await queryCounts.run(counter, work);
  return { result, queries: counter.queries };
}

let connection: Connection | undefined;
let opening: Promise<Connection> | undefined;
let writer: Writer | undefined;
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

/** Opens (once, however many callers ask at the same moment) and returns the database connection for this process. */
export function openDatabase(): Promise<Connection> {
  opening ??= connect().catch((error: unknown) => {
    opening = undefined;
    throw error;
  });
  return opening;
}

async function connect(): Promise<Connection> {
  const env = readEnvironment();
  const embedded = env.DATABASE_URL.startsWith('file:');
  const url = embedded ? fileUrlToAbsolute(env.DATABASE_URL) : env.DATABASE_URL;
  const client = createClient({ url, authToken: embedded ? undefined : env.DATABASE_AUTH_TOKEN });
  if (embedded) {
    await client.execute('PRAGMA journal_mode = WAL');
    await configureEmbeddedConnection(client);
  }
  connection = { client, db: drizzle(client, drizzleOptions), embedded, url };
  return connection;
}

/** The Drizzle handle for reads. Writes go through `write()`. */
export async function getDb(): Promise<Database> {
  return (await openDatabase()).db;
}

async function openWriter(url: string): Promise<Writer> {
  if (writer) return writer;
  const client = createClient({ url });
  await configureEmbeddedConnection(client);
  writer = { client, db: drizzle(client, drizzleOptions) };
  return writer;
}

/** Whether `error`, or an error it wraps (Drizzle wraps failed queries), is SQLite's SQLITE_BUSY. */
function isBusyError(error: unknown): boolean {
  for (let current = error, depth = 0; current instanceof Error && depth < 5; current = current.cause, depth += 1) {
    const code = (current as { code?: unknown }).code;
    if (typeof code === 'string' && code.startsWith('SQLITE_BUSY')) return true;
  }
  return false;
}

/** Closes the writer connection; the next write opens a fresh one. */
function dropWriter(client: Client): void {
  if (writer?.client === client) writer = undefined;
  client.close();
}

/** One transaction on the writer connection; only ever called from the queue in `write()`. */
async function runOnWriter<T>(url: string, work: (tx: Transaction) => Promise<T>): Promise<T> {
  const { client, db } = await openWriter(url);
  try {
    await client.execute('BEGIN IMMEDIATE');
  } catch (error) {
    // The client never resets a statement that failed with SQLITE_BUSY (a BEGIN IMMEDIATE that
    // waited out the busy timeout), and the connection then refuses every later COMMIT ("SQL
    // statements in progress"): the next write opens a fresh one.
    if (isBusyError(error)) dropWriter(client);
    throw error;
  }
  try {
    // The writer's own handle, inside BEGIN … COMMIT: the same query builder a Drizzle transaction offers.
    const result = await work(db as unknown as Transaction);
    await client.execute('COMMIT');
    return result;
  } catch (error) {
    // Some errors (a full disk) have already rolled the transaction back; then ROLLBACK has nothing to do.
    await client.execute('ROLLBACK').catch(() => undefined);
    if (isBusyError(error)) dropWriter(client);
    throw error;
  }
}

/**
 * Runs `work` in one write transaction, after every earlier write of this process has ended.
 * The transaction always ends: committed when `work` resolves, rolled back when it throws.
 */
export function write<T>(work: (tx: Transaction) => Promise<T>): Promise<T> {
  const run = async (): Promise<T> => {
    const { db, embedded, url } = await openDatabase();
    return embedded ? runOnWriter(url, work) : db.transaction(work);
  };
  const result = writeQueue.then(run, run);
  writeQueue = result.catch(() => undefined);
  return result;
}

/** Closes the connections (tests and command-line scripts). */
export function closeDatabase(): void {
  connection?.client.close();
  writer?.client.close();
  connection = undefined;
  opening = undefined;
  writer = undefined;
}
