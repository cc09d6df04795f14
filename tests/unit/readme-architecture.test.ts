// README's architecture table matches the tree: every folder it names exists, and every top-level
// folder and every folder under components/ and lib/ is named. A new folder without a line in the
// table (or a line left behind by a removed one) fails here.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(__dirname, "../..");

/** The folders named in the first column of README's "## Architecture" table, e.g. "lib/policy". */
export function listedFolders(readme: string): string[] {
  const start = readme.indexOf("## Architecture");
  if (start < 0) return [];
  const next = readme.indexOf("\n## ", start + 1);
  const section = readme.slice(start, next < 0 ? undefined : next);
  return [...section.matchAll(/^\| `([^`]+)\/` \|/gm)].map((m) => m[1]!);
}

function foldersIn(rel: string): string[] {
  return readdirSync(path.join(ROOT, rel), { withFileTypes: true })
    .filter((e) => e.isDirectory() && !e.name.startsWith(".") && e.name !== "node_modules")
    .map((e) => (rel === "." ? e.name : `${rel}/${e.name}`));
}

describe("README's architecture table", () => {
  const listed = listedFolders(readFileSync(path.join(ROOT, "README.md"), "utf8"));

  it("names only folders that exist", () => {
    expect(listed.length).toBeGreaterThan(10);
    const missing = listed.filter(
      (f) => !statSync(path.join(ROOT, f), { throwIfNoEntry: false })?.isDirectory(),
    );
    expect(missing).toEqual([]);
  });

  it("names every top-level folder and every folder of components/ and lib/", () => {
    const expected = [...foldersIn("."), ...foldersIn("components"), ...foldersIn("lib")];
    expect(expected.filter((f) => !listed.includes(f))).toEqual([]);
  });

  it("reads the table the way it is written (checked on a planted one)", () => {
    const planted =
      "## Architecture\n\n| folder | what |\n|---|---|\n| `app/` | routes |\n| `lib/x/` | x |\n\n## Next\n| `no/` | not in the section |\n";
    expect(listedFolders(planted)).toEqual(["app", "lib/x"]);
  });
});
