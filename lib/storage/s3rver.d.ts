// Types for s3rver 3.7 (it ships none): only what lib/storage/dev-s3.ts and the tests use.
declare module "s3rver" {
  interface S3rverOptions {
    port?: number;
    address?: string;
    directory: string;
    silent?: boolean;
    resetOnClose?: boolean;
    configureBuckets?: { name: string; configs?: string[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
}
