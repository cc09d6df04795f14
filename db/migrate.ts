/**
 * Applies the committed migrations. A PostgreSQL advisory lock makes it safe when two app
 * instances start together: the second waits, then finds nothing to do.
 */
import { env } from "@/lib/env";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { Client } from "pg";

const MIGRATION_LOCK = 724_001;

export async function runMigrations(url: string): Promise<void> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    await client.query("SELECT pg_advisory_lock($1)", [MIGRATION_LOCK]);
    await migrate(drizzle(client), { migrationsFolder: new URL("./migrations", import.meta.url).pathname });
  } finally {
    await client.query("SELECT pg_advisory_unlock($1)", [MIGRATION_LOCK]).catch(() => {});
    await client.end();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = env.DATABASE_URL;
  const t0 = Date.now();
  await runMigrations(url);
  console.error(`db/migrate: up to date (${Date.now() - t0} ms)`);
}
