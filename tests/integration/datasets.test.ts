// Dataset uploads through the real route handlers against the real database (storage: the
// PostgreSQL driver): accepted files, every kind of bad file with its exact row/column issues,
// the size limit for declared and chunked bodies, nothing stored on rejection, byte-identical
// downloads, soft delete, column mapping, and the test-part evaluation with its CSV export.
import { createHash } from "node:crypto";
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { insertDataset } from "@/db/queries/datasets";
import { getActor } from "@/db/queries/users";
import { env } from "@/lib/env";
import { getStorage, setStorageForTests, type ObjectStorage } from "@/lib/storage";
import { parseDatasetText, parseUploadForm } from "@/lib/storage/parse-dataset";
import {
  deleteApi,
  evaluationApi,
  fileApi,
  fixture,
  listDatasetsApi,
  storedState,
  summaryApi,
  upload,
  uploadRoute,
} from "./dataset-helpers";
import { jobIdByReference, request, signInAs } from "./helpers";
import { GOOD_TEST_PART_DECISIONS, GOOD_TEST_PART_TOTALS } from "../fixtures/test-part-decisions";

const sha = (b: Uint8Array) => createHash("sha256").update(b).digest("hex");
const SPHERE = { kind: "sphere_probe", phase: "pre", units: "mm" };
const TEST_PART = { kind: "test_part", phase: "post", uncertainty_mm: "0.002" };
const TRAM = { kind: "tram", phase: "pre", travel_units: "mm", reading_units: "um" };
const SWEEP = { kind: "sweep", phase: "pre", reading_units: "um", radius_mm: "50" };

let measuring: string; // TR-2026-0052, Marlow Creek, measuring, guarded rule
let draft: string; // TR-2026-0057, Marlow Creek, draft, nobody assigned
let issued: string; // TR-2026-0041, issued
let goodId: string;

beforeAll(async () => {
  measuring = await jobIdByReference("TR-2026-0052");
  draft = await jobIdByReference("TR-2026-0057");
  issued = await jobIdByReference("TR-2026-0041");
});

