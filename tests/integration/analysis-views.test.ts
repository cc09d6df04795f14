// Saved views of the 3D view (POST/GET /api/analyses/{id}/views, GET /api/analysis-views/{id}/image,
// db/queries/analysis-views.latestJobView) against the real database: a PNG made by pngjs (an
// independent encoder) is stored and read back byte for byte; a non-PNG is 422; a picture over the
// 4 MiB cap is 413; only engineers save (403); another tenant's view is 404; each save is audited
// in the hash chain; the row cannot be changed afterwards (migration 0006).
import { createHash } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { PNG } from "pngjs";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as listRoute, POST as saveRoute } from "@/app/api/analyses/[id]/views/route";
import { GET as imageRoute } from "@/app/api/analysis-views/[id]/image/route";
import { db } from "@/db";
import { approveAnalysis } from "@/db/queries/analyses";
import { latestJobView, VIEW_MAX_BYTES } from "@/db/queries/analysis-views";
import { verifyAuditChain } from "@/db/queries/audit";
import { analysisViews, jobs } from "@/db/schema";
import {
  BASE_JOB,
  insertTestJob,
  signInActor,
  auditEventsOf,
  fitDemoProbe,
  seededFits,
  TOLLAN_JOB,
} from "./fixtures";
import { formPost, jobIdByReference, request, signInAs } from "./helpers";

const p = (id: string) => ({ params: Promise.resolve({ id }) });

function pngOf(width: number, height: number, seed = 1): Buffer {
  const img = new PNG({ width, height });
  for (let i = 0; i < img.data.length; i++) img.data[i] = (i * 31 + seed * 7) & 0xff;
  return PNG.sync.write(img);
}

/** POST /api/analyses/{id}/views: these fields and, when given, the picture sent as view.png (image/png). */
const save = (analysisId: string, file: Buffer | null, fields: Record<string, string>) => {
  const picture = file && { bytes: file, type: "image/png", name: "view.png" };
  return saveRoute(formPost(`/api/analyses/${analysisId}/views`, fields, picture), p(analysisId));
};
const image = (viewId: string) => imageRoute(request(`/api/analysis-views/${viewId}/image`), p(viewId));
const list = (analysisId: string) => listRoute(request(`/api/analyses/${analysisId}/views`), p(analysisId));

const ids = { job: "", pre: "", post: "", tollanAnalysis: "" };

beforeAll(async () => {
  // The seeded before/after fits of TR-2026-0052 (Marlow Creek, measuring).
  ids.job = await jobIdByReference(BASE_JOB);
  const fits = await seededFits();
  ids.pre = fits.pre.analysisId;
  ids.post = fits.post.analysisId;
  // A Tollan fit on TR-2026-0048 (in review).
  ids.tollanAnalysis = (
    await fitDemoProbe(await jobIdByReference(TOLLAN_JOB), "tollan-views.csv")
  ).analysisId;
});

