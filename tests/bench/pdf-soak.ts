/**
 * PDF render soak: renders the demo acceptance report (tests/fixtures/report, an invented job)
 * SOAK_RENDERS times (500 by default) through lib/report/render.tsx in this one process and
 * prints the resident memory before and after, so a leak in the renderer, its fonts or its
 * images shows up as growth. The first renders warm font and module caches, so the baseline is
 * taken after SOAK_WARMUP renders (10) and after a full garbage collection at both ends.
 * Exits 1 when the growth exceeds SOAK_MAX_GROWTH_MB (50).
 *   npm run bench:pdf-soak
 */
import { renderReportPdf } from "@/lib/report/render";
import { samplePng, samplePngSha256, sampleReport } from "../fixtures/report/sample-report";

const RENDERS = Number(process.env.SOAK_RENDERS ?? 500);
const WARMUP = Number(process.env.SOAK_WARMUP ?? 10);
const LIMIT_MB = Number(process.env.SOAK_MAX_GROWTH_MB ?? 50);
const images = new Map([[samplePngSha256, samplePng]]);
const gc = (globalThis as { gc?: () => void }).gc;
const settle = async () => {
  for (let i = 0; i < 3; i++) {
    gc?.();
    await new Promise((r) => setTimeout(r, 20));
  }
};
const rssMb = () => process.memoryUsage().rss / 2 ** 20;

for (let i = 0; i < WARMUP; i++) await renderReportPdf(sampleReport, undefined, images);
await settle();
const before = rssMb();
const heapBefore = process.memoryUsage().heapUsed / 2 ** 20;
const t0 = performance.now();
let bytes = 0;
let peak = before;
for (let i = 0; i < RENDERS; i++) {
  const pdf = await renderReportPdf(sampleReport, undefined, images);
  if (pdf.subarray(0, 5).toString() !== "%PDF-") throw new Error(`render ${i + 1} is not a PDF`);
  bytes = pdf.length;
  if (i % 25 === 0) peak = Math.max(peak, rssMb());
  if ((i + 1) % 50 === 0)
    console.error(
      `pdf-soak: ${i + 1}/${RENDERS} renders, rss ${rssMb().toFixed(1)} MB (started at ${before.toFixed(1)} MB), ${((performance.now() - t0) / (i + 1)).toFixed(0)} ms each`,
    );
}
const seconds = (performance.now() - t0) / 1000;
await settle();
const after = rssMb();
const growth = after - before;
const result = {
  bench: "pdf-soak",
  renders: RENDERS,
  pdf_kb: Math.round(bytes / 1024),
  ms_per_render: +((seconds * 1000) / RENDERS).toFixed(1),
  gc_exposed: !!gc,
  rss_before_mb: +before.toFixed(1),
  rss_peak_mb: +Math.max(peak, after).toFixed(1),
  rss_after_mb: +after.toFixed(1),
  rss_growth_mb: +growth.toFixed(1),
  heap_growth_mb: +(process.memoryUsage().heapUsed / 2 ** 20 - heapBefore).toFixed(1),
  limit_mb: LIMIT_MB,
  ok: growth <= LIMIT_MB,
};
console.log(JSON.stringify(result, null, 2));
if (!result.ok) process.exitCode = 1;
