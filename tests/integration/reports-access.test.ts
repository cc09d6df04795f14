// Report routes × every role and tenant, against the seeded issued report of TR-2026-0041
// (Marlow Creek). Expected answers written out by hand. Verification routes are public by design.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as reportPdf } from "@/app/api/reports/[id]/pdf/route";
import { GET as reportMeta } from "@/app/api/reports/[id]/route";
import { GET as reportKey } from "@/app/api/report-key/route";
import { GET as verifyById } from "@/app/api/verify/[reportId]/route";
import { POST as verifyUpload } from "@/app/api/verify/route";
import { db } from "@/db";
import { reports } from "@/db/schema";
import { sha256Hex } from "@/lib/report/signing";
import { jobIdByReference, request, signInAs } from "./helpers";

const WHO: Record<string, { email: string | null; expect: 200 | 401 | 404 }> = {
  anonymous: { email: null, expect: 401 },
  admin: { email: "admin@halvard.example", expect: 200 },
  installer: { email: "installer@halvard.example", expect: 200 },
  inspector: { email: "inspector@halvard.example", expect: 200 },
  engineer: { email: "engineer@halvard.example", expect: 200 },
  "customer (Marlow Creek)": { email: "buyer@marlowcreek.example", expect: 200 },
  "customer (Tollan)": { email: "buyer@tollan.example", expect: 404 },
};

async function seededReport() {
  const jobId = await jobIdByReference("TR-2026-0041");
  const [r] = await db.select().from(reports).where(eq(reports.jobId, jobId));
  if (!r) throw new Error("the seed issues a report for TR-2026-0041");
  return r;
}

describe("report routes", () => {
  for (const [who, { email, expect: status }] of Object.entries(WHO)) {
    it(`${who}: GET /api/reports/{id} and /pdf answer ${status}`, async () => {
      const r = await seededReport();
      await signInAs(email);
      const meta = await reportMeta(request(`/api/reports/${r.id}`), {
        params: Promise.resolve({ id: r.id }),
      });
      expect(meta.status).toBe(status);
      const pdf = await reportPdf(request(`/api/reports/${r.id}/pdf`), {
        params: Promise.resolve({ id: r.id }),
      });
      expect(pdf.status).toBe(status);
      if (status === 200) {
        const bytes = Buffer.from(await pdf.arrayBuffer());
        expect(sha256Hex(bytes)).toBe(r.pdfSha256);
        expect(pdf.headers.get("content-type")).toBe("application/pdf");
        const body = await meta.json();
        expect(body.signatures.map((s: { meaning: string }) => s.meaning)).toEqual([
          "performed",
          "inspected",
          "parameters_approved",
          "approved",
        ]);
      }
      if (status === 404)
        expect(await meta.json()).toEqual({ error: { code: "not_found", message: "No such report." } });
    });

    it(`${who}: verification and the public key are public`, async () => {
      const r = await seededReport();
      await signInAs(email);
      const byId = await verifyById(request(`/api/verify/${r.id}`), {
        params: Promise.resolve({ reportId: r.id }),
      });
      expect(byId.status).toBe(200);
      // What the service holds, vouching for no file; only the uploaded file below is authentic.
      expect(await byId.json()).toMatchObject({ checked: "record", recordIntact: true, authentic: false });
      const form = new FormData();
      form.set("file", new File([new Uint8Array(r.pdf)], "report.pdf", { type: "application/pdf" }));
      const up = await verifyUpload(request("/api/verify", { method: "POST", body: form }), undefined);
      expect(up.status).toBe(200);
      const checked = await up.json();
      expect(checked.report.revision).toBe(1);
      expect(checked).toMatchObject({ checked: "file", authentic: true, fileSha256: r.pdfSha256 });
      const key = await reportKey();
      expect((await key.json()).algorithm).toBe("Ed25519");
    });
  }

  it("POST /api/verify refuses an empty upload with a reason, and an oversized one with 413", async () => {
    const empty = await verifyUpload(
      request("/api/verify", { method: "POST", body: new Uint8Array(0) }),
      undefined,
    );
    expect(empty.status).toBe(422);
    const big = await verifyUpload(
      request("/api/verify", {
        method: "POST",
        headers: { "content-length": String(21 * 1024 * 1024) },
        body: new Uint8Array(8),
      }),
      undefined,
    );
    expect(big.status).toBe(413);
  });

  it("GET /api/verify/{unknown} is 404 and says not authentic", async () => {
    const id = "00000000-0000-4000-8000-000000000000";
    const res = await verifyById(request(`/api/verify/${id}`), { params: Promise.resolve({ reportId: id }) });
    expect(res.status).toBe(404);
    expect((await res.json()).authentic).toBe(false);
  });
});
