/**
 * CPU cost per request, which a busy or throttled machine distorts far less than requests/s:
 * the app server's and PostgreSQL's CPU time (user + system, from /proc) spent on a fixed number
 * of requests to the bare route and to GET /api/jobs, signed in as the engineer, at 16
 * connections. The server is found by its listening port; PostgreSQL by its postmaster.pid
 * (PG_BASE/pg, default .data/pg), whose child processes are its backends. Prints JSON.
 *   npm run bench:cost [-- --url http://127.0.0.1:3000 --requests 3000]
 */
import { execFileSync } from "node:child_process";
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import autocannon from "autocannon";
import { signIn } from "./sign-in";

const args = process.argv.slice(2);
const opt = (name: string, dflt: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? args[i + 1]! : dflt;
};
const BASE = opt("url", process.env.BENCH_URL ?? "http://127.0.0.1:3000");
const N = Number(opt("requests", "3000"));
if (!/^https?:\/\/(127\.\d+\.\d+\.\d+|localhost)(:\d+)?$/.test(BASE))
  throw new Error("The cost benchmark only targets loopback.");
const TICK_MS = 1000 / Number(execFileSync("getconf", ["CLK_TCK"], { encoding: "utf8" }).trim());

const stat = (pid: number) => readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1]!.split(" ");
/** utime + stime of one process, in clock ticks (fields 14 and 15 of /proc/<pid>/stat). */
const ticks = (pid: number) => {
  const f = stat(pid);
  return Number(f[11]) + Number(f[12]);
};

const serverPid = Number(
  /pid=(\d+)/.exec(
    execFileSync("ss", ["-ltnpH", `sport = :${new URL(BASE).port || "80"}`], { encoding: "utf8" }),
  )?.[1],
);
if (!serverPid) throw new Error(`no process listens on ${BASE}`);
const pgBase = process.env.PG_BASE ?? path.resolve(".data");
const postmaster = Number(readFileSync(path.join(pgBase, "pg", "postmaster.pid"), "utf8").split("\n")[0]);

/** CPU ticks of every PostgreSQL backend now; backends that come and go are counted from what is seen. */
function backends(): Map<number, number> {
  const m = new Map<number, number>();
  for (const d of readdirSync("/proc")) {
    if (!/^\d+$/.test(d)) continue;
    try {
      if (Number(stat(Number(d))[1]) === postmaster) m.set(Number(d), ticks(Number(d)));
    } catch {
      /* exited meanwhile */
    }
  }
  m.set(postmaster, ticks(postmaster));
  return m;
}

const load = (p: string, headers: Record<string, string>) =>
  new Promise<number>((resolve, reject) =>
    autocannon({ url: `${BASE}${p}`, connections: 16, amount: N, headers }, (err, r) =>
      err ? reject(err) : resolve(r.errors + r.timeouts + r.non2xx),
    ),
  );

const cookie = await signIn(BASE, "engineer@halvard.example");
const results = [];
for (const [route, p, headers] of [
  ["bare static JSON", "/api/ping", {}],
  ["GET /api/jobs", "/api/jobs", { cookie }],
] as const) {
  await load(p, headers); // warm: JIT, pool connections, PostgreSQL's plan cache
  const app0 = ticks(serverPid);
  const pg0 = backends();
  const errors = await load(p, headers);
  const pg1 = backends();
  const pgTicks = [...pg1].reduce((s, [pid, t]) => s + t - (pg0.get(pid) ?? 0), 0);
  results.push({
    route,
    requests: N,
    errors,
    app_cpu_ms_per_request: +(((ticks(serverPid) - app0) * TICK_MS) / N).toFixed(2),
    postgres_cpu_ms_per_request: +((pgTicks * TICK_MS) / N).toFixed(2),
  });
}
console.log(
  JSON.stringify({ base: BASE, server_pid: serverPid, postmaster_pid: postmaster, results }, null, 2),
);
if (results.some((r) => r.errors > 0)) process.exitCode = 1;
