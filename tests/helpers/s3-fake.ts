import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';

export const TEST_BUCKET = 'lashline-test';

/** A local S3-compatible server (s3rver) on a free port, with one empty bucket, for the server under test. */
export class S3Fake {
  private constructor(
    private readonly server: S3rver,
    private readonly directory: string,
    readonly endpoint: string,
    readonly client: S3Client,
  ) {}

  static async start(): Promise<S3Fake> {
    const directory = mkdtempSync(join(tmpdir(), 'lashline-s3-'));
    const server = new S3rver({
      address: '127.0.0.1',
      port: 0,
      silent: true,
      directory,
      configureBuckets: [{ name: TEST_BUCKET, configs: [] }],
    });
    const { port } = await server.run();
    const endpoint = `http://127.0.0.1:${port}`;
    // s3rver accepts the keys S3RVER / S3RVER.
    const client = new S3Client({
      endpoint,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
    return new S3Fake(server, directory, endpoint, client);
  }

  /** The S3_* variables that point the server at this bucket. */
  environment(): Record<string, string> {
    return {
      S3_BUCKET: TEST_BUCKET,
      S3_ENDPOINT: this.endpoint,
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
      S3_FORCE_PATH_STYLE: 'true',
    };
  }

  /** Every key in the bucket, sorted. */
  async keys(): Promise<string[]> {
    const listed = await this.client.send(new ListObjectsV2Command({ Bucket: TEST_BUCKET }));
    return (listed.Contents ?? []).map((object) => object.Key ?? '').sort();
  }

  async stop(): Promise<void> {
    this.client.destroy();
    await this.server.close();
    rmSync(this.directory, { recursive: true, force: true });
  }
}
