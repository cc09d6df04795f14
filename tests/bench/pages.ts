/**
 * Page benchmark in Debian's Chromium (playwright-core, the browser tests' launch flags) at
 * 1440×900: every main page as each role, signed in through next-auth's real endpoint, with the
 * browser cache and service workers off so every load transfers its JavaScript. Per page (median of --runs loads after
 * one warm-up): first byte and load event (ms from navigation start, Navigation Timing), the
 * server's answer time for the HTML alone (first byte minus request start), the compressed
 * JavaScript transferred by the load event and after it (the 3D chunk comes after), and the
 * shared client JavaScript (chunks every page loads). On the analysis page it also times the 3D
 * view until it is drawn and records where the scene's placeholder sits (it should be in view
 * at first paint). Prints JSON; --out writes it to a file too (npm run bench:summary reads it).
 * Builds nothing: needs the app running (npm run demo, or a build served by `next start`).
 *   npm run bench:pages [-- --url http://127.0.0.1:3000 --runs 3 --roles engineer,customer --out f.json]
 */
import { writeFileSync } from "node:fs";
import { chromium, type BrowserContext } from "playwright-core";
import { CHROMIUM_ARGS } from "../e2e/chromium-args";
import { signIn } from "./sign-in";

const args = process.argv.slice(2);
const opt = (name: string, dflt: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? args[i + 1]! : dflt;
};
const BASE = opt("url", process.env.BENCH_URL ?? "http://127.0.0.1:3000");
const RUNS = Math.max(1, Math.min(20, Number(opt("runs", "3"))));
const OUT = opt("out", "");
if (!/^https?:\/\/(127\.\d+\.\d+\.\d+|localhost|\[::1\])(:\d+)?$/.test(BASE))
  throw new Error("The page benchmark only targets loopback.");

const VIEWPORT = { width: 1440, height: 900 };
/** Targets (issue: pages ready in a second, shared client JavaScript ≤ 120 KB compressed). */
const TARGETS = { load_ms: 1000, shared_js_kb: 120 };

const ALL_ROLES = [
  { role: "admin", email: "admin@halvard.example" },
  { role: "installer", email: "installer@halvard.example" },
  { role: "inspector", email: "inspector@halvard.example" },
  { role: "engineer", email: "engineer@halvard.example" },
  { role: "customer", email: "buyer@marlowcreek.example" },
] as const;
const wantedRoles = opt("roles", "").split(",").filter(Boolean);
const ROLES = wantedRoles.length ? ALL_ROLES.filter((r) => wantedRoles.includes(r.role)) : ALL_ROLES;

/** The demo job with a stored fit, a checklist and a report (TR-2026-0041), found through the API. */
const engineerCookie = await signIn(BASE, "engineer@halvard.example");
const jobList = (await (await fetch(`${BASE}/api/jobs`, { headers: { cookie: engineerCookie } })).json()) as {
  jobs: { id: string; reference: string }[];
};
const job = jobList.jobs.find((j) => j.reference === "TR-2026-0041") ?? jobList.jobs[0];
if (!job) throw new Error("no job to load; seed the demo data first");

const JOB_PAGES = ["", "/checklist", "/data", "/analysis", "/compare", "/report", "/activity"].map(
  (p) => `/jobs/${job.id}${p}`,
);
/** Pages besides the job's: the job list for everyone, and each role's registers. */
const OTHER_PAGES: Record<string, string[]> = {
  admin: ["/jobs", "/registers", "/registers/heads", "/registers/people"],
  engineer: ["/jobs", "/registers/heads"],
  installer: ["/jobs"],
  inspector: ["/jobs"],
  customer: ["/jobs"],
};
/** How a page is named in the output: the job's id replaced by {id}. */
const label = (p: string) => p.replace(job.id, "{id}");

interface Load {
  status: number;
  first_byte_ms: number;
  server_ms: number;
  load_ms: number;
  scripts: { url: string; bytes: number; afterLoad: boolean }[];
  viewer_ready_ms?: number;
  /** The 3D view was not drawn within the wait. */
  viewer_missed?: boolean;
  placeholder_top_px?: number;
}

