// A TCP check judged against the procedure's limits (simple acceptance, ISO 14253-1: the value
// against the limit, U stated not subtracted), and the readiness rule for a procedure that asks
// for one. Figures are worked by hand beside each case.
import { describe, expect, it } from "vitest";
import { tcpCheck } from "@/geometry";
import { readSphereProbeCsv } from "@/geometry";
import { demoTcpCheckCsv } from "@/db/seed-control";
import { readiness } from "@/lib/report/readiness";
import { judgeTcpCheck, tcpCheckSubject } from "@/lib/tcp-check-display";
import { signedEmptyJob } from "./readiness-inputs";

const summary = {
  range_um: { x: 8.2, y: 3.1, z: 12.5 },
  max_from_mean_um: 7.4,
  worst_row: 14,
  poses: 60,
  warnings: [],
};

describe("judging a TCP check", () => {
  it("passes each range and the distance from the mean when each is within its limit", () => {
    const v = judgeTcpCheck(summary, { required: true, rangeLimitUm: 15, deviationLimitUm: 10 });
    expect(v.rows.map((r) => [r.quantity, r.valueText, r.limitText, r.decision])).toEqual([
      ["Range of the centre in X", "8.2 µm", "≤ 15.0 µm", "pass"],
      ["Range of the centre in Y", "3.1 µm", "≤ 15.0 µm", "pass"],
      ["Range of the centre in Z", "12.5 µm", "≤ 15.0 µm", "pass"],
      ["Largest distance from the mean centre (row 14)", "7.4 µm", "≤ 10.0 µm", "pass"],
    ]);
    expect(v.decision).toBe("pass");
  });

  it("fails the check when one figure is over its limit (12.5 µm > 12 µm in Z)", () => {
    const v = judgeTcpCheck(summary, { required: true, rangeLimitUm: 12, deviationLimitUm: 10 });
    expect(v.rows.map((r) => r.decision)).toEqual(["pass", "pass", "fail", "pass"]);
    expect(v.decision).toBe("fail");
  });

  it("records the figures without judging them when the procedure sets no limits", () => {
    const v = judgeTcpCheck(summary, { required: false, rangeLimitUm: null, deviationLimitUm: null });
    expect(v.decision).toBe("recorded");
    expect(v.rows.every((r) => r.limitText === "—")).toBe(true);
  });

  it("the demo TCP file passes 15 µm / 10 µm limits (residual errors of a few µm, geometry's model)", () => {
    const r = tcpCheck(readSphereProbeCsv(demoTcpCheckCsv(), { units: "mm" }));
    const v = judgeTcpCheck(
      { ...r, range_um: r.range_um, warnings: r.warnings },
      { required: true, rangeLimitUm: 15, deviationLimitUm: 10 },
    );
    expect(r.poses).toBe(60);
    expect(v.decision).toBe("pass");
    // A 2.5 µm pivot error swung through ±90° moves the centre by at least 2.5 µm (sin 90° · 2.5 µm).
    expect(Math.max(r.range_um.x, r.range_um.y, r.range_um.z)).toBeGreaterThan(2.5);
  });
});

describe("readiness with a procedure that asks for a TCP check", () => {
  const base = signedEmptyJob;

  it("blocks issue while no TCP check is stored, and names where to resolve it", () => {
    const r = readiness({ ...base, tcpCheck: { required: true, latest: null } });
    expect(r.ready).toBe(false);
    expect(r.blockers).toEqual([
      expect.objectContaining({ code: "tcp_check_missing", href: "/jobs/j/control" }),
    ]);
    expect(readiness({ ...base, tcpCheck: { required: false, latest: null } }).ready).toBe(true);
  });

  it("a failing check blocks until it is carried as a deviation; a passing one does not", () => {
    const latest = { datasetId: "d1", filename: "tcp.csv" };
    const failing = {
      ...base,
      tcpCheck: { required: true, latest },
      results: [
        {
          subject: tcpCheckSubject("d1"),
          label: "Tool-centre-point check tcp.csv",
          decision: "fail" as const,
        },
      ],
    };
    expect(readiness(failing).blockers.map((b) => b.code)).toEqual(["result_not_conforming"]);
    expect(readiness({ ...failing, deviationSubjects: [tcpCheckSubject("d1")] }).ready).toBe(true);
    expect(
      readiness({ ...failing, results: [{ ...failing.results[0]!, decision: "pass" as const }] }).ready,
    ).toBe(true);
  });
});
