/**
 * Object storage for uploaded originals, behind one small interface (put/get/delete by key) so the
 * app can keep files in S3-compatible storage (s3rver locally, through the AWS SDK) or, as the
 * fallback, in PostgreSQL (table storage_objects). STORAGE_DRIVER chooses; keys are always made by
 * the server (datasetObjectKey), never from a user's file name.
 */
import "server-only";
import { randomUUID } from "node:crypto";
import { env } from "@/lib/env";
import { createPostgresStorage } from "./postgres";
import { createS3Storage } from "./s3";
import { isUuid } from "@/lib/domain/uuid";

export interface StoredObjectMeta {
  readonly contentType: string;
  /** SHA-256 of the bytes, lower-case hex. */
  readonly sha256: string;
}

export interface ObjectStorage {
  readonly driver: "s3" | "postgres";
  put(key: string, data: Buffer, meta: StoredObjectMeta): Promise<void>;
  /** The stored bytes, or null when there is no object under the key. */
  get(key: string): Promise<Buffer | null>;
  /** Removes the object; removing a missing key is not an error. */
  delete(key: string): Promise<void>;
}

/** `datasets/<job uuid>/<random uuid>`: nothing in it comes from the uploader. */
export function datasetObjectKey(jobId: string): string {
  if (!isUuid(jobId)) throw new Error("datasetObjectKey: job id must be a uuid");
  return `datasets/${jobId.toLowerCase()}/${randomUUID()}`;
}

const cache = globalThis as unknown as { trammelStorage?: ObjectStorage };

/** The storage chosen by the environment (one instance per process). */
export function getStorage(): ObjectStorage {
  cache.trammelStorage ??=
    env.STORAGE_DRIVER === "s3"
      ? createS3Storage({
          endpoint: env.S3_ENDPOINT,
          bucket: env.S3_BUCKET,
          region: env.S3_REGION,
          accessKeyId: env.S3_ACCESS_KEY_ID,
          secretAccessKey: env.S3_SECRET_ACCESS_KEY,
        })
      : createPostgresStorage();
  return cache.trammelStorage;
}

/** For tests: use this storage instead of the environment's choice (null: back to the default). */
export function setStorageForTests(storage: ObjectStorage | null): void {
  if (storage) cache.trammelStorage = storage;
  else delete cache.trammelStorage;
}
