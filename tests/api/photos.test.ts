import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient } from '../helpers/api-client';
import {
  GPS_TAGS,
  METADATA_MARKERS,
  cameraJpeg,
  fetchPhoto,
  largeTransparentPng,
  noiseImage,
  pngBomb,
  pngHeaderBomb,
  readExifTags,
  uploadPhoto,
} from '../helpers/images';
import { createInspection } from '../helpers/inspections';
import { sendStreamedBody } from '../helpers/streamed-body';
import { startServer, type RunningServer, openDatabase } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';
import { makeTeamOfFour, type TeamOfFour } from '../helpers/team';

let server: RunningServer;
let smtp: SmtpFake;
let team: TeamOfFour;
let stranger: ApiClient;
/** Inspections: one the technician recorded, one the crew chief recorded, one of another team. */
const inspection = { byTech: '', byChief: '', elsewhere: '' };

beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  team = await makeTeamOfFour(server.baseUrl, smtp, 'Photo Crew');
  const gearSet = (await team.chief.post('/api/gear-sets', { serial: 'PH-G1', ringTeeth: 41, pinionTeeth: 10 })).body
    .id;
  inspection.byTech = await createInspection(team.tech, gearSet);
  inspection.byChief = await createInspection(team.chief, gearSet);
  stranger = (await signedInClient(server.baseUrl, { team: 'Other Photo Crew' })).client;
  const theirGearSet = (await stranger.post('/api/gear-sets', { serial: 'THEIRS-G1', ringTeeth: 41, pinionTeeth: 10 }))
    .body.id;
  inspection.elsewhere = await createInspection(stranger, theirGearSet);
});
afterAll(async () => {
  await server?.stop();
  await smtp?.stop();
});

async function sql(statement: string): Promise<unknown[][]> {
  const db = await openDatabase(server.databaseUrl);
  try {
    return (await db.execute(statement)).rows.map((row) => Array.from({ length: row.length }, (_, i) => row[i]));
  } finally {
    db.close();
  }
}

/** Rows in inspection_photos and files (temporaries included) under DATA_DIR/photos. */
async function storedState(): Promise<{ rows: number; files: string[] }> {
  const folder = join(server.dataDir, 'photos');
  const [[rows]] = (await sql('SELECT count(*) FROM inspection_photos')) as [[number]];
  return { rows: Number(rows), files: existsSync(folder) ? readdirSync(folder).sort() : [] };
}

/** Runs `refuse`, expecting nothing new in the table or the photo folder afterwards. */
async function expectNothingStored(refuse: () => Promise<void>): Promise<void> {
  const before = await storedState();
  await refuse();
  expect(await storedState()).toEqual(before);
}

async function pixelAt(image: Buffer, left: number, top: number): Promise<number[]> {
  const { data } = await sharp(image)
    .extract({ left, top, width: 1, height: 1 })
    .raw()
    .toBuffer({ resolveWithObject: true });
  return [...data];
}

