// The report's record details (ISO/IEC 17025:2017 §7.8.2.1): every item present or saying "not
// recorded"; the method cites only the standards of what the job did (no fit sentence without a
// fit). Standards named: ISO 230-1:2012 (terms and symbols), JCGM 100:2008 §6.2 (U = k·u_c,
// k = 2), ISO 14253-1:2017 (guarded acceptance), ISO 1:2016 clause 3 (20 °C) — clause numbers from
// memory, as the section's own comment says.
import { describe, expect, it } from "vitest";
import {
  methodSentences,
  NOT_RECORDED,
  recordsSection,
  type RecordsInput,
} from "@/lib/report/sections/records";

const base: RecordsInput = {
  issuer: {
    name: "Issuer Ltd",
    address: "1 Road",
    contactEmail: "",
    contactPhone: "",
    accreditation: "",
    reproductionStatement: "Reproduce in full only.",
  },
  job: {
    orderReference: null,
    customerContactName: null,
    customerContactEmail: "  ",
    conditionAsFound: null,
    nextRecheckOn: null,
  },
  item: { head: "two-axis head X, serial H-1", machine: "Mill 4" },
  did: {
    readings: true,
    fit: false,
    testPart: false,
    procedure: "Install, version 2",
    decisionRule: "simple",
  },
  deviationCount: 0,
  work: { first: null, last: null },
  issuedAt: null,
  environment: [],
  unitSystem: "metric",
  instruments: [
    {
      kind: "Dial test indicator",
      serial: "D-1",
      certificateRef: null,
      calibratedOn: null,
      laboratory: null,
      dueOn: "2027-01-01",
    },
  ],
  fits: [],
  software: { version: "0.1.0", commit: null },
};

describe("recordsSection", () => {
  it("says 'not recorded' for each item the job does not hold, never leaves it out", () => {
    const r = recordsSection(base);
    expect(r.orderReference).toBe(NOT_RECORDED);
    expect(r.customerContact).toBe(NOT_RECORDED);
    expect(r.conditionAsFound).toBe(NOT_RECORDED);
    expect(r.nextRecheck).toBe(NOT_RECORDED);
    expect(r.issuer.contact).toBe(NOT_RECORDED);
    expect(r.workDates).toMatch(/^not recorded/);
    expect(r.environment).toEqual(["not recorded: no air or machine temperature was entered for this job"]);
    expect(r.traceability[0]).toMatchObject({
      certificate: NOT_RECORDED,
      calibratedOn: NOT_RECORDED,
      laboratory: NOT_RECORDED,
      due: "2027-01-01",
    });
    expect(r.issueDate).toBe("not issued (draft)");
    expect(r.relatesOnly).toMatch(/relate only to the item tested/);
    expect(r.methodDeviations).toMatch(/^None/);
  });

  it("prints what is recorded: contact, environment with time and phase, dates, fit source, software build", () => {
    const r = recordsSection({
      ...base,
      job: {
        ...base.job,
        customerContactName: "Dana",
        customerContactEmail: "d@x.example",
        nextRecheckOn: "2027-04-01",
      },
      issuedAt: new Date("2026-11-02T10:00:00Z"),
      work: { first: new Date("2026-11-01T07:00:00Z"), last: new Date("2026-11-01T15:30:00Z") },
      environment: [
        {
          phase: "pre",
          airTempC: 20.44,
          machineTempC: null,
          takenAt: new Date("2026-11-01T07:05:00Z"),
          note: null,
        },
      ],
      fits: [
        { filename: "probe.csv", sha256: "ab".repeat(32), phase: "post", geometryVersion: "head-fit-1.0.0" },
      ],
      software: { version: "0.1.0", commit: "0123456789abcdef0123" },
      unitSystem: "inch",
      deviationCount: 2,
    });
    expect(r.customerContact).toBe("Dana, d@x.example");
    expect(r.issueDate).toBe("2026-11-02");
    expect(r.workDates).toBe(
      "2026-11-01 07:00 UTC to 2026-11-01 15:30 UTC (first and last reading or data file)",
    );
    expect(r.environment).toEqual([
      "2026-11-01 07:05 UTC, before adjustment: air 20.4 °C, machine not recorded",
    ]);
    expect(r.fits).toEqual([
      {
        file: "probe.csv",
        sha256: "ab".repeat(32),
        phase: "after adjustment",
        computation: "head-fit-1.0.0",
      },
    ]);
    expect(r.software).toBe("Trammel 0.1.0 (build 0123456789ab)");
    expect(r.units).toMatch(/inch as recorded, with mm beside \(1 in = 25\.4 mm exactly\)/);
    expect(r.nextRecheck).toBe("2027-04-01");
    expect(r.methodDeviations).toMatch(/2 results outside their limits are carried as deviations/);
  });
});

describe("methodSentences", () => {
  it("cites only what the job did: no fit sentence without a fit, no test part sentence without one", () => {
    const m = methodSentences(base.did).join(" ");
    expect(m).toContain("ISO 230-1:2012, clause 3");
    expect(m).toContain("JCGM 100:2008 (GUM), §5.1 and §6.2");
    expect(m).not.toMatch(/fit/);
    expect(m).not.toContain("ISO 10791-7");
    expect(m).toContain("ISO 1:2016, clause 3");
  });
  it("adds the fit and test part sentences when they were done, and the guarded rule of ISO 14253-1", () => {
    const m = methodSentences({ ...base.did, fit: true, testPart: true, decisionRule: "guarded" }).join(" ");
    expect(m).toContain("least-squares fit");
    expect(m).toContain("ISO 10791-7");
    expect(m).toContain("guarded acceptance per ISO 14253-1:2017");
  });
});
