// The report's view model (lib/report/build.ts) and the amendment rule (lib/policy/reports.ts):
// plain values in, the report's text out. Decisions follow ISO 14253-1 (simple acceptance: the
// value against the limit, U stated); the content hash is checked with node:crypto directly.
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { headFitJson, param } from "./fit-builders";
import { canonicalJson } from "@/lib/canonical-json";
import { amendRefusal } from "@/lib/policy/reports";
import type { ReportData } from "@/lib/report/types";
import {
  buildReportContent,
  conformityStatement,
  deviationRows,
  figureOf,
  instrumentRows,
  parameterSection,
  readingSection,
  residualChartValues,
  signatureLine,
  testPartRows,
  type JobInput,
} from "@/lib/report/build";

describe("residualChartValues", () => {
  it("keeps each bucket's largest value, so a single peak survives thinning", () => {
    const values = Array.from({ length: 1000 }, (_, i) => (i === 537 ? 9.5 : 1));
    const r = residualChartValues(values, 100);
    expect(r.perPoint).toBe(10);
    expect(r.valuesUm).toHaveLength(100);
    expect(r.valuesUm[53]).toBe(9.5);
    expect(r.valuesUm.filter((v) => v === 9.5)).toHaveLength(1);
  });
  it("does not thin a short series", () => {
    expect(residualChartValues([1.23456, 2], 240)).toEqual({ valuesUm: [1.235, 2], perPoint: 1 });
  });
});

describe("readingSection", () => {
  const row = {
    title: "Spindle run-out",
    quantityKind: "length" as const,
    lowerLimit: null,
    upperLimit: 0.01,
    limitSource: "maker_manual",
    pre: { value: 0.014 },
    post: { value: 0.004 },
    change: -0.01,
    status: "pass" as const,
  };
  it("lists measured steps with limit source in words and leaves unmeasured steps out", () => {
    const s = readingSection([row, { ...row, title: "Not done", pre: null, post: null, change: null }]);
    expect(s.rows).toHaveLength(1);
    expect(s.rows[0]!.step).toBe("Spindle run-out");
    expect(s.rows[0]!.source).toBe("maker manual");
    expect(s.rows[0]!.decision).toBe("pass");
    expect(s.chart).toEqual([
      { step: "Spindle run-out", lower: null, upper: 0.01, pre: 0.014, post: 0.004, unit: "mm", digits: 4 },
    ]);
  });
  it("prints the step's own decision rule and limit source beside a judged row (ISO/IEC 17025:2017 §7.8.6.1)", () => {
    const s = readingSection([
      { ...row, decisionRule: "guarded", limitSourceNote: "HC-40 manual §4.2" },
      { ...row, title: "Tram", status: "fail", limitSource: "standard", limitSourceNote: null },
    ]);
    expect(s.rows[0]!.basis).toBe("Rule: guarded (ISO 14253-1); limit: Maker's manual: HC-40 manual §4.2");
    expect(s.rows[1]!.basis).toBe("Rule: simple; limit: Standard");
  });
  it("calls a reading without a limit 'recorded' and draws no chart for it", () => {
    const s = readingSection([{ ...row, upperLimit: null, status: "no_limit" }]);
    expect(s.rows[0]!.basis).toBeUndefined();
    expect(s.rows[0]!.decision).toBe("recorded");
    expect(s.chart).toEqual([]);
  });
});

describe("readingSection in the unit the job recorded (ISO/IEC 17025:2017 §7.8.2.1)", () => {
  // 1 in = 25.4 mm exactly (NIST SP 811): 0.0003 in = 0.00762 mm, 0.0005 in = 0.0127 mm.
  const row = {
    title: "Collar face",
    quantityKind: "length" as const,
    lowerLimit: null,
    upperLimit: 0.0005 * 25.4,
    limitSource: "common_practice",
    pre: null,
    post: { value: 0.0003 * 25.4, U: 0.0024, resolution: 0.00254, instrument: "DTI-1" },
    change: null,
    status: "pass" as const,
  };
  it("prints an inch job's reading and limit in inch with mm beside, with its U", () => {
    const [r] = readingSection([row], "inch").rows;
    expect(r!.post).toBe("0.0003 in (0.008 mm)");
    expect(r!.limits).toBe("≤ 0.0005 in (≤ 0.0127 mm)");
    expect(r!.expanded).toBe("± 0.00009 in (± 0.0024 mm)");
  });
  it("prints a dash with the reason for a reading without an instrument, never 0.000", () => {
    const [r] = readingSection([{ ...row, post: { value: 0.001, U: 0, instrument: null } }], "metric").rows;
    expect(r!.expanded).toBe("— (no instrument named)");
  });
});