describe("accepted uploads", () => {
  it("a test-part file is stored: 201 with id, kind, rows, sha256 and warnings", async () => {
    await signInAs("inspector@halvard.example");
    const bytes = fixture("test-part-good.csv");
    const res = await upload(measuring, bytes, TEST_PART, "part 7 results.csv");
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body).toEqual({
      id: expect.stringMatching(/^[0-9a-f-]{36}$/),
      kind: "test_part",
      rows: 6,
      sha256: sha(bytes),
      warnings: [],
    });
    goodId = body.id;
  });

  it("the original downloads byte-identical, with the same SHA-256, a safe name and nosniff", async () => {
    await signInAs("buyer@marlowcreek.example");
    const res = await fileApi(goodId);
    expect(res.status).toBe(200);
    const got = new Uint8Array(await res.arrayBuffer());
    expect(Buffer.compare(Buffer.from(got), fixture("test-part-good.csv"))).toBe(0);
    expect(sha(got)).toBe(sha(fixture("test-part-good.csv")));
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("content-disposition")).toBe(
      `attachment; filename="part 7 results.csv"; filename*=UTF-8''part%207%20results.csv`,
    );
  });

  it("a UTF-8 file with a BOM is accepted and stored with its BOM (the original is unchanged)", async () => {
    await signInAs("installer@halvard.example");
    const bytes = fixture("sphere-bom.csv");
    const res = await upload(measuring, bytes, SPHERE);
    expect(res.status).toBe(201);
    const { id, rows } = await res.json();
    expect(rows).toBe(3);
    const got = Buffer.from(await (await fileApi(id)).arrayBuffer());
    expect([...got.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    expect(sha(got)).toBe(sha(bytes));
  });

  it("inch coordinates are stored in mm (1 in = 25.4 mm exactly, NIST SP 811) as Float64 columns", async () => {
    await signInAs("engineer@halvard.example");
    const csv = "primary_deg,secondary_deg,x,y,z\n0,0,1,2,-0.5\n90,45,1.0001,2,-0.5\n";
    const res = await upload(measuring, Buffer.from(csv), { ...SPHERE, units: "in" });
    expect(res.status).toBe(201);
    const { id } = await res.json();
    const cols = await db.execute<{ name: string; unit: string; data: Buffer }>(
      sql`select name, unit, data from dataset_columns where dataset_id = ${id} order by name`,
    );
    const byName = Object.fromEntries(
      cols.rows.map((r) => [
        r.name,
        { unit: r.unit, v: [...new Float64Array(new Uint8Array(r.data).buffer)] },
      ]),
    );
    expect(Object.keys(byName).sort()).toEqual(["primary_deg", "secondary_deg", "x_mm", "y_mm", "z_mm"]);
    expect(byName.x_mm).toEqual({ unit: "mm", v: [25.4, 1.0001 * 25.4] });
    expect(byName.z_mm!.v).toEqual([-12.7, -12.7]);
    expect(byName.secondary_deg).toEqual({ unit: "deg", v: [0, 45] });
    const summary = await (await summaryApi(id)).json();
    expect(summary.dataset).toMatchObject({
      kind: "sphere_probe",
      phase: "pre",
      status: "stored",
      rows: 2,
      units: { units: "in" },
    });
    expect(summary.dataset.summary.columns.x_mm).toEqual({ unit: "mm", min: 25.4, max: 1.0001 * 25.4 });
  });

  it("a semicolon file with decimal commas is accepted when the decimal-comma option is chosen", async () => {
    await signInAs("inspector@halvard.example");
    const res = await upload(measuring, fixture("sphere-semicolon-decimal-comma.csv"), {
      ...SPHERE,
      decimal: "comma",
    });
    expect(res.status).toBe(201);
    expect((await res.json()).rows).toBe(2);
  });

  it("tram and sweep files are stored with their line and sweep fits in the summary", async () => {
    await signInAs("installer@halvard.example");
    const tram = await upload(measuring, fixture("tram-good.csv"), TRAM);
    expect(tram.status).toBe(201);
    const t = await (await summaryApi((await tram.json()).id)).json();
    // Least-squares slope of (0,0) (100,1.2) (200,2.3) (300,3.7): Σ(x−x̄)(y−ȳ)/Σ(x−x̄)² = 610/50000 µm/mm, by hand.
    expect(t.dataset.summary.tram.slope_um_per_m).toBeCloseTo(12.2, 10);
    const sweep = await upload(measuring, fixture("sweep-good.csv"), SWEEP);
    expect(sweep.status).toBe(201);
    const s = await (await summaryApi((await sweep.json()).id)).json();
    // a + b cosθ + c sinθ through 2, 0.5, −2, −0.5 at 0/90/180/270°: b = 2, c = 0.5 µm; tilt √(b²+c²)/r (geometry/README.md) = 2.0616 µm / 50 mm.
    expect(s.dataset.summary.sweep.tilt_um_per_m).toBeCloseTo((Math.sqrt(4.25) / 50) * 1000, 9);
    expect(s.dataset.units).toEqual({ reading_units: "um", radius_mm: 50 });
  });

  it("a column mapping renames the header for parsing only; the stored original keeps the user's header", async () => {
    await signInAs("inspector@halvard.example");
    const csv = "C angle;A angle;X;Y;Z\n0;0;1.5;2.5;3.5\n";
    const bytes = Buffer.from(csv);
    const res = await upload(measuring, bytes, { ...SPHERE, header: "primary_deg;secondary_deg;x;y;z" });
    expect(res.status).toBe(201);
    const { id } = await res.json();
    expect(Buffer.compare(Buffer.from(await (await fileApi(id)).arrayBuffer()), bytes)).toBe(0);
    const s = await (await summaryApi(id)).json();
    expect(s.dataset.options).toEqual({
      decimal: "point",
      header: "primary_deg;secondary_deg;x;y;z",
      header_replaced: "C angle;A angle;X;Y;Z",
    });
  });
});

