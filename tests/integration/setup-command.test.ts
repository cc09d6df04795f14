// `npm run setup -- --admin-email …` on an empty database of its own (made on the test server and
// dropped after): migrates, creates the one administrator with a one-time set-password link that
// is printed and queued by e-mail, loads nothing of the demo, and refuses a second run.
import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { promisify } from "node:util";
import { Client } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

const run = promisify(execFile);
const name = `setup_cmd_test_${process.pid}_${Date.now().toString(36)}`;
const server = new URL(process.env.DATABASE_URL!);
const target = new URL(server.toString());
target.pathname = `/${name}`;

async function onServer<T>(url: URL, work: (c: Client) => Promise<T>): Promise<T> {
  const c = new Client({ connectionString: url.toString() });
  await c.connect();
  try {
    return await work(c);
  } finally {
    await c.end();
  }
}
function setup(...args: string[]) {
  return run("npx", ["tsx", "--import", "./lib/scripts/allow-server-only.mjs", "db/setup.ts", ...args], {
    env: { ...process.env, DATABASE_URL: target.toString(), PUBLIC_URL: "https://trammel.example.com" },
  }).then(
    (r) => ({ code: 0, stdout: r.stdout, stderr: r.stderr }),
    (e: { code: number; stdout: string; stderr: string }) => ({
      code: e.code,
      stdout: e.stdout,
      stderr: e.stderr,
    }),
  );
}

beforeAll(async () => {
  await onServer(server, (c) => c.query(`CREATE DATABASE "${name}"`));
});
afterAll(async () => {
  await onServer(server, (c) => c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`));
});

describe("npm run setup", () => {
  it("creates the first administrator with a printed, queued one-time link and no demo data", async () => {
    const r = await setup("--admin-email", "first@service.example", "--admin-name", "First Admin");
    expect(r.code, r.stderr).toBe(0);
    const m = /https:\/\/trammel\.example\.com\/set-password\?token=([A-Za-z0-9_-]{40,})/.exec(r.stdout);
    expect(m).not.toBeNull();
    const token = m![1]!;
    await onServer(target, async (c) => {
      const u = await c.query("select email, name, role, password_hash from users");
      expect(u.rows).toEqual([
        { email: "first@service.example", name: "First Admin", role: "admin", password_hash: null },
      ]);
      // Only the token's SHA-256 is stored, and it is the printed token's.
      const t = await c.query("select token_hash, purpose, used_at from user_tokens");
      expect(t.rows).toEqual([
        { token_hash: createHash("sha256").update(token).digest("hex"), purpose: "invite", used_at: null },
      ]);
      const mail = await c.query("select to_address, text_body from outbox");
      expect(mail.rows).toHaveLength(1);
      expect(mail.rows[0].to_address).toBe("first@service.example");
      expect(mail.rows[0].text_body).toContain(token);
      for (const table of ["customers", "sites", "machines", "heads", "jobs", "instruments"]) {
        const n = await c.query(`select count(*)::int as n from ${table}`);
        expect(n.rows[0].n, table).toBe(0);
      }
      // The starter library and nothing else: three procedures, version 1, current, one per job
      // kind, with the installation's full sequence; none of the demo's own procedure.
      const procs = await c.query(
        `select t.name, t.version, t.is_current, t.job_kinds::text as kinds, count(s.id)::int as steps
           from procedure_templates t join template_steps s on s.template_id = t.id
          group by t.id order by t.name`,
      );
      expect(procs.rows).toEqual([
        {
          name: "Starter: check a two-axis head after a crash",
          version: 1,
          is_current: true,
          kinds: "{after_crash}",
          steps: 11,
        },
        {
          name: "Starter: install a two-axis head",
          version: 1,
          is_current: true,
          kinds: "{installation}",
          steps: 25,
        },
        {
          name: "Starter: periodic re-check of a two-axis head",
          version: 1,
          is_current: true,
          kinds: "{reverification}",
          steps: 8,
        },
      ]);
      const kinds = await c.query(
        `select derivation::text as d, count(*)::int as n from template_steps s
           join procedure_templates t on t.id = s.template_id
          where t.name = 'Starter: install a two-axis head' group by 1 order by 1`,
      );
      expect(Object.fromEntries(kinds.rows.map((r) => [r.d, r.n]))).toEqual({
        angle_over_distance: 2,
        check: 10,
        direct: 2,
        multi_point: 2,
        note: 1,
        record: 8,
      });
      // Every judged step names its limit's source; every multi-point step its points.
      const unsourced = await c.query(
        `select title from template_steps where derivation in ('direct','angle_over_distance','multi_point')
            and (limit_source_note is null or (lower_limit is null and upper_limit is null))`,
      );
      expect(unsourced.rows).toEqual([]);
      const audit = await c.query("select action from audit_events order by id");
      expect(audit.rows.map((a) => a.action)).toEqual([
        "procedure.library_loaded",
        "procedure.library_loaded",
        "procedure.library_loaded",
        "user.first_admin_created",
      ]);
      // The issuer's details start empty (a readiness blocker until the administrator fills
      // them in), with the usual statement about reproduction in full.
      const issuer = await c.query("select name, address, reproduction_statement from issuer_settings");
      expect(issuer.rows).toHaveLength(1);
      expect(issuer.rows[0].name).toBe("");
      expect(issuer.rows[0].address).toBe("");
      expect(issuer.rows[0].reproduction_statement).toMatch(/except in full/);
    });
  }, 120_000);

  it("refuses a second run, and a missing or malformed e-mail, with the reason and exit status 1", async () => {
    const again = await setup("--admin-email", "second@service.example");
    expect(again.code).toBe(1);
    expect(again.stderr).toContain("already has accounts");
    const bad = await setup("--admin-email", "not-an-address");
    expect(bad.code).toBe(1);
    expect(bad.stderr).toContain("--admin-email");
    await onServer(target, async (c) => {
      expect((await c.query("select count(*)::int as n from users")).rows[0].n).toBe(1);
      // Loading the library again adds nothing (idempotent by name and version).
      expect((await c.query("select count(*)::int as n from procedure_templates")).rows[0].n).toBe(3);
    });
  }, 120_000);
});