describe("instrumentRows", () => {
  it("is in calibration through its due date and past due the day after", () => {
    const i = {
      kind: "indicator",
      serial: "DI-1",
      quantityKind: "length",
      resolution: 0.001,
      u: 0.0008,
      due: "2026-03-10",
    };
    expect(instrumentRows([i], new Date("2026-03-10T23:00:00Z"))[0]!.status).toBe("In calibration");
    expect(instrumentRows([i], new Date("2026-03-11T00:00:00Z"))[0]!.status).toBe("Past due");
    const r = instrumentRows([i], new Date("2026-03-01T00:00:00Z"))[0]!;
    expect(r.resolution).toBe("0.0010 mm");
    expect(r.uncertainty).toBe("0.80 µm");
  });
});

describe("testPartRows", () => {
  it("prints each row in its own unit, with a dash for a one-sided lower limit", () => {
    const [r] = testPartRows([
      {
        feature: "Face",
        characteristic: "flatness",
        unit: "mm",
        nominal: 0,
        measured: 0.0123,
        deviation: 0.0123,
        lower_limit: null,
        upper_limit: 0.02,
        U: 0.002,
        decision: "pass",
      },
    ]);
    expect(r).toMatchObject({
      measured: "0.012 mm",
      deviation: "+0.012",
      limits: "— / 0.020",
      expanded: "0.002",
    });
  });
});

const fit = headFitJson(
  [param("pivot_length_error_um", 31.2, 4, "EZ"), param("secondary_zero_arcsec", -5, null, "EC0C")],
  { rms_um: 3.21, max_um: 9.87, iterations: 4 },
);

describe("parameterSection", () => {
  const limits = [
    {
      parameter: "pivot_length_error_um",
      lowerLimit: -20,
      upperLimit: 20,
      decisionRule: "simple" as const,
      limitSource: "customer_spec" as const,
      limitSourceNote: "PO 77",
    },
    {
      parameter: "secondary_zero_arcsec",
      lowerLimit: -30,
      upperLimit: 30,
      decisionRule: "simple" as const,
      limitSource: "common_practice" as const,
      limitSourceNote: null,
    },
  ];
  const s = parameterSection(
    {
      fit,
      residualsUm: [
        [1, -2, 0.5],
        [0, 0, -7],
      ],
      sUm: 1.5,
      approvedBy: "Ada Engineer",
      approvedAt: new Date("2026-03-02T10:00:00Z"),
    },
    limits,
  );
  it("judges a fitted value outside its limit as fail (ISO 14253-1 simple acceptance) and a held one as not determined", () => {
    expect(s.rows[0]).toMatchObject({
      symbol: "EZ",
      value: "+31.2 µm",
      expanded: "4.0 µm",
      decision: "fail",
    });
    expect(s.rows[0]!.limitSource).toContain("PO 77");
    expect(s.rows[1]).toMatchObject({ value: "−5.0″ (held)", expanded: "—", decision: "not_measured" });
  });
  it("charts only judged, fitted parameters and the largest residual component per pose", () => {
    expect(s.charts.parameters?.map((p) => p.symbol)).toEqual(["EZ"]);
    expect(s.charts.residuals).toMatchObject({ valuesUm: [2, 7], totalPoses: 2, sUm: 1.5 });
  });
  it("says who approved the fit and how many parameters were judged", () => {
    expect(s.note).toContain("approved by Ada Engineer");
    expect(s.note).toContain("1 of 2 parameters judged");
    expect(s.note).toContain("1 could not be determined");
  });
});

