// The dataset routes × every role and tenant, against the real database. Expected answers are
// written out by hand from the product's rules (README.md, "Who uses it"): staff see every
// job, the installer their assigned ones, a customer only their own company's; another tenant's
// record is 404, exactly like a missing one.
import { beforeAll, describe, expect, it } from "vitest";
import {
  deleteApi,
  evaluationApi,
  fileApi,
  fixture,
  listDatasetsApi,
  summaryApi,
  upload,
} from "./dataset-helpers";
import { WHO, type Who } from "./fixtures";
import { jobIdByReference, signInAs } from "./helpers";

const TEST_PART = { kind: "test_part", phase: "post", uncertainty_mm: "0.002" };

/**
 * Per role: reads of the seeded Marlow Creek dataset (TR-2026-0041) and of a Tollan dataset
 * (TR-2026-0048); upload to and delete from TR-2026-0052 (Marlow Creek, measuring, assigned to the
 * installer).
 */
const CELLS: Record<Who, { marlow: number; tollan: number; upload: number; del: number }> = {
  anonymous: { marlow: 401, tollan: 401, upload: 401, del: 401 },
  admin: { marlow: 200, tollan: 200, upload: 201, del: 200 },
  installer: { marlow: 200, tollan: 200, upload: 201, del: 200 },
  inspector: { marlow: 200, tollan: 200, upload: 201, del: 200 },
  engineer: { marlow: 200, tollan: 200, upload: 201, del: 200 },
  "customer (Marlow Creek)": { marlow: 200, tollan: 404, upload: 403, del: 403 },
  "customer (Tollan)": { marlow: 404, tollan: 200, upload: 404, del: 404 },
};
const cells = Object.entries(CELLS) as [Who, (typeof CELLS)[Who]][];

const ids: { marlowJob: string; tollanJob: string; marlow: string; tollan: string; measuring: string } = {
  marlowJob: "",
  tollanJob: "",
  marlow: "",
  tollan: "",
  measuring: "",
};

beforeAll(async () => {
  ids.marlowJob = await jobIdByReference("TR-2026-0041");
  ids.tollanJob = await jobIdByReference("TR-2026-0048");
  ids.measuring = await jobIdByReference("TR-2026-0052");
  await signInAs("admin@halvard.example");
  const seeded = (await (await listDatasetsApi(ids.marlowJob)).json()).datasets as {
    id: string;
    kind: string;
  }[];
  ids.marlow = seeded.find((d) => d.kind === "test_part")!.id;
  const res = await upload(ids.tollanJob, fixture("test-part-good.csv"), TEST_PART);
  expect(res.status).toBe(201);
  ids.tollan = (await res.json()).id;
});

describe("demo seed", () => {
  it("TR-2026-0041 carries a synthesised sphere-probe dataset (120 poses, two tool lengths) and the test-part data", async () => {
    await signInAs("engineer@halvard.example");
    const list = (await (await listDatasetsApi(ids.marlowJob)).json()).datasets as {
      id: string;
      kind: string;
      rows: number;
    }[];
    expect(list.map((d) => [d.kind, d.rows]).sort()).toEqual([
      ["sphere_probe", 120],
      ["test_part", 8],
    ]);
    const probe = (await (await summaryApi(list.find((d) => d.kind === "sphere_probe")!.id)).json()).dataset;
    expect(probe.summary.columns.tool_mm).toEqual({ unit: "mm", min: 0, max: 100 });
    expect(probe.originalFilename).toContain("synthetic demo");
  });
});

describe("dataset reads by role and tenant", () => {
  for (const [who, cell] of cells) {
    for (const tenant of ["marlow", "tollan"] as const) {
      const expected = cell[tenant];
      it(`${who}: list, summary, file and evaluation of the ${tenant} dataset → ${expected}`, async () => {
        await signInAs(WHO[who]);
        const job = tenant === "marlow" ? ids.marlowJob : ids.tollanJob;
        const id = ids[tenant];
        const answers = [
          await listDatasetsApi(job),
          await summaryApi(id),
          await fileApi(id),
          await evaluationApi(id),
        ];
        expect(answers.map((r) => r.status)).toEqual([expected, expected, expected, expected]);
        if (expected === 404) {
          expect(await answers[0]!.json()).toEqual({ error: { code: "not_found", message: "No such job." } });
          expect(await answers[1]!.json()).toEqual({
            error: { code: "not_found", message: "No such dataset." },
          });
        }
        if (expected === 200) {
          const list = (await answers[0]!.json()).datasets as { id: string }[];
          expect(list.map((d) => d.id)).toContain(id);
        }
      });
    }
  }
  it("a dataset id that does not exist, or is malformed, is 404", async () => {
    await signInAs("admin@halvard.example");
    for (const id of ["00000000-0000-4000-8000-000000000000", "nope", "../../etc/passwd"]) {
      expect((await summaryApi(id)).status).toBe(404);
      expect((await fileApi(id)).status).toBe(404);
    }
  });
});

describe("dataset writes by role and tenant", () => {
  for (const [who, cell] of cells) {
    it(`${who}: upload → ${cell.upload}, delete → ${cell.del}`, async () => {
      await signInAs(WHO[who]);
      expect(
        (
          await upload(ids.measuring, fixture("sweep-good.csv"), {
            kind: "sweep",
            phase: "pre",
            reading_units: "um",
            radius_mm: "40",
          })
        ).status,
      ).toBe(cell.upload);
      await signInAs("admin@halvard.example");
      const made = await upload(ids.measuring, fixture("tram-good.csv"), {
        kind: "tram",
        phase: "pre",
        travel_units: "mm",
        reading_units: "um",
      });
      const { id } = await made.json();
      await signInAs(WHO[who]);
      expect((await deleteApi(id)).status).toBe(cell.del);
    });
  }
});
