/** The PostgreSQL fallback of lib/storage: objects as bytea rows in storage_objects. */
import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { storageObjects } from "@/db/schema";
import type { ObjectStorage } from "./index";

export function createPostgresStorage(): ObjectStorage {
  return {
    driver: "postgres",
    async put(key, data, meta) {
      await db
        .insert(storageObjects)
        .values({ key, data, sha256: meta.sha256, sizeBytes: data.length, contentType: meta.contentType });
    },
    async get(key) {
      const [row] = await db
        .select({ data: storageObjects.data })
        .from(storageObjects)
        .where(eq(storageObjects.key, key))
        .limit(1);
      return row ? row.data : null;
    },
    async delete(key) {
      await db.delete(storageObjects).where(eq(storageObjects.key, key));
    },
  };
}
