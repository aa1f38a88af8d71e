import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, uniqueEmail, type ApiClient } from '../helpers/api-client';
import {
  MIGRATION_FILES,
  assertPhotoColumns,
  checkAfterRestart,
  writeUntilKilled,
  type CrashTarget,
} from '../helpers/crash';
import { fetchPhoto, noiseImage } from '../helpers/images';
import { createInspection } from '../helpers/inspections';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { createRandom, pickInteger } from '../helpers/seeded-random';

/**
 * kill -9 in the middle of writes, five times (bench/crash-restart.ts does it a hundred times):
 * after each restart on the same folder the database is whole, every migration is applied, every
 * write acknowledged before the kill is there, and no half-stored photo is left or served. The
 * outbox keeps a message queued before a kill and delivers it once after the restart.
 */

const KILLS = 5;
const SEED = Number(process.env.CRASH_SEED ?? Date.now() % 100_000);

let server: RunningServer;
let smtp: SmtpFake;
let owner: ApiClient;
let target: CrashTarget;

beforeAll(async () => {
  // The fake mail server is made (its port fixed) but not started: the outbox cannot deliver yet.
  smtp = await SmtpFake.create();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  owner = (await signedInClient(server.baseUrl, { team: 'Crash Crew' })).client;
  const carId = (await owner.post('/api/cars', { name: 'Crash car' })).body.id as string;
  const gearSetId = (await owner.post('/api/gear-sets', { serial: 'CRASH-1', ringTeeth: 41, pinionTeeth: 10 })).body
    .id as string;
  const inspectionId = await createInspection(owner, gearSetId);
  const photo = await noiseImage('jpeg', 800, 600);
  target = { server, writers: [owner, owner, owner], carId, uploader: owner, inspectionId, photo };
  await assertPhotoColumns(server.databaseUrl);
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

describe('kill -9 during writes', () => {
  it(
    `keeps the database whole and every acknowledged write, ${KILLS} times (seed ${SEED})`,
    { timeout: 120_000 },
    async () => {
      const random = createRandom(SEED);
      const runs = new Set<string>();
      const photos = new Set<string>();
      let cutOff = 0;
      for (let kill = 1; kill <= KILLS; kill += 1) {
        const killAfterMs = pickInteger(random, 300, 3000);
        const acknowledged = await writeUntilKilled(target, killAfterMs, `kill ${kill}`);
        acknowledged.runs.forEach((id) => runs.add(id));
        acknowledged.photos.forEach((id) => photos.add(id));
        cutOff += acknowledged.cutOff;
        expect(acknowledged.unexpected, `kill ${kill} after ${killAfterMs} ms (seed ${SEED})`).toEqual([]);
        await server.restart();
        const after = await checkAfterRestart(server, owner, { runs, photos });
        const context = `kill ${kill} after ${killAfterMs} ms (seed ${SEED})`;
        expect(after.integrity, context).toBe('ok');
        expect(after.migrationsApplied, context).toBe(MIGRATION_FILES);
        expect(after.missingRuns, context).toEqual([]);
        expect(after.missingPhotos, context).toEqual([]);
        expect(after.brokenPhotoRows, context).toEqual([]);
        expect(after.servedPartials, context).toEqual([]);
      }
      console.log(
        `crash: ${KILLS} kills (seed ${SEED}), ${runs.size} runs and ${photos.size} photos acknowledged and all present, ${cutOff} requests cut off`,
      );
      expect(runs.size).toBeGreaterThan(0);
      expect(cutOff).toBeGreaterThanOrEqual(KILLS);

      // Every photo row the API lists after the last restart serves its image and thumbnail.
      const listed = await owner.get<{ items: { url: string; thumbnailUrl: string }[] }>(
        `/api/inspections/${target.inspectionId}/photos`,
      );
      expect(listed.status).toBe(200);
      for (const item of listed.body.items) {
        for (const url of [item.url, item.thumbnailUrl]) {
          const { response, bytes } = await fetchPhoto(owner, url);
          expect(response.status, url).toBe(200);
          expect(response.headers.get('content-type')).toBe('image/jpeg');
          expect(bytes.subarray(-2)).toEqual(Buffer.from([0xff, 0xd9]));
        }
      }
    },
  );

  it('delivers a message queued before the kill exactly once after the restart', { timeout: 60_000 }, async () => {
    const email = uniqueEmail('after-crash');
    const invited = await owner.post('/api/invitations', { email, role: 'viewer' });
    expect(invited.status).toBe(201);
    // Wait for the worker's first attempt to fail (the mail server is not listening), so the kill
    // lands on a message that is queued with a failed attempt behind it.
    const deadline = Date.now() + 10_000;
    let row: { to: string; status: string; attempts: number } | undefined;
    while (Date.now() < deadline) {
      row = (
        await owner.get<{ items: { to: string; status: string; attempts: number }[] }>('/api/outbox')
      ).body.items.find((item) => item.to === email);
      if (row && row.attempts >= 1) break;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    expect(row).toMatchObject({ status: 'queued' });
    expect(row!.attempts).toBeGreaterThanOrEqual(1);
    expect(smtp.received).toEqual([]);

    await server.kill();
    await smtp.start();
    await server.restart();
    await smtp.waitFor((mail) => mail.to.includes(email), 20_000);
    // Two more polls of the worker (every 2 s): a second copy would arrive here.
    await new Promise((resolve) => setTimeout(resolve, 4500));
    expect(smtp.received.filter((mail) => mail.to.includes(email))).toHaveLength(1);
    const sent = (await owner.get<{ items: { to: string; status: string }[] }>('/api/outbox')).body.items.filter(
      (item) => item.to === email,
    );
    expect(sent).toEqual([expect.objectContaining({ status: 'sent' })]);
  });
});
