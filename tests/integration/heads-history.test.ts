// A head's fitted parameters across its jobs (GET /api/heads/{id}/history), against the real
// database: per job the approved fit (named by the hash-chained "analysis.approved" event) or else
// the latest fit, values exactly the stored analysis's (geometry's headFitToJson), oldest job first;
// a customer sees a head only through their own company's jobs on it, also after the head moved.
import { and, desc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as historyRoute } from "@/app/api/heads/[id]/history/route";
import { db } from "@/db";
import type { StoredHeadFit } from "@/db/queries/analyses";
import { analyses, auditEvents, customers, heads, jobs, machines, sites } from "@/db/schema";
import { DEMO_HEAD_ERRORS as ERRORS_0041 } from "@/db/seed-datasets";
import { DEMO_HEAD_ERRORS_AFTER } from "@/db/seed-analyses";
import { getHeadFitHistory } from "@/db/queries/heads-admin";
import { getActor } from "@/db/queries/users";
import { jobIdByReference, request, signInAs } from "./helpers";

const history = (id: string) =>
  historyRoute(request(`/api/heads/${id}/history`), { params: Promise.resolve({ id }) });
type Body = {
  head: { serial: string };
  jobs: {
    id: string;
    reference: string;
    kind: string;
    status: string;
    date: string;
    fit: null | {
      analysisId: string;
      approved: boolean;
      phase: string;
      parameters: { key: string; value: number; U: number | null }[];
    };
  }[];
};

let headId = "";
beforeAll(async () => {
  headId = (await db.select({ id: heads.id }).from(heads).where(eq(heads.serial, "TH-2241")))[0]!.id;
});

