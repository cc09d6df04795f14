// The procedure builder's API against the real database: every role, anonymous and both
// tenants' customers on each write route (expected answers written by hand from the product's
// rules: the office and the application engineers write procedures, the service company's staff
// read them, customers neither); field-named 422s; versioning that keeps a job on its version;
// retiring; and the new-job query proceduresFor.
import { and, asc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as rawList, POST as rawCreate } from "@/app/api/procedures/route";
import { GET as itemGet, PATCH as itemPatch } from "@/app/api/procedures/[id]/route";
import { POST as versionPost } from "@/app/api/procedures/[id]/versions/route";
import { db } from "@/db";
import { createJobFromTemplate } from "@/db/queries/job-status";
import { proceduresFor } from "@/db/queries/procedures";
import { getActor } from "@/db/queries/users";
import { auditEvents, jobs, procedureTemplates, templateParameterLimits, templateSteps } from "@/db/schema";
import { WHO } from "./fixtures";
import { jobIdByReference, jsonBody, request, signInAs } from "./helpers";

// Outside a Next request there is no cache to revalidate.
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));
const actions = await import("@/app/(app)/registers/procedures/actions");

const p = (id: string) => ({ params: Promise.resolve({ id }) });
const createPost = (req: Request) => rawCreate(req, undefined as never);
const listGet = (req: Request, _ctx: undefined) => rawList(req, undefined as never);
let n = 0;
const uniq = () => `${Date.now().toString(36)}-${++n}`;

/** A procedure with a multi-point step, a yes/no step, a photo-required record step and a note. */
const body = (name: string, extra: object = {}) => ({
  name,
  jobKind: "installation",
  headModel: "HX-40",
  steps: [
    {
      title: "Collar run-out",
      kind: "multi_point",
      unit: "in",
      upper: 0.0005,
      points: ["12", "3", "6", "9"],
      pointResult: "tir",
      limitSource: "common_practice",
      limitSourceNote: "trade default",
    },
    {
      title: "Motor plate on its dowels",
      kind: "check",
      limitSource: "maker_manual",
      limitSourceNote: "HX manual",
    },
    { title: "Shims", kind: "record", recordUnit: "mm", photoRequired: true, safety: "Lock out first." },
    { title: "Findings", kind: "note" },
  ],
  ...extra,
});

/** Per role: [POST /api/procedures, POST …/{id}/versions, PATCH …/{id}, GET /api/procedures?jobKind=]. */
const CELLS: Record<string, [number, number, number, number]> = {
  anonymous: [401, 401, 401, 401],
  admin: [201, 200, 200, 200],
  installer: [403, 403, 403, 200],
  inspector: [403, 403, 403, 200],
  engineer: [201, 200, 200, 200],
  "customer (Marlow Creek)": [403, 403, 403, 403],
  "customer (Tollan)": [403, 403, 403, 403],
};

let shared = "";
beforeAll(async () => {
  await signInAs("admin@halvard.example");
  const res = await createPost(request("/api/procedures", jsonBody("POST", body(`Matrix ${uniq()}`))));
  expect(res.status).toBe(201);
  shared = (await res.json()).procedure.id;
});

describe("procedure API access matrix", () => {
  for (const [who, email] of Object.entries(WHO)) {
    const [create, version, retire, list] = CELLS[who]!;
    describe(who, () => {
      it(`POST /api/procedures answers ${create}`, async () => {
        await signInAs(email);
        const res = await createPost(
          request("/api/procedures", jsonBody("POST", body(`By ${who} ${uniq()}`))),
        );
        expect(res.status).toBe(create);
        const out = await res.json();
        if (create === 201) {
          expect(out.procedure.version).toBe(1);
          expect(out.procedure.steps.map((s: { derivation: string }) => s.derivation)).toEqual([
            "multi_point",
            "check",
            "record",
            "note",
          ]);
        } else expect(out.error.code).toBe(create === 401 ? "unauthorized" : "forbidden");
      });

      it(`POST /api/procedures/{id}/versions answers ${version}`, async () => {
        await signInAs(email);
        const res = await versionPost(
          request(`/api/procedures/${shared}/versions`, jsonBody("POST", body(undefined as never))),
          p(shared),
        );
        expect(res.status).toBe(version);
      });

      it(`PATCH /api/procedures/{id} answers ${retire}`, async () => {
        await signInAs(email);
        const res = await itemPatch(
          request(`/api/procedures/${shared}`, jsonBody("PATCH", { retired: false })),
          p(shared),
        );
        expect(res.status).toBe(retire);
      });

      it(`GET /api/procedures?jobKind=installation&headModel=HX-40 answers ${list}`, async () => {
        await signInAs(email);
        const res = await listGet(request("/api/procedures?jobKind=installation&headModel=HX-40"), undefined);
        expect(res.status).toBe(list);
        if (list !== 200) return;
        const names = (await res.json()).procedures.map((t: { name: string }) => t.name);
        expect(names).toContain("Starter: install a two-axis head");
        expect(names).not.toContain("Starter: check a two-axis head after a crash");
      });
    });
  }
});

