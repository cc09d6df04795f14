// Faults and scale-out, against the built app: two migration runs started together on an empty
// database, two app instances on two ports sharing one PostgreSQL, one object store and one
// SMTP fake (a session from one works on the other; their e-mail workers never send a message
// twice), the SMTP fake stopped while mail is due, and PostgreSQL restarted under load.
// The figures (seconds, counts) are printed as JSON lines starting with "faults:".
import { readFileSync } from "node:fs";
import path from "node:path";
import { Client } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  freshMailDir,
  pgScript,
  probeCsv,
  probeForm,
  required,
  ROOT,
  run,
  signIn,
  signOut,
  sleep,
  start,
  startApp,
  stop,
  stopAll,
  storedMails,
  tally,
  waitFor,
  type AppInstance,
  type Child,
} from "./harness";

const DB_URL = required("FAULTS_DB_URL");
if (!new URL(DB_URL).pathname.includes("faults"))
  throw new Error("FAULTS_DB_URL must name a database containing 'faults' (it is dropped)");
const [PORT_A, PORT_B] = (process.env.FAULTS_PORTS ?? "3100,3101").split(",").map(Number) as [number, number];
const SMTP_PORT = Number(process.env.FAULTS_SMTP_PORT ?? 2527);
const MAIL_DIR = path.join(ROOT, ".data/test-faults-mail");
const UPLOAD_JOB = "TR-2026-0052";
// The test process's own queries (inviteUser below) use the same database as the instances.
process.env.DATABASE_URL = DB_URL;

const report = (what: string, figures: Record<string, unknown>) =>
  console.log(`faults: ${JSON.stringify({ test: what, ...figures })}`);

let a: AppInstance;
let b: AppInstance;
let smtp: Child;

async function sql<T = Record<string, unknown>>(
  text: string,
  values: unknown[] = [],
  url = DB_URL,
): Promise<T[]> {
  const c = new Client({ connectionString: url });
  await c.connect();
  try {
    return (await c.query(text, values)).rows as T[];
  } finally {
    await c.end();
  }
}

const startSmtp = () =>
  start("smtp-fake", "node", ["--import", "tsx", "lib/mail/fake-smtp.ts"], {
    MAIL_DIR,
    SMTP_FAKE_PORT: String(SMTP_PORT),
  });
const smtpUp = () => waitFor("the SMTP fake", async () => /listening/.test(smtp.log()), 20_000, 50);

const appEnv = () => ({
  DATABASE_URL: DB_URL,
  SMTP_URL: `smtp://127.0.0.1:${SMTP_PORT}`,
  OUTBOX_INTERVAL_MS: "300",
  OUTBOX_RETRY_BASE_MS: "500",
  NEXT_DIST_DIR: required("NEXT_DIST_DIR"),
  STORAGE_DRIVER: process.env.STORAGE_DRIVER ?? "postgres",
  ...(process.env.S3_ENDPOINT ? { S3_ENDPOINT: process.env.S3_ENDPOINT } : {}),
});

async function json(res: Response): Promise<{ status: number; body: unknown; text: string }> {
  const text = await res.text();
  let body: unknown = null;
  try {
    body = JSON.parse(text);
  } catch {
    body = null;
  }
  return { status: res.status, body, text };
}

