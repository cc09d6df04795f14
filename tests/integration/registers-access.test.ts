// The office's register API × every role and tenant, against the real database. Expected answers
// are written out by hand from the register rules (lib/policy/registers.ts states them; these
// cells do not read it): the administrator keeps every register; engineers read the heads; the
// service company's staff read the instruments and procedures; customers read no register, not
// even their own company's row (403: the register itself is refused, no record is revealed).
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as customersGet, POST as customersPost } from "@/app/api/customers/route";
import { PATCH as customerPatch } from "@/app/api/customers/[id]/route";
import { GET as sitesGet, POST as sitesPost } from "@/app/api/sites/route";
import { PATCH as sitePatch } from "@/app/api/sites/[id]/route";
import { GET as machinesGet, POST as machinesPost } from "@/app/api/machines/route";
import { PATCH as machinePatch } from "@/app/api/machines/[id]/route";
import { GET as headsGet, POST as headsPost } from "@/app/api/heads/route";
import { PATCH as headPatch } from "@/app/api/heads/[id]/route";
import { GET as instrumentsGet, POST as instrumentsPost } from "@/app/api/instruments/route";
import { PATCH as instrumentPatch } from "@/app/api/instruments/[id]/route";
import { GET as usersGet } from "@/app/api/users/route";
import { GET as proceduresGet } from "@/app/api/procedures/route";
import { GET as procedureGet } from "@/app/api/procedures/[id]/route";
import { POST as calibrationPost } from "@/app/api/instruments/[id]/calibrations/route";
import { GET as jobGet } from "@/app/api/jobs/[id]/route";
import { createJobFromTemplate } from "@/db/queries/job-status";
import { getActor } from "@/db/queries/users";
import { db } from "@/db";
import {
  auditEvents,
  customers,
  heads,
  instrumentCalibrations,
  instruments,
  machines,
  procedureTemplates,
  sites,
} from "@/db/schema";
import { insertRow, WHO } from "./fixtures";
import { issueFields, jsonBody, request, signInAs } from "./helpers";

type Handler = (req: Request, ctx: { params: Promise<{ id: string }> }) => Promise<Response>;
const p = (id: string) => ({ params: Promise.resolve({ id }) });
const get = (h: (req: Request, ctx: never) => Promise<Response>, path: string) =>
  h(request(path), undefined as never);
const post = (h: (req: Request, ctx: never) => Promise<Response>, path: string, body: unknown) =>
  h(request(path, jsonBody("POST", body)), undefined as never);
const patch = (h: Handler, path: string, id: string, body: unknown) =>
  h(request(`${path}/${id}`, jsonBody("PATCH", body)), p(id));

/** Per role: [customers, sites, machines, heads, instruments, users, procedures] for read; write is the admin's alone. */
type Cells = { read: Record<string, number>; write: number };
const staffOnly = { customers: 403, sites: 403, machines: 403, users: 403 };
const CELLS: Record<string, Cells> = {
  anonymous: {
    read: {
      customers: 401,
      sites: 401,
      machines: 401,
      heads: 401,
      instruments: 401,
      users: 401,
      procedures: 401,
    },
    write: 401,
  },
  admin: {
    read: {
      customers: 200,
      sites: 200,
      machines: 200,
      heads: 200,
      instruments: 200,
      users: 200,
      procedures: 200,
    },
    write: 200,
  },
  installer: { read: { ...staffOnly, heads: 403, instruments: 200, procedures: 200 }, write: 403 },
  inspector: { read: { ...staffOnly, heads: 403, instruments: 200, procedures: 200 }, write: 403 },
  engineer: { read: { ...staffOnly, heads: 200, instruments: 200, procedures: 200 }, write: 403 },
  "customer (Marlow Creek)": {
    read: { ...staffOnly, heads: 403, instruments: 403, procedures: 403 },
    write: 403,
  },
  "customer (Tollan)": { read: { ...staffOnly, heads: 403, instruments: 403, procedures: 403 }, write: 403 },
};