describe("procedure bodies", () => {
  it("answer 422 naming the step's field", async () => {
    await signInAs("engineer@halvard.example");
    const bad = body(`Bad ${uniq()}`);
    (bad.steps[0] as Record<string, unknown>).limitSource = undefined;
    (bad.steps[1] as Record<string, unknown>).kind = "guess";
    let res = await createPost(request("/api/procedures", jsonBody("POST", bad)));
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues).toContainEqual(
      expect.objectContaining({ field: "steps.1.kind" }),
    );
    (bad.steps[1] as Record<string, unknown>).kind = "check";
    res = await createPost(request("/api/procedures", jsonBody("POST", bad)));
    expect(res.status).toBe(422);
    const issues = (await res.json()).error.issues as { field: string }[];
    expect(issues.map((i) => i.field)).toEqual(["steps.0.limitSource"]);
  });

  it("stores limits canonically (mm) and gives them back in the step's unit", async () => {
    await signInAs("admin@halvard.example");
    const res = await createPost(request("/api/procedures", jsonBody("POST", body(`Units ${uniq()}`))));
    const id = (await res.json()).procedure.id;
    const [s] = await db
      .select()
      .from(templateSteps)
      .where(and(eq(templateSteps.templateId, id), eq(templateSteps.position, 1)));
    // 0.0005 in = 0.0127 mm exactly (1 in = 25.4 mm, NIST SP 811).
    expect(s!.upperLimit).toBeCloseTo(0.0127, 12);
    expect(s!.limitUnit).toBe("in");
    expect(s!.points).toEqual(["12", "3", "6", "9"]);
    const detail = await (await itemGet(request(`/api/procedures/${id}`), p(id))).json();
    expect(detail.procedure.steps[2].photoRequired).toBe(true);
  });

  it("refuse a second procedure of the same name with 409", async () => {
    await signInAs("admin@halvard.example");
    const name = `Twice ${uniq()}`;
    expect((await createPost(request("/api/procedures", jsonBody("POST", body(name))))).status).toBe(201);
    const again = await createPost(request("/api/procedures", jsonBody("POST", body(name))));
    expect(again.status).toBe(409);
  });
});