describe('uploading a photo', () => {
  it('keeps only pixels: EXIF with GPS, XMP and the ICC profile are gone after upload', async () => {
    const input = await cameraJpeg();
    const sent = await sharp(input).metadata();
    expect(readExifTags(sent.exif!).gps).toEqual(GPS_TAGS);
    expect(sent.xmp).toBeDefined();
    expect(sent.icc).toBeDefined();
    for (const marker of METADATA_MARKERS) expect(input.includes(Buffer.from(marker, 'latin1'))).toBe(true);

    const made = await uploadPhoto(team.tech, inspection.byTech, input, { side: 'drive' });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({
      side: 'drive',
      contentType: 'image/jpeg',
      url: `/api/photos/${made.body.id}`,
      thumbnailUrl: `/api/photos/${made.body.id}/thumbnail`,
    });
    expect(Date.parse(made.body.createdAt)).toBeGreaterThan(Date.now() - 60_000);

    for (const url of [made.body.url, made.body.thumbnailUrl]) {
      const { response, bytes } = await fetchPhoto(team.viewer, url);
      expect(response.status).toBe(200);
      const stored = await sharp(bytes).metadata();
      expect(stored.format).toBe('jpeg');
      expect([stored.exif, stored.xmp, stored.icc, stored.iptc, stored.orientation]).toEqual([
        undefined,
        undefined,
        undefined,
        undefined,
        undefined,
      ]);
      for (const marker of METADATA_MARKERS) expect(bytes.includes(Buffer.from(marker, 'latin1')), marker).toBe(false);
    }
  });

  it('turns the pixels the way the EXIF orientation says, so width and height swap', async () => {
    const made = await uploadPhoto(team.tech, inspection.byTech, await cameraJpeg(), { side: 'coast' });
    expect(made.body).toMatchObject({ width: 300, height: 400, side: 'coast' });
    const { bytes } = await fetchPhoto(team.tech, made.body.url);
    expect(await sharp(bytes).metadata()).toMatchObject({ width: 300, height: 400 });
    // Stored left half red, right half blue; turned 90° clockwise the red half is on top.
    const [top, bottom] = [await pixelAt(bytes, 150, 20), await pixelAt(bytes, 150, 380)];
    expect(top[0]).toBeGreaterThan(180);
    expect(top[2]).toBeLessThan(70);
    expect(bottom[2]).toBeGreaterThan(180);
    expect(bottom[0]).toBeLessThan(70);
  });

  it('caps the longest side at 2560 px, makes a 320 px thumbnail, and puts transparency on white', async () => {
    const made = await uploadPhoto(team.chief, inspection.byTech, await largeTransparentPng(4000, 3000), {
      type: 'image/png',
      filename: 'p.png',
    });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({ width: 2560, height: 1920, contentType: 'image/jpeg' });
    const full = await fetchPhoto(team.tech, made.body.url);
    expect(full.response.headers.get('content-type')).toBe('image/jpeg');
    expect(Math.min(...(await pixelAt(full.bytes, 10, 10)))).toBeGreaterThan(245);
    const [red, green, blue] = await pixelAt(full.bytes, 2500, 10);
    expect([red! < 30, green! > 130, blue! < 30]).toEqual([true, true, true]);
    const thumbnail = await fetchPhoto(team.tech, made.body.thumbnailUrl);
    expect(thumbnail.response.headers.get('content-type')).toBe('image/jpeg');
    expect(await sharp(thumbnail.bytes).metadata()).toMatchObject({ format: 'jpeg', width: 320, height: 240 });
    expect(thumbnail.bytes.length).toBeLessThan(full.bytes.length);
  });

  it('accepts WebP and stores it as JPEG, by content whatever the name says', async () => {
    const made = await uploadPhoto(team.tech, inspection.byTech, await noiseImage('webp', 640, 480), {
      filename: 'pattern.gif',
      type: 'image/gif',
    });
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({ width: 640, height: 480, contentType: 'image/jpeg' });
    const { response, bytes } = await fetchPhoto(team.tech, made.body.url);
    expect(bytes.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
    expect(response.headers.get('content-disposition')).toBe(`inline; filename="lashline-photo-${made.body.id}.jpg"`);
  });

  it('serves the bytes privately cached, not sniffable, under a server-made name', async () => {
    const made = await uploadPhoto(team.tech, inspection.byTech, await noiseImage('jpeg'), {
      filename: '../../etc/evil name.jpg',
    });
    const { response, bytes } = await fetchPhoto(team.tech, made.body.url);
    expect(response.headers.get('content-length')).toBe(String(bytes.length));
    expect(response.headers.get('cache-control')).toMatch(/^private, max-age=\d+/);
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
    expect(response.headers.get('content-disposition')).toBe(`inline; filename="lashline-photo-${made.body.id}.jpg"`);
    const thumbnail = await fetchPhoto(team.tech, made.body.thumbnailUrl);
    expect(thumbnail.response.headers.get('content-disposition')).toBe(
      `inline; filename="lashline-photo-${made.body.id}-thumbnail.jpg"`,
    );
    const [[storageKey]] = (await sql(`SELECT storage_key FROM inspection_photos WHERE id = '${made.body.id}'`)) as [
      [string],
    ];
    expect(storageKey).toMatch(/^[0-9a-f-]{36}\.jpg$/);
    expect(readdirSync(join(server.dataDir, 'photos'))).toContain(storageKey);
  });

  it('lists the inspection’s photos for any member, oldest first', async () => {
    const made = await uploadPhoto(team.chief, inspection.byChief, await noiseImage('png', 300, 200), {
      side: 'coast',
    });
    const listed = await team.viewer.get(`/api/inspections/${inspection.byChief}/photos`);
    expect(listed.status).toBe(200);
    expect(listed.body).toEqual({
      items: [
        {
          id: made.body.id,
          side: 'coast',
          url: made.body.url,
          thumbnailUrl: made.body.thumbnailUrl,
          width: 300,
          height: 200,
          createdAt: made.body.createdAt,
        },
      ],
      nextCursor: null,
    });
    const byTech = (await team.owner.get(`/api/inspections/${inspection.byTech}/photos`)).body.items;
    expect(byTech.length).toBeGreaterThanOrEqual(4);
    expect(byTech.map((p: { createdAt: string }) => p.createdAt)).toEqual(
      byTech.map((p: { createdAt: string }) => p.createdAt).sort(),
    );
  });

  it('writes an audit row in the same change', async () => {
    const made = await uploadPhoto(team.tech, inspection.byTech, await noiseImage('jpeg', 64, 64));
    const rows = await sql(`SELECT action, record_type FROM audit_events WHERE record_id = '${made.body.id}'`);
    expect(rows).toEqual([['create', 'inspection-photo']]);
  });
});

describe('refusing an upload stores nothing', () => {
  it('refuses a text file named .jpg with 415 naming file', () =>
    expectNothingStored(async () => {
      const made = await uploadPhoto(
        team.tech,
        inspection.byTech,
        Buffer.from('just some notes about the pinion depth\n'),
        { filename: 'pattern.jpg', type: 'image/jpeg' },
      );
      expect(made.status).toBe(415);
      expect(made.body.error.fields).toHaveProperty('file');
    }));

  it('refuses a 50 MB upload with 413 before reading it', () =>
    expectNothingStored(async () => {
      const made = await uploadPhoto(team.tech, inspection.byTech, Buffer.alloc(50 * 1024 * 1024, 0xff));
      expect(made.status).toBe(413);
    }));

  it('refuses a body just over 15 MB from its Content-Length with 413', () =>
    expectNothingStored(async () => {
      const bytes = Buffer.alloc(15 * 1024 * 1024 + 200 * 1024, 0x20);
      bytes.set([0xff, 0xd8, 0xff]);
      const made = await uploadPhoto(team.tech, inspection.byTech, bytes);
      expect(made.status).toBe(413);
      expect(made.body.error.message).toMatch(/15 MB/);
      expect(made.body.error.fields).toHaveProperty('file');
      // Refused from the header, before reading: a refusal part-way through the body closes the connection.
      expect(made.headers.get('connection')).not.toBe('close');
    }));

  it('refuses a streamed body without a length (up to 100 MB) once it passes the limit, with 413', () =>
    expectNothingStored(async () => {
      const boundary = 'lashline-boundary';
      const head = Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="side"\r\n\r\ndrive\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.jpg"\r\nContent-Type: image/jpeg\r\n\r\n\xff\xd8\xff`,
        'latin1',
      );
      const answer = await sendStreamedBody(server.baseUrl, `/api/inspections/${inspection.byTech}/photos`, {
        headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, cookie: team.tech.cookieHeader() },
        head,
        chunk: Buffer.alloc(1024 * 1024, 0x20),
        maxChunks: 100,
      });
      expect(answer.status).toBe(413);
      expect(answer.headers.connection).toBe('close');
      // The server stopped reading a little past 15 MB; kernel buffers let the client push some more.
      expect(answer.sentBytes).toBeLessThan(100 * 1024 * 1024);
    }));

  it('refuses a truncated JPEG with 422', () =>
    expectNothingStored(async () => {
      const whole = await noiseImage('jpeg');
      const made = await uploadPhoto(team.tech, inspection.byTech, whole.subarray(0, Math.floor(whole.length / 2)));
      expect(made.status).toBe(422);
      expect(made.body.error.fields).toHaveProperty('file');
    }));

  it('refuses a truncated PNG and a corrupt JPEG with 422', () =>
    expectNothingStored(async () => {
      const png = await noiseImage('png');
      expect(
        (await uploadPhoto(team.tech, inspection.byTech, png.subarray(0, Math.floor(png.length * 0.7)))).status,
      ).toBe(422);
      const corrupt = Buffer.concat([
        Buffer.from([0xff, 0xd8, 0xff]),
        Buffer.from('this is not really a JPEG after its first three bytes'),
      ]);
      expect((await uploadPhoto(team.tech, inspection.byTech, corrupt)).status).toBe(422);
    }));

  it('refuses image bombs (PNGs declaring 30000×30000) with 422 from the header, without decoding them', async () => {
    const bomb = await pngBomb(30_000);
    expect(bomb.length).toBeLessThan(5 * 1024 * 1024);
    await expectNothingStored(async () => {
      for (const image of [bomb, pngHeaderBomb(30_000)]) {
        const started = Date.now();
        const made = await uploadPhoto(team.tech, inspection.byTech, image, { type: 'image/png' });
        expect(made.status).toBe(422);
        expect(made.body.error.message).toMatch(/50 megapixels/);
        // Decoding 900 MP takes seconds (and the memory of 900 MB at worst); the header alone, milliseconds.
        expect(Date.now() - started).toBeLessThan(1500);
      }
    });
  });

  it('names file when it is missing, and side when it is missing or not drive/coast (400)', () =>
    expectNothingStored(async () => {
      const image = await noiseImage('jpeg', 64, 64);
      const missingFile = await uploadPhoto(team.tech, inspection.byTech, null);
      expect(missingFile.status).toBe(400);
      expect(Object.keys(missingFile.body.error.fields)).toEqual(['file']);
      for (const side of ['left', null]) {
        const badSide = await uploadPhoto(team.tech, inspection.byTech, image, { side });
        expect(badSide.status).toBe(400);
        expect(Object.keys(badSide.body.error.fields)).toEqual(['side']);
      }
    }));

  it('answers 415 to a body that is not multipart', () =>
    expectNothingStored(async () => {
      const made = await team.tech.post(`/api/inspections/${inspection.byTech}/photos`, { file: 'x', side: 'drive' });
      expect(made.status).toBe(415);
    }));

  it('refuses a viewer (403), a technician on another’s inspection (403) and another team (404)', () =>
    expectNothingStored(async () => {
      const image = await noiseImage('jpeg', 64, 64);
      expect((await uploadPhoto(team.viewer, inspection.byTech, image)).status).toBe(403);
      expect((await uploadPhoto(team.tech, inspection.byChief, image)).status).toBe(403);
      expect((await uploadPhoto(stranger, inspection.byTech, image)).status).toBe(404);
      expect((await uploadPhoto(team.owner, inspection.elsewhere, image)).status).toBe(404);
      expect((await uploadPhoto(new ApiClient(server.baseUrl), inspection.byTech, image)).status).toBe(401);
    }));

  it('removes the stored images again when the row cannot be written', async () => {
    // A trigger makes this one inspection's insert fail after both images are stored.
    await sql(
      `CREATE TRIGGER fail_photo_insert BEFORE INSERT ON inspection_photos WHEN NEW.inspection_id = '${inspection.byChief}' BEGIN SELECT RAISE(ABORT, 'test: insert refused'); END`,
    );
    try {
      await expectNothingStored(async () => {
        expect((await uploadPhoto(team.chief, inspection.byChief, await noiseImage('jpeg'))).status).toBe(500);
      });
    } finally {
      await sql('DROP TRIGGER fail_photo_insert');
    }
    expect((await uploadPhoto(team.chief, inspection.byChief, await noiseImage('jpeg', 64, 64))).status).toBe(201);
  });
});

