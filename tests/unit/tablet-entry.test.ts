// The tablet's pure rules: checks as a value is typed, how a server answer is treated by the
// offline queue, the wait between tries, device-made UUIDs, and the one date-time format.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cautionOf, entryProblem, resolutionDecimals } from "@/lib/checklist";
import { formatDateTime, formatDateTimeUtc } from "@/lib/format";
import {
  clearedEntry,
  entryFromQueued,
  localNow,
  parseLocal,
  readingRequestBody,
  type EntryValues,
} from "@/lib/reading-entry";
import { backoffMs, classifyAnswer, newClientId } from "@/lib/readings-sync";
import { fromCanonical } from "@/lib/units";

describe("entry checks as you type", () => {
  it("counts the decimals an instrument reads in the unit shown", () => {
    expect(resolutionDecimals(0.0001)).toBe(4); // a tenth-reading indicator in inch
    expect(resolutionDecimals(0.001)).toBe(3); // 1 µm in mm
    expect(resolutionDecimals(0.01)).toBe(2);
    // 0.001 mm shown in inch is 0.0000394 in (1 in = 25.4 mm, NIST SP 811): five decimals.
    expect(resolutionDecimals(fromCanonical(0.001, "in"))).toBe(5);
    expect(resolutionDecimals(0.2)).toBe(1); // an electronic level reading 0.2″
    expect(resolutionDecimals(1)).toBe(0);
  });

  it("flags what is not a number, and digits finer than the instrument reads", () => {
    expect(entryProblem("", 4)).toBeNull();
    expect(entryProblem("abc", 4)).toMatch(/Not a number/);
    expect(entryProblem("1.2.3", 4)).toMatch(/Not a number/);
    expect(entryProblem("0.0003", 4)).toBeNull();
    expect(entryProblem("-0,0003", 4)).toBeNull(); // a decimal comma is accepted
    expect(entryProblem(".5", 1)).toBeNull();
    expect(entryProblem("0.00031", 4, "DTI-0112")).toMatch(/More decimals than DTI-0112.*at most 4/);
  });

  it("never flags a number written with at most the allowed decimals (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: -99999, max: 99999 }), fc.integer({ min: 0, max: 5 }), (n, d) => {
        const text = (n / 10 ** d).toFixed(d);
        return entryProblem(text, d) === null && (d === 0 || entryProblem(`${text}1`, d) !== null);
      }),
    );
  });
});

