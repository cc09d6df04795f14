import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { axisLettersFor, headJudgingValues } from "@/components/procedures/builder-values";
import { starterLibraryRows } from "@/db/library/starter";
import {
  equalPoints,
  moveStep,
  procedureRows,
  procedureSchema,
  stepInputFromRow,
  versionPlan,
} from "@/lib/validations/procedures";

const rowsOf = (body: unknown) => procedureRows(procedureSchema.parse(body));
const one = (step: object) => ({ name: "Unit procedure", steps: [{ title: "Step", ...step }] });

describe("procedure steps", () => {
  it("store limits canonically: 0.0005 in = 0.0127 mm, 12.7 µm = 0.0127 mm (1 in = 25.4 mm exactly, NIST SP 811)", () => {
    const a = rowsOf(one({ kind: "reading", unit: "in", upper: 0.0005, limitSource: "common_practice" }));
    const b = rowsOf(one({ kind: "reading", unit: "um", upper: 12.7, limitSource: "common_practice" }));
    expect(a.rows!.steps[0]!.upperLimit).toBeCloseTo(0.0127, 15);
    expect(b.rows!.steps[0]!.upperLimit).toBeCloseTo(0.0127, 15);
    expect(a.rows!.steps[0]!.derivation).toBe("direct");
    expect(a.rows!.steps[0]!.limitUnit).toBe("in");
  });

  it("read back in the step's own unit", () => {
    const r = rowsOf(
      one({
        kind: "reading",
        unit: "in",
        lower: -0.0003,
        upper: 0.0005,
        limitSource: "standard",
        limitSourceNote: "ISO 230-1, clause given by the customer",
      }),
    );
    const back = stepInputFromRow(r.rows!.steps[0]!);
    expect(back).toMatchObject({ unit: "in", lower: -0.0003, upper: 0.0005, kind: "direct" });
  });

  it("require a limit source on every judged step, and its note for a standard", () => {
    const r = rowsOf(
      one({
        kind: "multi_point",
        unit: "mm",
        upper: 0.01,
        points: ["12", "3", "6", "9"],
        pointResult: "tir",
      }),
    );
    expect(r.issues.map((i) => i.field)).toEqual(["steps.0.limitSource"]);
    const s = rowsOf(one({ kind: "check", limitSource: "standard" }));
    expect(s.issues.map((i) => i.field)).toEqual(["steps.0.limitSourceNote"]);
    // A record or a note is never judged and needs no source.
    expect(rowsOf(one({ kind: "record", recordUnit: "N·m" })).issues).toEqual([]);
    expect(rowsOf(one({ kind: "note" })).issues).toEqual([]);
  });

  it("name the field of each problem", () => {
    const r = rowsOf({
      name: "Unit procedure",
      steps: [
        { title: "A", kind: "reading", unit: "mm", lower: 2, upper: 1, limitSource: "common_practice" },
        {
          title: "B",
          kind: "multi_point",
          unit: "mm",
          upper: 1,
          points: ["12", "3", "6"],
          pointResult: "flatness",
          limitSource: "common_practice",
        },
        { title: "C", kind: "record" },
        { title: "D", kind: "angle_over_distance", unit: "mm", upper: 20, limitSource: "common_practice" },
      ],
    });
    expect(r.issues.map((i) => i.field)).toEqual([
      "steps.0.lower",
      "steps.1.points",
      "steps.2.recordUnit",
      "steps.3.distanceMm",
      "steps.3.unit",
    ]);
  });

  it("map the API's words: reading → direct, recheck → reverification", () => {
    const r = rowsOf({ ...one({ kind: "note" }), jobKind: "recheck", jobKinds: ["after_crash"] });
    expect(r.rows!.jobKinds).toEqual(["reverification", "after_crash"]);
  });

  it("refuse an unknown kind through zod, with the path", () => {
    const p = procedureSchema.safeParse(one({ kind: "guess" }));
    expect(p.success).toBe(false);
    expect(p.error!.issues[0]!.path).toEqual(["steps", 0, "kind"]);
  });
});

describe("versions and ordering", () => {
  it("change a version in place only while no job uses it", () => {
    expect(versionPlan(0)).toBe("replace");
    expect(versionPlan(1)).toBe("new_version");
    expect(versionPlan(40)).toBe("new_version");
  });

  it("move a step up or down; moving twice back restores the order", () => {
    expect(moveStep(["a", "b", "c"], 2, -1)).toEqual(["a", "c", "b"]);
    expect(moveStep(["a", "b", "c"], 0, -1)).toEqual(["a", "b", "c"]);
    fc.assert(
      fc.property(fc.array(fc.integer(), { minLength: 2, maxLength: 20 }), fc.nat(), (xs, k) => {
        const i = k % (xs.length - 1);
        expect(moveStep(moveStep(xs, i, 1), i + 1, -1)).toEqual(xs);
        expect(moveStep(xs, i, 1).slice().sort()).toEqual(xs.slice().sort());
      }),
    );
  });

  it("name equal points so they cannot be read as clock positions", () => {
    expect(equalPoints(5)).toEqual(["P1", "P2", "P3", "P4", "P5"]);
  });
});

describe("starter library", () => {
  it("passes the builder's own rules, every judged step sourced", () => {
    const all = starterLibraryRows();
    expect(all.map((p) => p.steps.length)).toEqual([25, 8, 11]);
    for (const p of all)
      for (const s of p.steps.filter((x) =>
        ["direct", "angle_over_distance", "multi_point"].includes(x.derivation),
      ))
        expect(s.limitSourceNote, s.title).toBeTruthy();
  });
});

