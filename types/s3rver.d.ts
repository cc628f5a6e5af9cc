// s3rver ships no types; only what the storage contract test uses.
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';
  export default class S3rver {
    constructor(opts: {
      port?: number;
      address?: string;
      silent?: boolean;
      directory: string;
      configureBuckets?: Array<{ name: string; configs: unknown[] }>;
    });
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
