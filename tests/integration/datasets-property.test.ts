// Property (fast-check): whatever bytes are posted as the file, the upload route answers either
// 201 with a dataset whose stored columns are all finite numbers, or 422 whose every issue names
// a row or a column — never a 500. Runs bounded so the suite stays fast.
import fc from "fast-check";
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { upload } from "./dataset-helpers";
import { jobIdByReference, signInAs } from "./helpers";

const FORMS: Record<string, Record<string, string>> = {
  sphere_probe: { kind: "sphere_probe", phase: "pre", units: "in" },
  tram: { kind: "tram", phase: "pre", travel_units: "in", reading_units: "mm" },
  sweep: { kind: "sweep", phase: "post", reading_units: "in", radius_mm: "25" },
  test_part: { kind: "test_part", phase: "post" },
};
const HEADERS: Record<string, string[]> = {
  sphere_probe: ["primary_deg", "secondary_deg", "x", "y", "z", "tool_mm", "point"],
  tram: ["travel", "reading", "note"],
  sweep: ["angle_deg", "reading"],
  test_part: ["feature", "characteristic", "nominal", "measured", "lower_tol", "upper_tol", "unit"],
};

const token = fc.oneof(
  fc.double({ noNaN: false }).map(String),
  fc.integer().map(String),
  fc.constantFrom(
    "",
    " ",
    "NaN",
    "Infinity",
    "-0",
    "1e309",
    "1,5",
    '"',
    '""',
    "mm",
    "um",
    "µm",
    "in",
    "deg",
    "x",
    "\t3",
    "1e-400",
    "0x10",
    "=1+1",
  ),
  fc.string({ maxLength: 6 }),
);

/** CSV-like text: a (maybe shuffled, maybe short) header of the kind's columns and rows of random tokens. */
const csvLike = (kind: string) =>
  fc
    .record({
      header: fc.shuffledSubarray(HEADERS[kind]!, { minLength: 0 }),
      rows: fc.array(fc.array(token, { minLength: 0, maxLength: 8 }), { maxLength: 6 }),
      sep: fc.constantFrom(",", ";"),
      eol: fc.constantFrom("\n", "\r\n", "\r"),
      bom: fc.boolean(),
    })
    .map(({ header, rows, sep, eol, bom }) =>
      Buffer.from(
        `${bom ? "\uFEFF" : ""}${[header.join(sep), ...rows.map((r) => r.join(sep))].join(eol)}`,
        "utf8",
      ),
    );

const TEXT_COLUMNS = new Set(["feature", "characteristic", "note", "unit"]);
/** Nearly valid files: every column of the kind, numbers mostly finite, now and then a bad token. */
const nearlyValid = (kind: string) =>
  fc
    .shuffledSubarray(HEADERS[kind]!, { minLength: HEADERS[kind]!.length })
    .chain((header) =>
      fc
        .array(
          fc.tuple(
            ...header.map((h) =>
              h === "unit"
                ? fc.constantFrom("mm", "in", "um", "", "deg")
                : TEXT_COLUMNS.has(h)
                  ? fc.constantFrom("Bore A", "face", "x")
                  : fc.oneof(
                      { arbitrary: fc.double({ min: -1e6, max: 1e6, noNaN: true }).map(String), weight: 12 },
                      { arbitrary: token, weight: 1 },
                    ),
            ),
          ),
          { minLength: 1, maxLength: 6 },
        )
        .map((rows) =>
          Buffer.from([header.join(","), ...rows.map((r) => r.join(","))].join("\n") + "\n", "utf8"),
        ),
    );

const input = fc.constantFrom(...Object.keys(FORMS)).chain((kind) =>
  fc.record({
    kind: fc.constant(kind),
    bytes: fc.oneof(
      fc.uint8Array({ maxLength: 200 }).map((a) => Buffer.from(a)),
      csvLike(kind),
      nearlyValid(kind),
    ),
  }),
);

let jobId: string;
beforeAll(async () => {
  jobId = await jobIdByReference("TR-2026-0052");
  await signInAs("inspector@halvard.example");
});

describe("any byte string as an upload", () => {
  it("is stored with finite columns (201) or refused with issues naming a row or column (422), never a 500", async () => {
    let accepted = 0;
    let refused = 0;
    await fc.assert(
      fc.asyncProperty(input, async ({ kind, bytes }) => {
        const res = await upload(jobId, bytes, FORMS[kind]!);
        const body = await res.json();
        expect([201, 422]).toContain(res.status);
        if (res.status === 201) {
          accepted++;
          const cols = await db.execute<{ data: Buffer }>(
            sql`select data from dataset_columns where dataset_id = ${body.id}`,
          );
          for (const c of cols.rows) {
            const buf = Buffer.from(c.data);
            for (let i = 0; i < buf.length; i += 8) expect(Number.isFinite(buf.readDoubleLE(i))).toBe(true);
          }
        } else {
          refused++;
          expect(body.error.issues.length).toBeGreaterThan(0);
          for (const issue of body.error.issues)
            expect(typeof issue.row === "number" || typeof issue.column === "string").toBe(true);
        }
      }),
      { numRuns: 150, seed: 20261202 },
    );
    // Both branches are exercised, so the property cannot pass vacuously.
    expect(accepted).toBeGreaterThan(0);
    expect(refused).toBeGreaterThan(0);
  });
});