const ids = { marlow: "", tollan: "", site: "", machine: "", head: "", instrument: "", procedure: "" };
let n = 0;
const uniq = () => `${Date.now().toString(36)}-${++n}`;
/**
 * POST /api/instruments as whoever is signed in: a dial test indicator reading in µm, with a serial
 * of its own, unless the test gives other fields.
 */
const postInstrument = (fields: Record<string, unknown> = {}) =>
  post(instrumentsPost, "/api/instruments", {
    kind: "dial test indicator",
    serial: `DTI-${uniq()}`,
    quantityKind: "length",
    resolution: 1,
    standardUncertainty: 1.5,
    unit: "um",
    calibrationDueOn: "2027-06-30",
    ...fields,
  });

beforeAll(async () => {
  const byName = async (name: string) =>
    (await db.select({ id: customers.id }).from(customers).where(eq(customers.name, name)))[0]!.id;
  ids.marlow = await byName("Marlow Creek Aerostructures");
  ids.tollan = await byName("Tollan Mold Works");
  // Rows of this file's own, so the corrections below change nothing other test files rely on.
  const u = uniq();
  ids.site = await insertRow(sites, { customerId: ids.tollan, name: `Site ${u}` });
  ids.machine = await insertRow(machines, { siteId: ids.site, name: `Mill ${u}` });
  ids.head = await insertRow(heads, {
    serial: `H-${u}`,
    primaryAxis: "C",
    secondaryAxis: "A",
    nominalPivotLengthMm: 200,
  });
  ids.instrument = await insertRow(instruments, {
    kind: "dial test indicator",
    serial: `I-${u}`,
    resolution: 0.001,
    standardUncertainty: 0.001,
    calibrationDueOn: "2027-06-30",
  });
  ids.procedure = (await db.select({ id: procedureTemplates.id }).from(procedureTemplates).limit(1))[0]!.id;
});

describe("register API access matrix", () => {
  for (const [who, email] of Object.entries(WHO)) {
    const cells = CELLS[who]!;
    describe(who, () => {
      const reads: [string, () => Promise<Response>][] = [
        ["customers", () => get(customersGet, "/api/customers")],
        ["sites", () => get(sitesGet, "/api/sites")],
        ["machines", () => get(machinesGet, "/api/machines")],
        ["heads", () => get(headsGet, "/api/heads")],
        ["instruments", () => get(instrumentsGet, "/api/instruments")],
        ["users", () => get(usersGet, "/api/users?role=installer")],
        ["procedures", () => get(proceduresGet, "/api/procedures")],
      ];
      for (const [plural, call] of reads) {
        const expected = cells.read[plural]!;
        it(`GET /api/${plural} answers ${expected}`, async () => {
          await signInAs(email);
          const res = await call();
          expect(res.status).toBe(expected);
          const body = await res.json();
          if (expected === 200) expect(Array.isArray(body[plural]) && body[plural].length > 0).toBe(true);
          else expect(body.error.code).toBe(expected === 401 ? "unauthorized" : "forbidden");
        });
      }

      const detail = cells.read.procedures!;
      it(`GET /api/procedures/{id} answers ${detail}`, async () => {
        await signInAs(email);
        const res = await procedureGet(request(`/api/procedures/${ids.procedure}`), p(ids.procedure));
        expect(res.status).toBe(detail);
        if (detail === 200) expect((await res.json()).procedure.steps.length).toBeGreaterThan(0);
      });

      const created = cells.write === 200 ? 201 : cells.write;
      it(`POST to every register answers ${created}`, async () => {
        await signInAs(email);
        const u = uniq();
        const answers = [
          await post(customersPost, "/api/customers", { name: `Matrix Customer ${u}` }),
          await post(sitesPost, "/api/sites", { customerId: ids.tollan, name: `Matrix site ${u}` }),
          await post(machinesPost, "/api/machines", {
            siteId: ids.site,
            name: `Matrix mill ${u}`,
            kind: "gantry mill",
          }),
          await post(headsPost, "/api/heads", {
            serial: `MX-${u}`,
            primaryAxis: "C",
            secondaryAxis: "A",
            nominalPivotLengthMm: 250,
          }),
          await postInstrument(),
        ];
        expect(answers.map((r) => r.status)).toEqual([created, created, created, created, created]);
      });

      const calibrated = cells.write === 200 ? 201 : cells.write;
      it(`POST /api/instruments/{id}/calibrations answers ${calibrated}`, async () => {
        await signInAs(email);
        const res = await calibrationPost(
          request(
            `/api/instruments/${ids.instrument}/calibrations`,
            jsonBody("POST", {
              calibratedOn: "2026-01-15",
              dueOn: "2027-01-15",
              certificateRef: `CERT-${uniq()}`,
              laboratory: "Invented Metrology Lab",
            }),
          ),
          p(ids.instrument),
        );
        expect(res.status).toBe(calibrated);
      });

      it(`PATCH on a row of every register answers ${cells.write}`, async () => {
        await signInAs(email);
        const answers = [
          // A customer user correcting their own company's row is refused like any other. (The
          // administrator's correction repeats the seeded address: 200, and nothing changes.)
          await patch(customerPatch, "/api/customers", ids.marlow, {
            contactEmail: "buyer@marlowcreek.example",
          }),
          await patch(customerPatch, "/api/customers", ids.tollan, { contactEmail: "buyer@tollan.example" }),
          await patch(sitePatch, "/api/sites", ids.site, { address: "Unit 4, Tollan Road" }),
          await patch(machinePatch, "/api/machines", ids.machine, { control: "five-axis control" }),
          await patch(headPatch, "/api/heads", ids.head, { massKg: 410 }),
          await patch(instrumentPatch, "/api/instruments", ids.instrument, { maker: "Invented Gauges" }),
        ];
        expect(answers.map((r) => r.status)).toEqual(Array(6).fill(cells.write));
      });
    });
  }
});