describe("head history", () => {
  it("one entry per job on the head, oldest first, with the approved or else the latest fit, values as stored", async () => {
    await signInAs("engineer@halvard.example");
    const res = await history(headId);
    expect(res.status).toBe(200);
    const body = (await res.json()) as Body;
    expect(body.head.serial).toBe("TH-2241");
    const dates = body.jobs.map((j) => Date.parse(j.date));
    expect([...dates].sort((a, b) => a - b)).toEqual(dates);
    const byRef = new Map(body.jobs.map((j) => [j.reference, j]));

    // TR-2026-0041: issued, its fit approved by the seed; the analysis is the one the approval event names.
    const j41 = byRef.get("TR-2026-0041")!;
    expect(j41).toMatchObject({ kind: "installation", status: "issued" });
    const [approval] = await db
      .select({ entityId: auditEvents.entityId })
      .from(auditEvents)
      .where(and(eq(auditEvents.jobId, j41.id), eq(auditEvents.action, "analysis.approved")))
      .orderBy(desc(auditEvents.id))
      .limit(1);
    // The seed probes TR-2026-0041 after adjustment: the issued report vouches for the head as left.
    expect(j41.fit).toMatchObject({ analysisId: approval!.entityId, approved: true, phase: "post" });

    // TR-2026-0052: measuring, nothing approved; the latest fit is the after-adjustment one.
    const j52 = byRef.get("TR-2026-0052")!;
    const [latest] = await db
      .select()
      .from(analyses)
      .where(eq(analyses.jobId, j52.id))
      .orderBy(desc(analyses.createdAt), desc(analyses.id))
      .limit(1);
    expect(j52.fit).toMatchObject({ analysisId: latest!.id, approved: false, phase: "post" });

    // TR-2026-0057: a draft with no data yet.
    expect(byRef.get("TR-2026-0057")!.fit).toBeNull();

    // Every value and U equals the stored fit's, key by key.
    for (const j of [j41, j52]) {
      const [a] = await db.select().from(analyses).where(eq(analyses.id, j.fit!.analysisId));
      const stored = (a!.result as StoredHeadFit).fit.parameters;
      expect(j.fit!.parameters.map((q) => [q.key, q.value, q.U])).toEqual(
        stored.map((q) => [q.key, q.value, q.U]),
      );
    }
    // And the fits find the invented errors the demo data was synthesised from (1 µm noise):
    // pivot length error within 3 U of the input (a check of the trend's numbers, not of the fit).
    const pivot = (j: typeof j41) => j.fit!.parameters.find((q) => q.key === "pivot_length_error_um")!;
    expect(Math.abs(pivot(j41).value - ERRORS_0041.pivot_length_error_um!)).toBeLessThan(3 * pivot(j41).U!);
    expect(Math.abs(pivot(j52).value - DEMO_HEAD_ERRORS_AFTER.pivot_length_error_um!)).toBeLessThan(
      3 * pivot(j52).U!,
    );
  });

  it("after the head moves to another company, each customer sees only their own jobs on it", async () => {
    const tollanMachine = (
      await db
        .select({ id: machines.id, customerId: customers.id })
        .from(machines)
        .innerJoin(sites, eq(sites.id, machines.siteId))
        .innerJoin(customers, eq(customers.id, sites.customerId))
        .where(eq(customers.name, "Tollan Mold Works"))
    )[0]!;
    const ref = `TR-MOVED-${Date.now().toString(36)}`;
    await db.insert(jobs).values({
      reference: ref,
      title: "Head TH-2241 on loan at Tollan",
      kind: "reverification",
      status: "draft",
      customerId: tollanMachine.customerId,
      machineId: tollanMachine.id,
      headId,
    });

    await signInAs("buyer@tollan.example");
    const t = (await (await history(headId)).json()) as Body;
    expect(t.jobs.map((j) => j.reference)).toEqual([ref]);
    await signInAs("buyer@marlowcreek.example");
    const m = (await (await history(headId)).json()) as Body;
    expect(m.jobs.map((j) => j.reference)).not.toContain(ref);
    expect(m.jobs.map((j) => j.reference)).toContain("TR-2026-0041");
    await signInAs("admin@halvard.example");
    const a = (await (await history(headId)).json()) as Body;
    expect(a.jobs.map((j) => j.reference)).toEqual(
      expect.arrayContaining([ref, "TR-2026-0041", "TR-2026-0052"]),
    );
    await db.delete(jobs).where(eq(jobs.reference, ref));
    expect(await jobIdByReference("TR-2026-0041")).toBeTruthy();
  });

  it("an installer reads every job on a head one of their jobs is on, and no other head (404)", async () => {
    // The installer is assigned TR-2026-0041 and TR-2026-0052 on this head; TR-2026-0057 on it is
    // assigned to nobody, and an after-crash re-check needs its figures too.
    await signInAs("installer@halvard.example");
    const res = await history(headId);
    expect(res.status).toBe(200);
    const body = (await res.json()) as Body;
    const refs = body.jobs.map((j) => j.reference);
    expect(refs).toEqual(expect.arrayContaining(["TR-2026-0041", "TR-2026-0052", "TR-2026-0057"]));
    const h = await getHeadFitHistory(
      (await getActor((await signInAs("installer@halvard.example"))!))!,
      headId,
    );
    const open = Object.fromEntries(h!.jobs.map((j) => [j.reference, j.open]));
    expect([open["TR-2026-0041"], open["TR-2026-0052"], open["TR-2026-0057"]]).toEqual([true, true, false]);
    // A head with no job of theirs is answered like one that does not exist.
    const [spare] = await db
      .insert(heads)
      .values({
        serial: `SPARE-${Date.now().toString(36)}`,
        primaryAxis: "C",
        secondaryAxis: "A",
        nominalPivotLengthMm: 250,
      })
      .returning();
    const none = await history(spare!.id);
    expect(none.status).toBe(404);
    expect(await none.json()).toEqual({ error: { code: "not_found", message: "No such head." } });
    // The inspector sees every job, so every head with a job on it; the spare head has none.
    await signInAs("inspector@halvard.example");
    expect((await history(headId)).status).toBe(200);
    expect((await history(spare!.id)).status).toBe(404);
    // The office reads the spare head's (empty) history.
    await signInAs("admin@halvard.example");
    const admin = await history(spare!.id);
    expect(admin.status).toBe(200);
    expect(((await admin.json()) as Body).jobs).toEqual([]);
  });
});
