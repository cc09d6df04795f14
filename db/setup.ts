/**
 * First start of a production install: `npm run setup -- --admin-email someone@example.com
 * [--admin-name "Full Name"]`. Applies the migrations, then on a database with no account yet
 * creates the first administrator and prints a one-time set-password link (also queued by e-mail
 * through the outbox), and loads the starter library of procedures (db/library, idempotent).
 * Loads no demo data. Exit status 1, with the reason, when it cannot.
 */
import { env } from "../lib/env";
import { runMigrations } from "./migrate";

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  if (i >= 0) return process.argv[i + 1];
  const eq = process.argv.find((a) => a.startsWith(`--${name}=`));
  return eq?.slice(name.length + 3);
}

const email = arg("admin-email") ?? "";
const name = arg("admin-name") ?? email.split("@")[0] ?? "";
let code = 0;
await runMigrations(env.DATABASE_URL);
const { pool } = await import("./index");
try {
  const { createFirstAdmin, firstAdminSchema } = await import("./queries/setup");
  firstAdminSchema.parse({ email, name });
  // The starter procedures (not demo data), so the first job can be opened; idempotent.
  const loaded = await (await import("./library")).loadStarterLibrary();
  console.log(
    loaded.length
      ? `Starter procedures loaded: ${loaded.join("; ")}.`
      : "The starter procedures are already in place.",
  );
  const { link } = await createFirstAdmin({ email, name });
  console.log(`Administrator ${email} created. Set the password within 72 hours (the link works once):`);
  console.log(link);
  console.log("The same link is queued by e-mail. No demo data was loaded.");
} catch (err) {
  const issues = (err as { issues?: { message: string }[] }).issues;
  console.error(
    `setup: ${issues?.length ? issues.map((i) => i.message).join("; ") : (err as Error).message}`,
  );
  code = 1;
} finally {
  await pool.end();
}
process.exit(code);
