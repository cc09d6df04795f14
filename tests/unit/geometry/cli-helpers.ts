// Shared by the command-line tests: run `npm run geometry`'s main in-process with its output
// captured (fast), or as a user runs it in a child process (`npx tsx lib/cli/geometry.ts`); the CSV
// fixtures by path; and files written for one test file into a temporary folder removed after it.
import { execFile } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll } from "vitest";
import type { SphereProbeData } from "@/geometry";
import { main } from "@/lib/cli/geometry";

export interface CliResult {
  code: number;
  stdout: string;
  stderr: string;
}

export const repoRoot = join(import.meta.dirname, "../../..");

/** The path of a CSV fixture in tests/fixtures/csv. */
export const csvFixturePath = (name: string) => join(repoRoot, "tests/fixtures/csv", name);

/** Calls the command line's main with these arguments; exit code and what it printed. */
export async function runCli(...args: string[]): Promise<CliResult> {
  let stdout = "";
  let stderr = "";
  const code = await main(
    args,
    (s) => void (stdout += s),
    (s) => void (stderr += s),
  );
  return { code, stdout, stderr };
}

/** Runs the command line in a child process, as a user does. */
export function runCliProcess(...args: string[]): Promise<CliResult> {
  return new Promise((resolve) => {
    execFile(
      "npx",
      ["tsx", "lib/cli/geometry.ts", ...args],
      { cwd: repoRoot, timeout: 60_000 },
      (error, stdout, stderr) => {
        const code = error ? (typeof error.code === "number" ? error.code : -1) : 0;
        resolve({ code, stdout, stderr });
      },
    );
  });
}

/**
 * A temporary folder for this test file (removed after its tests) and a writer that puts a file in
 * it and returns its path. Call at the top level of a test file.
 */
export function tempFiles(prefix: string): { dir: string; file: (name: string, text: string) => string } {
  const dir = mkdtempSync(join(tmpdir(), `trammel-${prefix}-`));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  return {
    dir,
    file: (name, text) => {
      const f = join(dir, name);
      writeFileSync(f, text);
      return f;
    },
  };
}

/** Sphere-probe data as the command line reads it (primary_deg,…,tool_mm), coordinates divided by `scale`. */
export function sphereProbeCsvText(data: SphereProbeData, scale = 1): string {
  const lines = ["primary_deg,secondary_deg,x,y,z,tool_mm"];
  for (let i = 0; i < data.rows; i++)
    lines.push(
      [
        data.primaryDeg[i],
        data.secondaryDeg[i],
        data.xMm[i]! / scale,
        data.yMm[i]! / scale,
        data.zMm[i]! / scale,
        data.toolMm?.[i] ?? 0,
      ].join(","),
    );
  return lines.join("\n");
}

/** The keys of sweep's JSON, in order (geometry/README.md, command line). */
export const SWEEP_JSON_KEYS = [
  "tilt_um_per_m",
  "tilt_arcsec",
  "direction_deg",
  "tir_um",
  "flatness_ls_um",
  "flatness_mz_um",
] as const;

/** The keys of tram's JSON, in order (geometry/README.md, command line). */
export const TRAM_JSON_KEYS = [
  "slope_um_per_m",
  "slope_u_um_per_m",
  "angle_arcsec",
  "straightness_um",
  "tir_um",
] as const;
