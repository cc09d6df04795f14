// Cross-site writes: the probe's DELETE /api/datasets/{id} and uploads with `Origin: http://evil.example`
// were accepted, and POST …/readings took JSON sent as text/plain (a form a page elsewhere can
// send without a preflight). Every state-changing route is tried here from another origin, from
// another port of the same host and with `Sec-Fetch-Site: cross-site`: each is 403 before the
// handler runs; the same request from the app's own origin is not.
// OWASP ASVS v4.0.3 4.2.2 (protection against cross-site request forgery) and 13.2.5 (the
// Content-Type of a request is checked: JSON routes take application/json only).
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as runFit } from "@/app/api/datasets/[id]/analyses/route";
import { DELETE as deleteDataset } from "@/app/api/datasets/[id]/route";
import { POST as saveView } from "@/app/api/analyses/[id]/views/route";
import { POST as authPost } from "@/app/api/auth/[...nextauth]/route";
import { POST as upload } from "@/app/api/jobs/[id]/datasets/route";
import { POST as recordReading } from "@/app/api/jobs/[id]/readings/route";
import { POST as postPhoto } from "@/app/api/jobs/[id]/photos/route";
import { POST as postEnvironment } from "@/app/api/jobs/[id]/environment/route";
import { PUT as recordControlValues } from "@/app/api/jobs/[id]/control-values/route";
import { POST as verifyUpload } from "@/app/api/verify/route";
import { POST as postCustomers } from "@/app/api/customers/route";
import { PATCH as patchCustomersItem } from "@/app/api/customers/[id]/route";
import { POST as postSites } from "@/app/api/sites/route";
import { PATCH as patchSitesItem } from "@/app/api/sites/[id]/route";
import { POST as postMachines } from "@/app/api/machines/route";
import { PATCH as patchMachinesItem } from "@/app/api/machines/[id]/route";
import { POST as postHeads } from "@/app/api/heads/route";
import { PATCH as patchHeadsItem } from "@/app/api/heads/[id]/route";
import { POST as postInstruments } from "@/app/api/instruments/route";
import { PATCH as patchInstrumentsItem } from "@/app/api/instruments/[id]/route";
import { POST as postCalibration } from "@/app/api/instruments/[id]/calibrations/route";
import { POST as postProcedures } from "@/app/api/procedures/route";
import { PATCH as patchProceduresItem } from "@/app/api/procedures/[id]/route";
import { POST as postProcedureVersion } from "@/app/api/procedures/[id]/versions/route";
import { POST as postJobs } from "@/app/api/jobs/route";
import { PATCH as patchJob } from "@/app/api/jobs/[id]/route";
import { NextRequest } from "next/server";
import { db } from "@/db";
import { sql } from "drizzle-orm";
import { jobIdByReference, signInAs } from "./helpers";

type Handler = (req: Request, ctx: unknown) => Promise<Response>;
const ROOT = path.resolve(import.meta.dirname, "../..");
const ids = { job: "", dataset: "", analysis: "" };
/** The office's register routes are tried on an id of no row: the check comes before any lookup. */
const NO_ROW = "00000000-0000-4000-8000-000000000000";

/**
 * A write route by its method and URL path, with the handler and the params to call it with. Its
 * file is the App Router's for that path unless named (next-auth's catch-all).
 */
function write(
  method: string,
  urlPath: string,
  handler: unknown,
  params: () => object = () => ({}),
  file = `app${urlPath.replaceAll("{id}", "[id]")}/route.ts`,
) {
  return { name: `${method} ${urlPath}`, file, method, handler: handler as Handler, params };
}

/** Every write route (method + file), with a handler and params to call it with. */
const WRITES = [
  write("POST", "/api/jobs", postJobs),
  write("PATCH", "/api/jobs/{id}", patchJob, () => ({ id: NO_ROW })),
  write("DELETE", "/api/datasets/{id}", deleteDataset, () => ({ id: ids.dataset })),
  write("POST", "/api/jobs/{id}/datasets", upload, () => ({ id: ids.job })),
  write("POST", "/api/jobs/{id}/photos", postPhoto, () => ({ id: ids.job })),
  write("POST", "/api/jobs/{id}/environment", postEnvironment, () => ({ id: ids.job })),
  write("POST", "/api/jobs/{id}/readings", recordReading, () => ({ id: ids.job })),
  write("PUT", "/api/jobs/{id}/control-values", recordControlValues, () => ({ id: ids.job })),
  write("POST", "/api/datasets/{id}/analyses", runFit, () => ({ id: ids.dataset })),
  write("POST", "/api/analyses/{id}/views", saveView, () => ({ id: ids.analysis })),
  write("POST", "/api/verify", verifyUpload),
  write(
    "POST",
    "/api/auth/callback/credentials",
    authPost,
    () => ({ nextauth: ["callback", "credentials"] }),
    "app/api/auth/[...nextauth]/route.ts",
  ),
  write("POST", "/api/customers", postCustomers),
  write("PATCH", "/api/customers/{id}", patchCustomersItem, () => ({ id: NO_ROW })),
  write("POST", "/api/sites", postSites),
  write("PATCH", "/api/sites/{id}", patchSitesItem, () => ({ id: NO_ROW })),
  write("POST", "/api/machines", postMachines),
  write("PATCH", "/api/machines/{id}", patchMachinesItem, () => ({ id: NO_ROW })),
  write("POST", "/api/heads", postHeads),
  write("PATCH", "/api/heads/{id}", patchHeadsItem, () => ({ id: NO_ROW })),
  write("POST", "/api/instruments", postInstruments),
  write("PATCH", "/api/instruments/{id}", patchInstrumentsItem, () => ({ id: NO_ROW })),
  write("POST", "/api/instruments/{id}/calibrations", postCalibration, () => ({ id: NO_ROW })),
  write("POST", "/api/procedures", postProcedures),
  write("PATCH", "/api/procedures/{id}", patchProceduresItem, () => ({ id: NO_ROW })),
  write("POST", "/api/procedures/{id}/versions", postProcedureVersion, () => ({ id: NO_ROW })),
];