describe("positioning limits of the rotary axes", () => {
  const withLimits = (positioningLimits: unknown) => ({ ...one({ kind: "note" }), positioningLimits });
  /** Parse and check; zod's own issues come back as field paths, like the API's 422. */
  const fieldsOf = (body: unknown) => {
    const parsed = procedureSchema.safeParse(body);
    if (!parsed.success) return parsed.error.issues.map((i) => i.path.join("."));
    return procedureRows(parsed.data).issues.map((i) => i.field);
  };

  it("store an upper limit in arc seconds per axis and ISO 230-2 quantity, with its source", () => {
    // The bidirectional quantities A, E, M, R and B are those ISO 230-2:2014 defines for an axis.
    const r = rowsOf(
      withLimits([
        {
          axis: "primary",
          quantity: "A",
          upper: "20",
          limitSource: "customer_spec",
          limitSourceNote: "CS-7",
        },
        { axis: "primary", quantity: "R", upper: 6, limitSource: "common_practice" },
        { axis: "secondary", quantity: "B", upper: "", limitSource: "" },
      ]),
    );
    expect(r.issues).toEqual([]);
    expect(r.rows!.positioningLimits).toEqual([
      {
        axis: "primary",
        quantity: "A",
        upperLimitArcsec: 20,
        limitSource: "customer_spec",
        limitSourceNote: "CS-7",
      },
      {
        axis: "primary",
        quantity: "R",
        upperLimitArcsec: 6,
        limitSource: "common_practice",
        limitSourceNote: null,
      },
    ]);
  });

  it("leave them out and the body keeps what the version had (null); an empty list clears them", () => {
    expect(rowsOf(one({ kind: "note" })).rows!.positioningLimits).toBeNull();
    expect(rowsOf(withLimits([])).rows!.positioningLimits).toEqual([]);
  });

  it("require a source for a limit, and the note for a standard", () => {
    expect(fieldsOf(withLimits([{ axis: "primary", quantity: "A", upper: 20 }]))).toEqual([
      "positioningLimits.0.limitSource",
    ]);
    expect(
      fieldsOf(withLimits([{ axis: "secondary", quantity: "E", upper: 12, limitSource: "standard" }])),
    ).toEqual(["positioningLimits.0.limitSourceNote"]);
  });

  it("refuse a negative or zero limit, and a second limit for the same axis and quantity", () => {
    const r = rowsOf(
      withLimits([
        { axis: "primary", quantity: "M", upper: -3, limitSource: "common_practice" },
        { axis: "primary", quantity: "A", upper: 0, limitSource: "common_practice" },
        { axis: "primary", quantity: "A", upper: 5, limitSource: "common_practice" },
      ]),
    );
    expect(r.issues).toEqual([
      {
        field: "positioningLimits.0.upper",
        message: "A positioning limit is a positive number of arc seconds.",
      },
      {
        field: "positioningLimits.1.upper",
        message: "A positioning limit is a positive number of arc seconds.",
      },
      { field: "positioningLimits.2.quantity", message: "This axis has a limit for this quantity already." },
    ]);
  });

  it("refuse an unknown quantity, an unknown axis and a limit that is not a number, by field", () => {
    expect(
      fieldsOf(
        withLimits([
          { axis: "primary", quantity: "B_mean", upper: 5, limitSource: "common_practice" },
          { axis: "tertiary", quantity: "A", upper: 5, limitSource: "common_practice" },
          { axis: "secondary", quantity: "R", upper: "five", limitSource: "common_practice" },
        ]),
      ),
    ).toEqual(["positioningLimits.0.quantity", "positioningLimits.1.axis", "positioningLimits.2.upper"]);
  });
});

describe("the builder's positioning rows", () => {
  it("hold every quantity of each axis, a stored limit in its row and the rest empty", () => {
    const v = headJudgingValues({
      tcpCheckRequired: false,
      tcpRangeLimitUm: null,
      tcpDeviationLimitUm: null,
      tcpLimitSource: null,
      tcpLimitSourceNote: null,
      parameterLimits: [],
      positioningLimits: [
        {
          axis: "secondary",
          quantity: "R",
          upperLimitArcsec: 6,
          limitSource: "standard",
          limitSourceNote: "x",
        },
      ],
    });
    expect(v.positioningLimits.map((r) => `${r.axis}:${r.quantity}`)).toEqual([
      "primary:A",
      "primary:E",
      "primary:M",
      "primary:R",
      "primary:B",
      "secondary:A",
      "secondary:E",
      "secondary:M",
      "secondary:R",
      "secondary:B",
    ]);
    expect(v.positioningLimits.filter((r) => r.upper !== "")).toEqual([
      { axis: "secondary", quantity: "R", upper: "6", limitSource: "standard", limitSourceNote: "x" },
    ]);
    // What the form sends back is what was stored.
    const back = rowsOf({ ...one({ kind: "note" }), positioningLimits: v.positioningLimits });
    expect(back.rows!.positioningLimits).toEqual([
      {
        axis: "secondary",
        quantity: "R",
        upperLimitArcsec: 6,
        limitSource: "standard",
        limitSourceNote: "x",
      },
    ]);
  });

  it("name the axis letters only when the register's heads of that model agree", () => {
    const heads = [
      { model: "CA-40", primaryAxis: "C", secondaryAxis: "A" },
      { model: "MIX-1", primaryAxis: "C", secondaryAxis: "A" },
      { model: "MIX-1", primaryAxis: "B", secondaryAxis: "A" },
    ];
    expect(axisLettersFor(heads, " ca-40 ")).toEqual({ primary: "C", secondary: "A" });
    expect(axisLettersFor(heads, "MIX-1")).toBeNull();
    expect(axisLettersFor(heads, "HX-40")).toBeNull();
    expect(axisLettersFor(heads, "")).toBeNull();
  });
});