describe("rejected uploads: exact issues, nothing stored", () => {
  const cases: Array<{ file: string; fields?: Record<string, string>; issues: unknown[] }> = [
    { file: "empty.csv", issues: [{ row: 1, message: "the file is empty; a header row is required" }] },
    {
      file: "test-part-header-only.csv",
      fields: TEST_PART,
      issues: [{ row: 1, message: "the file has a header row but no data rows" }],
    },
    {
      file: "sphere-missing-column.csv",
      issues: [
        {
          row: 1,
          column: "z",
          message: "the required column 'z' is missing (expected: primary_deg, secondary_deg, x, y, z)",
        },
      ],
    },
    {
      file: "sphere-duplicate-column.csv",
      issues: [{ row: 1, column: "x", message: "the column 'x' appears more than once in the header" }],
    },
    {
      file: "sphere-text-nan-infinity.csv",
      issues: [
        { row: 2, column: "x", message: "'abc' is not a number" },
        { row: 3, column: "x", message: "'NaN' is not a finite number" },
        { row: 4, column: "y", message: "'Infinity' is not a finite number" },
        { row: 5, column: "z", message: "'-inf' is not a finite number" },
      ],
    },
    {
      file: "sphere-ragged.csv",
      issues: [
        { row: 3, message: "has 4 fields, the header has 5" },
        {
          row: 4,
          message:
            "has 6 fields, the header has 5; a decimal comma in a comma-separated file splits a number in two — use a decimal point",
        },
      ],
    },
    {
      file: "sphere-decimal-comma-in-comma-file.csv",
      issues: [
        {
          row: 2,
          message:
            "has 6 fields, the header has 5; a decimal comma in a comma-separated file splits a number in two — use a decimal point",
        },
      ],
    },
    {
      // Semicolons with decimal commas, but the decimal-comma option not chosen.
      file: "sphere-semicolon-decimal-comma.csv",
      issues: [
        {
          row: 2,
          column: "x",
          message:
            "'100,001' uses a decimal comma; write a decimal point (100.001) or choose the decimal-comma option for this semicolon-separated file",
        },
        {
          row: 2,
          column: "y",
          message:
            "'200,002' uses a decimal comma; write a decimal point (200.002) or choose the decimal-comma option for this semicolon-separated file",
        },
        {
          row: 2,
          column: "z",
          message:
            "'50,000' uses a decimal comma; write a decimal point (50.000) or choose the decimal-comma option for this semicolon-separated file",
        },
        {
          row: 3,
          column: "x",
          message:
            "'100,0012' uses a decimal comma; write a decimal point (100.0012) or choose the decimal-comma option for this semicolon-separated file",
        },
        {
          row: 3,
          column: "y",
          message:
            "'200,0018' uses a decimal comma; write a decimal point (200.0018) or choose the decimal-comma option for this semicolon-separated file",
        },
        {
          row: 3,
          column: "z",
          message:
            "'50,0003' uses a decimal comma; write a decimal point (50.0003) or choose the decimal-comma option for this semicolon-separated file",
        },
      ],
    },
    {
      file: "test-part-unclosed-quote.csv",
      fields: TEST_PART,
      issues: [{ row: 2, column: "characteristic", message: "a quote opens here and is never closed" }],
    },
  ];

  for (const c of cases) {
    it(`${c.file} → 422 naming row and column; earlier datasets and objects intact`, async () => {
      await signInAs("inspector@halvard.example");
      const before = await storedState();
      const res = await upload(measuring, fixture(c.file), c.fields ?? SPHERE);
      expect(res.status).toBe(422);
      const body = await res.json();
      expect(body.error.code).toBe("invalid_csv");
      expect(typeof body.error.message).toBe("string");
      expect(body.error.issues).toEqual(c.issues);
      expect(await storedState()).toEqual(before);
      // The first dataset still downloads, unchanged.
      const again = Buffer.from(await (await fileApi(goodId)).arrayBuffer());
      expect(sha(again)).toBe(sha(fixture("test-part-good.csv")));
    });
  }

  it("bytes that are not UTF-8 → 422 naming the row of the first bad byte", async () => {
    await signInAs("inspector@halvard.example");
    const bytes = Buffer.concat([
      Buffer.from("primary_deg,secondary_deg,x,y,z\n0,0,1,2,3\n0,0,"),
      Buffer.from([0xff, 0xfe]),
      Buffer.from(",2,3\n"),
    ]);
    const res = await upload(measuring, bytes, SPHERE);
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues).toEqual([
      { row: 3, message: "the file is not valid UTF-8 text; save it as CSV UTF-8" },
    ]);
  });

  it("missing or wrong form fields → 422 naming the field, nothing stored", async () => {
    await signInAs("inspector@halvard.example");
    const before = await storedState();
    const bytes = fixture("sphere-bom.csv");
    const noUnits = await upload(measuring, bytes, { kind: "sphere_probe", phase: "pre" });
    expect(noUnits.status).toBe(422);
    expect((await noUnits.json()).error.issues).toEqual([
      { field: "units", message: "choose mm or in for the x, y, z columns" },
    ]);
    const badKind = await upload(measuring, bytes, { kind: "photo", phase: "during" });
    expect((await badKind.json()).error.issues).toEqual([
      {
        field: "kind",
        message: "kind must be sphere_probe, tram, sweep, test_part, tcp_check or rotary_positioning",
      },
      { field: "phase", message: "phase must be pre or post" },
    ]);
    const noRadius = await upload(measuring, fixture("sweep-good.csv"), { ...SWEEP, radius_mm: "-3" });
    expect((await noRadius.json()).error.issues).toEqual([
      { field: "radius_mm", message: "the sweep radius must be above 0 mm" },
    ]);
    const noFile = await upload(measuring, null, SPHERE);
    expect(noFile.status).toBe(422);
    expect((await noFile.json()).error.issues).toEqual([{ field: "file", message: "no file was sent" }]);
    const notMultipart = await uploadRoute(
      request(`/api/jobs/${measuring}/datasets`, {
        method: "POST",
        body: "x,y\n1,2\n",
        headers: { "content-type": "text/csv" },
      }),
      {
        params: Promise.resolve({ id: measuring }),
      },
    );
    expect(notMultipart.status).toBe(422);
    expect(await storedState()).toEqual(before);
  });
});