async function contextFor(email: string): Promise<BrowserContext> {
  // Service workers blocked: the checklist page registers one (keeping a job for offline use),
  // which would then answer every later load of the context from its cache, unseen by this page's
  // network events (0 bytes counted for every page after it).
  const ctx = await browser.newContext({ viewport: VIEWPORT, baseURL: BASE, serviceWorkers: "block" });
  const cookie = await signIn(BASE, email);
  const host = new URL(BASE).hostname;
  await ctx.addCookies(
    cookie.split("; ").map((c) => {
      const i = c.indexOf("=");
      return { name: c.slice(0, i), value: c.slice(i + 1), domain: host, path: "/" };
    }),
  );
  return ctx;
}

async function loadOnce(ctx: BrowserContext, path: string): Promise<Load> {
  const page = await ctx.newPage();
  const cdp = await ctx.newCDPSession(page);
  await cdp.send("Network.enable");
  await cdp.send("Page.enable");
  await cdp.send("Network.setCacheDisabled", { cacheDisabled: true });
  await cdp.send("Network.setBypassServiceWorker", { bypass: true });
  // Bytes on the wire per script (compressed, headers included), and when each was requested
  // relative to the load event (CDP's monotonic timestamps, seconds).
  const scriptUrls = new Map<string, { url: string; sentAt: number }>();
  const wire = new Map<string, number>();
  let loadAt = Infinity;
  cdp.on("Network.requestWillBeSent", (e) => {
    if (e.type === "Script") scriptUrls.set(e.requestId, { url: e.request.url, sentAt: e.timestamp });
  });
  cdp.on("Network.loadingFinished", (e) => wire.set(e.requestId, e.encodedDataLength));
  cdp.on("Page.loadEventFired", (e) => (loadAt = Math.min(loadAt, e.timestamp)));
  // Where the 3D view's box is at first paint (the placeholder, before the chunk arrives).
  await page.addInitScript(() => {
    new PerformanceObserver((list) => {
      for (const e of list.getEntries())
        if (e.name === "first-contentful-paint") {
          const el = document.querySelector(
            "[data-testid=head-viewer-placeholder],[data-testid=head-viewer]",
          );
          (window as unknown as { __placeholderTop?: number }).__placeholderTop = el
            ? el.getBoundingClientRect().top
            : -1;
        }
    }).observe({ type: "paint", buffered: true });
  });
  const res = await page.goto(path, { waitUntil: "load" });
  let viewerReady: number | undefined;
  let viewerMissed = false;
  if (
    path.endsWith("/analysis") &&
    (await page.locator("[data-testid=head-viewer-placeholder],[data-testid=head-viewer]").count())
  ) {
    viewerReady = await page
      .waitForFunction(
        () => document.querySelector("[data-testid=head-viewer][data-ready=true]") && performance.now(),
        null,
        { timeout: 30_000, polling: 20 },
      )
      .then((h) => h.jsonValue() as Promise<number>)
      // Software WebGL under load can miss the wait: count the load as "not drawn" rather than
      // losing every figure measured so far (the row then says how many loads missed it).
      .catch(() => undefined);
    viewerMissed = viewerReady === undefined;
  } else {
    await page.waitForLoadState("networkidle").catch(() => {});
  }
  const m = await page.evaluate(() => {
    const nav = performance.getEntriesByType("navigation")[0] as PerformanceNavigationTiming;
    return {
      first_byte_ms: nav.responseStart,
      server_ms: nav.responseStart - nav.requestStart,
      load_ms: nav.loadEventEnd,
      placeholder_top_px: (window as unknown as { __placeholderTop?: number }).__placeholderTop,
    };
  });
  await page.close();
  const scripts = [...scriptUrls].map(([id, r]) => ({
    url: r.url,
    bytes: wire.get(id) ?? 0,
    afterLoad: r.sentAt > loadAt,
  }));
  return {
    status: res?.status() ?? 0,
    ...m,
    scripts,
    ...(viewerReady !== undefined ? { viewer_ready_ms: viewerReady } : {}),
    ...(viewerMissed ? { viewer_missed: true } : {}),
  };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};
const kb = (bytes: number) => Math.round(bytes / 102.4) / 10;

const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  headless: true,
  args: CHROMIUM_ARGS,
});
const measured: { role: string; page: string; loads: Load[] }[] = [];
try {
  for (const { role, email } of ROLES) {
    const ctx = await contextFor(email);
    for (const path of [...(OTHER_PAGES[role] ?? []), ...JOB_PAGES]) {
      await loadOnce(ctx, path); // warm-up: the server's first render of this route, its plan cache
      const loads: Load[] = [];
      for (let i = 0; i < RUNS; i++) loads.push(await loadOnce(ctx, path));
      measured.push({ role, page: path, loads });
    }
    await ctx.close();
  }
} finally {
  await browser.close();
}

