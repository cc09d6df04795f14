// Each step kind on the tablet: what is accepted, what is refused (naming the point or field),
// and what is stored and shown. Derived values are checked against definitions and against an
// independent library (mathjs).
import fc from "fast-check";
import { lusolve, multiply, transpose } from "mathjs";
import { describe, expect, it } from "vitest";
import { multiPointValue } from "@/geometry/multi-point";
import { judge } from "@/lib/checklist";
import { readingSection } from "@/lib/report/build";
import { rangeProblem, shownPoints, shownValue, stepEntry, type KindStep } from "@/lib/step-kinds";

const base: KindStep = {
  quantityKind: "length",
  derivation: "direct",
  distanceMm: null,
  lowerLimit: null,
  upperLimit: 0.01,
  decisionRule: "simple",
  points: null,
  pointResult: null,
  recordUnit: null,
};
const collar: KindStep = {
  ...base,
  derivation: "multi_point",
  points: ["12", "3", "6", "9"],
  pointResult: "tir",
};

describe("multi-point steps", () => {
  it("derives the TIR as largest minus smallest reading (ASME B89.3.4 / ISO 230-1 definition of run-out)", () => {
    const r = stepEntry(collar, {
      unit: "mm",
      points: { "12": "0", "3": "0.004", "6": "0.010", "9": "-0.002" },
    });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.stored.value).toBeCloseTo(0.012, 12);
    expect(r.stored.inputs).toMatchObject({
      points: { "12": 0, "3": 0.004, "6": 0.01, "9": -0.002 },
      highPoint: "6",
      lowPoint: "9",
    });
    expect(judge(collar, r.stored.value)).toBe("fail");
  });

  it("converts inch points to the canonical mm (1 in = 25.4 mm exactly, NIST SP 811)", () => {
    const r = stepEntry(collar, {
      unit: "in",
      points: { "12": "0.0000", "3": "0.0002", "6": "0.0001", "9": "0" },
    });
    expect(r.ok && r.stored.value).toBeCloseTo(0.0002 * 25.4, 12);
    expect(r.ok && r.stored.enteredValue).toBeCloseTo(0.0002, 12);
  });

  it("names the missing or bad point", () => {
    const r = stepEntry(collar, { unit: "mm", points: { "12": "0", "3": "abc", "6": "" } });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toEqual([
      { field: "points.3", message: "The reading at 3 is not a number." },
      { field: "points.6", message: "Enter the reading at 6." },
      { field: "points.9", message: "Enter the reading at 9." },
    ]);
    const extra = stepEntry(collar, { unit: "mm", points: { "12": 0, "3": 0, "6": 0, "9": 0, "4:30": 1 } });
    expect(!extra.ok && extra.problems[0]).toEqual({
      field: "points.4:30",
      message: "4:30 is not a point of this step.",
    });
  });

  it("takes the mean as the arithmetic mean (definition)", () => {
    const step = { ...collar, pointResult: "mean" as const };
    const r = stepEntry(step, { unit: "um", points: { "12": 2, "3": 4, "6": 6, "9": 8 } });
    expect(r.ok && r.stored.value).toBeCloseTo(0.005, 12); // 5 µm = 0.005 mm
  });

  it("gives the same flatness about the least-squares plane as mathjs solving the normal equations", () => {
    const names = ["12", "1:30", "3", "4:30", "6", "7:30", "9", "10:30"];
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -50, max: 50, noNaN: true }), { minLength: 8, maxLength: 8 }),
        (ys) => {
          const deg = [0, 45, 90, 135, 180, 225, 270, 315].map((d) => (d * Math.PI) / 180);
          const A = deg.map((t) => [1, Math.cos(t), Math.sin(t)]);
          const At = transpose(A);
          const x = (lusolve(multiply(At, A), multiply(At, ys)) as number[][]).map((row) => row[0]!);
          const res = A.map((row, i) => ys[i]! - (x[0]! * row[0]! + x[1]! * row[1]! + x[2]! * row[2]!));
          const expected = Math.max(...res) - Math.min(...res);
          expect(multiPointValue("flatness", names, ys).value).toBeCloseTo(expected, 8);
        },
      ),
    );
  });

  it("finds a pure tilt flat: readings on a plane have no flatness error", () => {
    const names = ["12", "3", "6", "9"];
    const tilt = [0, 90, 180, 270].map(
      (d) => 3 + 2 * Math.cos((d * Math.PI) / 180) - Math.sin((d * Math.PI) / 180),
    );
    expect(multiPointValue("flatness", names, tilt).value).toBeCloseTo(0, 10);
  });
});

