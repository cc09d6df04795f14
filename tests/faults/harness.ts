/**
 * What the fault and scale-out tests start and stop: their own database on the test command's
 * PostgreSQL, two instances of the built app on two ports against it and the same object store,
 * and the local SMTP fake. Every child runs in its own process group and is stopped by its id.
 * Inputs (tests/run-all.sh sets them): PGPORT and PG_BASE of the cluster to restart, FAULTS_DB_URL
 * (a database whose name contains "faults"; dropped and made anew), NEXT_DIST_DIR of the build,
 * FAULTS_PORTS ("3100,3101"), FAULTS_SMTP_PORT, S3_ENDPOINT with STORAGE_DRIVER=s3.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { mkdirSync, readdirSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";

export const ROOT = path.resolve(import.meta.dirname, "../..");

export function required(name: string): string {
  const v = process.env[name];
  if (!v) throw new Error(`the fault tests need ${name}; tests/run-all.sh sets it`);
  return v;
}

export interface Child {
  name: string;
  proc: ChildProcess;
  log: () => string;
  exited: () => boolean;
}

const children: Child[] = [];

/** Starts `cmd` in its own process group (so its children stop with it), output kept in memory. */
export function start(
  name: string,
  cmd: string,
  args: string[],
  env: Record<string, string | undefined>,
): Child {
  const cleanEnv = { ...process.env, ...env };
  for (const [k, v] of Object.entries(cleanEnv)) if (v === undefined) delete cleanEnv[k];
  const proc = spawn(cmd, args, {
    cwd: ROOT,
    env: cleanEnv as NodeJS.ProcessEnv,
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  let done = false;
  proc.stdout!.on("data", (b: Buffer) => (out = (out + b.toString()).slice(-200_000)));
  proc.stderr!.on("data", (b: Buffer) => (out = (out + b.toString()).slice(-200_000)));
  proc.on("exit", () => (done = true));
  const c: Child = { name, proc, log: () => out, exited: () => done };
  children.push(c);
  return c;
}

/** Stops a child's whole process group and waits for it to exit. */
export async function stop(c: Child): Promise<void> {
  if (c.exited() || !c.proc.pid) return;
  try {
    process.kill(-c.proc.pid, "SIGTERM");
  } catch {
    return;
  }
  for (let i = 0; i < 100 && !c.exited(); i++) await sleep(50);
  if (!c.exited()) {
    try {
      process.kill(-c.proc.pid, "SIGKILL");
    } catch {
      /* gone */
    }
  }
}

export async function stopAll(): Promise<void> {
  for (const c of children.splice(0).reverse()) await stop(c);
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Runs a command to completion; resolves with its exit code and output. */
export function run(
  cmd: string,
  args: string[],
  env: Record<string, string | undefined> = {},
): Promise<{ code: number; out: string }> {
  return new Promise((resolve) => {
    const c = start(`${cmd} ${args.join(" ")}`, cmd, args, env);
    c.proc.on("exit", (code) => resolve({ code: code ?? -1, out: c.log() }));
  });
}

export async function waitFor(
  what: string,
  check: () => Promise<boolean>,
  timeoutMs: number,
  everyMs = 100,
): Promise<void> {
  const t0 = Date.now();
  while (Date.now() - t0 < timeoutMs) {
    if (await check().catch(() => false)) return;
    await sleep(everyMs);
  }
  throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
}

/** The project's PostgreSQL script, aimed at the test command's cluster (never at DATABASE_URL). */
export function pgScript(cmd: "start" | "stop") {
  return run("bash", ["db/pg.sh", cmd], {
    DATABASE_URL: undefined,
    PGPORT: required("PGPORT"),
    PG_BASE: required("PG_BASE"),
  });
}

export interface AppInstance {
  base: string;
  child: Child;
}

/** One instance of the built app (next start) on `port`, with its outbox worker on a short timer. */
export async function startApp(port: number, env: Record<string, string>): Promise<AppInstance> {
  const base = `http://127.0.0.1:${port}`;
  const child = start(
    `app:${port}`,
    "node",
    ["node_modules/next/dist/bin/next", "start", "-p", String(port), "-H", "127.0.0.1"],
    {
      NEXTAUTH_URL: base,
      PUBLIC_URL: base,
      ...env,
    },
  );
  await waitFor(`the app on ${base}`, async () => (await fetch(`${base}/api/health`)).ok, 30_000, 200).catch(
    (err) => {
      throw new Error(`${String(err)}\n${child.log().slice(-3000)}`);
    },
  );
  return { base, child };
}

export { signIn } from "../bench/sign-in";

/** Signs out through next-auth's endpoint (which revokes the account's sessions). */
export async function signOut(base: string, cookie: string): Promise<number> {
  const { csrfToken } = (await (await fetch(`${base}/api/auth/csrf`, { headers: { cookie } })).json()) as {
    csrfToken: string;
  };
  const res = await fetch(`${base}/api/auth/signout`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie },
    body: new URLSearchParams({ csrfToken, json: "true" }),
  });
  return res.status;
}

/** An invented sphere-probe file: `rows` poses on a 50 mm sphere, with a distinct offset per call. */
export function probeCsv(rows: number, salt: number): Buffer {
  const lines = ["primary_deg,secondary_deg,x,y,z,point,repeat"];
  for (let i = 0; i < rows; i++) {
    const a = ((i * 7.2) % 360) * (Math.PI / 180);
    const b = (-90 + ((i * 3.6) % 180)) * (Math.PI / 180);
    const x = 250 + 25 * Math.cos(b) * Math.cos(a) + salt * 1e-6;
    const y = 400 + 25 * Math.cos(b) * Math.sin(a);
    const z = -120 + 25 * Math.sin(b);
    lines.push(
      `${((i * 7.2) % 360).toFixed(3)},${(-90 + ((i * 3.6) % 180)).toFixed(3)},${x.toFixed(5)},${y.toFixed(5)},${z.toFixed(5)},${i + 1},1`,
    );
  }
  return Buffer.from(lines.join("\n") + "\n");
}

export function probeForm(csv: Buffer, filename: string): FormData {
  const form = new FormData();
  form.set("kind", "sphere_probe");
  form.set("phase", "pre");
  form.set("units", "mm");
  form.set("file", new Blob([new Uint8Array(csv)], { type: "text/csv" }), filename);
  return form;
}

/** The SMTP fake's mail folder, emptied. */
export function freshMailDir(dir: string): string {
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  return dir;
}

export interface StoredMail {
  file: string;
  outboxId: string | null;
  sender: string | null;
  to: string | null;
}

/** Every message the fake stored, with the outbox id and sender headers the worker adds. */
export function storedMails(dir: string): StoredMail[] {
  let names: string[] = [];
  try {
    names = readdirSync(dir).filter((f) => f.endsWith(".eml"));
  } catch {
    return [];
  }
  return names.map((file) => {
    const head = readFileSync(path.join(dir, file), "utf8")
      .split(/\r?\n\r?\n/)[0]!
      .replace(/\r?\n[ \t]+/g, " ");
    const header = (name: string) => new RegExp(`^${name}:\\s*(.+)$`, "im").exec(head)?.[1]?.trim() ?? null;
    return {
      file,
      outboxId: header("X-Trammel-Outbox-Id"),
      sender: header("X-Trammel-Sender"),
      to: header("To"),
    };
  });
}

/** How many times each value occurs. */
export function tally<T>(xs: readonly T[]): Map<T, number> {
  const m = new Map<T, number>();
  for (const x of xs) m.set(x, (m.get(x) ?? 0) + 1);
  return m;
}
