// s3rver ships no types; this covers the part tests/helpers/s3-fake.ts uses.
declare module 's3rver' {
  interface S3rverOptions {
    address?: string;
    port?: number;
    silent?: boolean;
    directory: string;
    configureBuckets?: { name: string; configs: (string | Buffer)[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; family: string; port: number }>;
    close(): Promise<void>;
  }
}