describe("versions", () => {
  it("change a version in place until a job uses it; then a new version, and the job keeps its own", async () => {
    const admin = (await getActor((await signInAs("admin@halvard.example"))!))!;
    const name = `Versioned ${uniq()}`;
    const v1 = (await (await createPost(request("/api/procedures", jsonBody("POST", body(name))))).json())
      .procedure;
    const draft = body(name);
    draft.steps = draft.steps.slice().reverse();
    let res = await versionPost(
      request(`/api/procedures/${v1.id}/versions`, jsonBody("POST", draft)),
      p(v1.id),
    );
    expect(res.status).toBe(200);
    const replaced = await res.json();
    expect(replaced.replaced).toBe(true);
    expect(replaced.procedure.id).toBe(v1.id);
    expect(replaced.procedure.version).toBe(1);

    // A job opens on version 1.
    const [seedJob] = await db
      .select()
      .from(jobs)
      .where(eq(jobs.id, await jobIdByReference("TR-2026-0052")));
    const job = await createJobFromTemplate(admin, {
      templateId: v1.id,
      machineId: seedJob!.machineId,
      headId: seedJob!.headId,
      kind: "installation",
      title: "Versioning test job",
      decisionRule: "simple",
    });
    const before = await db
      .select({ title: templateSteps.title })
      .from(templateSteps)
      .where(eq(templateSteps.templateId, v1.id))
      .orderBy(asc(templateSteps.position));

    res = await versionPost(
      request(`/api/procedures/${v1.id}/versions`, jsonBody("POST", body(name))),
      p(v1.id),
    );
    expect(res.status).toBe(201);
    const v2 = (await res.json()).procedure;
    expect(v2.version).toBe(2);
    expect(v2.id).not.toBe(v1.id);
    const rows = await db
      .select({
        id: procedureTemplates.id,
        version: procedureTemplates.version,
        isCurrent: procedureTemplates.isCurrent,
      })
      .from(procedureTemplates)
      .where(eq(procedureTemplates.name, name))
      .orderBy(asc(procedureTemplates.version));
    expect(rows).toEqual([
      { id: v1.id, version: 1, isCurrent: false },
      { id: v2.id, version: 2, isCurrent: true },
    ]);
    const [kept] = await db.select({ t: jobs.templateId }).from(jobs).where(eq(jobs.id, job.id));
    expect(kept!.t).toBe(v1.id);
    const after = await db
      .select({ title: templateSteps.title })
      .from(templateSteps)
      .where(eq(templateSteps.templateId, v1.id))
      .orderBy(asc(templateSteps.position));
    expect(after).toEqual(before);
    const events = await db
      .select({ action: auditEvents.action })
      .from(auditEvents)
      .where(eq(auditEvents.entityId, v2.id));
    expect(events.map((e) => e.action)).toEqual(["procedure.versioned"]);

    // A rename through a version is refused with the field named.
    res = await versionPost(
      request(`/api/procedures/${v2.id}/versions`, jsonBody("POST", body(`${name} renamed`))),
      p(v2.id),
    );
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues[0].field).toBe("name");
  });

  it("are offered for new jobs by kind and head model until retired, and again once brought back", async () => {
    await signInAs("engineer@halvard.example");
    const name = `Offered ${uniq()}`;
    const t = (
      await (
        await createPost(request("/api/procedures", jsonBody("POST", body(name, { headModel: "HX-77" }))))
      ).json()
    ).procedure;
    const names = async (kind: "installation" | "after_crash", model: string | null) =>
      (await proceduresFor(kind, model)).map((x) => x.name);
    expect(await names("installation", "hx-77")).toContain(name);
    expect(await names("installation", "HX-77")).toContain("Starter: install a two-axis head");
    expect(await names("installation", "Other")).not.toContain(name);
    // A procedure written for one model is not offered for a head whose model is not recorded.
    expect(await names("installation", null)).not.toContain(name);
    expect(await names("installation", null)).toContain("Starter: install a two-axis head");
    expect(await names("after_crash", "HX-77")).not.toContain(name);
    // The head model's own procedure comes first.
    expect((await names("installation", "HX-77"))[0]).toBe(name);

    let res = await itemPatch(
      request(`/api/procedures/${t.id}`, jsonBody("PATCH", { retired: true })),
      p(t.id),
    );
    expect(res.status).toBe(200);
    expect(await names("installation", "HX-77")).not.toContain(name);
    // A retired procedure cannot be changed until it is brought back.
    res = await versionPost(
      request(`/api/procedures/${t.id}/versions`, jsonBody("POST", body(name))),
      p(t.id),
    );
    expect(res.status).toBe(409);
    res = await itemPatch(request(`/api/procedures/${t.id}`, jsonBody("PATCH", { retired: false })), p(t.id));
    expect(res.status).toBe(200);
    expect(await names("installation", "HX-77")).toContain(name);
  });
});

describe("builder actions", () => {
  it("name each step's field on refusal, create, save in place and retire", async () => {
    await signInAs("engineer@halvard.example");
    const name = `Action ${uniq()}`;
    const bad = body(name);
    (bad.steps[1] as Record<string, unknown>).limitSource = "";
    const refused = await actions.createProcedureAction(bad);
    expect(refused.ok).toBe(false);
    if (refused.ok) return;
    expect(Object.keys(refused.fieldErrors ?? {})).toEqual(["steps.1.limitSource"]);
    expect(await db.select().from(procedureTemplates).where(eq(procedureTemplates.name, name))).toEqual([]);

    const made = await actions.createProcedureAction(body(name));
    expect(made.ok).toBe(true);
    if (!made.ok) return;
    const saved = await actions.saveProcedureVersionAction({ ...body(name), id: made.data.id });
    expect(saved).toEqual({ ok: true, data: { id: made.data.id, version: 1, replaced: true } });
    const retired = await actions.setProcedureRetiredAction({ id: made.data.id, retired: "true" });
    expect(retired).toEqual({ ok: true, data: { id: made.data.id, retired: true } });
    expect((await proceduresFor("installation", "HX-40")).map((x) => x.name)).not.toContain(name);
  });
});

