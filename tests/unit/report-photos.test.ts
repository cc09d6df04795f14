// The report's appendix of photos: only steps that ask for a photo, in step order, times in UTC;
// rendered into the PDF (read back with poppler's pdftotext, an independent reader) and listed
// the same way on the report page.
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ReportView } from "@/components/report/report-view";
import { renderReportPdf } from "@/lib/report/render";
import { photoAppendixRows } from "@/lib/report/sections/photo-rows";
import { samplePng, samplePngSha256, sampleReport } from "../fixtures/report/sample-report";
import { pdfText } from "../pdf-tools";

const steps = [
  { stepId: "b", position: 4, title: "Shims", photoRequired: true },
  { stepId: "a", position: 2, title: "Collar", photoRequired: true },
  { stepId: "c", position: 1, title: "Lock-out", photoRequired: false },
];
const photo = (stepId: string, iso: string, sha256: string) => ({
  stepId,
  phase: "pre" as const,
  takenAt: new Date(iso),
  uploadedBy: "Iver Sandvik",
  width: 800,
  height: 600,
  sha256,
});

describe("photo appendix", () => {
  it("lists the photos of steps that ask for one, by step then time, in UTC", () => {
    const rows = photoAppendixRows(steps, [
      photo("b", "2026-12-04T09:10:00Z", "s3"),
      photo("a", "2026-12-04T09:05:00Z", "s2"),
      photo("a", "2026-12-04T09:00:00Z", "s1"),
      photo("c", "2026-12-04T08:00:00Z", "not-listed"),
    ]);
    expect(rows.map((r) => r.sha256)).toEqual(["s1", "s2", "s3"]);
    expect(rows[0]).toMatchObject({
      step: "2 Collar",
      phase: "before adjustment",
      by: "Iver Sandvik",
      size: "800 × 600 px",
    });
    expect(rows[0]!.takenAtUtc).toMatch(/^2026-12-04 09:00/);
    expect(rows[0]!.takenAtUtc).toMatch(/UTC/);
  });

  it("is printed in the PDF with each photo's SHA-256", async () => {
    const sha = "9f".repeat(32);
    const pdf = await renderReportPdf(
      { ...sampleReport, photos: photoAppendixRows(steps, [photo("a", "2026-12-04T09:00:00Z", sha)]) },
      undefined,
      new Map([[samplePngSha256, samplePng]]),
    );
    const text = pdfText(pdf);
    expect(text).toContain("Appendix: photos kept with the record");
    expect(text).toContain("Step 2 Collar, before adjustment");
    expect(text.replace(/\s+/g, "")).toContain(`SHA-256${sha}`);
  }, 30_000);

  it("is listed on the report page as in the PDF, and left out when there is no photo", () => {
    const sha = "4e".repeat(32);
    // React's server HTML marks text joins with empty comments; a reader sees the text without them.
    const page = renderToString(
      createElement(ReportView, {
        data: {
          ...sampleReport,
          photos: photoAppendixRows(steps, [photo("b", "2026-12-04T09:10:00Z", sha)]),
        },
      }),
    ).replaceAll("<!-- -->", "");
    expect(page).toContain("Appendix: photos kept with the record");
    expect(page).toContain(
      "Step 4 Shims, before adjustment, 2026-12-04 09:10 UTC, by Iver Sandvik, 800 × 600 px",
    );
    expect(page).toContain(`SHA-256 ${sha}`);
    // Before the signatures, as in the PDF.
    expect(page.indexOf("Appendix: photos")).toBeLessThan(page.indexOf("10 Signatures"));
    const without = renderToString(createElement(ReportView, { data: { ...sampleReport, photos: [] } }));
    expect(without).not.toContain("Appendix: photos");
  });
});