describe("register API: creating, correcting and refusing bad input (administrator)", () => {
  beforeAll(async () => {
    await signInAs("admin@halvard.example");
  });

  it("creates a customer that the list then holds; a second of the same name is 422 naming `name`", async () => {
    const name = `Brightwater Tooling ${uniq()}`;
    const res = await post(customersPost, "/api/customers", { name, contactEmail: "qa@brightwater.example" });
    expect(res.status).toBe(201);
    const { customer } = await res.json();
    expect(customer).toMatchObject({ name, contactEmail: "qa@brightwater.example" });
    const list = await (await get(customersGet, "/api/customers")).json();
    expect(list.customers.map((c: { id: string }) => c.id)).toContain(customer.id);
    const again = await post(customersPost, "/api/customers", { name: name.toUpperCase() });
    expect(again.status).toBe(422);
    expect((await again.json()).error.issues).toEqual([{ field: "name", message: "Already registered." }]);
  });

  it("a body without a required field is 422 naming it, and nothing is stored", async () => {
    const before = (await db.select({ c: sql<number>`count(*)::int` }).from(sites))[0]!.c;
    const res = await post(sitesPost, "/api/sites", { name: "No customer" });
    expect(res.status).toBe(422);
    expect(await issueFields(res)).toEqual(["customerId"]);
    expect((await db.select({ c: sql<number>`count(*)::int` }).from(sites))[0]!.c).toBe(before);
  });

  it("a body that is not JSON is refused (415) before anything is read", async () => {
    const res = await customersPost(
      request("/api/customers", { method: "POST", body: "name=Form Post Ltd" }),
      undefined as never,
    );
    expect(res.status).toBe(415);
  });

  it("corrects a head and audits the old and new values of what changed only", async () => {
    const serial = `PATCH-${uniq()}`;
    const created = await (
      await post(headsPost, "/api/heads", {
        serial,
        primaryAxis: "C",
        secondaryAxis: "B",
        nominalPivotLengthMm: 300,
      })
    ).json();
    const id = created.head.id as string;
    const res = await patch(headPatch, "/api/heads", id, {
      nominalPivotLengthMm: 301.5,
      maker: "Invented Heads",
    });
    expect(res.status).toBe(200);
    const { head } = await res.json();
    expect(head).toMatchObject({
      serial,
      nominalPivotLengthMm: 301.5,
      maker: "Invented Heads",
      toolAxisOffsetMm: 0,
    });
    const events = await db.select().from(auditEvents).where(eq(auditEvents.entityId, id));
    const upd = events.filter((e) => e.action === "head.updated");
    expect(upd).toHaveLength(1);
    expect(upd[0]!.oldValues).toEqual({ nominalPivotLengthMm: 300, maker: null });
    expect(upd[0]!.newValues).toEqual({ nominalPivotLengthMm: 301.5, maker: "Invented Heads" });
    // The same values again change nothing and add no event.
    expect((await patch(headPatch, "/api/heads", id, { nominalPivotLengthMm: 301.5 })).status).toBe(200);
    const after = await db.select().from(auditEvents).where(eq(auditEvents.entityId, id));
    expect(after.filter((e) => e.action === "head.updated")).toHaveLength(1);
  });

  it("a head's serial taken by another head is 422 naming `serial`, and the head keeps its own", async () => {
    const [before] = await db.select({ serial: heads.serial }).from(heads).where(eq(heads.id, ids.head));
    const res = await patch(headPatch, "/api/heads", ids.head, { serial: "TH-2241" });
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues).toEqual([{ field: "serial", message: "Already registered." }]);
    const [h] = await db.select({ serial: heads.serial }).from(heads).where(eq(heads.id, ids.head));
    expect(h!.serial).toBe(before!.serial);
  });

  it("a field that cannot be changed, a bad value, or nothing at all is 422 naming the field", async () => {
    const axes = await patch(headPatch, "/api/heads", ids.head, { primaryAxis: "A" });
    expect(axes.status).toBe(422);
    expect(await issueFields(axes)).toEqual(["primaryAxis"]);
    const owner = await patch(sitePatch, "/api/sites", ids.site, { customerId: ids.marlow });
    expect(await issueFields(owner)).toEqual(["customerId"]);
    const neg = await patch(headPatch, "/api/heads", ids.head, { nominalPivotLengthMm: -5 });
    expect(neg.status).toBe(422);
    expect(await issueFields(neg)).toEqual(["nominalPivotLengthMm"]);
    const empty = await patch(machinePatch, "/api/machines", ids.machine, {});
    expect(empty.status).toBe(422);
    const email = await patch(customerPatch, "/api/customers", ids.tollan, {
      contactEmail: "not an address",
    });
    expect(await issueFields(email)).toEqual(["contactEmail"]);
  });

  it("an instrument's resolution is stored in mm from µm; an angle unit on a length instrument is 422 `unit`", async () => {
    const created = await (await postInstrument({ resolution: 10, standardUncertainty: 5 })).json();
    const id = created.instrument.id as string;
    const res = await patch(instrumentPatch, "/api/instruments", id, {
      resolution: 2,
      standardUncertainty: 1,
      unit: "um",
    });
    expect(res.status).toBe(200);
    const { instrument } = await res.json();
    // 1 µm = 0.001 mm (SI prefixes).
    expect(instrument.resolution).toBeCloseTo(0.002, 12);
    expect(instrument.standardUncertainty).toBeCloseTo(0.001, 12);
    const wrong = await patch(instrumentPatch, "/api/instruments", id, { resolution: 2, unit: "arcsec" });
    expect(wrong.status).toBe(422);
    expect(await issueFields(wrong)).toEqual(["unit"]);
    const noUnit = await patch(instrumentPatch, "/api/instruments", id, { resolution: 2 });
    expect(await issueFields(noUnit)).toEqual(["unit"]);
  });

  it("a row that does not exist, or an id that is not one, is 404", async () => {
    const none = "00000000-0000-4000-8000-000000000000";
    expect((await patch(customerPatch, "/api/customers", none, { name: "Nobody Ltd" })).status).toBe(404);
    expect(
      (await patch(instrumentPatch, "/api/instruments", none, { maker: "X", unit: "mm", resolution: 1 }))
        .status,
    ).toBe(404);
    expect((await patch(machinePatch, "/api/machines", "not-a-uuid", { name: "X" })).status).toBe(404);
    expect((await procedureGet(request(`/api/procedures/${none}`), p(none))).status).toBe(404);
  });

  it("GET /api/users?role= lists that role only; an unknown role is 422 naming `role`", async () => {
    const body = await (await get(usersGet, "/api/users?role=installer")).json();
    expect(body.users.length).toBeGreaterThan(0);
    expect(new Set(body.users.map((u: { role: string }) => u.role))).toEqual(new Set(["installer"]));
    const all = await (await get(usersGet, "/api/users")).json();
    expect(new Set(all.users.map((u: { role: string }) => u.role)).size).toBeGreaterThan(1);
    const bad = await get(usersGet, "/api/users?role=boss");
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues[0].field).toBe("role");
  });
});

