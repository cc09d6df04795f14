// Large-file benchmark of the `sweep`, `circle` and `tram` commands: each on a 10^6-row CSV, as a
// child process (`node lib/cli/run.mjs`, what `npm run geometry` runs), its wall time and the peak
// memory of the whole process (max RSS by GNU time; target ≤ 300 MB), each beside its peer in the
// same run, ratio first: a vectorised numpy/scipy script of the same least-squares figures on the
// same file (tests/bench/line_fits_numpy.py), whose figures must agree with the command's; and, for
// memory, a bare `node` that only reads the file into a string (what holding the text alone costs).
// The fixed CPU loop is timed before and after. Prints a summary, then JSON.
// Run: npm run bench (or npx tsx tests/bench/cli-large.ts [rows]). The data are invented.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { cpuLoopSeconds, median, round, timedChild } from "./machine";

const rows = Number(process.argv[2] ?? 1_000_000);
const root = join(import.meta.dirname, "../..");
const TARGET_MB = 300;

// Deterministic noise (a linear congruential generator).
let seed = 1;
const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648 - 0.5;
function write(file: string, header: string, line: (i: number) => string): number {
  const parts = [header];
  for (let i = 0; i < rows; i++) parts.push(line(i));
  const text = `${parts.join("\n")}\n`;
  writeFileSync(file, text);
  return text.length;
}

interface Case {
  command: string;
  args: string[];
  peerArgs: string[];
  /** Figures compared with the peer's (same key in both JSON outputs). */
  keys: string[];
  csvBytes: number;
  file: string;
}

function agreement(ours: Record<string, unknown>, theirs: Record<string, unknown>, keys: string[]): number {
  let worst = 0;
  for (const k of keys) {
    const a = ([] as unknown[]).concat(ours[k]) as number[];
    const b = ([] as unknown[]).concat(theirs[k]) as number[];
    a.forEach((v, i) => (worst = Math.max(worst, Math.abs(v - b[i]!) / Math.max(1, Math.abs(b[i]!)))));
  }
  return worst;
}

