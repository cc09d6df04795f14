// Matrix cells of the checklist routes: every role, anonymous and each tenant's customer, against
// jobs in different states. Expected answers written out by hand from the product's rules.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as comparisonCsvRoute } from "@/app/api/jobs/[id]/comparison/csv/route";
import { GET as comparisonRoute } from "@/app/api/jobs/[id]/comparison/route";
import { GET as readingsGet, POST as readingsPost } from "@/app/api/jobs/[id]/readings/route";
import { db } from "@/db";
import { instruments, jobs, templateSteps } from "@/db/schema";
import { WHO, type Who } from "./fixtures";
import { jobIdByReference, request, signInAs } from "./helpers";

/** GET of readings, comparison and its CSV: who may read which job. */
const READ: Record<string, Record<Who, number>> = {
  "TR-2026-0041": {
    anonymous: 401,
    admin: 200,
    installer: 200,
    inspector: 200,
    engineer: 200,
    "customer (Marlow Creek)": 200,
    "customer (Tollan)": 404,
  },
  "TR-2026-0048": {
    anonymous: 401,
    admin: 200,
    installer: 200,
    inspector: 200,
    engineer: 200,
    "customer (Marlow Creek)": 404,
    "customer (Tollan)": 200,
  },
  "TR-2026-0052": {
    anonymous: 401,
    admin: 200,
    installer: 200,
    inspector: 200,
    engineer: 200,
    "customer (Marlow Creek)": 200,
    "customer (Tollan)": 404,
  },
  "TR-2026-0057": {
    anonymous: 401,
    admin: 200,
    installer: 404,
    inspector: 200,
    engineer: 200,
    "customer (Marlow Creek)": 200,
    "customer (Tollan)": 404,
  },
};

/**
 * POST of a reading: 0052 is measuring (installer assigned), 0048 in review, 0041 issued. The
 * office never records readings (segregation of duties, ISO/IEC 17025:2017 §7.5.1); the assigned
 * installer and an application engineer do.
 */
const WRITE: Record<string, Record<Who, number>> = {
  "TR-2026-0052": {
    anonymous: 401,
    admin: 403,
    installer: 201,
    inspector: 403,
    engineer: 201,
    "customer (Marlow Creek)": 403,
    "customer (Tollan)": 404,
  },
  "TR-2026-0048": {
    anonymous: 401,
    admin: 403,
    installer: 403,
    inspector: 403,
    engineer: 403,
    "customer (Marlow Creek)": 404,
    "customer (Tollan)": 403,
  },
  "TR-2026-0041": {
    anonymous: 401,
    admin: 403,
    installer: 403,
    inspector: 403,
    engineer: 403,
    "customer (Marlow Creek)": 403,
    "customer (Tollan)": 404,
  },
};

const ids: Record<string, string> = {};
let validInstrument: string;

async function bodyFor(ref: string) {
  const [job] = await db.select().from(jobs).where(eq(jobs.id, ids[ref]!));
  const [step] = await db
    .select()
    .from(templateSteps)
    .where(and(eq(templateSteps.templateId, job!.templateId!), eq(templateSteps.position, 1)));
  return {
    stepId: step!.id,
    phase: "post",
    value: 0.0004,
    unit: "in",
    instrumentId: validInstrument,
    note: "matrix cell",
  };
}

beforeAll(async () => {
  for (const ref of Object.keys(READ)) ids[ref] = await jobIdByReference(ref);
  const [i] = await db.select().from(instruments).where(eq(instruments.serial, "DTI-0112"));
  validInstrument = i!.id;
});

describe("checklist routes: access matrix", () => {
  for (const [ref, cells] of Object.entries(READ)) {
    for (const [who, expected] of Object.entries(cells) as [Who, number][]) {
      it(`${who}: GET readings, comparison and CSV of ${ref} answer ${expected}`, async () => {
        await signInAs(WHO[who]);
        const ctx = { params: Promise.resolve({ id: ids[ref]! }) };
        const responses = [
          await readingsGet(request(`/api/jobs/${ids[ref]}/readings`), ctx),
          await comparisonRoute(request(`/api/jobs/${ids[ref]}/comparison`), ctx),
          await comparisonCsvRoute(request(`/api/jobs/${ids[ref]}/comparison/csv`), ctx),
        ];
        for (const res of responses) {
          expect(res.status).toBe(expected);
          if (expected === 404)
            expect(await res.json()).toEqual({ error: { code: "not_found", message: "No such job." } });
        }
      });
    }
  }

  for (const [ref, cells] of Object.entries(WRITE)) {
    for (const [who, expected] of Object.entries(cells) as [Who, number][]) {
      it(`${who}: POST a reading to ${ref} answers ${expected}`, async () => {
        await signInAs(WHO[who]);
        const body = await bodyFor(ref);
        const res = await readingsPost(
          request(`/api/jobs/${ids[ref]}/readings`, {
            method: "POST",
            body: JSON.stringify(body),
            headers: { "content-type": "application/json" },
          }),
          { params: Promise.resolve({ id: ids[ref]! }) },
        );
        expect(res.status).toBe(expected);
        const json = await res.json();
        if (expected === 201)
          expect(json.reading).toMatchObject({ unit: "mm", entered: { value: 0.0004, unit: "in" } });
        if (expected === 404) expect(json).toEqual({ error: { code: "not_found", message: "No such job." } });
        if (expected === 403) expect(json.error.code).toBe("forbidden");
      });
    }
  }

  it("a job id that does not exist, or is malformed, is 404 for the checklist routes", async () => {
    await signInAs("admin@halvard.example");
    for (const id of ["00000000-0000-4000-8000-000000000000", "not-a-uuid"]) {
      const ctx = { params: Promise.resolve({ id }) };
      expect((await readingsGet(request("/x"), ctx)).status).toBe(404);
      expect((await comparisonRoute(request("/x"), ctx)).status).toBe(404);
    }
  });
});
