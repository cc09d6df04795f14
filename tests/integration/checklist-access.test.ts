// Matrix cells of the checklist routes: every role, anonymous and each tenant's customer, against
// jobs in different states. Expected answers written out by hand from the product's rules.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as comparisonCsvRoute } from "@/app/api/jobs/[id]/comparison/csv/route";
import { GET as comparisonRoute } from "@/app/api/jobs/[id]/comparison/route";
import { GET as readingsGet } from "@/app/api/jobs/[id]/readings/route";
import { db } from "@/db";
import { instruments, jobs, templateSteps } from "@/db/schema";
import { postReading, WHO, type Who } from "./fixtures";
import { jobIdByReference, request, signInAs } from "./helpers";

/**
 * Per role, one cell per job: `read` is GET of readings, comparison and its CSV; `write` is POST of
 * a reading: 0052 is measuring (installer assigned), 0048 in review, 0041 issued. The office never
 * records readings (segregation of duties, ISO/IEC 17025:2017 §7.5.1); the assigned installer and
 * an application engineer do.
 */
const READ_JOBS = ["TR-2026-0041", "TR-2026-0048", "TR-2026-0052", "TR-2026-0057"];
const WRITE_JOBS = ["TR-2026-0052", "TR-2026-0048", "TR-2026-0041"];
const CELLS: Record<Who, { read: [number, number, number, number]; write: [number, number, number] }> = {
  anonymous: { read: [401, 401, 401, 401], write: [401, 401, 401] },
  admin: { read: [200, 200, 200, 200], write: [403, 403, 403] },
  installer: { read: [200, 200, 200, 404], write: [201, 403, 403] },
  inspector: { read: [200, 200, 200, 200], write: [403, 403, 403] },
  engineer: { read: [200, 200, 200, 200], write: [201, 403, 403] },
  "customer (Marlow Creek)": { read: [200, 404, 200, 200], write: [403, 404, 403] },
  "customer (Tollan)": { read: [404, 200, 404, 404], write: [404, 403, 404] },
};

/** The cells of one job's column, role by role. */
const column = (kind: "read" | "write", col: number) =>
  (Object.keys(CELLS) as Who[]).map((who) => [who, CELLS[who][kind][col]!] as const);

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
  for (const ref of READ_JOBS) ids[ref] = await jobIdByReference(ref);
  const [i] = await db.select().from(instruments).where(eq(instruments.serial, "DTI-0112"));
  validInstrument = i!.id;
});

describe("checklist routes: access matrix", () => {
  for (const [col, ref] of READ_JOBS.entries()) {
    for (const [who, expected] of column("read", col)) {
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

  for (const [col, ref] of WRITE_JOBS.entries()) {
    for (const [who, expected] of column("write", col)) {
      it(`${who}: POST a reading to ${ref} answers ${expected}`, async () => {
        await signInAs(WHO[who]);
        const body = await bodyFor(ref);
        const { status, json } = await postReading(ids[ref]!, body);
        expect(status).toBe(expected);
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
