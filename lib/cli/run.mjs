// Runs the geometry CLI (lib/cli/geometry.ts) from the bundle that `npm run build:cli` makes at
// build time (lib/cli/build.mjs; `npm run build`, the test command and the demo script run it).
// Nothing is compiled here: a missing or out-of-date bundle is an error that says how to make it,
// so the CLI never runs code older than its sources.
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const bundle = path.join(root, ".data", "cli", "geometry.mjs");

/** The newest .ts/.mjs source under dir (mtime, ms) and its path. */
function newestSource(dir, best = { t: 0, file: "" }) {
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) newestSource(p, best);
    else if (/\.(ts|mjs)$/.test(e.name)) {
      const t = statSync(p).mtimeMs;
      if (t > best.t) Object.assign(best, { t, file: p });
    }
  }
  return best;
}

let built = 0;
try {
  built = statSync(bundle).mtimeMs;
} catch {
  built = 0;
}
const newest = newestSource(path.join(root, "geometry"), newestSource(path.join(root, "lib", "cli")));
if (built === 0 || built < newest.t) {
  process.stderr.write(
    `error: the geometry CLI bundle ${built === 0 ? "has not been built" : `is older than ${path.relative(root, newest.file)}`}; run \`npm run build:cli\` (npm run build, npm test and the demo script do it)\n`,
  );
  process.exitCode = 2;
} else {
  const { main } = await import(pathToFileURL(bundle).href);
  process.exitCode = await main(process.argv.slice(2));
}
