// The analysis routes × every role and tenant, against the real database. Expected answers are
// written out by hand from the product's rules (README.md, "Who uses it"): inspectors and
// engineers (and the office) run fits, installers upload but do not fit, a customer reads only
// their own company's records; another tenant's record is 404, exactly like a missing one.
import { beforeAll, describe, expect, it } from "vitest";
import { GET as getRoute } from "@/app/api/analyses/[id]/route";
import { fitDemoProbe, runFit as run, seededFits, TOLLAN_JOB } from "./fixtures";
import { jobIdByReference, request, signInAs } from "./helpers";

const p = (id: string) => ({ params: Promise.resolve({ id }) });
const read = (id: string) => getRoute(request(`/api/analyses/${id}`), p(id));

// POST on the seeded Marlow Creek dataset (TR-2026-0052, measuring; its fit is stored by the seed,
// so an allowed role gets 200 with the stored fit) and GET of that analysis and of a Tollan one.
const CELLS: Record<string, { email: string | null; post: number; getMarlow: number; getTollan: number }> = {
  anonymous: { email: null, post: 401, getMarlow: 401, getTollan: 401 },
  admin: { email: "admin@halvard.example", post: 200, getMarlow: 200, getTollan: 200 },
  installer: { email: "installer@halvard.example", post: 403, getMarlow: 200, getTollan: 200 },
  inspector: { email: "inspector@halvard.example", post: 200, getMarlow: 200, getTollan: 200 },
  engineer: { email: "engineer@halvard.example", post: 200, getMarlow: 200, getTollan: 200 },
  "customer (Marlow Creek)": {
    email: "buyer@marlowcreek.example",
    post: 403,
    getMarlow: 200,
    getTollan: 404,
  },
  "customer (Tollan)": { email: "buyer@tollan.example", post: 404, getMarlow: 404, getTollan: 200 },
};

const ids = { marlowDataset: "", marlowAnalysis: "", tollanDataset: "", tollanAnalysis: "" };

beforeAll(async () => {
  ids.marlowDataset = (await seededFits()).pre.datasetId;
  await signInAs("engineer@halvard.example");
  const first = await run(ids.marlowDataset);
  expect(first.status).toBe(200);
  ids.marlowAnalysis = (await first.json()).analysis.id;
  // A Tollan sphere-probe dataset on TR-2026-0048 (in review), fitted by the engineer.
  const t = await fitDemoProbe(await jobIdByReference(TOLLAN_JOB), "tollan-probe.csv");
  ids.tollanDataset = t.datasetId;
  ids.tollanAnalysis = t.analysisId;
});

describe("analysis routes by role and tenant", () => {
  for (const [who, cell] of Object.entries(CELLS)) {
    it(`${who}: POST /api/datasets/{Marlow probe}/analyses → ${cell.post}`, async () => {
      await signInAs(cell.email);
      const res = await run(ids.marlowDataset);
      expect(res.status).toBe(cell.post);
      const body = await res.json();
      if (cell.post === 200) {
        expect(body.reused).toBe(true);
        expect(body.analysis.id).toBe(ids.marlowAnalysis);
      }
      if (cell.post === 404)
        expect(body).toEqual({ error: { code: "not_found", message: "No such dataset." } });
      if (cell.post === 403) expect(body.error.code).toBe("forbidden");
    });

    it(`${who}: GET /api/analyses/{Marlow} → ${cell.getMarlow}, GET /api/analyses/{Tollan} → ${cell.getTollan}`, async () => {
      await signInAs(cell.email);
      for (const [id, expected] of [
        [ids.marlowAnalysis, cell.getMarlow],
        [ids.tollanAnalysis, cell.getTollan],
      ] as const) {
        const res = await read(id);
        expect(res.status).toBe(expected);
        const body = await res.json();
        if (expected === 200) expect(body.analysis.id).toBe(id);
        if (expected === 404)
          expect(body).toEqual({ error: { code: "not_found", message: "No such analysis." } });
      }
    });
  }

  it("a missing or malformed id is 404 on both routes", async () => {
    await signInAs("admin@halvard.example");
    for (const id of ["00000000-0000-4000-8000-000000000000", "not-a-uuid"]) {
      expect((await run(id)).status).toBe(404);
      expect((await read(id)).status).toBe(404);
    }
  });
});
