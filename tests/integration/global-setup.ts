// Integration tests run against a real PostgreSQL. Each run gets its own fresh database, made
// from the server in DATABASE_URL (whose database name must contain "test"), migrated from the
// committed migrations; the seed runs per file (tests/integration/setup.ts). The database is
// dropped at the end, so concurrent runs never share state.
import { Client } from "pg";

let admin: { url: URL; name: string } | undefined;

export default async function setup() {
  const raw = process.env.DATABASE_URL;
  if (!raw || !new URL(raw).pathname.includes("test")) {
    throw new Error(
      "Integration tests need DATABASE_URL pointing at a test database (its name must contain 'test'); tests/run-all.sh sets it.",
    );
  }
  const url = new URL(raw);
  const name = `${url.pathname.slice(1)}_${process.pid}_${Date.now().toString(36)}`.replace(
    /[^a-z0-9_]/gi,
    "_",
  );
  const client = new Client({ connectionString: raw });
  await client.connect();
  await client.query(`CREATE DATABASE "${name}"`);
  await client.end();
  url.pathname = `/${name}`;
  process.env.DATABASE_URL = url.toString();
  admin = { url: new URL(raw), name };
  const { runMigrations } = await import("../../db/migrate");
  await runMigrations(url.toString());

  return async () => {
    if (!admin) return;
    const c = new Client({ connectionString: admin.url.toString() });
    await c.connect();
    await c.query(`DROP DATABASE IF EXISTS "${admin.name}" WITH (FORCE)`);
    await c.end();
  };
}