describe("a failure after the object is stored", () => {
  it("removes the object again when the database transaction fails", async () => {
    const inner = getStorage();
    const calls: string[] = [];
    const recording: ObjectStorage = {
      driver: inner.driver,
      put: async (k, d, m) => {
        calls.push(`put ${k}`);
        await inner.put(k, d, m);
      },
      get: (k) => inner.get(k),
      delete: async (k) => {
        calls.push(`delete ${k}`);
        await inner.delete(k);
      },
    };
    setStorageForTests(recording);
    try {
      const before = await storedState();
      const actorId = await signInAs("inspector@halvard.example");
      const actor = (await getActor(actorId!))!;
      const form = parseUploadForm(TEST_PART);
      const text = fixture("test-part-good.csv").toString("utf8");
      // A job id that does not exist: the dataset row's foreign key fails inside the transaction.
      const missingJob = "00000000-0000-4000-8000-000000000000";
      const file = {
        filename: "x.csv",
        contentType: "text/csv",
        data: Buffer.from(text),
        sha256: sha(Buffer.from(text)),
      };
      await expect(
        insertDataset(actor, missingJob, form, file, parseDatasetText(form, text)),
      ).rejects.toThrow();
      expect(calls).toHaveLength(2);
      expect(calls[0]).toMatch(new RegExp(`^put datasets/${missingJob}/[0-9a-f-]{36}$`));
      expect(calls[1]).toBe(calls[0]!.replace("put", "delete"));
      expect(await storedState()).toEqual(before);
    } finally {
      setStorageForTests(null);
    }
  });
});

