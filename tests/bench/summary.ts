/**
 * Every speed figure beside its peer from the same run, ratio first: GET /api/jobs and a job page
 * against the bare route (requests/s, npm run bench:load), their CPU per request (npm run
 * bench:cost), each page's first byte against the run's median page, its load event against the 1 s
 * target, shared client JavaScript against its 120 KB budget (npm run bench:pages), and, when
 * another benchmark has left its JSON at --fit-json (default .data/bench/fit-head.json), its
 * pairs too (shape: {"pairs": [{"what", "figure", "peer", "ratio"?, "unit"?}]}). A fixed CPU loop
 * (3·10^8 steps) is timed before and after, since the machine's speed varies.
 * Builds nothing: needs the app running.
 *   npm run bench:summary [-- --url http://127.0.0.1:3000 --seconds 10 --pages-runs 1 --skip-pages]
 */
import { execFileSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

const args = process.argv.slice(2);
const opt = (name: string, dflt: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? args[i + 1]! : dflt;
};
const flag = (name: string) => args.includes(`--${name}`);
const BASE = opt("url", process.env.BENCH_URL ?? "http://127.0.0.1:3000");
const SECONDS = opt("seconds", "10");
const FIT_JSON = opt("fit-json", path.join(".data", "bench", "fit-head.json"));
const HERE = path.dirname(new URL(import.meta.url).pathname);

/** The fixed CPU loop README quotes beside its figures: 3·10^8 additions, seconds. */
function loopSeconds(): number {
  const t0 = process.hrtime.bigint();
  let x = 0;
  for (let i = 0; i < 3e8; i++) x += i & 1;
  if (x !== 1.5e8) throw new Error("loop miscounted");
  return Number(process.hrtime.bigint() - t0) / 1e9;
}

/** Runs one of the bench scripts and parses the JSON it prints (a missed target does not stop the summary). */
function bench(script: string, extra: string[]): Record<string, unknown> {
  let out: string;
  try {
    out = execFileSync("npx", ["tsx", path.join(HERE, script), "--url", BASE, ...extra], {
      encoding: "utf8",
      stdio: ["ignore", "pipe", "inherit"],
      maxBuffer: 64 << 20,
    });
  } catch (err) {
    out = String((err as { stdout?: string }).stdout ?? "");
    if (!out.trim()) throw err;
  }
  return JSON.parse(out.slice(out.indexOf("{"))) as Record<string, unknown>;
}

interface Pair {
  what: string;
  ratio: number;
  figure: string;
  peer: string;
}
const pairs: Pair[] = [];
const r2 = (x: number) => Math.round(x * 100) / 100;
const add = (what: string, figure: number, peer: number, unit: string, peerName: string) =>
  pairs.push({
    what,
    ratio: r2(figure / peer),
    figure: `${figure} ${unit}`,
    peer: `${peer} ${unit} (${peerName})`,
  });

const loopBefore = loopSeconds();

type Row = Record<string, number | string>;
const load = bench("load.ts", ["--seconds", SECONDS, "--uploads", "0"]);
const loadRows = load.results as Row[];
const ceiling = loadRows.find((r) => String(r.route).startsWith("bare"))!;
for (const r of loadRows.filter((x) => x !== ceiling)) {
  add(
    `${r.route}: requests/s at 16 connections`,
    Number(r.requests_per_s),
    Number(ceiling.requests_per_s),
    "req/s",
    "bare route",
  );
  pairs.at(-1)!.figure += `, p99 ${r.p99_ms} ms`;
  pairs.at(-1)!.peer += `, p99 ${ceiling.p99_ms} ms`;
}

const cost = bench("request-cost.ts", []);
const costRows = cost.results as Row[];
const cpu = (r: Row) => r2(Number(r.app_cpu_ms_per_request) + Number(r.postgres_cpu_ms_per_request));
const bare = costRows.find((r) => String(r.route).startsWith("bare"))!;
for (const r of costRows.filter((x) => x !== bare))
  pairs.push({
    what: `${r.route}: share of the bare route by CPU per request (app + PostgreSQL)`,
    ratio: r2(cpu(bare) / cpu(r)),
    figure: `${cpu(r)} ms (app ${r.app_cpu_ms_per_request}, PostgreSQL ${r.postgres_cpu_ms_per_request})`,
    peer: `${cpu(bare)} ms (bare route)`,
  });

if (!flag("skip-pages")) {
  const pages = bench("pages.ts", ["--runs", opt("pages-runs", "1")]);
  const rows = (pages.results as Row[]).filter((r) => r.status === 200);
  // The peer of a page's first byte: the median page of the same run (a single lightest page is
  // mostly luck on a busy machine).
  const sorted = [...rows].sort((a, b) => Number(a.first_byte_ms) - Number(b.first_byte_ms));
  const mid = sorted[Math.floor((sorted.length - 1) / 2)]!;
  for (const r of rows) {
    add(
      `${r.page} as ${r.role}: first byte`,
      Number(r.first_byte_ms),
      Number(mid.first_byte_ms),
      "ms",
      "median page of this run",
    );
    add(`${r.page} as ${r.role}: load event`, Number(r.load_ms), 1000, "ms", "target");
    if (r.viewer_ready_ms !== undefined)
      add(
        `${r.page} as ${r.role}: 3D view drawn`,
        Number(r.viewer_ready_ms),
        Number(r.load_ms),
        "ms",
        "its load event",
      );
  }
  const s = pages.summary as {
    shared_js_kb: number;
    largest_js_by_load: { page: string; role: string; kb: number };
  };
  add("shared client JavaScript per page (compressed)", s.shared_js_kb, 120, "KB", "budget");
  add(
    `largest JavaScript by load event: ${s.largest_js_by_load.page} as ${s.largest_js_by_load.role}`,
    s.largest_js_by_load.kb,
    s.shared_js_kb,
    "KB",
    "shared part",
  );
}

if (existsSync(FIT_JSON)) {
  const fit = JSON.parse(readFileSync(FIT_JSON, "utf8")) as {
    pairs?: {
      what: string;
      figure: number;
      peer: number;
      ratio?: number;
      unit?: string;
      peerName?: string;
    }[];
  };
  for (const p of fit.pairs ?? [])
    pairs.push({
      what: p.what,
      ratio: p.ratio ?? r2(p.figure / p.peer),
      figure: `${p.figure} ${p.unit ?? ""}`.trim(),
      peer: `${p.peer} ${p.unit ?? ""} (${p.peerName ?? "peer"})`.trim(),
    });
}

const loopAfter = loopSeconds();
const w = Math.max(...pairs.map((p) => p.what.length));
console.log(`CPU loop (3·10^8 steps): ${loopBefore.toFixed(2)} s before, ${loopAfter.toFixed(2)} s after`);
console.log(`${"ratio".padStart(6)}  ${"what".padEnd(w)}  figure  |  peer`);
for (const p of pairs)
  console.log(`${p.ratio.toFixed(2).padStart(6)}  ${p.what.padEnd(w)}  ${p.figure}  |  ${p.peer}`);
console.log(
  JSON.stringify(
    { base: BASE, at: new Date().toISOString(), loop_s: [r2(loopBefore), r2(loopAfter)], pairs },
    null,
    2,
  ),
);
