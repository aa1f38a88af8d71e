import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { createClient } from '@libsql/client';
import { PROJECT_ROOT, type RunningServer } from './server';
import type { ApiClient } from './api-client';
import { uploadPhoto } from './images';

/**
 * kill -9 in the middle of writes, for tests/api/crash.test.ts and bench/crash-restart.ts: clients
 * stream runs and photo uploads until the server dies under them; after the restart the checks say
 * whether the database is whole, every migration is applied, every acknowledged write is there,
 * and no half-stored photo is left or served.
 */

/** The number of migration files in drizzle/. */
export const MIGRATION_FILES = readdirSync(join(PROJECT_ROOT, 'drizzle')).filter((name) =>
  name.endsWith('.sql'),
).length;

export interface Acknowledged {
  runs: string[];
  photos: string[];
  /** Requests the kill cut off (no answer). */
  cutOff: number;
  /** Answers other than 201 while the server was up (the caller expects none). */
  unexpected: string[];
}

/** Logs runs from `client` until it gets no answer (the server died) or `deadline` passes. */
async function streamRuns(
  client: ApiClient,
  carId: string,
  tag: string,
  deadline: number,
  into: Acknowledged,
): Promise<void> {
  for (let i = 0; Date.now() < deadline && i < 10_000; i += 1) {
    // Distinct times in the past: a run more than a day ahead is refused.
    const at = new Date(Date.UTC(2023, 0, 1) + Math.floor(Math.random() * 50_000_000) * 1000).toISOString();
    let response: Response;
    try {
      response = await client.request('/api/runs', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ carId, at, notes: `${tag} #${i}` }),
      });
    } catch {
      into.cutOff += 1;
      return;
    }
    let text = '';
    try {
      text = await response.text();
    } catch {
      // The answer began but the body never arrived: not acknowledged.
      into.cutOff += 1;
      return;
    }
    if (response.status === 201) into.runs.push((JSON.parse(text) as { id: string }).id);
    else into.unexpected.push(`run: ${response.status} ${text.slice(0, 200)}`);
  }
}

/** Uploads `bytes` as photos of the inspection until the server dies or `deadline` passes. */
async function streamUploads(
  client: ApiClient,
  inspectionId: string,
  bytes: Uint8Array,
  deadline: number,
  into: Acknowledged,
): Promise<void> {
  for (let i = 0; Date.now() < deadline && i < 1000; i += 1) {
    let answer: Awaited<ReturnType<typeof uploadPhoto>>;
    try {
      answer = await uploadPhoto(client, inspectionId, bytes, { side: i % 2 ? 'coast' : 'drive' });
    } catch {
      into.cutOff += 1;
      return;
    }
    if (answer.status === 201) into.photos.push(answer.body.id as string);
    else into.unexpected.push(`photo: ${answer.status} ${JSON.stringify(answer.body).slice(0, 200)}`);
  }
}

export interface CrashTarget {
  server: RunningServer;
  /** Clients that log runs (one stream each). */
  writers: ApiClient[];
  carId: string;
  /** The client that uploads, and the inspection it may add photos to. */
  uploader: ApiClient;
  inspectionId: string;
  photo: Uint8Array;
}

/**
 * Streams writes and uploads, kills the server with SIGKILL after `killAfterMs`, and returns what
 * was acknowledged before the kill (every stream ends when its request is cut off).
 */
export async function writeUntilKilled(target: CrashTarget, killAfterMs: number, tag: string): Promise<Acknowledged> {
  const acknowledged: Acknowledged = { runs: [], photos: [], cutOff: 0, unexpected: [] };
  // A deadline well after the kill bounds every loop even if a kill went wrong.
  const deadline = Date.now() + killAfterMs + 10_000;
  const streams = [
    ...target.writers.map((client, i) => streamRuns(client, target.carId, `${tag}/${i}`, deadline, acknowledged)),
    streamUploads(target.uploader, target.inspectionId, target.photo, deadline, acknowledged),
  ];
  await new Promise((resolve) => setTimeout(resolve, killAfterMs));
  await target.server.kill();
  await Promise.all(streams);
  return acknowledged;
}

export interface AfterRestart {
  integrity: string;
  migrationsApplied: number;
  missingRuns: string[];
  missingPhotos: string[];
  /** inspection_photos rows whose full image or thumbnail is missing or not a whole JPEG. */
  brokenPhotoRows: string[];
  /** Temporary files of interrupted writes found in the photo folder. */
  partialFiles: string[];
  /** Temporary files that a photo URL served. */
  servedPartials: string[];
}

/** A whole JPEG starts with SOI (FF D8) and ends with EOI (FF D9). */
function isWholeJpeg(path: string): boolean {
  if (!existsSync(path)) return false;
  const bytes = readFileSync(path);
  return (
    bytes.length > 4 &&
    bytes[0] === 0xff &&
    bytes[1] === 0xd8 &&
    bytes[bytes.length - 2] === 0xff &&
    bytes[bytes.length - 1] === 0xd9
  );
}

/** The checks after a restart; `client` is a signed-in member of the team. */
export async function checkAfterRestart(
  server: RunningServer,
  client: ApiClient,
  acknowledged: { runs: Iterable<string>; photos: Iterable<string> },
): Promise<AfterRestart> {
  const db = createClient({ url: server.databaseUrl });
  try {
    const integrity = (await db.execute('PRAGMA integrity_check')).rows.map((row) => String(row[0])).join('; ');
    const runIds = new Set((await db.execute('SELECT id FROM runs')).rows.map((row) => String(row[0])));
    const photoRows = (await db.execute('SELECT id, storage_key, thumbnail_key FROM inspection_photos')).rows.map(
      (row) => ({ id: String(row[0]), keys: [String(row[1]), String(row[2])] }),
    );
    const folder = join(server.dataDir, 'photos');
    const files = existsSync(folder) ? readdirSync(folder) : [];
    const partialFiles = files.filter((name) => name.endsWith('.partial'));
    const servedPartials: string[] = [];
    for (const name of partialFiles.slice(0, 5)) {
      for (const path of [
        `/api/photos/${encodeURIComponent(name)}`,
        `/api/photos/${encodeURIComponent(name.replace(/^\./, '').replace(/\.[^.]+\.partial$/, ''))}`,
      ]) {
        const response = await client.request(path);
        await response.arrayBuffer();
        if (response.status !== 404) servedPartials.push(`${path} → ${response.status}`);
      }
    }
    const health = await client.get<{ migrationsApplied: number }>('/api/health');
    const photoIds = new Set(photoRows.map((row) => row.id));
    return {
      integrity,
      migrationsApplied: health.body.migrationsApplied,
      missingRuns: [...acknowledged.runs].filter((id) => !runIds.has(id)),
      missingPhotos: [...acknowledged.photos].filter((id) => !photoIds.has(id)),
      brokenPhotoRows: photoRows
        .filter((row) => !row.keys.every((key) => isWholeJpeg(join(folder, key))))
        .map((row) => row.id),
      partialFiles,
      servedPartials,
    };
  } finally {
    db.close();
  }
}

/** The column names the checks read, so a schema rename fails loudly here rather than passing. */
export async function assertPhotoColumns(databaseUrl: string): Promise<void> {
  const db = createClient({ url: databaseUrl });
  try {
    const columns = (await db.execute('PRAGMA table_info(inspection_photos)')).rows.map((row) => String(row[1]));
    for (const name of ['id', 'storage_key', 'thumbnail_key'])
      if (!columns.includes(name)) throw new Error(`inspection_photos has no column ${name}: ${columns.join(', ')}`);
  } finally {
    db.close();
  }
}
