// The architecture's lint rules (eslint.config.mjs) fail on a planted violation of each, and stay
// quiet where the code is allowed. Runs ESLint's Node API on small texts at made-up paths, so the
// real config decides which rules apply where.
import path from "node:path";
import { ESLint } from "eslint";
import { describe, expect, it } from "vitest";

const eslint = new ESLint({ cwd: path.resolve(__dirname, "../..") });

/** The rule ids ESLint reports for `code` as if it were the file at `file` (relative to the repo). */
async function rulesHit(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: file });
  return (result?.messages ?? []).map((m) => m.ruleId ?? m.message);
}

const PAGE = "app/(app)/jobs/[id]/planted/page.tsx";

describe("lint rules that guard the architecture", { timeout: 60_000 }, () => {
  it("pages may not import the database client, the schema or drizzle", async () => {
    expect(await rulesHit(PAGE, `import { db } from "@/db";\nexport const x = db;\n`)).toContain(
      "no-restricted-imports",
    );
    expect(await rulesHit(PAGE, `import { jobs } from "@/db/schema";\nexport const x = jobs;\n`)).toContain(
      "no-restricted-imports",
    );
    expect(await rulesHit(PAGE, `import { eq } from "drizzle-orm";\nexport const x = eq;\n`)).toContain(
      "no-restricted-imports",
    );
    // …but read through db/queries like every page does.
    expect(
      await rulesHit(
        PAGE,
        `import { getJobDetail } from "@/db/queries/jobs";\nexport const x = getJobDetail;\n`,
      ),
    ).toEqual([]);
  });

  it("components import nothing from db/", async () => {
    const file = "components/jobs/planted.tsx";
    expect(
      await rulesHit(
        file,
        `import type { JobListRow } from "@/db/queries/jobs";\nexport type X = JobListRow;\n`,
      ),
    ).toContain("no-restricted-imports");
    expect(
      await rulesHit(
        file,
        `import type { JobListRow } from "@/lib/domain/jobs";\nexport type X = JobListRow;\n`,
      ),
    ).toEqual([]);
  });

  it("no component file runs past 250 lines", async () => {
    const long = (lines: number) =>
      Array.from({ length: lines }, (_, i) => `export const line${i} = ${i};`).join("\n") + "\n";
    expect(await rulesHit("components/ui/planted.tsx", long(251))).toContain("max-lines");
    expect(await rulesHit("components/ui/planted.tsx", long(250))).not.toContain("max-lines");
    expect(await rulesHit("lib/planted.ts", long(251))).not.toContain("max-lines");
  });

  it("settings are read only in lib/env.ts", async () => {
    const code = `export const from = process.env.MAIL_FROM;\n`;
    expect(await rulesHit("lib/mail/planted.ts", code)).toContain("no-restricted-properties");
    expect(await rulesHit("app/api/planted/route.ts", code)).toContain("no-restricted-properties");
    expect(await rulesHit("lib/env.ts", code)).toEqual([]);
    expect(await rulesHit("tests/unit/planted.test.ts", code)).toEqual([]);
  });

  it("geometry/ stays pure", async () => {
    expect(
      await rulesHit(
        "geometry/planted.ts",
        `import { useState } from "react";\nexport const x = useState;\n`,
      ),
    ).toContain("no-restricted-imports");
  });

  it("React's hook rules, including the compiler's, apply to components", async () => {
    const effect = [
      `import { useEffect, useState } from "react";`,
      `export function Planted() {`,
      `  const [n, setN] = useState(0);`,
      `  useEffect(() => setN(1), []);`,
      `  return <p>{n}</p>;`,
      `}`,
    ].join("\n");
    expect(await rulesHit("components/ui/planted.tsx", effect)).toContain("react-hooks/set-state-in-effect");
    const conditional = [
      `import { useState } from "react";`,
      `export function Planted({ on }: { on: boolean }) {`,
      `  if (on) {`,
      `    const [n] = useState(0);`,
      `    return <p>{n}</p>;`,
      `  }`,
      `  return null;`,
      `}`,
    ].join("\n");
    expect(await rulesHit("components/ui/planted.tsx", conditional)).toContain("react-hooks/rules-of-hooks");
  });

  it("Next.js's rules apply (a bare <img> is reported)", async () => {
    const code = `export function Planted() {\n  return <img src="/a.png" alt="a" />;\n}\n`;
    expect(await rulesHit("components/ui/planted.tsx", code)).toContain("@next/next/no-img-element");
  });
});