function call(
  w: (typeof WRITES)[number],
  headers: Record<string, string>,
  params: object = w.params(),
  body?: BodyInit,
) {
  // A NextRequest, as Next hands to route handlers (next-auth reads its nextUrl).
  const req = new NextRequest("http://app.test/api/auth/callback/credentials", {
    method: w.method,
    headers: { host: "app.test", ...headers },
    ...(w.method === "DELETE" ? {} : { body: body ?? "{}" }),
  });
  return w.handler(req, { params: Promise.resolve(params) });
}

/** The route's params with every id replaced by a UUID of no record. */
const noRecord = (w: (typeof WRITES)[number]) =>
  Object.fromEntries(
    Object.entries(w.params()).map(([k, v]) => [
      k,
      k === "nextauth" ? v : "00000000-0000-4000-8000-000000000000",
    ]),
  );

beforeAll(async () => {
  ids.job = await jobIdByReference("TR-2026-0052");
  const [row] = (
    await db.execute<{ dataset: string; analysis: string }>(
      sql`select a.dataset_id as dataset, a.id as analysis from analyses a where a.job_id = ${ids.job} limit 1`,
    )
  ).rows;
  ids.dataset = row!.dataset;
  ids.analysis = row!.analysis;
});

describe("cross-origin writes are refused with 403", () => {
  it("the list above is every route that exports POST, PUT, PATCH or DELETE", () => {
    const walk = (d: string): string[] =>
      readdirSync(d).flatMap((e) => {
        const p = path.join(d, e);
        return statSync(p).isDirectory() ? walk(p) : e === "route.ts" ? [p] : [];
      });
    const found = walk(path.join(ROOT, "app/api")).flatMap((f) => {
      const src = readFileSync(f, "utf8");
      return ["POST", "PUT", "PATCH", "DELETE"]
        .filter((m) =>
          new RegExp(
            // export const POST = …, export function POST, export { POST }, export const { POST } = …
            `export (const|async function|function) ${m}\\b|export (const )?\\{[^}]*\\b${m}\\b`,
          ).test(src),
        )
        .map((m) => `${m} ${path.relative(ROOT, f)}`);
    });
    expect(found.sort()).toEqual(WRITES.map((w) => `${w.method} ${w.file}`).sort());
  });

  for (const w of WRITES) {
    describe(w.name, () => {
      for (const [label, headers] of [
        ["another site's Origin", { origin: "http://evil.example" }],
        ["another port of the same host", { origin: "http://app.test:8080" }],
        ["a sandboxed page (Origin: null)", { origin: "null" }],
        ["Sec-Fetch-Site: cross-site", { "sec-fetch-site": "cross-site" }],
        ["Sec-Fetch-Site: same-site", { "sec-fetch-site": "same-site" }],
      ] as const) {
        it(`${label} → 403 forbidden`, async () => {
          await signInAs("admin@halvard.example");
          // Ids of no record: a refused request must not reach the handler, and a broken check
          // would show as a 404 here, never as a change to data other files rely on.
          const res = await call(w, headers, noRecord(w));
          expect(res.status).toBe(403);
          expect((await res.json()).error).toMatchObject({ code: "forbidden" });
        });
      }

      it("the app's own origin gets past the check (whatever the handler then says, not that 403)", async () => {
        await signInAs("admin@halvard.example");
        // next-auth's own handler needs Next's request scope, absent here: reaching it (and throwing) is past the check.
        // Ids of no record, so that nothing the other test files rely on is changed.
        const res = await call(
          w,
          { origin: "http://app.test", "sec-fetch-site": "same-origin" },
          noRecord(w),
        ).catch(() => null);
        if (!res) return expect(w.file).toContain("nextauth");
        const body = res.headers.get("content-type")?.includes("json") ? await res.json() : {};
        expect(body?.error?.message ?? "").not.toMatch(/another (site|origin)/);
      });
    });
  }
});

describe("JSON routes take application/json only", () => {
  it("POST …/readings with a JSON body sent as text/plain is 415 and records nothing", async () => {
    await signInAs("installer@halvard.example");
    const before = await db.execute<{ n: string }>(sql`select count(*)::text as n from readings`);
    for (const type of [
      "text/plain",
      "application/x-www-form-urlencoded",
      "multipart/form-data; boundary=x",
      "",
    ]) {
      const res = await recordReading(
        new Request(`http://app.test/api/jobs/${ids.job}/readings`, {
          method: "POST",
          headers: type ? { "content-type": type } : {},
          body: JSON.stringify({ stepId: "x", value: 1 }),
        }),
        { params: Promise.resolve({ id: ids.job }) },
      );
      expect(res.status).toBe(415);
      expect((await res.json()).error.code).toBe("unsupported_media_type");
    }
    const after = await db.execute<{ n: string }>(sql`select count(*)::text as n from readings`);
    expect(after.rows[0]!.n).toBe(before.rows[0]!.n);
  });
});
