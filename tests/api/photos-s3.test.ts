import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { GetObjectCommand } from '@aws-sdk/client-s3';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedInClient, type ApiClient } from '../helpers/api-client';
import { cameraJpeg, fetchPhoto, METADATA_MARKERS, noiseImage, uploadPhoto } from '../helpers/images';
import { createInspection } from '../helpers/inspections';
import { S3Fake, TEST_BUCKET } from '../helpers/s3-fake';
import { startServer, type RunningServer } from '../helpers/server';

let s3: S3Fake;
let server: RunningServer;
let owner: ApiClient;
let inspectionId: string;

beforeAll(async () => {
  s3 = await S3Fake.start();
  server = await startServer({ env: s3.environment() });
  owner = (await signedInClient(server.baseUrl, { team: 'Bucket Crew' })).client;
  const gearSet = (await owner.post('/api/gear-sets', { serial: 'S3-G1', ringTeeth: 41, pinionTeeth: 10 })).body.id;
  inspectionId = await createInspection(owner, gearSet);
});
afterAll(async () => {
  await server?.stop();
  await s3?.stop();
});

async function objectBytes(key: string): Promise<Buffer> {
  const object = await s3.client.send(new GetObjectCommand({ Bucket: TEST_BUCKET, Key: key }));
  return Buffer.from(await object.Body!.transformToByteArray());
}

describe('photos in an S3-compatible bucket (S3_BUCKET set)', () => {
  it('stores both images in the bucket, serves them back, and deletes them', async () => {
    expect(await s3.keys()).toEqual([]);
    const made = await uploadPhoto(owner, inspectionId, await cameraJpeg());
    expect(made.status).toBe(201);
    const keys = await s3.keys();
    expect(keys).toHaveLength(2);
    for (const key of keys) expect(key).toMatch(/^[0-9a-f-]{36}\.jpg$/);
    // Nothing went to the embedded folder.
    expect(existsSync(join(server.dataDir, 'photos'))).toBe(false);

    const full = await fetchPhoto(owner, made.body.url);
    const thumbnail = await fetchPhoto(owner, made.body.thumbnailUrl);
    expect(full.response.headers.get('content-type')).toBe('image/jpeg');
    expect(thumbnail.response.headers.get('content-type')).toBe('image/jpeg');
    const inBucket = await Promise.all(keys.map(objectBytes));
    expect(inBucket.map((bytes) => bytes.equals(full.bytes)).filter(Boolean)).toHaveLength(1);
    expect(inBucket.map((bytes) => bytes.equals(thumbnail.bytes)).filter(Boolean)).toHaveLength(1);
    const stored = await sharp(full.bytes).metadata();
    expect([stored.width, stored.height, stored.exif]).toEqual([300, 400, undefined]);
    for (const marker of METADATA_MARKERS) expect(full.bytes.includes(Buffer.from(marker, 'latin1'))).toBe(false);

    expect((await owner.delete(`/api/inspections/${inspectionId}/photos/${made.body.id}`)).status).toBe(204);
    expect(await s3.keys()).toEqual([]);
    expect((await fetchPhoto(owner, made.body.url)).response.status).toBe(404);
  });

  it('leaves the bucket untouched when an upload is refused', async () => {
    const whole = await noiseImage('jpeg');
    const refused = await uploadPhoto(owner, inspectionId, whole.subarray(0, whole.length / 2));
    expect(refused.status).toBe(422);
    expect(await s3.keys()).toEqual([]);
  });
});
