// Every API route × every role (anonymous, each staff role, each tenant's customer), against the
// real database. The expected answers are written out by hand from the product's rules, not
// computed from lib/policy, so removing a check anywhere on the path makes a cell fail.
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { GET as health } from "@/app/api/health/route";
import { GET as ping } from "@/app/api/ping/route";
import { GET as listJobsRoute } from "@/app/api/jobs/route";
import { GET as jobRoute } from "@/app/api/jobs/[id]/route";
import { GET as readinessRoute } from "@/app/api/jobs/[id]/readiness/route";
import { GET as draftRoute } from "@/app/api/jobs/[id]/report/draft/route";
import { jobIdByReference, request, signInAs } from "./helpers";

const ALL = ["TR-2026-0041", "TR-2026-0048", "TR-2026-0052", "TR-2026-0057"];
const WHO: Record<string, { email: string | null; sees: string[] | "401" }> = {
  anonymous: { email: null, sees: "401" },
  admin: { email: "admin@halvard.example", sees: ALL },
  installer: { email: "installer@halvard.example", sees: ["TR-2026-0041", "TR-2026-0048", "TR-2026-0052"] },
  inspector: { email: "inspector@halvard.example", sees: ALL },
  engineer: { email: "engineer@halvard.example", sees: ALL },
  "customer (Marlow Creek)": {
    email: "buyer@marlowcreek.example",
    sees: ["TR-2026-0041", "TR-2026-0052", "TR-2026-0057"],
  },
  "customer (Tollan)": { email: "buyer@tollan.example", sees: ["TR-2026-0048"] },
};

/** The routes this matrix covers; a route file not listed here fails the last test. */
const COVERED = new Set([
  "app/api/health/route.ts",
  "app/api/jobs/route.ts",
  "app/api/jobs/[id]/route.ts",
  "app/api/jobs/[id]/readiness/route.ts",
  "app/api/jobs/[id]/report/draft/route.ts",
  "app/api/auth/[...nextauth]/route.ts",
  // POST app/api/jobs/route.ts and PATCH app/api/jobs/[id]/route.ts: tests/integration/jobs-office.test.ts
  // tests/integration/checklist-access.test.ts
  "app/api/jobs/[id]/readings/route.ts",
  "app/api/jobs/[id]/comparison/route.ts",
  "app/api/jobs/[id]/comparison/csv/route.ts",
  // tests/integration/datasets-access.test.ts
  "app/api/jobs/[id]/datasets/route.ts",
  "app/api/datasets/[id]/route.ts",
  "app/api/datasets/[id]/file/route.ts",
  "app/api/datasets/[id]/evaluation/route.ts",
  // tests/integration/reports-access.test.ts
  "app/api/reports/[id]/route.ts",
  "app/api/reports/[id]/pdf/route.ts",
  "app/api/verify/route.ts",
  "app/api/verify/[reportId]/route.ts",
  "app/api/report-key/route.ts",
  // tests/integration/analyses-access.test.ts
  "app/api/datasets/[id]/analyses/route.ts",
  "app/api/analyses/[id]/route.ts",
  // tests/integration/views-history-access.test.ts
  "app/api/analyses/[id]/views/route.ts",
  "app/api/analysis-views/[id]/image/route.ts",
  "app/api/heads/[id]/history/route.ts",
  // tests/integration/control-values.test.ts
  "app/api/jobs/[id]/control-values/route.ts",
  // tests/integration/registers-access.test.ts
  "app/api/customers/route.ts",
  "app/api/customers/[id]/route.ts",
  "app/api/sites/route.ts",
  "app/api/sites/[id]/route.ts",
  "app/api/machines/route.ts",
  "app/api/machines/[id]/route.ts",
  "app/api/heads/route.ts",
  "app/api/heads/[id]/route.ts",
  "app/api/instruments/route.ts",
  "app/api/instruments/[id]/route.ts",
  "app/api/instruments/[id]/calibrations/route.ts",
  "app/api/users/route.ts",
  "app/api/procedures/route.ts",
  "app/api/procedures/[id]/route.ts",
  // tests/integration/procedures-access.test.ts
  "app/api/procedures/[id]/versions/route.ts",
  // tests/integration/environment.test.ts
  "app/api/jobs/[id]/environment/route.ts",
  // tests/integration/photos.test.ts
  "app/api/jobs/[id]/photos/route.ts",
  "app/api/photos/[id]/route.ts",
  "app/api/photos/[id]/thumb/route.ts",
  // public, static: the load benchmark's ceiling
  "app/api/ping/route.ts",
]);

