// The scans that keep a rule in one home (role checks in lib/policy, colours in the theme) read the
// app's own source through this: every .ts/.tsx/.mjs file under the roots given, less the allowed
// ones, each with what the scanner found in it as "path:line: what".
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { expect } from "vitest";

const ROOT = path.resolve(__dirname, "../..");

function sourceFiles(rel: string): string[] {
  const abs = path.join(ROOT, rel);
  if (!statSync(abs, { throwIfNoEntry: false })) return [];
  if (statSync(abs).isFile()) return /\.(ts|tsx|mjs)$/.test(rel) ? [rel] : [];
  return readdirSync(abs).flatMap((e) => sourceFiles(path.posix.join(rel, e)));
}

/** What `scan` finds in each file under `roots` but not matched by `allowed`, and how many files it read. */
export function scanSource(
  roots: readonly string[],
  allowed: readonly RegExp[],
  scan: (text: string) => string[],
): { files: number; found: string[] } {
  const files = roots.flatMap(sourceFiles).filter((f) => !allowed.some((a) => a.test(f)));
  const found = files.flatMap((f) => scan(readFileSync(path.join(ROOT, f), "utf8")).map((o) => `${f}:${o}`));
  return { files: files.length, found };
}

/** The scan finds nothing, and it did read the app (a scan of no files would pass trivially). */
export function expectNothingFound(
  roots: readonly string[],
  allowed: readonly RegExp[],
  scan: (text: string) => string[],
): void {
  const { files, found } = scanSource(roots, allowed, scan);
  expect(files).toBeGreaterThan(100);
  expect(found).toEqual([]);
}