describe('reading and deleting photos', () => {
  it('answers 404 to another team for the list, the photo and its thumbnail, and 401 when signed out', async () => {
    const made = await uploadPhoto(team.tech, inspection.byTech, await noiseImage('jpeg', 64, 64));
    expect((await fetchPhoto(team.viewer, made.body.url)).response.status).toBe(200);
    expect((await stranger.get(`/api/inspections/${inspection.byTech}/photos`)).status).toBe(404);
    expect((await fetchPhoto(stranger, made.body.url)).response.status).toBe(404);
    expect((await fetchPhoto(stranger, made.body.thumbnailUrl)).response.status).toBe(404);
    expect((await stranger.delete(`/api/inspections/${inspection.byTech}/photos/${made.body.id}`)).status).toBe(404);
    expect((await fetchPhoto(new ApiClient(server.baseUrl), made.body.url)).response.status).toBe(401);
    expect((await fetchPhoto(team.viewer, made.body.url)).response.status).toBe(200);
  });

  it('deletes the row and both images (204), then answers 404', async () => {
    const made = await uploadPhoto(team.tech, inspection.byTech, await noiseImage('jpeg', 64, 64));
    const [[storageKey, thumbnailKey]] = (await sql(
      `SELECT storage_key, thumbnail_key FROM inspection_photos WHERE id = '${made.body.id}'`,
    )) as [[string, string]];
    const folder = join(server.dataDir, 'photos');
    expect(readdirSync(folder)).toEqual(expect.arrayContaining([storageKey, thumbnailKey]));
    const path = `/api/inspections/${inspection.byTech}/photos/${made.body.id}`;
    expect((await team.viewer.delete(path)).status).toBe(403);
    const removed = await team.tech.delete(path);
    expect(removed.status).toBe(204);
    expect((await fetchPhoto(team.tech, made.body.url)).response.status).toBe(404);
    expect((await fetchPhoto(team.tech, made.body.thumbnailUrl)).response.status).toBe(404);
    expect(readdirSync(folder)).not.toContain(storageKey);
    expect(readdirSync(folder)).not.toContain(thumbnailKey);
    expect(
      (await team.tech.get(`/api/inspections/${inspection.byTech}/photos`)).body.items.map((p: { id: string }) => p.id),
    ).not.toContain(made.body.id);
    expect(
      await sql(`SELECT action FROM audit_events WHERE record_id = '${made.body.id}' ORDER BY created_at, rowid`),
    ).toEqual([['create'], ['delete']]);
    expect((await team.tech.delete(path)).status).toBe(404);
  });

  it('lets a crew chief delete a photo on the technician’s inspection', async () => {
    const made = await uploadPhoto(team.tech, inspection.byTech, await noiseImage('jpeg', 64, 64));
    expect((await team.chief.delete(`/api/inspections/${inspection.byTech}/photos/${made.body.id}`)).status).toBe(204);
  });
});
