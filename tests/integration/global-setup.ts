// Integration tests run against a real PostgreSQL: the database in DATABASE_URL is wiped,
// migrated from the committed migrations and seeded with the demo scenario before the run.
import { Client } from "pg";

export default async function setup() {
  const url = process.env.DATABASE_URL;
  if (!url || !/_test\b|test/.test(new URL(url).pathname)) {
    throw new Error("Integration tests need DATABASE_URL pointing at a test database (its name must contain 'test'); tests/run-all.sh sets it.");
  }
  const client = new Client({ connectionString: url });
  await client.connect();
  await client.query("DROP SCHEMA IF EXISTS public CASCADE; DROP SCHEMA IF EXISTS drizzle CASCADE; CREATE SCHEMA public;");
  await client.end();
  const { runMigrations } = await import("../../db/migrate");
  await runMigrations(url);
}
