/**
 * Load benchmark on loopback with autocannon: the jobs API, a job page, the PDF download and a
 * bare static-JSON route (the ceiling), each for a bounded time at 16 connections, signed in as
 * the engineer. Prints JSON with requests/s, p50, p99, errors and the ratio to the ceiling.
 * Needs the app running (npm run demo):  npm run bench:load [-- --seconds 10 --url http://127.0.0.1:3000]
 */
import autocannon from "autocannon";

const args = process.argv.slice(2);
const opt = (name: string, dflt: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? args[i + 1]! : dflt;
};
const BASE = opt("url", process.env.BENCH_URL ?? "http://127.0.0.1:3000");
const SECONDS = Math.min(60, Number(opt("seconds", "10")));
const CONNECTIONS = Number(opt("connections", "16"));
if (!/^https?:\/\/(127\.\d+\.\d+\.\d+|localhost|\[::1\])(:\d+)?$/.test(BASE)) throw new Error("The load benchmark only targets loopback.");

async function signInCookie(email: string, password: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const [k, v] = pair!.split("=");
      jar.set(k!, v ?? "");
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrfRes = await fetch(`${BASE}/api/auth/csrf`);
  keep(csrfRes);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${BASE}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie() },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  keep(res);
  if (![...jar.keys()].some((k) => k.includes("session-token"))) throw new Error(`sign-in failed (${res.status})`);
  return cookie();
}

function run(title: string, path: string, headers: Record<string, string>) {
  return new Promise<Record<string, number | string>>((resolve, reject) => {
    autocannon({ url: `${BASE}${path}`, connections: CONNECTIONS, duration: SECONDS, headers }, (err, r) => {
      if (err) return reject(err);
      resolve({
        route: title,
        requests_per_s: Math.round(r.requests.average),
        p50_ms: r.latency.p50,
        p99_ms: r.latency.p99,
        errors: r.errors + r.timeouts + r.non2xx,
        total: r.requests.total,
      });
    });
  });
}

const cookie = await signInCookie("engineer@halvard.example", "trammel-demo");
const jobs = (await (await fetch(`${BASE}/api/jobs`, { headers: { cookie } })).json()) as { jobs: { id: string; reference: string }[] };
const job = jobs.jobs.find((j) => j.reference === "TR-2026-0041") ?? jobs.jobs[0];
if (!job) throw new Error("no job to load; seed the demo data first");
const results = [];
results.push(await run("bare static JSON (ceiling)", "/api/ping", {}));
results.push(await run("GET /api/jobs", "/api/jobs", { cookie }));
results.push(await run("GET /jobs/{id} (page)", `/jobs/${job.id}`, { cookie }));
const report = (await (await fetch(`${BASE}/jobs/${job.id}/report`, { headers: { cookie } })).text()).match(/\/api\/reports\/([0-9a-f-]{36})\/pdf/);
if (report) results.push(await run("GET /api/reports/{id}/pdf", `/api/reports/${report[1]}/pdf`, { cookie }));
const ceiling = Number(results[0]!.requests_per_s);
console.log(JSON.stringify({ base: BASE, seconds: SECONDS, connections: CONNECTIONS, results: results.map((r) => ({ ...r, share_of_ceiling: Math.round((Number(r.requests_per_s) / ceiling) * 100) / 100 })) }, null, 2));
