// lib/cli/chunked-csv.ts: a file read in blocks of lines must give what the whole-file reader gives
// on its text, value for value (numbers, file rows, header warnings), and must hand back to the
// whole-file reader (undefined) whenever a block cannot decide alone. The reference is the
// whole-file path of geometry/csv itself, as the streaming commands promise identical results; the
// commands' figures are then checked end to end against fits of the whole-file data.
import { describe, expect, it } from "vitest";
import {
  fitCircle,
  fitSweep,
  fitTram,
  readPointsCsv,
  readSphereProbeCsv,
  readSweepCsv,
  readTramCsv,
} from "@/geometry";
import { readCsvInBlocks } from "@/lib/cli/chunked-csv";
import { runCli, tempFiles } from "./cli-helpers";

const temp = tempFiles("cli-blocks");
let fileCount = 0;
const file = (text: string): string => temp.file(`f${fileCount++}.csv`, text);

/** Plain-object form of a reader result, typed arrays as arrays, for deep comparison. */
const plain = (r: object) =>
  Object.fromEntries(
    Object.entries(r).map(([k, v]) => [
      k,
      v instanceof Float64Array || v instanceof Int32Array ? Array.from(v) : v,
    ]),
  );

// Deterministic rows (a linear congruential generator); values are arbitrary.
function rows(n: number, line: (i: number, r: () => number) => string): string[] {
  let seed = 7;
  const r = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  return Array.from({ length: n }, (_, i) => line(i, r));
}
const sweepLines = rows(
  3000,
  (i, r) => `${((i * 360) / 3000).toFixed(4)},${(5 * Math.cos(i / 477) + r()).toFixed(4)}`,
);
const sweepRead = (t: string) => readSweepCsv(t, { readingUnits: "mm" });

describe("readCsvInBlocks", () => {
  it("joins blocks into exactly the whole-file result (LF, CRLF, BOM, unknown column, trailing blank lines)", () => {
    const variants = [
      `angle_deg,reading\n${sweepLines.join("\n")}\n`,
      `angle_deg,reading\n${sweepLines.join("\n")}`,
      `\uFEFFangle_deg,reading\r\n${sweepLines.join("\r\n")}\r\n`,
      `angle_deg,reading,operator\n${sweepLines.map((l) => `${l},AB`).join("\n")}\n\n  \n\n`,
    ];
    for (const text of variants) {
      const p = file(text);
      for (const block of [64, 1000, 4096, 1 << 20]) {
        const joined = readCsvInBlocks(p, sweepRead, block);
        expect(joined, `block ${block}`).toBeDefined();
        expect(plain(joined!)).toEqual(plain(sweepRead(text)));
      }
    }
  });

  it("keeps text columns and two-plane tram columns, and comma decimals in a semicolon file", () => {
    const tram = `travel;reading;note;plane;bar_deg\n${rows(900, (i, r) => `${i};${(r() * 3).toFixed(3).replace(".", ",")};${i % 7 ? "" : "check"};${i % 2 ? "XZ" : "yz"};${i % 4 < 2 ? 0 : 180}`).join("\n")}\n`;
    const read = (t: string) => readTramCsv(t, { travelUnits: "in", readingUnits: "um", decimal: "comma" });
    const joined = readCsvInBlocks(file(tram), read, 512);
    expect(joined).toBeDefined();
    expect(plain(joined!)).toEqual(plain(read(tram)));
  });

  it("keeps every optional sphere-probe column (fit-head reads its file this way too)", () => {
    const text = `primary_deg,secondary_deg,x,y,z,point,repeat,temp_c,tool_mm\n${rows(700, (i, r) => `${i % 360},${(i % 7) * 15 - 45},${(r() * 10).toFixed(5)},${(r() * 10).toFixed(5)},${(r() * 10).toFixed(5)},${i % 9},${i % 3},${(20 + r()).toFixed(2)},${i % 2 ? 0 : 100}`).join("\n")}\n`;
    const read = (t: string) => readSphereProbeCsv(t, { units: "in" });
    const joined = readCsvInBlocks(file(text), read, 700);
    expect(joined).toBeDefined();
    expect(plain(joined!)).toEqual(plain(read(text)));
  });

  it("hands back to the whole-file reader for quotes, interior blank rows, lone CRs and bad input", () => {
    const body = sweepLines.slice(0, 400);
    const cases = [
      `angle_deg,reading\n${body.join("\n")}\n1,"2"\n`, // a quote
      `angle_deg,reading\n${body.slice(0, 200).join("\n")}\n\n${body.slice(200).join("\n")}\n`, // blank row
      `angle_deg,reading\r${body.join("\r")}\r`, // lone CR line breaks
      `angle_deg,reading\n${body.join("\n")}\n1,abc\n`, // bad number
      `angle_deg,reading\n`, // header only
      ``, // empty file
    ];
    for (const text of cases) expect(readCsvInBlocks(file(text), sweepRead, 256)).toBeUndefined();
  });
});