describe("yes/no checks", () => {
  const check: KindStep = { ...base, derivation: "check", lowerLimit: null, upperLimit: null };
  it("stores yes as 1 and no as 0 with the word, judged pass and fail", () => {
    const yes = stepEntry(check, { unit: "mm", answer: "yes" });
    const no = stepEntry(check, { unit: "mm", answer: "No" });
    expect(yes.ok && yes.stored).toMatchObject({ value: 1, textValue: "yes" });
    expect(no.ok && no.stored).toMatchObject({ value: 0, textValue: "no" });
    expect(judge(check, 1)).toBe("pass");
    expect(judge(check, 0)).toBe("fail");
    expect(
      shownValue(
        check,
        { value: 1, enteredValue: 1, enteredUnit: "yes/no", inputs: null, textValue: "yes" },
        "metric",
      ),
    ).toBe("Yes");
  });
  it("refuses anything but yes or no", () => {
    expect(stepEntry(check, { unit: "mm", answer: "maybe" })).toEqual({
      ok: false,
      problems: [{ field: "answer", message: "Answer yes or no." }],
    });
    expect(stepEntry(check, { unit: "mm" }).ok).toBe(false);
  });
});

describe("record and note steps", () => {
  const torque: KindStep = { ...base, derivation: "record", recordUnit: "N·m", upperLimit: null };
  const note: KindStep = { ...base, derivation: "note", upperLimit: null };
  it("keeps a record value in its own unit with where it applies, never judged", () => {
    const r = stepEntry(torque, { unit: "mm", value: "45", text: " shims at 3 and 9 " });
    expect(r.ok && r.stored).toMatchObject({ value: 45, enteredUnit: "N·m", textValue: "shims at 3 and 9" });
    expect(judge(torque, 45)).toBe("no_limit");
    expect(
      shownValue(
        torque,
        { value: 45, enteredValue: 45, enteredUnit: "N·m", inputs: null, textValue: null },
        "inch",
      ),
    ).toBe("45 N·m");
    expect(stepEntry(torque, { unit: "mm", value: "" })).toEqual({
      ok: false,
      problems: [{ field: "value", message: "Enter the value in N·m." }],
    });
  });
  it("stores a note as value 0 with its text, and refuses an empty note", () => {
    const r = stepEntry(note, { unit: "mm", text: "Orientation mark faces the machine front." });
    expect(r.ok && r.stored).toMatchObject({
      value: 0,
      textValue: "Orientation mark faces the machine front.",
    });
    expect(stepEntry(note, { unit: "mm", text: "  " })).toEqual({
      ok: false,
      problems: [{ field: "text", message: "Write the note." }],
    });
    expect(judge(note, 0)).toBe("no_limit");
  });
});