describe("judging the head as a whole", () => {
  it("a TCP limit needs its source; the check, its limits and the parameter limits are stored and kept", async () => {
    await signInAs("admin@halvard.example");
    const name = `TCP ${uniq()}`;
    // A limit without its source is refused, naming the field the builder shows.
    const noSource = await actions.createProcedureAction(
      body(name, { tcpCheckRequired: true, tcpRangeLimitUm: "15", tcpDeviationLimitUm: "" }),
    );
    expect(noSource.ok).toBe(false);
    if (noSource.ok) return;
    expect(Object.keys(noSource.fieldErrors ?? {})).toEqual(["tcpLimitSource"]);
    const negative = await createPost(
      request(
        "/api/procedures",
        jsonBody("POST", body(name, { tcpRangeLimitUm: -3, tcpLimitSource: "common_practice" })),
      ),
    );
    expect(negative.status).toBe(422);
    expect((await negative.json()).error.issues[0].field).toBe("tcpRangeLimitUm");
    const badParam = await actions.createProcedureAction(
      body(name, {
        parameterLimits: [
          { parameter: "pivot_length_error_um", lower: "5", upper: "-5", limitSource: "customer_spec" },
        ],
      }),
    );
    expect(badParam.ok).toBe(false);
    if (badParam.ok) return;
    expect(Object.keys(badParam.fieldErrors ?? {}).sort()).toEqual([
      "parameterLimits.0.limitSourceNote",
      "parameterLimits.0.lower",
    ]);
    expect(await db.select().from(procedureTemplates).where(eq(procedureTemplates.name, name))).toEqual([]);

    const made = await actions.createProcedureAction(
      body(name, {
        tcpCheckRequired: true,
        tcpRangeLimitUm: "15",
        tcpDeviationLimitUm: "10",
        tcpLimitSource: "customer_spec",
        tcpLimitSourceNote: "Acceptance sheet 3, TCP",
        parameterLimits: [
          // Both limits empty: recorded, not judged, so not stored.
          { parameter: "tip_offset_s_um", lower: "", upper: "", decisionRule: "simple", limitSource: "" },
          {
            parameter: "secondary_tilt_arcsec",
            lower: "-12",
            upper: "12",
            decisionRule: "simple",
            limitSource: "common_practice",
            limitSourceNote: "",
          },
        ],
      }),
    );
    expect(made.ok).toBe(true);
    if (!made.ok) return;
    const [t] = await db.select().from(procedureTemplates).where(eq(procedureTemplates.id, made.data.id));
    expect(t).toMatchObject({
      tcpCheckRequired: true,
      tcpRangeLimitUm: 15,
      tcpDeviationLimitUm: 10,
      tcpLimitSource: "customer_spec",
      tcpLimitSourceNote: "Acceptance sheet 3, TCP",
    });
    const limits = await db
      .select()
      .from(templateParameterLimits)
      .where(eq(templateParameterLimits.templateId, made.data.id));
    expect(limits.map((l) => [l.parameter, l.lowerLimit, l.upperLimit, l.limitSource])).toEqual([
      ["secondary_tilt_arcsec", -12, 12, "common_practice"],
    ]);

    // The API's version body without these fields keeps them (in place, no job uses it yet).
    const res = await versionPost(
      request(`/api/procedures/${made.data.id}/versions`, jsonBody("POST", body(name))),
      p(made.data.id),
    );
    expect(res.status).toBe(200);
    const detail = (await (await itemGet(request(`/api/procedures/${made.data.id}`), p(made.data.id))).json())
      .procedure;
    expect(detail).toMatchObject({
      tcpCheckRequired: true,
      tcpRangeLimitUm: 15,
      tcpLimitSource: "customer_spec",
    });
    expect(
      await db
        .select({ n: templateParameterLimits.parameter })
        .from(templateParameterLimits)
        .where(eq(templateParameterLimits.templateId, made.data.id)),
    ).toEqual([{ n: "secondary_tilt_arcsec" }]);

    // Cleared in the builder: no check asked for, no limits, nothing left to source.
    const cleared = await actions.saveProcedureVersionAction({
      ...body(name),
      id: made.data.id,
      tcpCheckRequired: false,
      tcpRangeLimitUm: "",
      tcpDeviationLimitUm: "",
      tcpLimitSource: "customer_spec",
      tcpLimitSourceNote: "",
      parameterLimits: [],
    });
    expect(cleared.ok).toBe(true);
    const [c] = await db.select().from(procedureTemplates).where(eq(procedureTemplates.id, made.data.id));
    expect(c).toMatchObject({
      tcpCheckRequired: false,
      tcpRangeLimitUm: null,
      tcpDeviationLimitUm: null,
      tcpLimitSource: null,
    });
    expect(
      await db
        .select()
        .from(templateParameterLimits)
        .where(eq(templateParameterLimits.templateId, made.data.id)),
    ).toEqual([]);
  });
});
