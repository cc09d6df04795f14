// The demo's issued report (TR-2026-0041, issued by the seed through the app's own issue path)
// read back with pdftotext (poppler, an independent PDF reader): every item ISO/IEC 17025:2017
// §7.8 asks of a calibration or test report is printed, or says plainly that it was not recorded.
// The clause is named beside each check.
import { execFileSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { and, asc, eq, isNull } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { analyses, datasets, deviations, environmentRecords, readings, reports } from "@/db/schema";
import { GEOMETRY_VERSION } from "@/geometry/version";
import { jobIdByReference } from "./helpers";
import pkg from "../../package.json" with { type: "json" };

let text = "";
let flat = "";
let jobId = "";

beforeAll(async () => {
  jobId = await jobIdByReference("TR-2026-0041");
  const [r] = await db
    .select({ pdf: reports.pdf })
    .from(reports)
    .where(eq(reports.jobId, jobId))
    .orderBy(asc(reports.revision));
  const dir = path.resolve(process.env.TMPDIR ?? "/tmp", "report-records");
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, "demo-report.pdf");
  writeFileSync(file, r!.pdf);
  text = execFileSync("pdftotext", ["-layout", file, "-"]).toString("utf8");
  // One line per item: the layout wraps long values, so checks on a phrase read the text unwrapped.
  flat = execFileSync("pdftotext", [file, "-"]).toString("utf8").replace(/\s+/g, " ");
});

/**
 * ISO/IEC 17025:2017 clauses whose content is fixed text of the seeded issued report, and the
 * phrases the report must print for each (the seed's invented record details).
 */
const PRINTED: [string, string[]][] = [
  [
    "§7.8.2.1 e: the customer, the customer's contact and the order reference",
    [
      "Marlow Creek Aerostructures",
      "Dana Okafor (invented), quality@marlowcreek.example",
      "PO 4500-7781 (invented)",
    ],
  ],
  [
    "§7.8.2.1 c and e: the method with the standards and clauses the job used, and nothing it did not",
    [
      "ISO 230-1:2012, clause 3",
      "JCGM 100:2008 (GUM), §5.1 and §6.2",
      "ISO 14253-1",
      // The demo job has a fit and a test part, so both method sentences are there.
      "least-squares fit of the kinematic model to sphere-probe data",
      "ISO 10791-7",
    ],
  ],
  [
    "§7.8.2.1 f: the item (head make, model, serial; host machine) and its condition as found",
    [
      "two-axis head Invented Head Co. CA-40, serial TH-2241",
      "Gantry mill G-7",
      "Head delivered crated, seals intact",
    ],
  ],
  [
    "§7.8.2.1 k: the results relate only to the item tested; reproduction only in full",
    ["The results relate only to the item tested", "shall not be reproduced except in full"],
  ],
  [
    "§7.8.4.1 and §6.5: each instrument with certificate, calibration date, laboratory and due date",
    ["CAL-26-0612 (invented)", "2026-06-15", "2027-06-15", "Invented Dimensional Lab"],
  ],
];

