// Builds the geometry CLI (lib/cli/geometry.ts) into one self-contained file, .data/cli/geometry.mjs,
// at build time: `npm run build:cli`, run by `npm run build`, the test command (tests/run-all.sh)
// and the demo script (lib/scripts/start-demo.sh). lib/cli/run.mjs only loads it, so a command
// starts in about the time of a bare `node`: no TypeScript, no bundler and no package resolution
// at run time.
//
// geometry/units.ts writes its factors as the definitions, so mathjs is not loaded at start-up.
import { build } from "esbuild";
import { mkdirSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
export const bundlePath = path.join(root, ".data", "cli", "geometry.mjs");

mkdirSync(path.dirname(bundlePath), { recursive: true });
await build({
  entryPoints: [path.join(root, "lib", "cli", "geometry.ts")],
  outfile: bundlePath,
  bundle: true,
  platform: "node",
  format: "esm",
  target: "node20",
  minify: true,
  // CommonJS packages bundled into an ES module still call require() for Node built-ins.
  banner: {
    js: "import { createRequire as __trammelRequire } from 'node:module'; const require = __trammelRequire(import.meta.url);",
  },
  tsconfig: path.join(root, "tsconfig.json"),
  logLevel: "error",
});