describe("the offline queue's reading of server answers", () => {
  it("treats stored and already-stored as sent, 5xx/408/429 as try again, other 4xx as refused", () => {
    expect(classifyAnswer(201, null, "pass")).toEqual({ kind: "sent", decision: "pass" });
    expect(classifyAnswer(200, null, "fail").kind).toBe("sent");
    for (const s of [500, 502, 503, 504, 408, 429]) expect(classifyAnswer(s, "x").kind).toBe("retry");
    expect(classifyAnswer(401, null).kind).toBe("signed_out");
    const refused = classifyAnswer(422, "Instrument DTI-0417 was due for calibration on 2026-09-30");
    expect(refused).toEqual({
      kind: "refused",
      reason: "Instrument DTI-0417 was due for calibration on 2026-09-30",
    });
    expect(classifyAnswer(403, "The job is in review; its readings are locked.").kind).toBe("refused");
    expect(classifyAnswer(409, null).kind).toBe("refused");
  });

  it("waits 2 s doubling after each failed try, never more than a minute", () => {
    expect([1, 2, 3, 4, 5, 6, 7, 20].map(backoffMs)).toEqual([
      2000, 4000, 8000, 16000, 32000, 60000, 60000, 60000,
    ]);
  });

  it("makes RFC 9562 version-4 UUIDs on the device", () => {
    const ids = new Set(Array.from({ length: 200 }, newClientId));
    expect(ids.size).toBe(200);
    for (const id of ids)
      expect(id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
  });
});

describe("one date-time format", () => {
  const at = "2026-12-04T06:12:00Z";
  it("shows UTC with its zone, and another zone with that zone's short name, 24-hour", () => {
    expect(formatDateTimeUtc(at)).toBe("2026-12-04 06:12 UTC");
    expect(formatDateTime(at, "UTC")).toBe("2026-12-04 06:12 UTC");
    // Central European Time is UTC+1 in December (IANA tz database).
    expect(formatDateTime(at, "Europe/Berlin")).toBe("2026-12-04 07:12 GMT+1");
    // US Eastern is UTC−5 in December: the evening before, not "1:12 AM".
    expect(formatDateTime("2026-12-04T01:12:00Z", "America/New_York")).toBe("2026-12-03 20:12 GMT-5");
    expect(formatDateTime(at, "Not/AZone")).toBe("2026-12-04 06:12 UTC");
    expect(formatDateTime(null, "UTC")).toBe("—");
  });
});

describe("safety notes", () => {
  it("shows a suspended load and a running spindle in full, lock-out and jogging compact", () => {
    expect(cautionOf("The head is heavy: lift it only with rated gear").severe).toBe(true);
    expect(cautionOf("The spindle rotates and chips fly").severe).toBe(true);
    expect(cautionOf("Lock out and tag out the machine").severe).toBe(false);
    expect(cautionOf("Axes move under power while you indicate").severe).toBe(false);
  });
});

describe("the reading a save sends, and the form around it", () => {
  const values: EntryValues = {
    phase: "pre",
    value: " 0,0125 ",
    answer: "yes",
    pointValues: ["1", "2"],
    text: "torque wrench",
    travel: "150",
    instrumentId: "i-1",
    note: "after shimming",
    takenAt: "2026-12-04 09:30",
  };
  const base = {
    stepId: "s-1",
    values,
    phase: "post" as const,
    unit: "mm",
    travelUnit: "mm" as const,
    points: { "12": "1", "6": "2" },
    withInstrument: true,
    clientId: "c-1",
    supersedes: null,
    now: new Date("2026-12-04T10:00:00Z"),
  };

  it("sends only the fields the step's kind reads", () => {
    const direct = readingRequestBody({ ...base, kind: "direct" });
    expect(direct).toMatchObject({ stepId: "s-1", phase: "post", value: "0.0125", instrumentId: "i-1" });
    expect(direct).not.toHaveProperty("answer");
    expect(direct).not.toHaveProperty("travel");
    const check = readingRequestBody({ ...base, kind: "check", withInstrument: false });
    expect(check).toMatchObject({ answer: "yes" });
    expect(check).not.toHaveProperty("value");
    expect(check).not.toHaveProperty("instrumentId");
    expect(readingRequestBody({ ...base, kind: "multi_point" })).toMatchObject({ points: base.points });
    expect(readingRequestBody({ ...base, kind: "multi_point" })).not.toHaveProperty("value");
    expect(readingRequestBody({ ...base, kind: "angle_over_distance" })).toMatchObject({
      value: "0.0125",
      travel: "150",
      travelUnit: "mm",
    });
    expect(readingRequestBody({ ...base, kind: "record" })).toMatchObject({
      text: "torque wrench",
      value: "0.0125",
    });
    expect(readingRequestBody({ ...base, kind: "note" })).not.toHaveProperty("value");
  });

  it("names the reading it replaces, stored or still queued, and the times", () => {
    expect(readingRequestBody({ ...base, kind: "direct", supersedes: { id: "r-9" } })).toMatchObject({
      supersedesId: "r-9",
    });
    const queued = readingRequestBody({ ...base, kind: "direct", supersedes: { clientId: "c-0" } });
    expect(queued).toMatchObject({ supersedesClientId: "c-0" });
    expect(queued).not.toHaveProperty("supersedesId");
    expect(queued.deviceTime).toBe("2026-12-04T10:00:00.000Z");
    expect(queued.takenAt).toBe(parseLocal("2026-12-04 09:30")!.toISOString());
  });

  it("reads only whole YYYY-MM-DD HH:MM times, and writes the tablet's time in that form", () => {
    expect(parseLocal("2026-12-04 09:30")).toBeInstanceOf(Date);
    expect(parseLocal("2026-12-04T09:30")).toBeInstanceOf(Date);
    expect(parseLocal("4.12.2026 09:30")).toBeNull();
    expect(parseLocal("2026-13-40 09:30")).toBeNull();
    expect(localNow()).toMatch(/^\d{4}-\d{2}-\d{2} \d{2}:\d{2}$/);
    expect(parseLocal(localNow(new Date("2026-12-04T10:00:00Z")))!.toISOString()).toBe(
      "2026-12-04T10:00:00.000Z",
    );
  });

  it("clears what was read after a save and keeps the phase, travel and instrument", () => {
    const next = clearedEntry(values, ["12", "6"]);
    expect(next).toMatchObject({ phase: "pre", travel: "150", instrumentId: "i-1" });
    expect(next).toMatchObject({ value: "", answer: "", text: "", note: "", pointValues: ["", ""] });
  });

  it("fills the form from a queued reading, its points in the step's order", () => {
    const back = entryFromQueued(
      { stepId: "s-1", phase: "post", points: { "6": "2", "12": "1" }, answer: "maybe", note: "n" },
      ["12", "6"],
      "150",
    );
    expect(back).toMatchObject({
      phase: "post",
      pointValues: ["1", "2"],
      answer: "",
      travel: "150",
      note: "n",
    });
  });
});