describe("the demo's issued report carries every §7.8 item (ISO/IEC 17025:2017)", () => {
  it("§7.8.2.1 a: a title, and b: the issuer's name, address and contact", () => {
    expect(flat).toContain("Acceptance report — two-axis head");
    expect(flat).toContain("Halvard Field Service");
    expect(flat).toContain("Halvard Industrial Estate");
    expect(flat).toContain("reports@halvard.example");
  });
  it("§7.8.2.1 d: the report's unique identification on every page, and 'Page n of m'", () => {
    const pages = text.split("\f").filter((p) => p.trim());
    expect(pages.length).toBeGreaterThan(1);
    for (const [i, p] of pages.entries()) {
      expect(p).toContain("TR-2026-0041");
      expect(p).toContain(`Page ${i + 1} of ${pages.length}`);
    }
  });
  for (const [clause, phrases] of PRINTED)
    it(clause, () => {
      for (const phrase of phrases) expect(flat).toContain(phrase);
    });
  it("§7.8.2.1 h and i: the dates of the work (first and last record) and the date of issue", async () => {
    const [first] = await db
      .select({ t: readings.takenAt })
      .from(readings)
      .where(eq(readings.jobId, jobId))
      .orderBy(asc(readings.takenAt))
      .limit(1);
    expect(flat).toContain(`${first!.t.toISOString().slice(0, 16).replace("T", " ")} UTC to`);
    const [rep] = await db.select({ at: reports.issuedAt }).from(reports).where(eq(reports.jobId, jobId));
    expect(flat).toMatch(new RegExp(`Date of issue ${rep!.at.toISOString().slice(0, 10)}`));
  });
  it("§7.8.4.1 a (calibration) and §7.8.3.1 a (testing): the environment, air and machine temperature with time", async () => {
    const env = await db.select().from(environmentRecords).where(eq(environmentRecords.jobId, jobId));
    expect(env.length).toBe(2);
    expect(flat).toContain("2026-10-12 06:55 UTC, before adjustment: air 20.4 °C, machine 20.1 °C");
    expect(flat).toContain("2026-10-12 09:40 UTC, after adjustment: air 20.9 °C, machine 20.6 °C");
  });
  it("§7.8.2.1 g: deviations from the method, stated even when there are none", async () => {
    const carried = await db.select().from(deviations).where(eq(deviations.jobId, jobId));
    expect(flat).toContain("Deviations from the method");
    if (carried.length === 0) expect(flat).toContain("None: the procedure was followed as written");
    for (const d of carried) {
      expect(flat).toContain(`Deviation: ${d.subjectLabel}`);
      expect(flat).toContain(d.justification);
    }
  });
  it("§7.8.6.1: the statement of conformity with the decision rule", () => {
    expect(flat).toContain("Statement of conformity");
    expect(flat).toMatch(/Decision rule: /);
  });
  it("§7.8.4.1 and §6.5: the probe, the reference sphere with its calibrated diameter and the CMM behind the data", () => {
    expect(flat).toContain("Touch probe (sphere probing)");
    expect(flat).toContain(
      "Reference sphere (reference for the sphere probing), calibrated diameter 25.4012 mm",
    );
    expect(flat).toContain("Coordinate measuring machine (test part measurement)");
    for (const cert of ["CAL-26-0701 (invented)", "CAL-26-0210 (invented)", "CAL-26-0415 (invented)"])
      expect(flat).toContain(cert);
  });
  it("§7.8.2.1 b and §7.11.2: each fit names its data file, SHA-256, phase and computation version; the software version", async () => {
    const [a] = await db
      .select({ sha: datasets.sha256, file: datasets.originalFilename, v: analyses.geometryVersion })
      .from(analyses)
      .innerJoin(datasets, eq(datasets.id, analyses.datasetId))
      .where(and(eq(analyses.jobId, jobId), isNull(datasets.deletedAt)));
    expect(flat).toContain(a!.file);
    expect(flat).toContain(`SHA-256 ${a!.sha}`);
    expect(a!.v).toBe(GEOMETRY_VERSION);
    expect(flat).toContain(GEOMETRY_VERSION);
    expect(flat).toContain(`Trammel ${pkg.version}`);
  });
  it("§7.8.2.1 (units as recorded): the inch job's readings print in inch with mm beside; limits in inch", () => {
    expect(flat).toContain("0.0003 in (0.008 mm)");
    expect(flat).toContain("≤ 0.0005 in (≤ 0.0127 mm)");
    expect(flat).not.toMatch(/0\.01016 mm(?!\))/);
  });
  it("§7.8.2.1: U is printed for the readings, and never as 0.000 for an undefined value", () => {
    expect(flat).toContain("U (k = 2)");
    expect(flat).toContain("± 0.00009 in (± 0.0024 mm)");
    expect(flat).not.toMatch(/± 0\.0+(?![0-9])/);
  });
  it("the next re-check date", () => {
    expect(flat).toContain("Next re-check 2027-04-12");
  });
});