describe("retiring register rows and recalibrating instruments (administrator)", () => {
  beforeAll(async () => {
    await signInAs("admin@halvard.example");
  });
  const events = async (id: string) =>
    (await db.select().from(auditEvents).where(eq(auditEvents.entityId, id))).map((e) => e.action);

  it("a retired head and machine stay readable on their old job, and take no new job", async () => {
    const admin = (await getActor((await signInAs("admin@halvard.example"))!))!;
    const u = uniq();
    const machine = (
      await (
        await post(machinesPost, "/api/machines", {
          siteId: ids.site,
          name: `Old mill ${u}`,
          kind: "bridge mill",
        })
      ).json()
    ).machine;
    const head = (
      await (
        await post(headsPost, "/api/heads", {
          serial: `OLD-${u}`,
          primaryAxis: "C",
          secondaryAxis: "A",
          nominalPivotLengthMm: 220,
        })
      ).json()
    ).head;
    const jobInput = {
      templateId: ids.procedure,
      machineId: machine.id as string,
      headId: head.id as string,
      kind: "installation" as const,
      title: `Job before retirement ${u}`,
      decisionRule: "simple" as const,
    };
    const job = await createJobFromTemplate(admin, jobInput);

    const retired = await patch(headPatch, "/api/heads", head.id, { retired: true });
    expect(retired.status).toBe(200);
    expect((await retired.json()).head.retiredAt).not.toBeNull();
    expect((await patch(machinePatch, "/api/machines", machine.id, { retired: true })).status).toBe(200);
    // Retiring again changes nothing and adds no event.
    expect((await patch(headPatch, "/api/heads", head.id, { retired: true })).status).toBe(200);
    expect((await events(head.id)).filter((a) => a === "head.retired")).toHaveLength(1);
    expect(await events(machine.id)).toContain("machine.retired");

    const detail = await jobGet(request(`/api/jobs/${job.id}`), p(job.id));
    expect(detail.status).toBe(200);
    expect((await detail.json()).job.head.serial).toBe(`OLD-${u}`);
    const list = await (await get(headsGet, "/api/heads")).json();
    expect(list.heads.find((h: { id: string }) => h.id === head.id).retiredAt).not.toBeNull();

    await expect(createJobFromTemplate(admin, { ...jobInput, title: "New work" })).rejects.toMatchObject({
      status: 422,
      issues: [{ field: "machineId", message: "This host machine is retired." }],
    });
    expect((await patch(machinePatch, "/api/machines", machine.id, { retired: false })).status).toBe(200);
    expect(await events(machine.id)).toContain("machine.restored");
    await expect(createJobFromTemplate(admin, { ...jobInput, title: "New work" })).rejects.toMatchObject({
      status: 422,
      issues: [{ field: "headId", message: "This head is retired." }],
    });
  });

  it("a retired customer takes no new site, and a retired site no new machine (422 naming the field)", async () => {
    const u = uniq();
    const customer = (
      await (await post(customersPost, "/api/customers", { name: `Closed Works ${u}` })).json()
    ).customer;
    const site = (
      await (await post(sitesPost, "/api/sites", { customerId: customer.id, name: "Hall 1" })).json()
    ).site;
    expect((await patch(sitePatch, "/api/sites", site.id, { retired: true })).status).toBe(200);
    const m = await post(machinesPost, "/api/machines", {
      siteId: site.id,
      name: "Mill",
      kind: "gantry mill",
    });
    expect(m.status).toBe(422);
    expect((await m.json()).error.issues[0].field).toBe("siteId");
    expect((await patch(customerPatch, "/api/customers", customer.id, { retired: true })).status).toBe(200);
    const s2 = await post(sitesPost, "/api/sites", { customerId: customer.id, name: "Hall 2" });
    expect(s2.status).toBe(422);
    expect((await s2.json()).error.issues[0].field).toBe("customerId");
    const bad = await patch(customerPatch, "/api/customers", customer.id, { retired: "yes" });
    expect((await bad.json()).error.issues[0].field).toBe("retired");
  });

  it("a recalibration is a new record with the history kept, and brings a retired instrument back", async () => {
    const u = uniq();
    const created = await (
      await postInstrument({
        kind: "electronic level",
        serial: `LVL-${u}`,
        quantityKind: "angle",
        standardUncertainty: 2,
        unit: "arcsec",
        calibratedOn: "2025-01-10",
        calibrationDueOn: "2026-01-10",
        certificateRef: "C-1",
      })
    ).json();
    const id = created.instrument.id as string;
    const retired = await (await patch(instrumentPatch, "/api/instruments", id, { retired: true })).json();
    expect(retired.instrument).toMatchObject({ retired: true });
    expect(retired.instrument.retiredAt).not.toBeNull();

    const cal = (body: unknown) =>
      calibrationPost(request(`/api/instruments/${id}/calibrations`, jsonBody("POST", body)), p(id));
    const first = await cal({
      calibratedOn: "2026-02-01",
      dueOn: "2027-02-01",
      certificateRef: "C-2",
      laboratory: "Invented Lab",
    });
    expect(first.status).toBe(201);
    const body = await first.json();
    expect(body.instrument).toMatchObject({
      retired: false,
      retiredAt: null,
      calibratedOn: "2026-02-01",
      calibrationDueOn: "2027-02-01",
      certificateRef: "C-2",
    });
    expect(body.calibration).toMatchObject({ laboratory: "Invented Lab", certificateRef: "C-2" });
    expect(
      (
        await cal({
          calibratedOn: "2026-03-01",
          dueOn: "2027-03-01",
          certificateRef: "C-3",
          laboratory: "Invented Lab",
        })
      ).status,
    ).toBe(201);
    const history = await db
      .select({ ref: instrumentCalibrations.certificateRef })
      .from(instrumentCalibrations)
      .where(eq(instrumentCalibrations.instrumentId, id))
      .orderBy(instrumentCalibrations.calibratedOn);
    expect(history.map((h) => h.ref)).toEqual(["C-2", "C-3"]);
    expect((await events(id)).filter((a) => a === "instrument.calibrated")).toHaveLength(2);

    const fields = async (r: Response) => {
      expect(r.status).toBe(422);
      return await issueFields(r);
    };
    // Before the last calibration, due before calibrated, in the future, or missing the laboratory.
    const calibration = (calibratedOn: string, dueOn: string) => ({
      calibratedOn,
      dueOn,
      certificateRef: "C-4",
      laboratory: "Lab",
    });
    for (const [body, field] of [
      [calibration("2026-02-15", "2027-02-15"), "calibratedOn"],
      [calibration("2026-04-01", "2026-03-01"), "dueOn"],
      [calibration("2999-01-01", "2999-06-01"), "calibratedOn"],
      [{ calibratedOn: "2026-04-01", dueOn: "2027-04-01", certificateRef: "C-4" }, "laboratory"],
    ] as const)
      expect(await fields(await cal(body))).toEqual([field]);
    expect(history).toHaveLength(2);
    const none = "00000000-0000-4000-8000-000000000000";
    const missing = await calibrationPost(
      request(
        `/api/instruments/${none}/calibrations`,
        jsonBody("POST", {
          calibratedOn: "2026-01-01",
          dueOn: "2027-01-01",
          certificateRef: "X",
          laboratory: "Lab",
        }),
      ),
      p(none),
    );
    expect(missing.status).toBe(404);
  });
});
