// Builds the geometry CLI (lib/cli/geometry.ts) into one self-contained file, .data/cli/geometry.mjs,
// at build time: `npm run build:cli`, run by `npm run build`, the test command (tests/run-all.sh)
// and the demo script (lib/scripts/start-demo.sh). lib/cli/run.mjs only loads it, so a command
// starts in about the time of a bare `node`: no TypeScript, no bundler and no package resolution
// at run time.
//
// Packages are bundled in, except mathjs where geometry/units.ts uses it: loading mathjs costs
// most of a second (it builds hundreds of typed functions), and units.ts only asks it for a few
// conversion factors (inch → mm, arc second → rad, …). Those factors are computed here, by mathjs
// itself, and written into the bundle as a small table with the same `unit(v, name).toNumber(to)`
// shape; a pair missing from the table falls back to mathjs at run time, so nothing is ever
// answered from a table of ours.
import { build } from "esbuild";
import { unit } from "mathjs";
import { mkdirSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
export const bundlePath = path.join(root, ".data", "cli", "geometry.mjs");

const UNIT_NAMES = ["mm", "um", "m", "inch", "deg", "rad", "arcsec", "arcmin"];

/** The module units.ts gets for "mathjs" in the bundle: mathjs's own factors, computed now. */
function prebuiltUnits() {
  const table = {};
  for (const from of UNIT_NAMES)
    for (const to of UNIT_NAMES) {
      try {
        table[`${from}>${to}`] = unit(1, from).toNumber(to);
      } catch {
        // Not the same dimension (e.g. mm → deg): no entry.
      }
    }
  return `import { createRequire } from "node:module";
const FACTORS = ${JSON.stringify(table)};
let mathjs;
export function unit(value, from) {
  return {
    toNumber(to) {
      const f = value === 1 ? FACTORS[from + ">" + to] : undefined;
      if (f !== undefined) return f;
      mathjs ??= createRequire(import.meta.url)("mathjs");
      return mathjs.unit(value, from).toNumber(to);
    },
  };
}
`;
}

const unitsPlugin = {
  name: "prebuilt-units",
  setup(b) {
    b.onResolve({ filter: /^mathjs$/ }, (a) =>
      a.importer.endsWith(path.join("geometry", "units.ts"))
        ? { path: "mathjs-units", namespace: "prebuilt" }
        : undefined,
    );
    b.onLoad({ filter: /.*/, namespace: "prebuilt" }, () => ({ contents: prebuiltUnits(), loader: "js" }));
  },
};

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
  plugins: [unitsPlugin],
  logLevel: "error",
});
