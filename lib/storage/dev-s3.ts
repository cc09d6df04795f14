/**
 * The local S3-compatible fake (s3rver) for the demo and the test command, on loopback only.
 *   npx tsx lib/storage/dev-s3.ts            (127.0.0.1:4569, bucket trammel-uploads, .data/s3)
 * S3_PORT, S3_BUCKET and S3_DIR override. Runs until it gets SIGTERM or SIGINT.
 */
import { env } from "@/lib/env";
import { mkdirSync } from "node:fs";
import S3rver from "s3rver";

const port = env.S3_PORT;
const bucket = env.S3_BUCKET;
const directory = env.S3_DIR;
mkdirSync(directory, { recursive: true });

const server = new S3rver({
  port,
  address: "127.0.0.1",
  directory,
  silent: true,
  configureBuckets: [{ name: bucket, configs: [] }],
});
await server.run();
console.error(`dev-s3: s3rver on http://127.0.0.1:${port}, bucket ${bucket}, files in ${directory}`);
const stop = () => {
  server.close().finally(() => process.exit(0));
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