describe("buildReportContent", () => {
  const d: JobInput = {
    job: {
      reference: "TR-1",
      kind: "acceptance",
      title: "Head check",
      scheduledFor: null,
      airTempC: 20.5,
      decisionRule: "guarded",
      notes: "Coolant off.",
    },
    customer: { name: "Acme" },
    site: { name: "Plant 2", address: null },
    machine: { name: "Mill 4", kind: "gantry", builder: null, model: null, serial: null, control: null },
    head: {
      serial: "H-9",
      maker: null,
      model: null,
      primaryAxis: "C",
      secondaryAxis: "A",
      nominalPivotLengthMm: 250,
      massKg: null,
    },
  };
  const approval = signatureLine({
    signerName: "Ada",
    signerRole: "engineer",
    meaning: "approved",
    signedAt: new Date("2026-03-03T08:00:00Z"),
  });
  const input: Parameters<typeof buildReportContent>[0] = {
    meta: {
      reportId: "r1",
      revision: 2,
      issuedAt: new Date("2026-03-03T08:00:00Z"),
      approval,
      amendment: { supersedesRevision: 1, reason: "typo" },
    },
    d,
    jobKindLabel: "Acceptance",
    template: null,
    instruments: [],
    readings: { rows: [], chart: [] },
    parameters: null,
    testPart: [],
    figures: [],
    signatures: [],
    deviations: [],
    carried: 0,
    verifyUrl: "https://example.test/verify/r1",
    issuer: { name: "Issuer Ltd", address: "1 Road" },
  };
  const data = buildReportContent(input);
  it("prints the issuer as the settings give it, not a fixed name (ISO/IEC 17025:2017 §7.8.2.1 b)", () => {
    expect(data.issuer).toEqual({ name: "Issuer Ltd", address: "1 Road" });
  });
  it("names its content by the SHA-256 of the canonical JSON without the hash", () => {
    const { contentSha256, ...rest } = data;
    expect(contentSha256).toBe(createHash("sha256").update(canonicalJson(rest)).digest("hex"));
  });
  it("ends the signature list with the approval and carries the amendment and the job's notes", () => {
    expect(data.signatures.at(-1)).toEqual(approval);
    expect(data.amendment).toEqual({ supersedesRevision: 1, reason: "typo" });
    expect(data.remarks).toEqual(["Coolant off."]);
    expect(data.work.decisionRule).toContain("ISO 14253-1");
    expect(data.work.airTemperature).toBe("20.5 °C air temperature as entered");
    expect(data.charts).toEqual({});
  });
  it("states as its method only what the job did: no kinematic fit without one (ISO/IEC 17025:2017 §7.8.2.1 c)", () => {
    const fit = { rows: [], note: "fit", charts: {} };
    const withRow = { rows: [{ step: "Run-out" } as ReportData["readings"][number]], chart: [] };
    expect(data.work.method).toBe("Indicator readings against the checklist limits");
    expect(buildReportContent({ ...input, readings: withRow }).work.method).not.toMatch(/fit/);
    expect(buildReportContent({ ...input, parameters: fit }).work.method).toMatch(
      /^Kinematic fit from sphere-probe data/,
    );
    expect(buildReportContent({ ...input, readings: withRow, parameters: fit }).work.method).toBe(
      "Indicator readings against the checklist limits; kinematic fit from sphere-probe data (geometry model stated in the product documentation)",
    );
  });
  it("captions a figure with who saved it and the caption as plain text", () => {
    const f = figureOf({
      id: "v",
      sha256: "ab",
      factor: 2000,
      caption: "<b>x</b>",
      widthPx: 800,
      heightPx: 600,
      createdAt: new Date("2026-03-02T00:00:00Z"),
      createdByName: null,
    });
    expect(f.caption).toContain("× 2,000, saved by the engineer");
    expect(f.caption.endsWith(": <b>x</b>")).toBe(true);
  });
});

describe("amendRefusal", () => {
  const engineer = { role: "engineer" as const };
  it("allows an engineer to amend an issued or rejected report", () => {
    expect(amendRefusal(engineer, { status: "issued", hasIssuedRevision: true })).toBeNull();
    expect(amendRefusal(engineer, { status: "rejected", hasIssuedRevision: true })).toBeNull();
  });
  it("refuses other roles, an accepted report and a job with no revision", () => {
    expect(amendRefusal({ role: "inspector" }, { status: "issued", hasIssuedRevision: true })).toMatch(
      /engineer/,
    );
    expect(amendRefusal(engineer, { status: "accepted", hasIssuedRevision: true })).toMatch(
      /issued or rejected/,
    );
    expect(amendRefusal(engineer, { status: "approved", hasIssuedRevision: false })).toMatch(
      /no issued revision/,
    );
  });
});

// ISO/IEC 17025:2017 §7.8.6.1: a statement of conformity names the decision rule it applies; the
// three verdicts follow the judged rows and the deviations recorded for the FAIL or undecided ones.
describe("conformityStatement", () => {
  const rule = "Simple acceptance";
  it("conforms when every judged row passes (recorded and undetermined rows are not judged)", () => {
    const c = conformityStatement(["pass", "pass", "recorded", "not_measured"], 0, rule);
    expect(c.verdict).toBe("conforms");
    expect(c.text).toBe(
      "Conforms: all 2 judged results are within their limits. Decision rule: Simple acceptance.",
    );
  });
  it("conforms with the listed deviations when each FAIL or undecided row is carried", () => {
    expect(conformityStatement(["pass", "fail", "undecided"], 2, rule).verdict).toBe(
      "conforms_with_deviations",
    );
  });
  it("does not conform when a FAIL is not carried", () => {
    const c = conformityStatement(["pass", "fail", "undecided"], 1, rule);
    expect(c.verdict).toBe("does_not_conform");
    expect(c.text).toContain("2 of 3 judged results");
  });
  it("says nothing was judged when no row has a limit", () => {
    expect(conformityStatement(["recorded"], 0, rule).verdict).toBe("not_judged");
  });
  it("prints a deviation with its justification, decision in capitals and the approving engineer", () => {
    expect(
      deviationRows([
        {
          subjectLabel: "Test part Bore B, diameter",
          decision: "fail",
          justification: "Re-machined by the customer.",
          approvedByName: "Emil Haraldsen",
          createdAt: new Date("2026-11-21T09:00:00Z"),
        },
      ]),
    ).toEqual([
      {
        result: "Test part Bore B, diameter",
        decision: "FAIL",
        justification: "Re-machined by the customer.",
        approvedBy: "Emil Haraldsen",
        recordedAtUtc: expect.stringContaining("2026-11-21"),
      },
    ]);
  });
});
