import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { createInspection } from '../helpers/inspections';
import { startServer, type RunningServer } from '../helpers/server';
import { sendStreamedBody } from '../helpers/streamed-body';

/**
 * Issue 15 §4: bodies used to be capped only by their declared length, so a chunked body with no length
 * went wholly into memory (300 MB to the sign-in callback took the server from 161 MB to 1.97 GB). Each
 * kind of route gets a chunked body far over its cap: the answer is 413 with `Connection: close`, sent
 * while the client is still writing, and the server's resident memory stays within 100 MB of where it was.
 */

const KB = 1024;
const MB = 1024 * KB;

let server: RunningServer;
let member: ApiClient;
let inspectionId: string;

beforeAll(async () => {
  server = await startServer();
  const made = await signedInClient(server.baseUrl, { team: 'Cap Crew' });
  member = made.client;
  const gearSet = (await member.post('/api/gear-sets', { serial: 'CAP-1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
  inspectionId = await createInspection(member, gearSet);
}, 60_000);
afterAll(async () => {
  await server?.stop();
});

/** The server process's resident memory, in bytes (Linux). */
function residentBytes(): number {
  const status = readFileSync(`/proc/${server.pid()}/status`, 'utf8');
  const kb = /VmRSS:\s+(\d+) kB/.exec(status)?.[1];
  if (!kb) throw new Error('no VmRSS in /proc/<pid>/status');
  return Number(kb) * KB;
}

interface Attack {
  name: string;
  path: string;
  cap: number;
  signedIn: boolean;
  contentType: string;
  head?: string;
}

const boundary = '----lashline-cap-test';
const ATTACKS: Attack[] = [
  {
    name: 'the sign-in callback (Auth.js)',
    path: '/api/auth/callback/credentials',
    cap: 64 * KB,
    signedIn: false,
    contentType: 'application/x-www-form-urlencoded',
    head: 'email=someone%40example.test&password=',
  },
  {
    name: 'a page form (/sign-up)',
    path: '/sign-up',
    cap: 64 * KB,
    signedIn: false,
    contentType: 'application/x-www-form-urlencoded',
    head: 'name=x&email=x%40example.test&password=',
  },
  { name: 'a JSON endpoint', path: '/api/cars', cap: 1 * MB, signedIn: true, contentType: 'application/json' },
  { name: 'the run import', path: '/api/runs/import', cap: 5 * MB, signedIn: true, contentType: 'text/csv' },
  {
    name: 'a photo upload',
    path: '/api/inspections/INSPECTION/photos',
    cap: 15 * MB + 64 * KB,
    signedIn: true,
    contentType: `multipart/form-data; boundary=${boundary}`,
    head: `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`,
  },
  {
    name: 'the team import (API)',
    path: '/api/imports/team',
    cap: 64 * MB,
    signedIn: true,
    contentType: 'application/json',
    head: '{"format":"lashline-team-archive","version":1,"team":{"name":"',
  },
  {
    name: 'the team import (Team data form)',
    path: '/team/data',
    cap: 64 * MB,
    signedIn: true,
    contentType: `multipart/form-data; boundary=${boundary}`,
    head: `--${boundary}\r\nContent-Disposition: form-data; name="archive"; filename="a.json"\r\nContent-Type: application/json\r\n\r\n`,
  },
];

describe('every request body is capped while it streams', () => {
  for (const attack of ATTACKS) {
    it(`${attack.name}: 413 and connection closed past ${attack.cap / KB} KB, memory held`, async () => {
      // Three times the cap and never less than 150 MB: what the server would hold if it read it all.
      const total = Math.max(3 * attack.cap, 150 * MB);
      const chunk = Buffer.alloc(MB, 0x61);
      const before = residentBytes();
      const answer = await sendStreamedBody(server.baseUrl, attack.path.replace('INSPECTION', inspectionId), {
        headers: {
          'content-type': attack.contentType,
          ...(attack.signedIn ? { cookie: member.cookieHeader() } : {}),
        },
        head: attack.head ? Buffer.from(attack.head) : undefined,
        chunk,
        maxChunks: Math.ceil(total / chunk.length),
      });
      const after = residentBytes();
      expect(answer.status, answer.body.slice(0, 300)).toBe(413);
      expect(answer.headers.connection).toBe('close');
      // It stopped reading near the cap; kernel buffers let the client push a little more.
      expect(answer.sentBytes).toBeLessThan(total);
      expect(after - before, `resident memory grew from ${before / MB} MB to ${after / MB} MB`).toBeLessThan(100 * MB);
      // The server is still there for the next request.
      expect((await fetch(`${server.baseUrl}/api/health`)).status).toBe(200);
    }, 60_000);
  }
});
