// The saved-view and head-history routes × every role and tenant, against the real database.
// Expected answers are written out by hand from the product's rules (README.md, "Who uses
// it"): engineers save views of a fit; anyone who may see the job reads them (installers only
// their assigned jobs, customers only their own company's); the head history is read by the office
// and engineers (who keep and read the heads register), by installers and inspectors for the heads
// on jobs they may see (the installer is assigned jobs on both heads; inspectors see every job),
// and by a customer through their own jobs on the head; another tenant's record is 404, exactly
// like a missing one.
import { eq } from "drizzle-orm";
import { PNG } from "pngjs";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as listRoute, POST as saveRoute } from "@/app/api/analyses/[id]/views/route";
import { GET as imageRoute } from "@/app/api/analysis-views/[id]/image/route";
import { GET as historyRoute } from "@/app/api/heads/[id]/history/route";
import { db } from "@/db";
import { heads } from "@/db/schema";
import { fitDemoProbe, seededFits, TOLLAN_JOB, WHO, type Who } from "./fixtures";
import { formPost, jobIdByReference, request, signInAs } from "./helpers";

const p = (id: string) => ({ params: Promise.resolve({ id }) });
const png = () => PNG.sync.write(new PNG({ width: 12, height: 8 }));
function save(analysisId: string) {
  const file = { bytes: png(), type: "image/png", name: "view.png" };
  return saveRoute(formPost(`/api/analyses/${analysisId}/views`, { factor: "300" }, file), p(analysisId));
}
const list = (id: string) => listRoute(request(`/api/analyses/${id}/views`), p(id));
const image = (id: string) => imageRoute(request(`/api/analysis-views/${id}/image`), p(id));
const history = (id: string) => historyRoute(request(`/api/heads/${id}/history`), p(id));

/**
 * Per role: [POST views of the Marlow fit, GET its views, GET a Marlow view's image, GET a Tollan
 * view's image, GET history of TH-2241 (Marlow's head), GET history of TH-1907 (Tollan's head)].
 */
const CELLS: Record<Who, [number, number, number, number, number, number]> = {
  anonymous: [401, 401, 401, 401, 401, 401],
  admin: [403, 200, 200, 200, 200, 200],
  // The installer is assigned to TR-2026-0052 (Marlow) and TR-2026-0048 (Tollan).
  installer: [403, 200, 200, 200, 200, 200],
  inspector: [403, 200, 200, 200, 200, 200],
  engineer: [201, 200, 200, 200, 200, 200],
  "customer (Marlow Creek)": [403, 200, 200, 404, 200, 404],
  "customer (Tollan)": [404, 404, 404, 200, 404, 200],
};

const ids = { marlowAnalysis: "", marlowView: "", tollanView: "", marlowHead: "", tollanHead: "" };

beforeAll(async () => {
  ids.marlowAnalysis = (await seededFits()).pre.analysisId;
  await signInAs("engineer@halvard.example");
  const m = await save(ids.marlowAnalysis);
  expect(m.status).toBe(201);
  ids.marlowView = (await m.json()).view.id;
  const t = await save(
    (await fitDemoProbe(await jobIdByReference(TOLLAN_JOB), "tollan-matrix.csv")).analysisId,
  );
  expect(t.status).toBe(201);
  ids.tollanView = (await t.json()).view.id;
  ids.marlowHead = (await db.select({ id: heads.id }).from(heads).where(eq(heads.serial, "TH-2241")))[0]!.id;
  ids.tollanHead = (await db.select({ id: heads.id }).from(heads).where(eq(heads.serial, "TH-1907")))[0]!.id;
});

describe("saved views and head history by role and tenant", () => {
  for (const who of Object.keys(CELLS) as Who[]) {
    const [saveView, listMarlow, imageMarlow, imageTollan, historyMarlowHead, historyTollanHead] = CELLS[who];
    const cell = {
      save: saveView,
      listMarlow,
      imageMarlow,
      imageTollan,
      historyMarlowHead,
      historyTollanHead,
    };
    it(`${who}: POST views → ${cell.save}; GET views → ${cell.listMarlow}; images Marlow ${cell.imageMarlow}, Tollan ${cell.imageTollan}`, async () => {
      await signInAs(WHO[who]);
      const s = await save(ids.marlowAnalysis);
      expect(s.status).toBe(cell.save);
      if (cell.save === 404)
        expect(await s.json()).toEqual({ error: { code: "not_found", message: "No such analysis." } });
      if (cell.save === 403) expect((await s.json()).error.code).toBe("forbidden");
      const l = await list(ids.marlowAnalysis);
      expect(l.status).toBe(cell.listMarlow);
      if (cell.listMarlow === 200)
        expect((await l.json()).views.map((v: { id: string }) => v.id)).toContain(ids.marlowView);
      for (const [id, expected] of [
        [ids.marlowView, cell.imageMarlow],
        [ids.tollanView, cell.imageTollan],
      ] as const) {
        const res = await image(id);
        expect(res.status).toBe(expected);
        if (expected === 200) expect(res.headers.get("content-type")).toBe("image/png");
        if (expected === 404)
          expect(await res.json()).toEqual({ error: { code: "not_found", message: "No such view." } });
      }
    });

    it(`${who}: GET /api/heads/{TH-2241}/history → ${cell.historyMarlowHead}, {TH-1907} → ${cell.historyTollanHead}`, async () => {
      await signInAs(WHO[who]);
      for (const [id, expected, customer] of [
        [ids.marlowHead, cell.historyMarlowHead, "marlow"],
        [ids.tollanHead, cell.historyTollanHead, "tollan"],
      ] as const) {
        const res = await history(id);
        expect(res.status).toBe(expected);
        const body = await res.json();
        if (expected === 200) {
          expect(body.head.id).toBe(id);
          const refs = body.jobs.map((j: { reference: string }) => j.reference);
          if (customer === "marlow")
            expect(refs).toEqual(expect.arrayContaining(["TR-2026-0041", "TR-2026-0052", "TR-2026-0057"]));
          else expect(refs).toContain("TR-2026-0048");
          expect(refs).not.toContain(customer === "marlow" ? "TR-2026-0048" : "TR-2026-0041");
        }
        if (expected === 404)
          expect(body).toEqual({ error: { code: "not_found", message: "No such head." } });
      }
    });
  }

  it("a malformed or unknown head id is 404", async () => {
    await signInAs("engineer@halvard.example");
    for (const id of ["00000000-0000-4000-8000-000000000000", "not-a-uuid"])
      expect((await history(id)).status).toBe(404);
  });
});