describe("size limit", () => {
  it("a declared Content-Length over the limit is 413 before any of the body is read", async () => {
    await signInAs("inspector@halvard.example");
    let pulls = 0;
    const body = new ReadableStream<Uint8Array>(
      {
        pull(c) {
          pulls++;
          c.enqueue(new Uint8Array(1024));
        },
      },
      { highWaterMark: 0 },
    );
    const req = new Request(`http://localhost/api/jobs/${measuring}/datasets`, {
      method: "POST",
      body,
      headers: {
        "content-type": "multipart/form-data; boundary=xyz",
        "content-length": String(env.UPLOAD_MAX_BYTES + 1),
      },
      duplex: "half",
    } as RequestInit);
    const res = await uploadRoute(req, { params: Promise.resolve({ id: measuring }) });
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe("too_large");
    expect(pulls).toBe(0);
  });

  it("a chunked body is cut off with 413 as soon as it passes the limit", async () => {
    await signInAs("inspector@halvard.example");
    const before = await storedState();
    const chunk = 1024 * 1024;
    let sent = 0;
    const head = new TextEncoder().encode(
      '--xyz\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\nContent-Type: text/csv\r\n\r\nprimary_deg,secondary_deg,x,y,z\n',
    );
    const body = new ReadableStream<Uint8Array>(
      {
        pull(c) {
          const part = sent === 0 ? head : new TextEncoder().encode("0,0,1,2,3\n".repeat(chunk / 10));
          sent += part.byteLength;
          c.enqueue(part);
        },
      },
      { highWaterMark: 0 },
    );
    const req = new Request(`http://localhost/api/jobs/${measuring}/datasets`, {
      method: "POST",
      body,
      headers: { "content-type": "multipart/form-data; boundary=xyz" },
      duplex: "half",
    } as RequestInit);
    const res = await uploadRoute(req, { params: Promise.resolve({ id: measuring }) });
    expect(res.status).toBe(413);
    // Read no further than one chunk past the limit (the stream itself never ends).
    expect(sent).toBeGreaterThan(env.UPLOAD_MAX_BYTES);
    expect(sent).toBeLessThanOrEqual(env.UPLOAD_MAX_BYTES + chunk + head.byteLength);
    expect(await storedState()).toEqual(before);
  });

  it("a file over the limit, sent whole, is refused and stores nothing", async () => {
    await signInAs("inspector@halvard.example");
    const before = await storedState();
    const big = Buffer.alloc(env.UPLOAD_MAX_BYTES + 10, "0,0,1,2,3\n");
    const res = await upload(measuring, big, SPHERE);
    expect(res.status).toBe(413);
    expect(await storedState()).toEqual(before);
  });
});

describe("who may upload and delete", () => {
  it("anonymous → 401; a customer of the job's own company → 403; another tenant's customer → 404", async () => {
    const bytes = fixture("test-part-good.csv");
    await signInAs(null);
    expect((await upload(measuring, bytes, TEST_PART)).status).toBe(401);
    await signInAs("buyer@marlowcreek.example");
    expect((await upload(measuring, bytes, TEST_PART)).status).toBe(403);
    await signInAs("buyer@tollan.example");
    const res = await upload(measuring, bytes, TEST_PART);
    expect(res.status).toBe(404);
    expect(await res.json()).toEqual({ error: { code: "not_found", message: "No such job." } });
  });

  it("an installer may upload only to jobs assigned to them (others are 404)", async () => {
    await signInAs("installer@halvard.example");
    expect((await upload(draft, fixture("test-part-good.csv"), TEST_PART)).status).toBe(404);
    await signInAs("admin@halvard.example");
    expect((await upload(draft, fixture("test-part-good.csv"), TEST_PART)).status).toBe(201);
  });

  it("an issued job takes no more data (409)", async () => {
    await signInAs("inspector@halvard.example");
    const res = await upload(issued, fixture("test-part-good.csv"), TEST_PART);
    expect(res.status).toBe(409);
    expect((await res.json()).error.code).toBe("job_closed");
  });

  it("delete is a soft delete, audited, while the job is measuring; refused after review and for customers", async () => {
    await signInAs("inspector@halvard.example");
    const res = await upload(measuring, fixture("tram-good.csv"), {
      ...TRAM,
      phase: "post",
      travel_units: "in",
      reading_units: "in",
    });
    const { id } = await res.json();
    await signInAs("buyer@marlowcreek.example");
    expect((await deleteApi(id)).status).toBe(403);
    await signInAs("buyer@tollan.example");
    expect((await deleteApi(id)).status).toBe(404);
    await signInAs("installer@halvard.example");
    const del = await deleteApi(id);
    expect(del.status).toBe(200);
    expect((await del.json()).status).toBe("deleted");
    expect((await deleteApi(id)).status).toBe(409);
    const audit = await db.execute<{ action: string }>(
      sql`select action from audit_events where entity_id = ${id} order by id`,
    );
    expect(audit.rows.map((r) => r.action)).toEqual(["dataset.uploaded", "dataset.deleted"]);
    // Still listed, marked deleted; the original is kept.
    const list = await (await listDatasetsApi(measuring)).json();
    expect(list.datasets.find((d: { id: string }) => d.id === id)).toMatchObject({
      status: "deleted",
      kind: "tram",
      phase: "post",
      uploaderName: "Ines Okafor",
    });
    expect((await fileApi(id)).status).toBe(200);
    // The issued job's seeded dataset cannot be deleted.
    await signInAs("admin@halvard.example");
    const seeded = (await (await listDatasetsApi(issued)).json()).datasets[0];
    const refused = await deleteApi(seeded.id);
    expect(refused.status).toBe(409);
    expect((await refused.json()).error.code).toBe("job_closed");
  });
});