describe("sweep, circle, tram commands on files larger than one block", () => {
  async function run(...args: string[]) {
    const { code, stdout, stderr } = await runCli(...args);
    return { code, json: code === 0 ? JSON.parse(stdout) : undefined, err: stderr };
  }

  it("print the figures of the fits on the whole-file data (to 1e-9 relative; here exactly)", async () => {
    // 60 000 rows: more than one 1 MiB block for the circle file.
    const n = 60_000;
    const sweepText = `angle_deg,reading\n${rows(n, (i, r) => `${((i * 360) / n).toFixed(5)},${(3 + 12 * Math.cos((i * 2 * Math.PI) / n - 0.4) + r()).toFixed(4)}`).join("\n")}\n`;
    const circleText = `x,y,z\n${rows(n, (i, r) => `${(100 + 250 * Math.cos((i * 2 * Math.PI) / n) + 1e-3 * r()).toFixed(6)},${(-50 + 250 * Math.sin((i * 2 * Math.PI) / n)).toFixed(6)},${(400 + 1e-3 * r()).toFixed(6)}`).join("\n")}\n`;
    const tramText = `travel,reading\n${rows(n, (i, r) => `${((i * 500) / n).toFixed(5)},${(2 + (0.012 * i * 500) / n + r()).toFixed(4)}`).join("\n")}\n`;
    const [sweep, circle, tram] = await Promise.all([
      run("sweep", file(sweepText), "--radius-mm", "150"),
      run("circle", file(circleText)),
      run("tram", file(tramText)),
    ]);
    const s = fitSweep(readSweepCsv(sweepText, { readingUnits: "um" }), 150);
    const c = fitCircle(readPointsCsv(circleText, { units: "mm" }));
    const t = fitTram(readTramCsv(tramText, { travelUnits: "mm", readingUnits: "um" }));
    // Every printed figure (arrays element by element) against the fit on the whole-file data.
    const agree = (printed: Record<string, unknown>, ref: object) => {
      const whole = ref as Record<string, unknown>;
      for (const [k, v] of Object.entries(printed)) {
        const a = ([] as unknown[]).concat(v) as (number | null)[];
        const b = ([] as unknown[]).concat(whole[k]) as (number | null)[];
        expect(a.length, k).toBe(b.length);
        a.forEach((x, i) =>
          expect(Math.abs(x! - b[i]!), `${k}[${i}]`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(b[i]!))),
        );
      }
    };
    expect([sweep.code, circle.code, tram.code]).toEqual([0, 0, 0]);
    agree(sweep.json, s);
    agree(circle.json, c);
    agree(tram.json, t);
    expect(Math.abs(tram.json.slope_u_um_per_m - t.slope_u_um_per_m)).toBeLessThanOrEqual(
      1e-9 * t.slope_u_um_per_m,
    );
    // And the figures make sense for the data (invented): 12 µm amplitude over r 150 mm = 80 µm/m.
    expect(sweep.json.tilt_um_per_m).toBeCloseTo(80, 0);
    expect(circle.json.radius_mm).toBeCloseTo(250, 4);
    expect(tram.json.slope_um_per_m).toBeCloseTo(12, 1);
  });

  it("report bad input in a large file with the row, as the whole-file reader does", async () => {
    const lines = sweepLines.concat(sweepLines, sweepLines, sweepLines);
    lines[9000] = "12,1.2.3";
    const r = await run("sweep", file(`angle_deg,reading\n${lines.join("\n")}\n`), "--radius-mm", "100");
    expect(r.code).toBe(2);
    expect(r.err).toContain("row 9002, column reading");
  });
});
