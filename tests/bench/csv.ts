// CSV reader benchmark: 10^6 sphere-probe rows (~50 MB) read by geometry/csv into Float64Arrays,
// against papaparse alone (streaming from the file, dynamicTyping off, no number conversion) on
// the same generated file. Target: ≤ 1.2 s, and ≥ 70 % of papaparse's streaming throughput.
// Prints JSON. Run: npx tsx tests/bench/csv.ts [rows]
import { createReadStream, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Papa from "papaparse";
import { readSphereProbeCsv } from "@/geometry";
import { cpuLoopSeconds, median } from "./machine";

const rows = Number(process.argv[2] ?? 1_000_000);
const dir = mkdtempSync(join(tmpdir(), "trammel-csv-bench-"));
const file = join(dir, "sphere.csv");

// Deterministic synthetic rows (a linear congruential generator; values are meaningless).
let seed = 1;
const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
const parts: string[] = ["primary_deg,secondary_deg,x,y,z\n"];
for (let i = 0; i < rows; i++) {
  parts.push(
    `${(rnd() * 360).toFixed(4)},${(rnd() * 180 - 90).toFixed(4)},${(rnd() * 1000 - 500).toFixed(6)},${(rnd() * 1000 - 500).toFixed(6)},${(rnd() * 500).toFixed(6)}\n`,
  );
}
writeFileSync(file, parts.join(""));
parts.length = 0;

let peakRss = 0;
const sample = setInterval(() => (peakRss = Math.max(peakRss, process.memoryUsage().rss)), 5);

async function papaStreaming(): Promise<number> {
  const t0 = performance.now();
  let n = 0;
  await new Promise<void>((resolve, reject) =>
    Papa.parse(createReadStream(file) as unknown as File, {
      dynamicTyping: false,
      chunk: (r: Papa.ParseResult<unknown>) => void (n += r.data.length),
      complete: () => resolve(),
      error: reject,
    }),
  );
  if (n < rows) throw new Error(`papaparse read ${n} rows`);
  return (performance.now() - t0) / 1000;
}

async function main() {
  const loopBefore = cpuLoopSeconds();
  const tRead0 = performance.now();
  const text = readFileSync(file, "utf8");
  const readBytesS = (performance.now() - tRead0) / 1000;
  // Memory held by one read's result (typed arrays live outside the JS heap: arrayBuffers).
  const mem = () => process.memoryUsage();
  const before = mem();
  const kept = readSphereProbeCsv(text, { units: "mm" });
  const after = mem();
  const resultMb = (after.arrayBuffers - before.arrayBuffers + after.heapUsed - before.heapUsed) / 1e6;
  if (kept.rows !== rows) throw new Error("row count");
  const ours: number[] = [];
  const papa: number[] = [];
  let rssOurs = 0;
  for (let k = 0; k < 3; k++) {
    const t0 = performance.now();
    const d = readSphereProbeCsv(text, { units: "mm" });
    ours.push((performance.now() - t0) / 1000);
    if (d.rows !== rows) throw new Error(`read ${d.rows} rows`);
    rssOurs = Math.max(rssOurs, process.memoryUsage().rss);
  }
  for (let k = 0; k < 3; k++) papa.push(await papaStreaming());
  clearInterval(sample);
  const oursS = median(ours);
  const papaS = median(papa);
  const loopAfter = cpuLoopSeconds();
  console.log(
    `  machine: a 3·10^8-step JS loop took ${loopBefore.toFixed(2)} s before and ${loopAfter.toFixed(2)} s after`,
  );
  // Ratio first, beside its peer in the same run (as every bench summary line).
  console.log(
    `  CSV ${rows} rows (${(text.length / 1e6).toFixed(0)} MB) into Float64Arrays: ${(oursS / papaS).toFixed(2)} of papaparse streaming alone (${oursS.toFixed(3)} s vs ${papaS.toFixed(3)} s; target ≤ 1.2 s and ≤ 1/0.7 of papaparse: ${oursS <= 1.2 && papaS / oursS >= 0.7 ? "met" : "missed"})`,
  );
  console.log(
    JSON.stringify(
      {
        rows,
        cpu_loop_s: { before: +loopBefore.toFixed(2), after: +loopAfter.toFixed(2) },
        file_mb: +(text.length / 1e6).toFixed(1),
        read_file_s: +readBytesS.toFixed(3),
        ours_parse_validate_s: +oursS.toFixed(3),
        ours_rows_per_s: Math.round(rows / oursS),
        papaparse_streaming_s: +papaS.toFixed(3),
        papaparse_rows_per_s: Math.round(rows / papaS),
        throughput_vs_papaparse: +(papaS / oursS).toFixed(2),
        target_met: oursS <= 1.2 && papaS / oursS >= 0.7,
        result_memory_mb: +resultMb.toFixed(1),
        peak_rss_mb_after_ours: Math.round(rssOurs / 1e6),
        peak_rss_mb_overall: Math.round(Math.max(peakRss, rssOurs) / 1e6),
        runs: { ours_s: ours.map((x) => +x.toFixed(3)), papaparse_s: papa.map((x) => +x.toFixed(3)) },
      },
      null,
      2,
    ),
  );
  rmSync(dir, { recursive: true, force: true });
}

void main();