describe("test-part evaluation", () => {
  it("judges each feature under the job's guarded rule (ISO 14253-1), with totals", async () => {
    await signInAs("inspector@halvard.example");
    const res = await evaluationApi(goodId);
    expect(res.status).toBe(200);
    const ev = await res.json();
    expect(ev.rule).toBe("guarded");
    // Worked by hand from ISO 14253-1 guarded acceptance with U = 0.002 mm (the working is beside the values).
    expect(ev.rows.map((r: { feature: string; decision: string }) => [r.feature, r.decision])).toEqual(
      GOOD_TEST_PART_DECISIONS,
    );
    expect(ev.totals).toEqual(GOOD_TEST_PART_TOTALS);
    expect(ev.rows[1]).toMatchObject({
      nominal: 20,
      measured: 20.0085,
      lower_limit: 19.995,
      upper_limit: 20.005,
      U: 0.002,
      unit: "mm",
    });
    expect(ev.rows[1].deviation).toBeCloseTo(0.0085, 12);
    expect(ev.rows[2].lower_limit).toBeNull();
  });

  it("the CSV export neutralises cells that a spreadsheet would run as a formula", async () => {
    await signInAs("inspector@halvard.example");
    const csv =
      'feature,characteristic,nominal,measured,lower_tol,upper_tol\n=HYPERLINK("http://x"),+diameter,1,1,-0.1,0.1\n@SUM(A1),-width,2,2,-0.1,0.1\n';
    const up = await upload(measuring, Buffer.from(csv), TEST_PART);
    expect(up.status).toBe(201);
    const res = await evaluationApi((await up.json()).id, "?format=csv");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    const lines = (await res.text()).split("\r\n");
    expect(lines[0]).toBe(
      "feature,characteristic,unit,nominal,measured,deviation,lower_limit,upper_limit,U_k2,decision,decision_rule,source_row",
    );
    expect(lines[1]).toBe(`"'=HYPERLINK(""http://x"")",'+diameter,mm,1,1,0,0.9,1.1,0.002,pass,guarded,2`);
    expect(lines[2]).toBe("'@SUM(A1),'-width,mm,2,2,0,1.9,2.1,0.002,pass,guarded,3");
  });

  it("a dataset of another kind has no feature evaluation (422)", async () => {
    await signInAs("inspector@halvard.example");
    const list = (await (await listDatasetsApi(measuring)).json()).datasets as { id: string; kind: string }[];
    const sphere = list.find((d) => d.kind === "sphere_probe")!;
    expect((await evaluationApi(sphere.id)).status).toBe(422);
  });
});
