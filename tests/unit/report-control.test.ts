// The report's control-values section: the rows and words built from the control loop, and the
// same printed in the PDF, read back with poppler's pdftotext (an independent reader).
import { describe, expect, it } from "vitest";
import { headFitJson, param } from "./fit-builders";
import { controlLoop } from "@/lib/control-values";
import { renderReportPdf } from "@/lib/report/render";
import { controlValuesSection } from "@/lib/report/sections/control";
import { samplePng, samplePngSha256, sampleReport } from "../fixtures/report/sample-report";
import { expectPhrases, pdfText } from "../pdf-tools";

const fit = headFitJson([
  param("pivot_length_error_um", 37.88, 1.2, "EZ0A"),
  param("secondary_zero_arcsec", 18, 0.6, "EA0A"),
]);
const at = new Date("2026-11-30T10:00:00Z");
const record = { createdAt: at, recordedBy: "Ines Okafor", note: null };

describe("the report's control-values section", () => {
  // Worked by hand: 152.4 mm + 37.88 µm = 152.43788 mm; 0° + 18″ = 0.005°; as left 0.015° differs by +0.01°.
  const section = controlValuesSection({
    loop: controlLoop({
      asFound: { pivot_length_mm: 152.4, secondary_zero_deg: 0 },
      asLeft: { pivot_length_mm: 152.4379, secondary_zero_deg: 0.015 },
      approvedFit: fit,
      unitSystem: "metric",
    }),
    asFound: record,
    asLeft: record,
    approved: { approvedBy: "Ines Okafor", approvedAt: at },
    asLeftStale: false,
  })!;

  it("lists the recorded settings with the value to enter and flags the one left different", () => {
    expect(section.rows.map((r) => [r.setting, r.toEnter, r.check])).toEqual([
      ["Pivot length (tilt axis to gauge point)", "152.4379 mm", "As computed"],
      ["Tilt axis zero offset", "0.00500° (18.0″)", "Differs from the value to enter (+0.01000° (+36.0″))"],
    ]);
    expect(section.flagged).toBe(1);
    expect(section.basis).toContain("Values to enter = as found + the correction");
    expect(section.caution).toContain("control builder's manual");
  });

  it("is left out when no control values were recorded", () => {
    const none = controlValuesSection({
      loop: controlLoop({ asFound: null, asLeft: null, approvedFit: fit, unitSystem: "metric" }),
      asFound: null,
      asLeft: null,
      approved: null,
      asLeftStale: false,
    });
    expect(none).toBeNull();
  });

  it("prints the section in the PDF with its numbers, flag, sign convention and caution", async () => {
    const pdf = await renderReportPdf(
      { ...sampleReport, controlValues: section },
      undefined,
      new Map([[samplePngSha256, samplePng]]),
    );
    expectPhrases(pdfText(pdf, true), [
      "5.1 Values for the control: as found, to enter, as left",
      "152.4379 mm",
      "Differs from the value to enter",
      "Value to enter = as found + correction",
      "qualified people",
    ]);
  }, 30_000);
});
