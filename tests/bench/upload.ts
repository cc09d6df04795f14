/**
 * Upload benchmark: a 10^6-row sphere-probe CSV (about 45 MB, generated here) posted as multipart
 * to the running app, signed in as the demo inspector. Prints JSON: the HTTP status (the file is
 * valid, so 201), wall time, the size, and the server process's resident memory growth sampled
 * while it works. Targets: stored within 15 s, growth < 256 MB.
 *   BENCH_BASE_URL=http://127.0.0.1:3000 npm run bench:upload
 * The server process is found by its listening port (ss); BENCH_SERVER_PID overrides.
 */
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";

const BASE = (process.env.BENCH_BASE_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
const ROWS = Number(process.env.BENCH_ROWS ?? 1_000_000);
const JOB = process.env.BENCH_JOB ?? "TR-2026-0052";

const jar = new Map<string, string>();
async function call(path: string, init: RequestInit = {}): Promise<Response> {
  const headers = new Headers(init.headers);
  if (jar.size) headers.set("cookie", [...jar].map(([k, v]) => `${k}=${v}`).join("; "));
  const res = await fetch(`${BASE}${path}`, { ...init, headers, redirect: "manual" });
  for (const c of res.headers.getSetCookie()) {
    const [pair] = c.split(";");
    const i = pair!.indexOf("=");
    jar.set(pair!.slice(0, i), pair!.slice(i + 1));
  }
  return res;
}

function serverPid(): number | null {
  if (process.env.BENCH_SERVER_PID) return Number(process.env.BENCH_SERVER_PID);
  try {
    const port = new URL(BASE).port || "80";
    const out = execFileSync("ss", ["-ltnpH", `sport = :${port}`], { encoding: "utf8" });
    const m = /pid=(\d+)/.exec(out);
    return m ? Number(m[1]) : null;
  } catch {
    return null;
  }
}

function rssMb(pid: number): number {
  const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"));
  return m ? Number(m[1]) / 1024 : NaN;
}

/** Invented poses over the primary turn and the secondary range, centres on a 50 mm sphere with noise. */
function makeCsv(rows: number): Buffer {
  const parts: string[] = ["primary_deg,secondary_deg,x,y,z,point,repeat"];
  let seed = 12345;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff - 0.5) * 0.002;
  for (let i = 0; i < rows; i++) {
    const p = (i * 7.2) % 360;
    const s = -90 + ((i * 3.6) % 180);
    parts.push(
      `${p.toFixed(3)},${s.toFixed(3)},${(250 + rnd()).toFixed(5)},${(400 + rnd()).toFixed(5)},${(-120 + rnd()).toFixed(5)},${i + 1},1`,
    );
  }
  return Buffer.from(parts.join("\n") + "\n");
}

async function main() {
  // Generate first: a pause of seconds between requests would meet the server's keep-alive timeout.
  const t0 = performance.now();
  const file = makeCsv(ROWS);
  const generateS = (performance.now() - t0) / 1000;
  const csrf = (await (await call("/api/auth/csrf")).json()) as { csrfToken: string };
  const form = new URLSearchParams({
    csrfToken: csrf.csrfToken,
    email: "inspector@halvard.example",
    password: "trammel-demo",
    json: "true",
  });
  await call("/api/auth/callback/credentials", {
    method: "POST",
    body: form,
    headers: { "content-type": "application/x-www-form-urlencoded" },
  });
  const jobs = (await (await call("/api/jobs")).json()) as { jobs: { id: string; reference: string }[] };
  const job = jobs.jobs.find((j) => j.reference === JOB);
  if (!job) throw new Error(`bench: job ${JOB} not visible; is the demo seeded and the sign-in working?`);

  const body = new FormData();
  body.set("kind", "sphere_probe");
  body.set("phase", "pre");
  body.set("units", "mm");
  body.set("file", new Blob([new Uint8Array(file)], { type: "text/csv" }), "bench-1e6.csv");

  const pid = serverPid();
  const base = pid ? rssMb(pid) : NaN;
  let peak = base;
  const timer = pid ? setInterval(() => (peak = Math.max(peak, rssMb(pid))), 25) : null;
  const t1 = performance.now();
  const res = await call(`/api/jobs/${job.id}/datasets`, { method: "POST", body });
  const answer = (await res.json()) as {
    id?: string;
    rows?: number;
    error?: { code: string; message: string };
  };
  const seconds = (performance.now() - t1) / 1000;
  if (timer) clearInterval(timer);
  if (pid) peak = Math.max(peak, rssMb(pid));

  const growth = peak - base;
  const result = {
    bench: "upload",
    rows: ROWS,
    file_mb: +(file.length / 1e6).toFixed(1),
    generate_s: +generateS.toFixed(2),
    status: res.status,
    stored_rows: answer.rows ?? null,
    error: answer.error?.code ?? null,
    seconds: +seconds.toFixed(2),
    server_pid: pid,
    server_rss_before_mb: +base.toFixed(0),
    server_rss_peak_mb: +peak.toFixed(0),
    server_rss_growth_mb: +growth.toFixed(0),
    targets: { seconds: 15, growth_mb: 256 },
    // The file is valid, so only 201 is right; a refusal here would be a bug, not a fast answer.
    ok: res.status === 201 && seconds < 15 && (!pid || growth < 256),
  };
  console.log(JSON.stringify(result, null, 2));
  if (!result.ok) process.exitCode = 1;
}

await main();
