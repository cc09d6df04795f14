// Air and machine temperature at the machine (POST/GET /api/jobs/{id}/environment) against the
// real database: stored once per clientId, audited, checked for plausibility, and who may record
// and read them, per role and tenant (written by hand).
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as listRoute, POST as postRoute } from "@/app/api/jobs/[id]/environment/route";
import { db } from "@/db";
import { auditEvents, environmentRecords } from "@/db/schema";
import { jsonBody, request, signInAs } from "./helpers";
import { jobLike } from "./tablet-helpers";

let jobId: string; // measuring, Marlow Creek, the demo installer assigned
const p = (id: string) => ({ params: Promise.resolve({ id }) });

async function post(body: Record<string, unknown>, id = jobId) {
  const res = await postRoute(request(`/api/jobs/${id}/environment`, jsonBody("POST", body)), p(id));
  return { status: res.status, json: await res.json() };
}

beforeAll(async () => {
  jobId = (await jobLike("TR-2026-0052", "measuring", "TR-ENV")).id;
});

describe("temperatures at the machine", () => {
  it("stores air and machine temperature once per clientId, audited", async () => {
    await signInAs("installer@halvard.example");
    const clientId = crypto.randomUUID();
    const a = await post({ phase: "pre", airTempC: "20,4", machineTempC: 21.2, clientId });
    const b = await post({ phase: "pre", airTempC: "20,4", machineTempC: 21.2, clientId });
    expect([a.status, b.status]).toEqual([201, 200]);
    expect(a.json.record).toMatchObject({ airTempC: 20.4, machineTempC: 21.2, phase: "pre" });
    expect(b.json.record.id).toBe(a.json.record.id);
    expect(
      await db.select().from(environmentRecords).where(eq(environmentRecords.clientId, clientId)),
    ).toHaveLength(1);
    const audit = await db.select().from(auditEvents).where(eq(auditEvents.entityId, a.json.record.id));
    expect(audit.map((x) => x.action)).toEqual(["environment.recorded"]);
  });

  it("refuses an empty record and an implausible temperature (68 typed in °F), naming the field", async () => {
    await signInAs("installer@halvard.example");
    const none = await post({ phase: "pre" });
    expect(none.status).toBe(422);
    expect(none.json.error.issues[0].field).toBe("airTempC");
    const f = await post({ phase: "pre", machineTempC: 68 });
    expect(f.status).toBe(422);
    expect(f.json.error.issues[0]).toMatchObject({
      field: "machineTempC",
      message: expect.stringMatching(/°F/),
    });
  });

  const WHO = {
    anonymous: [null, 401, 401],
    admin: ["admin@halvard.example", 403, 200],
    installer: ["installer@halvard.example", 201, 200],
    inspector: ["inspector@halvard.example", 403, 200],
    engineer: ["engineer@halvard.example", 201, 200],
    "customer (Marlow Creek)": ["buyer@marlowcreek.example", 403, 200],
    "customer (Tollan)": ["buyer@tollan.example", 404, 404],
  } as const;
  for (const [who, [email, add, see]] of Object.entries(WHO)) {
    it(`${who}: POST ${add}, GET ${see}`, async () => {
      await signInAs(email);
      expect((await post({ phase: "post", airTempC: 20 })).status).toBe(add);
      const res = await listRoute(request(`/api/jobs/${jobId}/environment`), p(jobId));
      expect(res.status).toBe(see);
      if (see === 200) expect(((await res.json()).records as unknown[]).length).toBeGreaterThan(0);
    });
  }
});