beforeAll(async () => {
  const server = new URL(DB_URL);
  const name = server.pathname.slice(1);
  server.pathname = "/postgres";
  await sql(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`, [], server.toString());
  await sql(`CREATE DATABASE "${name}"`, [], server.toString());
  freshMailDir(MAIL_DIR);
}, 30_000);

afterAll(async () => {
  await stopAll();
  const { pool } = await import("@/db");
  await pool.end().catch(() => {});
});

describe("scale-out", () => {
  it("two migration runs started together on an empty database both succeed and apply each migration once", async () => {
    const journal = JSON.parse(readFileSync(path.join(ROOT, "db/migrations/meta/_journal.json"), "utf8")) as {
      entries: unknown[];
    };
    const t0 = performance.now();
    const migrate = () =>
      run("node", ["--import", "tsx", "--import", "./lib/scripts/allow-server-only.mjs", "db/migrate.ts"], {
        DATABASE_URL: DB_URL,
      });
    const [r1, r2] = await Promise.all([migrate(), migrate()]);
    const seconds = (performance.now() - t0) / 1000;
    expect(r1.code, r1.out).toBe(0);
    expect(r2.code, r2.out).toBe(0);
    const applied = await sql<{ hash: string }>("SELECT hash FROM drizzle.__drizzle_migrations");
    report("concurrent migrations", {
      runs: 2,
      migrations_in_journal: journal.entries.length,
      rows_applied: applied.length,
      seconds: +seconds.toFixed(2),
    });
    expect(applied.length).toBe(journal.entries.length);
    expect(new Set(applied.map((r) => r.hash)).size).toBe(applied.length);
    const tables = await sql<{ n: number }>(
      "SELECT count(*)::int AS n FROM information_schema.tables WHERE table_schema = 'public' AND table_name IN ('users', 'jobs', 'outbox', 'datasets')",
    );
    expect(tables[0]!.n).toBe(4);
  }, 120_000);

  it("starts two instances of the built app on two ports against the same database, store and SMTP fake", async () => {
    const seeded = await run(
      "node",
      ["--import", "tsx", "--import", "./lib/scripts/allow-server-only.mjs", "db/seed.ts"],
      appEnv(),
    );
    expect(seeded.code, seeded.out).toBe(0);
    smtp = startSmtp();
    await smtpUp();
    [a, b] = await Promise.all([startApp(PORT_A, appEnv()), startApp(PORT_B, appEnv())]);
    expect((await fetch(`${a.base}/api/health`)).status).toBe(200);
    expect((await fetch(`${b.base}/api/health`)).status).toBe(200);
  }, 180_000);

  it("a session signed in on one instance is served by the other, and signing out on one ends it on both", async () => {
    const cookie = await signIn(a.base, "engineer@halvard.example");
    const onA = await json(await fetch(`${a.base}/api/jobs`, { headers: { cookie } }));
    const onB = await json(await fetch(`${b.base}/api/jobs`, { headers: { cookie } }));
    expect(onA.status).toBe(200);
    expect(onB.status).toBe(200);
    const ids = (x: unknown) => ((x as { jobs: { id: string }[] }).jobs ?? []).map((j) => j.id).sort();
    expect(ids(onB.body).length).toBeGreaterThan(0);
    expect(ids(onB.body)).toEqual(ids(onA.body));

    // An original uploaded through A is read back byte for byte through B (the shared object store).
    const inspector = await signIn(b.base, "inspector@halvard.example");
    const job = (onA.body as { jobs: { id: string; reference: string }[] }).jobs.find(
      (j) => j.reference === UPLOAD_JOB,
    )!;
    const csv = probeCsv(300, 1);
    const up = await json(
      await fetch(`${a.base}/api/jobs/${job.id}/datasets`, {
        method: "POST",
        headers: { cookie: inspector },
        body: probeForm(csv, "scale-out.csv"),
      }),
    );
    expect(up.status, up.text).toBe(201);
    const id = (up.body as { id: string }).id;
    const file = await fetch(`${b.base}/api/datasets/${id}/file`, { headers: { cookie: inspector } });
    expect(file.status).toBe(200);
    expect(Buffer.from(await file.arrayBuffer()).equals(csv)).toBe(true);

    // Signing out on B revokes the account's sessions, so A refuses the same cookie at once.
    expect([200, 302]).toContain(await signOut(b.base, cookie));
    const after = await fetch(`${a.base}/api/jobs`, { headers: { cookie } });
    report("shared session", {
      signed_in_on: a.base,
      served_by: b.base,
      jobs: ids(onB.body).length,
      after_sign_out_on_b: after.status,
    });
    expect(after.status).toBe(401);
  }, 60_000);

  it("the two instances' e-mail workers drain one outbox and send every message exactly once", async () => {
    const { getActor } = await import("@/db/queries/users");
    const { inviteUser } = await import("@/db/queries/users-admin");
    const [adminRow] = await sql<{ id: string }>(
      "SELECT id FROM users WHERE email = 'admin@halvard.example'",
    );
    const admin = (await getActor(adminRow!.id))!;
    const N = 40;
    const tag = Date.now().toString(36);
    const invited = await Promise.all(
      Array.from({ length: N }, (_, i) =>
        inviteUser(admin, {
          email: `person-${tag}-${i}@fieldcrew.example`,
          name: `Person ${i}`,
          role: "installer",
        }),
      ),
    );
    expect(invited.length).toBe(N);
    const rows = () =>
      sql<{ id: string; status: string; attempts: number }>(
        "SELECT id, status, attempts FROM outbox WHERE to_address LIKE $1",
        [`person-${tag}-%`],
      );
    await waitFor(
      "every invitation to be sent",
      async () => (await rows()).every((r) => r.status === "sent") && (await rows()).length === N,
      60_000,
      200,
    );
    await sleep(1_500); // several more worker runs on both instances: nothing may go out again
    const sent = await rows();
    const mails = storedMails(MAIL_DIR).filter((m) => sent.some((r) => r.id === m.outboxId));
    const perId = tally(mails.map((m) => m.outboxId));
    const duplicates = [...perId.values()].filter((n) => n > 1).length;
    const bySender = Object.fromEntries(tally(mails.map((m) => m.sender ?? "?")));
    report("two outbox workers", {
      queued: N,
      delivered: mails.length,
      distinct: perId.size,
      duplicates,
      by_sender: bySender,
      max_attempts: Math.max(...sent.map((r) => r.attempts)),
    });
    expect(perId.size).toBe(N);
    expect(duplicates).toBe(0);
    expect(mails.length).toBe(N);
    expect(sent.every((r) => r.attempts === 1)).toBe(true);
  }, 90_000);
});

describe("faults", () => {
  it("with the SMTP fake stopped, an invitation waits in the outbox and arrives exactly once after the fake returns", async () => {
    await stop(smtp);
    const { getActor } = await import("@/db/queries/users");
    const { inviteUser } = await import("@/db/queries/users-admin");
    const [adminRow] = await sql<{ id: string }>(
      "SELECT id FROM users WHERE email = 'admin@halvard.example'",
    );
    const email = `late-${Date.now().toString(36)}@fieldcrew.example`;
    await inviteUser((await getActor(adminRow!.id))!, { email, name: "Late Mail", role: "installer" });
    const row = async () =>
      (
        await sql<{ id: string; status: string; attempts: number; last_error: string | null }>(
          "SELECT id, status, attempts, last_error FROM outbox WHERE to_address = $1",
          [email],
        )
      )[0]!;
    // The workers try, fail and keep it pending for a retry.
    await waitFor("two failed attempts", async () => (await row()).attempts >= 2, 20_000, 100);
    const down = await row();
    expect(down.status).toBe("pending");
    expect(down.last_error).toBeTruthy();
    expect(storedMails(MAIL_DIR).filter((m) => m.outboxId === down.id)).toHaveLength(0);

    smtp = startSmtp();
    await smtpUp();
    const t0 = performance.now();
    await waitFor("the invitation to be sent", async () => (await row()).status === "sent", 30_000, 100);
    const seconds = (performance.now() - t0) / 1000;
    await sleep(1_500);
    const copies = storedMails(MAIL_DIR).filter((m) => m.outboxId === down.id);
    const final = await row();
    report("smtp down", {
      attempts_while_down: down.attempts,
      attempts_total: final.attempts,
      seconds_to_deliver_after_return: +seconds.toFixed(2),
      copies: copies.length,
    });
    expect(copies).toHaveLength(1);
    expect(copies[0]!.to).toContain(email);
    expect(final.status).toBe("sent");
  }, 90_000);

  it("PostgreSQL restarted under load: no crash, only generic 503s while it is down, recovered within 5 s, no partial uploads", async () => {
    const reader = await signIn(a.base, "engineer@halvard.example");
    const uploader = await signIn(b.base, "inspector@halvard.example");
    const jobs = (await (await fetch(`${a.base}/api/jobs`, { headers: { cookie: reader } })).json()) as {
      jobs: { id: string; reference: string }[];
    };
    const job = jobs.jobs.find((j) => j.reference === UPLOAD_JOB)!;
    const [{ n: columnsPerDataset }] = (await sql<{ n: number }>(
      "SELECT count(*)::int AS n FROM dataset_columns WHERE dataset_id = (SELECT id FROM datasets WHERE job_id = $1 AND original_filename = 'scale-out.csv')",
      [job.id],
    )) as [{ n: number }];
    expect(columnsPerDataset).toBeGreaterThan(0);
    const startedAt = new Date(Date.now() - 1000);

    interface Outcome {
      kind: "read" | "upload";
      start: number;
      end: number;
      status: number;
      text: string;
      id?: string;
    }
    const outcomes: Outcome[] = [];
    let running = true;
    let salt = 100;
    const loop = async (kind: Outcome["kind"]) => {
      while (running) {
        const t = performance.now();
        try {
          const res =
            kind === "read"
              ? await fetch(`${a.base}/api/jobs`, { headers: { cookie: reader } })
              : await fetch(`${b.base}/api/jobs/${job.id}/datasets`, {
                  method: "POST",
                  headers: { cookie: uploader },
                  body: probeForm(probeCsv(200, salt++), "restart.csv"),
                });
          const text = await res.text();
          const id = res.status === 201 ? (JSON.parse(text) as { id: string }).id : undefined;
          outcomes.push({
            kind,
            start: t,
            end: performance.now(),
            status: res.status,
            text: res.status < 300 ? "" : text,
            ...(id ? { id } : {}),
          });
        } catch (err) {
          outcomes.push({ kind, start: t, end: performance.now(), status: 0, text: String(err) });
          await sleep(50);
        }
      }
    };
    const workers = [...Array.from({ length: 14 }, () => loop("read")), loop("upload"), loop("upload")];
    await sleep(1_500);
    const tStop = performance.now();
    const stopped = await pgScript("stop");
    expect(stopped.code, stopped.out).toBe(0);
    await sleep(2_500);
    const started = await pgScript("start");
    expect(started.code, started.out).toBe(0);
    const tUp = performance.now();
    await sleep(6_000);
    running = false;
    await Promise.all(workers);

    const failures = outcomes.filter((o) => o.status !== 200 && o.status !== 201);
    const unavailable = failures.filter((o) => o.status === 503);
    const others = failures.filter((o) => o.status !== 503);
    const lastFailureEnd = Math.max(tUp, ...failures.map((o) => o.end));
    const recovery = (lastFailureEnd - tUp) / 1000;
    const afterRecovery = outcomes.filter((o) => o.start > lastFailureEnd);
    const okUploads = outcomes.filter((o) => o.status === 201).map((o) => o.id!);
    const stored = await sql<{ id: string; rows: number; columns: number; audits: number }>(
      `SELECT d.id, d.rows,
              (SELECT count(*)::int FROM dataset_columns c WHERE c.dataset_id = d.id) AS columns,
              (SELECT count(*)::int FROM audit_events e WHERE e.entity_id = d.id::text AND e.action = 'dataset.uploaded') AS audits
         FROM datasets d WHERE d.job_id = $1 AND d.original_filename = 'restart.csv' AND d.uploaded_at >= $2`,
      [job.id, startedAt],
    );
    const partial = stored.filter((d) => d.columns !== columnsPerDataset || d.audits !== 1 || d.rows !== 200);
    report("postgres restart", {
      requests: outcomes.length,
      ok: outcomes.length - failures.length,
      unavailable_503: unavailable.length,
      other_failures: others.length,
      other_statuses: Object.fromEntries(tally(others.map((o) => o.status))),
      down_for_s: +((tUp - tStop) / 1000).toFixed(2),
      recovery_s: +recovery.toFixed(2),
      first_ok_after_up_s: +(
        (Math.min(...outcomes.filter((o) => o.start >= tUp && o.status < 300).map((o) => o.end)) - tUp) /
        1000
      ).toFixed(2),
      ok_after_recovery: afterRecovery.filter((o) => o.status < 300).length,
      uploads_201: okUploads.length,
      uploads_stored: stored.length,
      partial_uploads: partial.length,
    });
    // The outage was seen, and seen only as the generic 503 (no 500, no stack, no dropped connection).
    expect(unavailable.length).toBeGreaterThan(0);
    expect(others.map((o) => `${o.kind} ${o.status} ${o.text.slice(0, 200)}`)).toEqual([]);
    for (const o of unavailable) {
      const body = JSON.parse(o.text) as { error: { code: string; message: string } };
      expect(body.error.code).toBe("unavailable");
      expect(Object.keys(body.error).sort()).toEqual(["code", "message"]);
      expect(o.text).not.toMatch(/\bat \S+ \(|Error:|Failed query|ECONN|postgres/i);
    }
    // Back within 5 s of PostgreSQL being up, and serving from then on.
    expect(recovery).toBeLessThanOrEqual(5);
    expect(afterRecovery.length).toBeGreaterThan(20);
    expect(afterRecovery.every((o) => o.status === 200 || o.status === 201)).toBe(true);
    // Neither process died.
    expect(a.child.exited()).toBe(false);
    expect(b.child.exited()).toBe(false);
    expect((await fetch(`${a.base}/api/health`)).status).toBe(200);
    expect((await fetch(`${b.base}/api/health`)).status).toBe(200);
    // Every upload is all or nothing: each 201 is stored whole, and nothing is stored half.
    expect(partial).toEqual([]);
    const storedIds = new Set(stored.map((d) => d.id));
    expect(okUploads.filter((id) => !storedIds.has(id))).toEqual([]);
    expect(okUploads.length).toBeGreaterThan(0);
  }, 120_000);
});