describe("saving a view of the 3D view", () => {
  it("an engineer stores a PNG; the image route returns it byte-identical as image/png with nosniff", async () => {
    await signInAs("engineer@halvard.example");
    const png = pngOf(480, 320);
    const res = await save(ids.post, png, {
      factor: "300",
      overlayAnalysisId: ids.pre,
      caption: "  Before and after shimming  ",
    });
    expect(res.status).toBe(201);
    const { view } = await res.json();
    expect(view).toMatchObject({
      analysisId: ids.post,
      overlayAnalysisId: ids.pre,
      widthPx: 480,
      heightPx: 320,
      factor: 300,
      caption: "Before and after shimming",
      sizeBytes: png.length,
      createdByName: "Emil Haraldsen",
    });
    expect(view.sha256).toBe(createHash("sha256").update(png).digest("hex"));

    const img = await image(view.id);
    expect(img.status).toBe(200);
    expect(img.headers.get("content-type")).toBe("image/png");
    expect(img.headers.get("x-content-type-options")).toBe("nosniff");
    const back = Buffer.from(await img.arrayBuffer());
    expect(back.equals(png)).toBe(true);
    // pngjs decodes what came back to the same size.
    expect(PNG.sync.read(back).width).toBe(480);

    // The key is the server's own: views/<job id>/<uuid>, nothing from the request.
    const [row] = await db.select().from(analysisViews).where(eq(analysisViews.id, view.id));
    expect(row!.storageKey).toMatch(new RegExp(`^views/${ids.job}/[0-9a-f-]{36}$`));
    // Audited in the same chain, and the chain still verifies.
    const [ev] = await auditEventsOf({ entityId: view.id }, "analysis_view.saved");
    expect(ev).toMatchObject({
      jobId: ids.job,
      entityType: "analysis_view",
      actorEmail: "engineer@halvard.example",
    });
    expect((ev!.newValues as { sha256: string }).sha256).toBe(view.sha256);
    expect((await verifyAuditChain(db)).firstBrokenId).toBeNull();

    // Listed for anyone who may see the job, newest first.
    await signInAs("buyer@marlowcreek.example");
    const l = await list(ids.post);
    expect(l.status).toBe(200);
    expect((await l.json()).views[0]).toMatchObject({
      id: view.id,
      imageUrl: `/api/analysis-views/${view.id}/image`,
    });
    expect((await image(view.id)).status).toBe(200);
  });

  it("a saved view cannot be changed or deleted afterwards (the table refuses it)", async () => {
    const [row] = await db.select().from(analysisViews).limit(1);
    await expect(
      db.execute(sql`update analysis_views set factor = 1 where id = ${row!.id}`),
    ).rejects.toThrow();
    await expect(db.execute(sql`delete from analysis_views where id = ${row!.id}`)).rejects.toThrow();
  });

  it("a file that is not a PNG is 422 naming the field, and nothing is stored", async () => {
    await signInAs("engineer@halvard.example");
    const before = await db.select({ n: sql<number>`count(*)::int` }).from(analysisViews);
    const objects = await db.execute<{ n: number }>(sql`select count(*)::int as n from storage_objects`);
    for (const bad of [
      Buffer.from("GIF89a not a png at all"),
      Buffer.from("<svg xmlns='http://www.w3.org/2000/svg'/>"),
      pngOf(10, 10).subarray(0, 20),
    ]) {
      const res = await save(ids.post, bad, { factor: "300" });
      expect(res.status).toBe(422);
      const body = await res.json();
      expect(body.error.issues[0].field).toBe("file");
    }
    const noFile = await save(ids.post, null, { factor: "300" });
    expect(noFile.status).toBe(422);
    expect((await noFile.json()).error.issues[0].field).toBe("file");
    // Bad fields are 422 naming them.
    const badFactor = await save(ids.post, pngOf(8, 8), { factor: "lots" });
    expect(badFactor.status).toBe(422);
    expect((await badFactor.json()).error.issues[0].field).toBe("factor");
    const zero = await save(ids.post, pngOf(8, 8), { factor: "0" });
    expect(zero.status).toBe(422);
    const foreign = await save(ids.post, pngOf(8, 8), {
      factor: "300",
      overlayAnalysisId: ids.tollanAnalysis,
    });
    expect(foreign.status).toBe(422);
    expect((await foreign.json()).error.issues[0].field).toBe("overlayAnalysisId");
    expect(await db.select({ n: sql<number>`count(*)::int` }).from(analysisViews)).toEqual(before);
    expect(
      (await db.execute<{ n: number }>(sql`select count(*)::int as n from storage_objects`)).rows,
    ).toEqual(objects.rows);
  });

  it("a picture over the 4 MiB cap is 413", async () => {
    await signInAs("engineer@halvard.example");
    // A valid PNG header followed by filler: over the cap by one byte.
    const head = pngOf(4, 4);
    const big = Buffer.concat([head, Buffer.alloc(VIEW_MAX_BYTES + 1 - head.length, 0x41)]);
    const res = await save(ids.post, big, { factor: "300" });
    expect(res.status).toBe(413);
    expect((await res.json()).error.code).toBe("too_large");
    // Far over: refused from the declared length.
    const huge = Buffer.concat([head, Buffer.alloc(VIEW_MAX_BYTES + 200_000)]);
    expect((await save(ids.post, huge, { factor: "300" })).status).toBe(413);
  });

  it("only an application engineer saves: every other role is 403, anonymous 401, another tenant 404", async () => {
    for (const [email, expected] of [
      [null, 401],
      ["admin@halvard.example", 403],
      ["installer@halvard.example", 403],
      ["inspector@halvard.example", 403],
      ["buyer@marlowcreek.example", 403],
      ["buyer@tollan.example", 404],
    ] as const) {
      await signInAs(email);
      const res = await save(ids.post, pngOf(8, 8), { factor: "300" });
      expect(res.status, String(email)).toBe(expected);
    }
  });

  it("another tenant's customer gets 404 for the list and the image, exactly like a missing view", async () => {
    await signInAs("engineer@halvard.example");
    const res = await save(ids.tollanAnalysis, pngOf(16, 9), { factor: "1000" });
    expect(res.status).toBe(201);
    const tollanView = (await res.json()).view.id as string;
    const marlowView = (await (await list(ids.post)).json()).views[0].id as string;
    await signInAs("buyer@tollan.example");
    expect((await image(tollanView)).status).toBe(200);
    const hidden = await image(marlowView);
    expect(hidden.status).toBe(404);
    expect(await hidden.json()).toEqual({ error: { code: "not_found", message: "No such view." } });
    expect((await image("00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await image("not-a-uuid")).status).toBe(404);
    expect((await list(ids.post)).status).toBe(404);
    await signInAs("buyer@marlowcreek.example");
    expect((await image(tollanView)).status).toBe(404);
  });
});

describe("latestJobView (for the report)", () => {
  it("is null until a fit is approved, then the latest view of the approved fit with its bytes", async () => {
    // A job of its own on the same head, so the seeded jobs keep their states.
    const [t] = await db.select().from(jobs).where(eq(jobs.id, ids.job));
    const jobId = await insertTestJob({
      tag: "VIEW",
      title: "Saved view test job",
      status: "measuring",
      assignedInstallerId: t!.assignedInstallerId,
    });
    const { analysisId } = await fitDemoProbe(jobId, "views-probe.csv");

    const first = pngOf(40, 30, 1);
    const second = pngOf(64, 48, 2);
    expect((await save(analysisId, first, { factor: "100" })).status).toBe(201);
    expect(await latestJobView(jobId)).toBeNull(); // not approved yet
    const res2 = await save(analysisId, second, { factor: "1000", caption: "Report view" });
    const id2 = (await res2.json()).view.id as string;

    await db.update(jobs).set({ status: "in_review" }).where(eq(jobs.id, jobId));
    const engineer = await signInActor("engineer@halvard.example");
    await approveAnalysis(engineer, analysisId, "trammel-demo");

    const v = await latestJobView(jobId);
    expect(v).not.toBeNull();
    expect(v).toMatchObject({
      id: id2,
      analysisId,
      factor: 1000,
      caption: "Report view",
      widthPx: 64,
      heightPx: 48,
      createdByName: "Emil Haraldsen",
    });
    expect(v!.png.equals(second)).toBe(true);
    expect(v!.createdAt).toBeInstanceOf(Date);
    expect(Object.keys(v!).sort()).toEqual([
      "analysisId",
      "caption",
      "createdAt",
      "createdByName",
      "factor",
      "heightPx",
      "id",
      "png",
      "widthPx",
    ]);
    expect(await latestJobView("not-a-uuid")).toBeNull();
  });
});
