// The report's control-values section: the rows and words built from the control loop, and the
// same printed in the PDF, read back with poppler's pdftotext (an independent reader).
import { describe, expect, it } from "vitest";
import { headFitJson, param } from "./fit-builders";
import { controlLoop } from "@/lib/control-values";
import { renderReportPdf } from "@/lib/report/render";
import { controlValuesSection } from "@/lib/report/sections/control";
import { judgeTcpCheck } from "@/lib/tcp-check-display";
import { samplePng, samplePngSha256, sampleReport } from "../fixtures/report/sample-report";
import { expectPhrases, pdfText } from "../pdf-tools";

/** The sample report with this control-values section, printed and read back by pdftotext. */
async function printed(controlValues: NonNullable<ReturnType<typeof controlValuesSection>>) {
  const pdf = await renderReportPdf(
    { ...sampleReport, controlValues },
    undefined,
    new Map([[samplePngSha256, samplePng]]),
  );
  return pdfText(pdf, true);
}

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

  it("closes each recorded line with one full stop, whether or not the note ends with one", () => {
    const withNotes = controlValuesSection({
      loop: controlLoop({
        asFound: { pivot_length_mm: 152.4 },
        asLeft: null,
        approvedFit: fit,
        unitSystem: "metric",
      }),
      asFound: { ...record, note: "Read off the control's page 3." },
      asLeft: { ...record, note: "Entered by the service engineer" },
      approved: null,
      asLeftStale: false,
    })!;
    expect(withNotes.recorded).toEqual([
      "As found recorded 2026-11-30 10:00 UTC by Ines Okafor: Read off the control's page 3.",
      "As left recorded 2026-11-30 10:00 UTC by Ines Okafor: Entered by the service engineer.",
    ]);
    expect(section.recorded[0]).toBe("As found recorded 2026-11-30 10:00 UTC by Ines Okafor.");
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
    expectPhrases(await printed(section), [
      "5.1 Values for the control: as found, to enter, as left",
      "152.4379 mm",
      "Differs from the value to enter",
      "Value to enter = as found + correction",
      "qualified people",
    ]);
  }, 30_000);

  describe("the TCP check after compensation", () => {
    // Worked by hand: ranges 8.2, 3.1 and 12.5 µm against ≤ 15 µm pass; 11.0 µm from the mean
    // against ≤ 10 µm fails (simple acceptance, ISO 14253-1: the value against the limit).
    const view = judgeTcpCheck(
      { range_um: { x: 8.2, y: 3.1, z: 12.5 }, max_from_mean_um: 11, worst_row: 14, poses: 60, warnings: [] },
      { required: true, rangeLimitUm: 15, deviationLimitUm: 10 },
    );
    const withTcp = (tcpLimitSource: { source: string | null; note: string | null } | null) =>
      controlValuesSection({
        loop: controlLoop({ asFound: null, asLeft: null, approvedFit: fit, unitSystem: "metric" }),
        asFound: null,
        asLeft: null,
        approved: null,
        asLeftStale: false,
        tcp: { filename: "tcp-after.csv", uploadedAt: at, view },
        tcpLimitSource,
      })!;

    it("prints the rule and the limits' source beside each judged figure", () => {
      const section = withTcp({ source: "customer_spec", note: "Acceptance sheet 3, TCP" });
      expect(section.tcpCheck!.rows.map((r) => [r.limit, r.decision, r.basis])).toEqual([
        ["≤ 15.0 µm", "pass", "Rule: simple; limit: Customer specification: Acceptance sheet 3, TCP"],
        ["≤ 15.0 µm", "pass", "Rule: simple; limit: Customer specification: Acceptance sheet 3, TCP"],
        ["≤ 15.0 µm", "pass", "Rule: simple; limit: Customer specification: Acceptance sheet 3, TCP"],
        ["≤ 10.0 µm", "fail", "Rule: simple; limit: Customer specification: Acceptance sheet 3, TCP"],
      ]);
      // A version stored before sources were asked for says so rather than printing nothing.
      expect(withTcp(null).tcpCheck!.rows[0]!.basis).toBe("Rule: simple; limit: source not recorded");
    });

    it("prints them in the PDF's 5.2", async () => {
      const text = await printed(withTcp({ source: "standard", note: "ISO 10791-6:2014, annex K" }));
      expect(text).toContain("5.2 Tool-centre-point check after compensation");
      expect(text).toContain("Rule: simple; limit: Standard: ISO 10791-6:2014, annex K");
      expect(text).toMatch(/≤ 10\.0 µm FAIL Rule: simple; limit: Standard/);
    }, 30_000);
  });
});
