// The draft preview of a report, read back with poppler's pdftotext (an independent reader): it
// says DRAFT and carries no signature and no verification block, even on a job whose issued
// report is signed, and it stores nothing. ISO/IEC 17025:2017 §7.8.1.1 (only an authorized,
// issued report is a report) and 21 CFR 11.50 (a signature is never implied where none was given).
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as draftRoute } from "@/app/api/jobs/[id]/report/draft/route";
import { db } from "@/db";
import { auditEvents, reports, signatures } from "@/db/schema";
import { SIGNATURE_LABELS } from "@/lib/domain/signatures";
import { pdfText } from "../pdf-tools";
import { jobIdByReference, request, signInAs } from "./helpers";

async function draftText(ref: string): Promise<string> {
  await signInAs("engineer@halvard.example");
  const id = await jobIdByReference(ref);
  const res = await draftRoute(request(`/api/jobs/${id}/report/draft`), { params: Promise.resolve({ id }) });
  expect(res.status).toBe(200);
  expect(res.headers.get("content-disposition")).toContain("DRAFT");
  return pdfText(Buffer.from(await res.arrayBuffer()));
}

describe("the draft preview (GET /api/jobs/{id}/report/draft)", () => {
  it("on an issued job: says DRAFT and prints none of the signatures the issued report carries", async () => {
    const id = await jobIdByReference("TR-2026-0041");
    const signed = await db.select().from(signatures).where(eq(signatures.jobId, id));
    expect(signed.length).toBeGreaterThan(0);
    const [reportsBefore, eventsBefore] = await Promise.all([
      db.select({ id: reports.id }).from(reports).where(eq(reports.jobId, id)),
      db.select({ id: auditEvents.id }).from(auditEvents).where(eq(auditEvents.jobId, id)),
    ]);
    const text = await draftText("TR-2026-0041");
    expect(text).toContain("DRAFT");
    expect(text).toContain("not signed, not issued");
    expect(text).toContain("Statement of conformity");
    expect(text).not.toContain("Signed electronically");
    expect(text).not.toContain("Verify this report");
    expect(text).not.toContain("10 Signatures");
    for (const s of signed) expect(text).not.toContain(SIGNATURE_LABELS[s.meaning]);
    // Nothing is stored or audited by a preview.
    expect(await db.select({ id: reports.id }).from(reports).where(eq(reports.jobId, id))).toEqual(
      reportsBefore,
    );
    expect(
      await db.select({ id: auditEvents.id }).from(auditEvents).where(eq(auditEvents.jobId, id)),
    ).toEqual(eventsBefore);
  }, 30_000);

  it("on a job in review: the record as it stands, marked not issued", async () => {
    const text = await draftText("TR-2026-0048");
    expect(text).toContain("DRAFT, not issued");
    expect(text).not.toContain("Signed electronically");
  }, 30_000);
});