function main() {
  const loopBefore = cpuLoopSeconds();
  const dir = mkdtempSync(join(tmpdir(), "trammel-cli-large-"));
  const summary: string[] = [];
  const results: Record<string, unknown>[] = [];
  try {
    execFileSync(process.execPath, ["lib/cli/build.mjs"], { cwd: root, stdio: "inherit" });
    const sweep = join(dir, "sweep.csv");
    const circle = join(dir, "circle.csv");
    const tram = join(dir, "tram.csv");
    // A face tilted 80 µm/m at r 150 mm (12 µm amplitude), a 250 mm circle, a 12 µm/m tram; ±0.5 µm noise.
    const cases: Case[] = [
      {
        command: "sweep",
        file: sweep,
        csvBytes: write(
          sweep,
          "angle_deg,reading",
          (i) =>
            `${((i * 360) / rows).toFixed(6)},${(3 + 12 * Math.cos((i * 2 * Math.PI) / rows - 0.4) + rnd()).toFixed(4)}`,
        ),
        args: ["--radius-mm", "150"],
        peerArgs: ["150"],
        keys: ["tilt_um_per_m", "tilt_arcsec", "direction_deg", "tir_um", "flatness_ls_um"],
      },
      {
        command: "circle",
        file: circle,
        csvBytes: write(circle, "x,y,z", (i) => {
          const t = (i * 2 * Math.PI) / rows;
          return `${(100 + 250 * Math.cos(t) + 1e-3 * rnd()).toFixed(6)},${(-50 + 250 * Math.sin(t) + 1e-3 * rnd()).toFixed(6)},${(400 + 1e-3 * Math.cos(t) + 1e-3 * rnd()).toFixed(6)}`;
        }),
        args: [],
        peerArgs: [],
        keys: ["centre_mm", "normal", "radius_mm", "rms_um"],
      },
      {
        command: "tram",
        file: tram,
        csvBytes: write(
          tram,
          "travel,reading",
          (i) => `${((i * 500) / rows).toFixed(6)},${(2 + (0.012 * i * 500) / rows + rnd()).toFixed(4)}`,
        ),
        args: [],
        peerArgs: [],
        keys: ["slope_um_per_m", "slope_u_um_per_m", "angle_arcsec", "straightness_um", "tir_um"],
      },
    ];
    const numpy = spawnSync("python3", ["-c", "import numpy, scipy"]).status === 0;
    for (const c of cases) {
      const ours = () =>
        timedChild(process.execPath, ["lib/cli/run.mjs", c.command, c.file, ...c.args], root);
      const runs = [ours(), ours(), ours()];
      const oursS = median(runs.map((r) => r.s));
      const oursMb = Math.max(...runs.map((r) => r.maxRssMb ?? NaN));
      const text = timedChild(
        process.execPath,
        ["-e", "require('fs').readFileSync(process.argv[1], 'utf8')", c.file],
        root,
      );
      const label = `${c.command}, ${rows} rows (${(c.csvBytes / 1e6).toFixed(0)} MB CSV)`;
      const met = oursMb <= TARGET_MB ? "met" : "missed";
      const entry: Record<string, unknown> = {
        command: c.command,
        rows,
        csv_mb: round(c.csvBytes / 1e6, 1),
        ours_s: round(oursS),
        ours_peak_mb: oursMb,
        bare_node_reading_text_peak_mb: text.maxRssMb,
        target_mb: TARGET_MB,
      };
      if (numpy) {
        const peerRuns = [0, 1].map(() =>
          timedChild(
            "python3",
            [join(root, "tests/bench/line_fits_numpy.py"), c.command, c.file, ...c.peerArgs],
            root,
          ),
        );
        const peerS = median(peerRuns.map((r) => r.s));
        const peerMb = Math.max(...peerRuns.map((r) => r.maxRssMb ?? NaN));
        const agree = agreement(JSON.parse(runs[0]!.stdout), JSON.parse(peerRuns[0]!.stdout), c.keys);
        Object.assign(entry, { peer_s: round(peerS), peer_peak_mb: peerMb, agreement_max_relative: agree });
        summary.push(
          `${label}: peak memory ${round(oursMb / peerMb, 2)} of the numpy/scipy script (${oursMb} MB vs ${peerMb} MB; target ≤ ${TARGET_MB} MB: ${met}), ${round(oursMb / text.maxRssMb!, 2)} of a bare node holding the file's text (${text.maxRssMb} MB); time ${round(oursS / peerS, 2)} of the script (${round(oursS, 2)} s vs ${round(peerS, 2)} s); figures agree to ${agree.toExponential(1)} (relative)`,
        );
      } else {
        summary.push(
          `${label}: peak memory ${round(oursMb / text.maxRssMb!, 2)} of a bare node holding the file's text (${oursMb} MB vs ${text.maxRssMb} MB; target ≤ ${TARGET_MB} MB: ${met}), ${round(oursS, 2)} s (numpy/scipy not installed: no script peer)`,
        );
      }
      results.push(entry);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  const loopAfter = cpuLoopSeconds();
  summary.unshift(
    `machine: a 3·10^8-step JS loop took ${round(loopBefore, 2)} s before and ${round(loopAfter, 2)} s after (about 0.12–0.4 s idle)`,
  );
  console.log(summary.map((l) => `  ${l}`).join("\n"));
  console.log(
    JSON.stringify(
      {
        benchmark: "cli-large",
        cpu_loop_s: { before: round(loopBefore, 2), after: round(loopAfter, 2) },
        results,
        peer: "tests/bench/line_fits_numpy.py (numpy loadtxt, lstsq, SVD; scipy least_squares LM for the circle); the sweep's minimum-zone flatness is not compared",
        note: "child processes, whole process: start-up, reading the CSV, the fit, the JSON",
      },
      null,
      2,
    ),
  );
}

main();
