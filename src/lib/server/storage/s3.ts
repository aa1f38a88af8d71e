import {
  DeleteObjectCommand,
  GetObjectCommand,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { assertObjectKey, type ObjectStorage, type StoredObject } from './types';

export interface S3Settings {
  bucket: string;
  endpoint?: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle: boolean;
}

const isMissing = (error: unknown) =>
  error instanceof S3ServiceException &&
  (error.name === 'NoSuchKey' || error.name === 'NotFound' || error.$metadata.httpStatusCode === 404);

/**
 * Objects in an S3-compatible bucket (any store that speaks the S3 API). Without keys in the
 * environment the SDK's own chain (profile, instance role) supplies credentials.
 */
export function createS3Storage(settings: S3Settings): ObjectStorage {
  const client = new S3Client({
    region: settings.region,
    endpoint: settings.endpoint,
    forcePathStyle: settings.forcePathStyle,
    credentials:
      settings.accessKeyId && settings.secretAccessKey
        ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey }
        : undefined,
    // Since early 2025 the SDK adds CRC checksums to every upload by default, which several
    // S3-compatible stores reject; checksums only where the operation requires them.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = settings.bucket;

  return {
    kind: 's3',
    async put(key, bytes, contentType) {
      assertObjectKey(key);
      await client.send(
        new PutObjectCommand({
          Bucket,
          Key: key,
          Body: bytes,
          ContentType: contentType,
          ContentLength: bytes.byteLength,
        }),
      );
    },
    async get(key): Promise<StoredObject | null> {
      assertObjectKey(key);
      try {
        const object = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        if (!object.Body) return null;
        return {
          body: object.Body.transformToWebStream(),
          contentType: object.ContentType ?? 'application/octet-stream',
          size: object.ContentLength,
        };
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async delete(key) {
      assertObjectKey(key);
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
  };
}
