import { join, resolve } from 'node:path';
import { readEnvironment, type Environment } from '../../../environment';
import { createFilesystemStorage } from './filesystem';
import type { ObjectStorage } from './types';

export type { ObjectStorage, StoredObject } from './types';

let chosen: Promise<ObjectStorage> | undefined;

/**
 * The photo storage, chosen once from the environment: an S3-compatible bucket when S3_BUCKET is
 * set, otherwise the folder `DATA_DIR/photos`. The S3 SDK is loaded only when it is used.
 */
export function getObjectStorage(): Promise<ObjectStorage> {
  chosen ??= chooseStorage(readEnvironment());
  chosen.catch(() => {
    chosen = undefined;
  });
  return chosen;
}

async function chooseStorage(env: Environment): Promise<ObjectStorage> {
  if (!env.S3_BUCKET) return createFilesystemStorage(join(resolve(env.DATA_DIR), 'photos'));
  const { createS3Storage } = await import('./s3');
  return createS3Storage({
    bucket: env.S3_BUCKET,
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    accessKeyId: env.S3_ACCESS_KEY_ID,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY,
    forcePathStyle: env.S3_FORCE_PATH_STYLE === 'true',
  });
}
