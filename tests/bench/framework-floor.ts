/**
 * The framework's floor for client JavaScript: builds an empty App Router page (a root layout and a
 * page that renders one paragraph, no client component of its own) with this project's own next,
 * react and react-dom in a temporary folder, and counts the JavaScript that page loads (module
 * scripts; the `noModule` polyfills are skipped by every browser that runs modules) compressed as
 * `next start` sends it (gzip, level 6) and with brotli at its best (quality 11). Beside it, ratio
 * first, the app's own shared set counted the same way: the chunks the signed-in jobs page of a
 * running build loads (--url, --dist: that build's folder), and the 120 KB budget.
 * Builds the empty page (about a minute); needs the app running for the peer.
 *   npx tsx tests/bench/framework-floor.ts [--url http://127.0.0.1:3000 --dist .next]
 */
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { brotliCompressSync, constants, gzipSync } from "node:zlib";
import { signIn } from "./sign-in";

const args = process.argv.slice(2);
const opt = (name: string, dflt: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? args[i + 1]! : dflt;
};
const BASE = opt("url", process.env.BENCH_URL ?? "http://127.0.0.1:3000");
const root = path.join(import.meta.dirname, "../..");
const DIST = path.resolve(root, opt("dist", process.env.NEXT_DIST_DIR ?? ".next"));
const BUDGET_KB = 120;
const kb = (bytes: number) => Math.round(bytes / 102.4) / 10;

/** Module scripts of an HTML page (src), without the noModule ones. */
function moduleScripts(html: string): string[] {
  return [...html.matchAll(/<script[^>]*\bsrc="([^"]+)"[^>]*>/g)]
    .filter((m) => !/\bnomodule\b/i.test(m[0]))
    .map((m) => m[1]!);
}

/** Compressed sizes of the scripts, read from a build folder (`/_next/x` is `<dist>/x`). */
function sizes(dist: string, srcs: string[]) {
  let raw = 0;
  let gzip = 0;
  let brotli = 0;
  for (const src of srcs) {
    const body = readFileSync(path.join(dist, new URL(src, "http://x").pathname.replace(/^\/_next\//, "")));
    raw += body.length;
    gzip += gzipSync(body, { level: 6 }).length;
    brotli += brotliCompressSync(body, { params: { [constants.BROTLI_PARAM_QUALITY]: 11 } }).length;
  }
  return { files: srcs.length, raw_kb: kb(raw), gzip_kb: kb(gzip), brotli_kb: kb(brotli) };
}

/** next, react, react-dom and everything they depend on, as found in this project's node_modules. */
function frameworkPackages(): string[] {
  const seen = new Set<string>();
  const queue = ["next", "react", "react-dom"];
  while (queue.length) {
    const name = queue.shift()!;
    if (seen.has(name) || !existsSync(path.join(root, "node_modules", name, "package.json"))) continue;
    seen.add(name);
    const pkg = JSON.parse(readFileSync(path.join(root, "node_modules", name, "package.json"), "utf8")) as {
      dependencies?: Record<string, string>;
      optionalDependencies?: Record<string, string>;
    };
    queue.push(...Object.keys({ ...pkg.dependencies, ...pkg.optionalDependencies }));
  }
  return [...seen];
}

async function main() {
  const dir = mkdtempSync(path.join(tmpdir(), "trammel-framework-floor-"));
  try {
    mkdirSync(path.join(dir, "app"));
    mkdirSync(path.join(dir, "node_modules", "@next"), { recursive: true });
    mkdirSync(path.join(dir, "node_modules", "@swc"), { recursive: true });
    mkdirSync(path.join(dir, "node_modules", "@img"), { recursive: true });
    // Hard links: the same files as the project's, no copy (and the folder is its own workspace root).
    for (const name of frameworkPackages())
      execFileSync("cp", [
        "-al",
        path.join(root, "node_modules", name),
        path.join(dir, "node_modules", name),
      ]);
    writeFileSync(path.join(dir, "package.json"), '{ "name": "framework-floor", "private": true }\n');
    writeFileSync(path.join(dir, "package-lock.json"), "{}\n");
    writeFileSync(
      path.join(dir, "next.config.mjs"),
      "const here = new URL('.', import.meta.url).pathname;\nexport default { poweredByHeader: false, turbopack: { root: here }, outputFileTracingRoot: here };\n",
    );
    writeFileSync(
      path.join(dir, "app", "layout.jsx"),
      'export default function RootLayout({ children }) {\n  return (\n    <html lang="en">\n      <body>{children}</body>\n    </html>\n  );\n}\n',
    );
    writeFileSync(
      path.join(dir, "app", "page.jsx"),
      "export default function Page() {\n  return <p>An empty page.</p>;\n}\n",
    );
    execFileSync(process.execPath, [path.join(dir, "node_modules", "next", "dist", "bin", "next"), "build"], {
      cwd: dir,
      env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", NEXT_DIST_DIR: "" },
      stdio: ["ignore", "ignore", "inherit"],
    });
    const html = readFileSync(path.join(dir, ".next", "server", "app", "index.html"), "utf8");
    const floor = sizes(path.join(dir, ".next"), moduleScripts(html));

    let app: ReturnType<typeof sizes> | null = null;
    try {
      const cookie = await signIn(BASE, "buyer@marlowcreek.example");
      const jobs = await (await fetch(`${BASE}/jobs`, { headers: { cookie } })).text();
      app = sizes(DIST, moduleScripts(jobs));
    } catch (e) {
      console.error(`the app's shared set was not measured (${e instanceof Error ? e.message : String(e)})`);
    }
    const version = (p: string) =>
      (
        JSON.parse(readFileSync(path.join(root, "node_modules", p, "package.json"), "utf8")) as {
          version: string;
        }
      ).version;
    const lines = [
      `empty App Router page (next ${version("next")}, react ${version("react")}): ${floor.files} module scripts, ${floor.gzip_kb} KB gzip (${floor.brotli_kb} KB brotli at quality 11, ${floor.raw_kb} KB uncompressed)`,
      `the ${BUDGET_KB} KB budget: ${(BUDGET_KB / floor.gzip_kb).toFixed(2)} of the empty page's gzip (${BUDGET_KB} KB vs ${floor.gzip_kb} KB)`,
    ];
    if (app)
      lines.push(
        `the app's jobs page, counted the same way: ${(app.gzip_kb / floor.gzip_kb).toFixed(2)} of the empty page (${app.gzip_kb} KB vs ${floor.gzip_kb} KB gzip; ${app.files} module scripts; brotli ${app.brotli_kb} KB)`,
      );
    console.log(lines.map((l) => `  ${l}`).join("\n"));
    console.log(JSON.stringify({ benchmark: "framework-floor", floor, app, budget_kb: BUDGET_KB }, null, 2));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