describe("single readings and the instrument's range", () => {
  it("keeps the direct kind as before and reports what the instrument read", () => {
    const r = stepEntry(base, { unit: "in", value: "0.0005" });
    expect(r.ok && r.stored.value).toBeCloseTo(0.0127, 12); // 0.0005 in × 25.4 (NIST SP 811)
    expect(r.ok && r.stored.instrumentReadings[0]).toBeCloseTo(0.0127, 12);
    expect(stepEntry(base, { unit: "mm", value: "abc" }).ok).toBe(false);
  });
  it("refuses a reading outside the instrument's range, naming the point", () => {
    const dti = { serial: "DTI-7", rangeMin: -0.4, rangeMax: 0.4 };
    expect(rangeProblem(dti, [0.1, -0.39])).toBeNull();
    expect(rangeProblem(dti, [0.1, 0.5], ["12", "3"])).toEqual({
      point: "3",
      message: "The reading at 3 is outside the instrument's range: DTI-7 reads from -0.4 to 0.4.",
    });
    expect(rangeProblem({ serial: "X", rangeMin: null, rangeMax: null }, [1e9])).toBeNull();
  });
  it("shows the points of a multi-point reading", () => {
    expect(
      shownPoints(
        {
          value: 0,
          enteredValue: 0,
          enteredUnit: "mm",
          textValue: null,
          inputs: { points: { "12": 0, "3": -0.002 }, unit: "mm" },
        },
        ["12", "3"],
      ),
    ).toBe("12: 0 · 3: −0.002 mm");
  });
});

describe("the report's readings per kind", () => {
  it("prints a check as Yes, a record in its own unit, and keeps both off the chart of lengths", () => {
    const check: KindStep = { ...base, derivation: "check", upperLimit: null };
    const torque: KindStep = { ...base, derivation: "record", recordUnit: "N·m", upperLimit: null };
    const row = (step: KindStep, value: number, textValue: string | null, unit: string) => ({
      title: step.derivation,
      quantityKind: "length" as const,
      lowerLimit: null,
      upperLimit: step.upperLimit,
      limitSource: "common_practice",
      pre: { value, shown: { value, enteredValue: value, enteredUnit: unit, inputs: null, textValue } },
      post: null,
      change: null,
      status: judge(step, value),
      kindStep: step,
    });
    const s = readingSection([
      row(check, 1, "yes", "yes/no"),
      row(torque, 85, null, "N·m"),
      row(base, 0.005, null, "mm"),
    ]);
    expect(s.rows.map((r) => r.pre)).toEqual(["Yes", "85 N·m", "0.005 mm"]);
    expect(s.chart.map((c) => c.step)).toEqual(["direct"]);
  });

  it("prints a multi-point step's points, before and after, under its derived value", () => {
    const entered = (points: Record<string, string>) => {
      const r = stepEntry(collar, { unit: "mm", points });
      if (!r.ok) throw new Error("the entry was refused");
      return { value: r.stored.value, shown: r.stored };
    };
    const pre = entered({ "12": "0", "3": "0.004", "6": "0.010", "9": "-0.002" });
    const post = entered({ "12": "0", "3": "0.001", "6": "0.003", "9": "0.002" });
    const [row] = readingSection([
      {
        title: "Collar run-out",
        quantityKind: "length" as const,
        lowerLimit: null,
        upperLimit: collar.upperLimit,
        limitSource: "common_practice",
        pre,
        post,
        change: post.value - pre.value,
        status: judge(collar, post.value),
        kindStep: collar,
      },
    ]).rows;
    // TIR = largest − smallest: 0.010 − (−0.002) = 0.012 before, 0.003 − 0 = 0.003 after.
    expect(row!.pre).toMatch(/^0\.012\d* mm TIR$/);
    expect(row!.points).toBe(
      "Before: 12: 0 · 3: 0.004 · 6: 0.01 · 9: −0.002 mm; After: 12: 0 · 3: 0.001 · 6: 0.003 · 9: 0.002 mm",
    );
    // A step of another kind prints no points.
    expect(
      readingSection([
        {
          ...row!,
          title: "x",
          quantityKind: "length",
          lowerLimit: null,
          upperLimit: 0.01,
          limitSource: "common_practice",
          pre,
          post: null,
          change: null,
          status: "pass",
          kindStep: base,
        },
      ]).rows[0]!.points,
    ).toBeUndefined();
  });
});
