/**
 * Load benchmark on loopback with autocannon: the jobs API, a job page, the PDF download and a
 * bare static-JSON route (the ceiling), each for a bounded time at 16 connections, signed in as
 * the engineer; then the upload of a 10 000-row sphere-probe file (invented poses) to the demo
 * job TR-2026-0052 as the inspector, a bounded number of times (--uploads, 160: each one is
 * stored, so the demo database grows by that many datasets). Prints JSON with requests/s, p50,
 * p99, errors and the ratio to the ceiling, and whether GET /api/jobs meets the read targets
 * (≥ 300 requests/s, p99 ≤ 100 ms, ≥ 0.6 of the ceiling); exits 1 on any error or a missed target.
 * Needs the app running (npm run demo):  npm run bench:load [-- --seconds 10 --url http://127.0.0.1:3000]
 */
import autocannon from "autocannon";
import { signIn } from "./sign-in";

const args = process.argv.slice(2);
const opt = (name: string, dflt: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? args[i + 1]! : dflt;
};
const BASE = opt("url", process.env.BENCH_URL ?? "http://127.0.0.1:3000");
const SECONDS = Math.min(60, Number(opt("seconds", "10")));
const CONNECTIONS = Number(opt("connections", "16"));
const UPLOADS = Math.min(2000, Number(opt("uploads", "160")));
if (!/^https?:\/\/(127\.\d+\.\d+\.\d+|localhost|\[::1\])(:\d+)?$/.test(BASE))
  throw new Error("The load benchmark only targets loopback.");

const signInCookie = (email: string, password: string) => signIn(BASE, email, password);

function run(
  title: string,
  path: string,
  headers: Record<string, string>,
  extra: Partial<autocannon.Options> = {},
) {
  return new Promise<Record<string, number | string>>((resolve, reject) => {
    autocannon(
      { url: `${BASE}${path}`, connections: CONNECTIONS, duration: SECONDS, headers, ...extra },
      (err, r) => {
        if (err) return reject(err);
        resolve({
          route: title,
          requests_per_s: Math.round(r.requests.average),
          p50_ms: r.latency.p50,
          p99_ms: r.latency.p99,
          errors: r.errors + r.timeouts + r.non2xx,
          total: r.requests.total,
        });
      },
    );
  });
}

const cookie = await signInCookie("engineer@halvard.example", "trammel-demo");
const jobs = (await (await fetch(`${BASE}/api/jobs`, { headers: { cookie } })).json()) as {
  jobs: { id: string; reference: string }[];
};
const job = jobs.jobs.find((j) => j.reference === "TR-2026-0041") ?? jobs.jobs[0];
if (!job) throw new Error("no job to load; seed the demo data first");
const results: Record<string, number | string>[] = [];
results.push(await run("bare static JSON (ceiling)", "/api/ping", {}));
results.push(await run("GET /api/jobs", "/api/jobs", { cookie }));
results.push(await run("GET /jobs/{id} (page)", `/jobs/${job.id}`, { cookie }));
const report = (await (await fetch(`${BASE}/jobs/${job.id}/report`, { headers: { cookie } })).text()).match(
  /\/api\/reports\/([0-9a-f-]{36})\/pdf/,
);
if (report) results.push(await run("GET /api/reports/{id}/pdf", `/api/reports/${report[1]}/pdf`, { cookie }));

/** An invented 10 000-pose sphere-probe file (a 50 mm sphere seen over both axes), as multipart. */
function probeUpload(rows: number): { body: Buffer; contentType: string } {
  const lines = ["primary_deg,secondary_deg,x,y,z,point,repeat"];
  for (let i = 0; i < rows; i++) {
    const a = (i * 7.2) % 360;
    const b = -90 + ((i * 3.6) % 180);
    const [ar, br] = [(a * Math.PI) / 180, (b * Math.PI) / 180];
    lines.push(
      `${a.toFixed(3)},${b.toFixed(3)},${(250 + 25 * Math.cos(br) * Math.cos(ar)).toFixed(5)},${(400 + 25 * Math.cos(br) * Math.sin(ar)).toFixed(5)},${(-120 + 25 * Math.sin(br)).toFixed(5)},${i + 1},1`,
    );
  }
  const boundary = `----trammel-bench-${Date.now().toString(36)}`;
  const field = (name: string, value: string) =>
    `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
  const body = Buffer.concat([
    Buffer.from(field("kind", "sphere_probe") + field("phase", "pre") + field("units", "mm")),
    Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="bench-probe-10k.csv"\r\nContent-Type: text/csv\r\n\r\n`,
    ),
    Buffer.from(lines.join("\n") + "\n"),
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
  return { body, contentType: `multipart/form-data; boundary=${boundary}` };
}

const inspector = await signInCookie("inspector@halvard.example", "trammel-demo");
const uploadJob = jobs.jobs.find((j) => j.reference === "TR-2026-0052");
if (uploadJob && UPLOADS > 0) {
  const probe = probeUpload(10_000);
  const r = await run(
    `POST /api/jobs/{id}/datasets (10 000-row probe file, ${(probe.body.length / 1e6).toFixed(2)} MB, ${UPLOADS} uploads)`,
    `/api/jobs/${uploadJob.id}/datasets`,
    { cookie: inspector, "content-type": probe.contentType },
    { method: "POST", body: probe.body, amount: UPLOADS },
  );
  results.push(r);
}
const ceiling = Number(results[0]!.requests_per_s);
const rows = results.map((r): Record<string, number | string> => ({
  ...r,
  share_of_ceiling: Math.round((Number(r.requests_per_s) / ceiling) * 100) / 100,
}));
const jobsRow = rows.find((r) => r.route === "GET /api/jobs")!;
const readTargets = { requests_per_s: 300, p99_ms: 100, share_of_ceiling: 0.6, errors: 0 };
const meetsReadTargets =
  Number(jobsRow.requests_per_s) >= readTargets.requests_per_s &&
  Number(jobsRow.p99_ms) <= readTargets.p99_ms &&
  Number(jobsRow.share_of_ceiling) >= readTargets.share_of_ceiling &&
  Number(jobsRow.errors) === 0;
const errors = rows.reduce((n, r) => n + Number(r.errors), 0);
console.log(
  JSON.stringify(
    {
      base: BASE,
      seconds: SECONDS,
      connections: CONNECTIONS,
      results: rows,
      read_targets: readTargets,
      meets_read_targets: meetsReadTargets,
      errors,
    },
    null,
    2,
  ),
);
if (!meetsReadTargets || errors > 0) process.exitCode = 1;