/** Shared client JavaScript: the chunks every page that answered 200 loaded by its load event. */
const ok = measured.filter((m) => m.loads[0]!.status === 200);
const chunkPath = (u: string) => new URL(u).pathname;
const sets = ok.map(
  (m) => new Set(m.loads[0]!.scripts.filter((s) => !s.afterLoad).map((s) => chunkPath(s.url))),
);
const shared = new Set([...(sets[0] ?? [])].filter((u) => sets.every((s) => s.has(u))));

const results = measured.map(({ role, page, loads }) => {
  const byLoad = (l: Load, after: boolean) =>
    l.scripts.filter((s) => s.afterLoad === after).reduce((n, s) => n + s.bytes, 0);
  const sharedBytes = (l: Load) =>
    l.scripts.filter((s) => !s.afterLoad && shared.has(chunkPath(s.url))).reduce((n, s) => n + s.bytes, 0);
  const row: Record<string, number | string> = {
    role,
    page: label(page),
    status: loads[0]!.status,
    first_byte_ms: Math.round(median(loads.map((l) => l.first_byte_ms))),
    server_ms: Math.round(median(loads.map((l) => l.server_ms))),
    load_ms: Math.round(median(loads.map((l) => l.load_ms))),
    js_by_load_kb: kb(median(loads.map((l) => byLoad(l, false)))),
    js_after_load_kb: kb(median(loads.map((l) => byLoad(l, true)))),
    shared_js_kb: kb(median(loads.map(sharedBytes))),
  };
  const ready = loads.map((l) => l.viewer_ready_ms).filter((x): x is number => x !== undefined);
  if (ready.length) row.viewer_ready_ms = Math.round(median(ready));
  const missed = loads.filter((l) => l.viewer_missed).length;
  if (missed) row.viewer_not_drawn_in_30s = `${missed} of ${loads.length} loads`;
  const top = loads[0]!.placeholder_top_px;
  if (ready.length && top !== undefined) row.viewer_box_top_at_first_paint_px = Math.round(top);
  return row;
});

const answered = results.filter((r) => r.status === 200);
// Every page that answered loads the framework's scripts: none counted means the counting failed
// (as it did when a service worker answered from its cache), not a page without JavaScript.
const uncounted = answered.filter((r) => Number(r.js_by_load_kb) === 0);
if (uncounted.length > 0)
  throw new Error(
    `no JavaScript counted on ${uncounted.length} pages (e.g. ${uncounted[0]!.page} as ${uncounted[0]!.role}): the byte counting is broken`,
  );
const worst = (k: string) =>
  answered.reduce(
    (a, r) => (Number(r[k]) > Number(a[k] ?? -Infinity) ? r : a),
    {} as Record<string, unknown>,
  );
const summary = {
  pages_measured: answered.length,
  slowest_first_byte: {
    page: worst("first_byte_ms").page,
    role: worst("first_byte_ms").role,
    ms: worst("first_byte_ms").first_byte_ms,
  },
  slowest_load: { page: worst("load_ms").page, role: worst("load_ms").role, ms: worst("load_ms").load_ms },
  largest_js_by_load: {
    page: worst("js_by_load_kb").page,
    role: worst("js_by_load_kb").role,
    kb: worst("js_by_load_kb").js_by_load_kb,
  },
  shared_js_kb: Math.max(0, ...answered.map((r) => Number(r.shared_js_kb))),
  shared_chunks: shared.size,
};
const meets = {
  load_ms: answered.every((r) => Number(r.load_ms) <= TARGETS.load_ms),
  shared_js_kb: summary.shared_js_kb <= TARGETS.shared_js_kb,
};
const out = {
  base: BASE,
  viewport: VIEWPORT,
  runs: RUNS,
  cache: "off (every load transfers its JavaScript)",
  at: new Date().toISOString(),
  results,
  summary,
  targets: TARGETS,
  meets_targets: meets,
};
const text = JSON.stringify(out, null, 2);
console.log(text);
if (OUT) writeFileSync(OUT, text + "\n");
if (!meets.load_ms || !meets.shared_js_kb) process.exitCode = 1;
