// s3rver ships no types; only what the local fake uses.
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';
  interface S3rverOptions {
    port?: number;
    address?: string;
    silent?: boolean;
    directory: string;
    configureBuckets?: { name: string }[];
    allowMismatchedSignatures?: boolean;
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
