/**
 * The database client: one pg Pool from the validated environment, cached on globalThis outside
 * production so that hot reload does not open a new pool per edit.
 */
import "server-only";
import { drizzle } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "@/lib/env";
import * as schema from "./schema";

const globalForDb = globalThis as unknown as { trammelPool?: Pool };

export const pool =
  globalForDb.trammelPool ??
  new Pool({
    connectionString: env.DATABASE_URL,
    max: env.DATABASE_POOL_MAX,
    connectionTimeoutMillis: 5_000,
    idleTimeoutMillis: 30_000,
  });
if (env.NODE_ENV !== "production") globalForDb.trammelPool = pool;

export const db = drizzle(pool, { schema });
export type Db = typeof db;
export { schema };