describe("API access matrix", () => {
  for (const [who, { email, sees }] of Object.entries(WHO)) {
    describe(who, () => {
      it("GET /api/ping answers 200 with static JSON (public)", async () => {
        await signInAs(email);
        expect(await ping().json()).toEqual({ ok: true });
      });

      it("GET /api/health answers 200 (public)", async () => {
        await signInAs(email);
        const res = await health();
        expect(res.status).toBe(200);
        expect(await res.json()).toEqual({ ok: true, db: "up" });
      });

      it("GET /api/jobs lists exactly the jobs this role and company may see", async () => {
        await signInAs(email);
        const res = await listJobsRoute(request("/api/jobs"), undefined);
        if (sees === "401") {
          expect(res.status).toBe(401);
          expect((await res.json()).error.code).toBe("unauthorized");
          return;
        }
        expect(res.status).toBe(200);
        const body = (await res.json()) as { jobs: { reference: string; customerName: string }[] };
        // Other test files add jobs of their own; the seeded ones must be exactly these.
        expect(
          body.jobs
            .map((j) => j.reference)
            .filter((r) => ALL.includes(r))
            .sort(),
        ).toEqual([...sees].sort());
        if (email?.endsWith("marlowcreek.example"))
          expect(new Set(body.jobs.map((j) => j.customerName))).toEqual(
            new Set(["Marlow Creek Aerostructures"]),
          );
        if (email?.endsWith("tollan.example"))
          expect(new Set(body.jobs.map((j) => j.customerName))).toEqual(new Set(["Tollan Mold Works"]));
      });

      for (const ref of ALL) {
        const expected = sees === "401" ? 401 : sees.includes(ref) ? 200 : 404;
        it(`GET /api/jobs/{${ref}} answers ${expected}`, async () => {
          await signInAs(email);
          const id = await jobIdByReference(ref);
          const res = await jobRoute(request(`/api/jobs/${id}`), { params: Promise.resolve({ id }) });
          expect(res.status).toBe(expected);
          const body = await res.json();
          if (expected === 200) expect(body.job.reference).toBe(ref);
          // Another tenant's job is indistinguishable from a missing one.
          if (expected === 404)
            expect(body).toEqual({ error: { code: "not_found", message: "No such job." } });
        });
      }

      // The blockers before issue are the service company's working list: staff who see the job
      // get them, a customer is refused on its own job and sees nothing of another tenant's.
      for (const ref of ALL) {
        const expected =
          sees === "401" ? 401 : !sees.includes(ref) ? 404 : who.startsWith("customer") ? 403 : 200;
        it(`GET /api/jobs/{${ref}}/readiness answers ${expected}`, async () => {
          await signInAs(email);
          const id = await jobIdByReference(ref);
          const res = await readinessRoute(request(`/api/jobs/${id}/readiness`), {
            params: Promise.resolve({ id }),
          });
          expect(res.status).toBe(expected);
          const body = await res.json();
          if (expected === 200) {
            expect(typeof body.ready).toBe("boolean");
            expect(Array.isArray(body.blockers)).toBe(true);
            for (const b of body.blockers) expect(b.href).toMatch(new RegExp(`^/jobs/${id}/`));
          }
          if (expected === 404)
            expect(body).toEqual({ error: { code: "not_found", message: "No such job." } });
        });
      }

      // The draft preview is the staff's working copy: customers never get it (403 on their own
      // job, 404 on one they may not see), anonymous 401.
      for (const ref of ALL) {
        const expected =
          sees === "401" ? 401 : !sees.includes(ref) ? 404 : who.startsWith("customer") ? 403 : 200;
        it(`GET /api/jobs/{${ref}}/report/draft answers ${expected}`, async () => {
          await signInAs(email);
          const id = await jobIdByReference(ref);
          const res = await draftRoute(request(`/api/jobs/${id}/report/draft`), {
            params: Promise.resolve({ id }),
          });
          expect(res.status).toBe(expected);
          if (expected === 200) {
            expect(res.headers.get("content-type")).toBe("application/pdf");
            expect(
              Buffer.from(await res.arrayBuffer())
                .subarray(0, 5)
                .toString(),
            ).toBe("%PDF-");
          } else await res.body?.cancel();
        }, 30_000);
      }
    });
  }

  it("a job id that does not exist is 404, and a malformed id is 404 too", async () => {
    await signInAs("admin@halvard.example");
    for (const id of ["00000000-0000-4000-8000-000000000000", "not-a-uuid", "' or 1=1 --"]) {
      const res = await jobRoute(request(`/api/jobs/x`), { params: Promise.resolve({ id }) });
      expect(res.status).toBe(404);
    }
  });

  it("filters on the jobs list are validated (422 names the field)", async () => {
    await signInAs("admin@halvard.example");
    const res = await listJobsRoute(request("/api/jobs?status=finished"), undefined);
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error.issues[0].field).toBe("status");
  });

  it("covers every route handler in app/api", () => {
    const found: string[] = [];
    const walk = (dir: string) => {
      for (const name of readdirSync(dir)) {
        const p = path.join(dir, name);
        if (statSync(p).isDirectory()) walk(p);
        else if (name === "route.ts") found.push(path.relative(process.cwd(), p));
      }
    };
    walk(path.join(process.cwd(), "app/api"));
    const missing = found.filter((f) => !COVERED.has(f));
    expect(missing, `routes without an access-matrix entry: ${missing.join(", ")}`).toEqual([]);
  });
});
