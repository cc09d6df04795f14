// The signed report against the real database: signing with password re-entry, issue in one
// transaction (a failure between render and commit leaves nothing), immutability enforced by
// PostgreSQL, verification from stored bytes and its tamper cases, customer acceptance, amendment.
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { issueReport, respondToReport } from "@/db/queries/reports";
import { signJobWork } from "@/db/queries/signatures";
import { verifyPdfFile, verifyReport } from "@/db/queries/verification";
import { jobs, outbox, reports, signatures } from "@/db/schema";
import { actorsBeforeAll, dbError, DEMO_PASSWORD as PW, refusalOf, insertTestJob } from "./fixtures";

let jobId: string;
const as = actorsBeforeAll();

beforeAll(async () => {
  // A job of its own, so other tests' data is untouched.
  jobId = await insertTestJob({
    tag: "TEST",
    title: "Report test job",
  });
});

describe("signing before issue", () => {
  it("refuses a signature without the right password", async () => {
    const e = await refusalOf(signJobWork(as.installer!, { jobId, meaning: "performed", password: "wrong" }));
    expect(e.status).toBe(422);
    expect(e.issues?.[0]).toMatchObject({ field: "password" });
    expect(await db.select().from(signatures).where(eq(signatures.jobId, jobId))).toHaveLength(0);
  });

  it("records the installer's and the inspector's signatures with name, meaning and UTC time", async () => {
    await signJobWork(as.installer!, { jobId, meaning: "performed", password: PW });
    await signJobWork(as.inspector!, { jobId, meaning: "inspected", password: PW });
    const rows = await db.select().from(signatures).where(eq(signatures.jobId, jobId));
    expect(rows.map((r) => r.meaning).sort()).toEqual(["inspected", "performed"]);
    for (const r of rows) expect((r.manifest as { signedAtUtc: string }).signedAtUtc).toMatch(/Z$/);
  });

  it("refuses the wrong role and a second identical signature", async () => {
    expect(
      (await refusalOf(signJobWork(as.engineer!, { jobId, meaning: "inspected", password: PW }))).status,
    ).toBe(403);
    expect(
      (await refusalOf(signJobWork(as.installer!, { jobId, meaning: "performed", password: PW }))).status,
    ).toBe(422);
  });

  it("another tenant's customer cannot even see the job (404)", async () => {
    expect((await refusalOf(issueReport(as["buyer-tollan"]!, { jobId, password: PW }))).status).toBe(404);
  });
});

describe("issuing the report", () => {
  it("is refused before the parameters are approved, and for anyone but an engineer", async () => {
    expect((await refusalOf(issueReport(as.engineer!, { jobId, password: PW }))).status).toBe(403);
    await db.update(jobs).set({ status: "approved" }).where(eq(jobs.id, jobId));
    expect((await refusalOf(issueReport(as.inspector!, { jobId, password: PW }))).status).toBe(403);
    expect((await refusalOf(issueReport(as.engineer!, { jobId, password: "wrong" }))).status).toBe(422);
  });

  it("leaves nothing behind when it fails between rendering and commit", async () => {
    await expect(
      issueReport(
        as.engineer!,
        { jobId, password: PW },
        {
          afterRender: () => {
            throw new Error("injected crash");
          },
        },
      ),
    ).rejects.toThrow("injected crash");
    expect(await db.select().from(reports).where(eq(reports.jobId, jobId))).toHaveLength(0);
    expect(await db.select().from(outbox).where(eq(outbox.jobId, jobId))).toHaveLength(0);
    expect((await db.select({ s: jobs.status }).from(jobs).where(eq(jobs.id, jobId)))[0]!.s).toBe("approved");
  });

  it("stores the PDF, signs its hash, moves the job to issued and queues the customer's e-mail, together", async () => {
    const { reportId, revision } = await issueReport(as.engineer!, { jobId, password: PW });
    expect(revision).toBe(1);
    expect((await db.select({ s: jobs.status }).from(jobs).where(eq(jobs.id, jobId)))[0]!.s).toBe("issued");
    const mail = await db.select().from(outbox).where(eq(outbox.jobId, jobId));
    expect(mail.map((m) => m.toAddress)).toContain("buyer@marlowcreek.example");
    expect(mail.every((m) => m.textBody.includes(`/jobs/${jobId}/report`))).toBe(true);
    const v = await verifyReport(reportId);
    // The record held for an id is intact, but no file was checked, so nothing is called authentic.
    expect(v).toMatchObject({ checked: "record", recordIntact: true, authentic: false });
    expect(v.statement).toMatch(/vouches for no file/);
    expect(v.report!.acceptance).toBe("awaiting");
    expect(v.signatures!.map((s) => s.meaning)).toEqual([
      "Work performed",
      "Inspected",
      "Approved and issued",
    ]);
    expect(v.signatures!.every((s) => s.valid && /UTC$/.test(s.signedAtUtc))).toBe(true);
  });
});

describe("an issued revision cannot change", () => {
  it("PostgreSQL refuses UPDATE and DELETE of reports and signatures", async () => {
    expect(await dbError(db.execute(sql`update reports set revision = 9 where job_id = ${jobId}`))).toMatch(
      /immutable/,
    );
    expect(await dbError(db.execute(sql`delete from reports where job_id = ${jobId}`))).toMatch(/immutable/);
    expect(
      await dbError(db.execute(sql`update signatures set signer_name = 'x' where job_id = ${jobId}`)),
    ).toMatch(/immutable/);
  });
});

describe("verification of a PDF someone holds", () => {
  it("accepts the exact bytes and refuses a flipped byte, a truncation or an appended byte", async () => {
    const [r] = await db.select().from(reports).where(eq(reports.jobId, jobId));
    const pdf = r!.pdf;
    const ok = await verifyPdfFile(pdf);
    expect(ok).toMatchObject({ checked: "file", authentic: true, fileSha256: r!.pdfSha256 });
    for (const i of [0, 100, Math.floor(pdf.length / 2), pdf.length - 1]) {
      const copy = Buffer.from(pdf);
      copy[i] = copy[i]! ^ 0x01;
      expect((await verifyPdfFile(copy)).authentic).toBe(false);
    }
    expect((await verifyPdfFile(pdf.subarray(0, pdf.length - 1))).authentic).toBe(false);
    expect((await verifyPdfFile(Buffer.concat([pdf, Buffer.from(" ")]))).authentic).toBe(false);
  });

  it("detects an edited manifest field or a signature swapped in from another report (simulated by a superuser)", async () => {
    const [r] = await db.select().from(reports).where(eq(reports.jobId, jobId));
    const edits = [
      sql`manifest = jsonb_set(manifest, '{signer,name}', '"Someone Else"')`,
      sql`manifest = jsonb_set(manifest, '{revision}', '2')`,
      sql`signature = (select signature from signatures s2 where s2.id <> signatures.id and s2.job_id = signatures.job_id limit 1)`,
    ];
    for (const edit of edits) {
      await db
        .transaction(async (tx) => {
          await tx.execute(sql`alter table signatures disable trigger signatures_immutable`);
          await tx.execute(sql`update signatures set ${edit} where report_id = ${r!.id}`);
          const v = await verifyReport(r!.id, tx);
          expect(v.recordIntact).toBe(false);
          throw new Error("rollback");
        })
        .catch((e: Error) => expect(e.message).toBe("rollback"));
    }
    expect((await verifyReport(r!.id)).recordIntact).toBe(true);
  });

  it("says so for an unknown id or a foreign file", async () => {
    expect(await verifyReport("00000000-0000-4000-8000-000000000000")).toMatchObject({
      authentic: false,
      recordIntact: false,
    });
    expect((await verifyPdfFile(Buffer.from("%PDF-1.4 not ours"))).reason).toMatch(/not, byte for byte/);
  });
});

describe("customer response and amendment", () => {
  it("only the job's own customer responds; a rejection needs a comment and the password", async () => {
    const [r] = await db.select().from(reports).where(eq(reports.jobId, jobId));
    expect(
      (
        await refusalOf(
          respondToReport(as["buyer-tollan"]!, { reportId: r!.id, decision: "accepted", password: PW }),
        )
      ).status,
    ).toBe(404);
    expect(
      (await refusalOf(respondToReport(as.buyer!, { reportId: r!.id, decision: "rejected", password: PW })))
        .status,
    ).toBe(422);
    expect(
      (
        await refusalOf(
          respondToReport(as.buyer!, {
            reportId: r!.id,
            decision: "rejected",
            password: "nope",
            comment: "Bore out of round",
          }),
        )
      ).status,
    ).toBe(422);
    await respondToReport(as.buyer!, {
      reportId: r!.id,
      decision: "rejected",
      password: PW,
      comment: "The test bore was measured on the wrong machine.",
    });
    expect((await db.select({ s: jobs.status }).from(jobs).where(eq(jobs.id, jobId)))[0]!.s).toBe("rejected");
    const toEngineer = await db
      .select()
      .from(outbox)
      .where(and(eq(outbox.jobId, jobId), eq(outbox.toAddress, "engineer@halvard.example")));
    expect(toEngineer[0]!.textBody).toContain("wrong machine");
  });

  it("an amendment is a new revision that names and supersedes the earlier one", async () => {
    const [r1] = await db.select().from(reports).where(eq(reports.jobId, jobId));
    expect((await refusalOf(issueReport(as.engineer!, { jobId, password: PW }))).status).toBe(422);
    const { reportId, revision } = await issueReport(as.engineer!, {
      jobId,
      password: PW,
      amendmentReason: "Test bore re-measured on the customer's machine.",
    });
    expect(revision).toBe(2);
    const v1 = await verifyReport(r1!.id);
    expect(v1.recordIntact).toBe(true);
    // The customer's rejection is stated, its comment is not: the public answer carries no comments.
    expect(v1.report!.acceptance).toBe("rejected");
    expect(JSON.stringify(v1)).not.toContain("measured on the wrong machine");
    expect(v1.report!.supersededBy).toEqual({ id: reportId, revision: 2 });
    const v2 = await verifyReport(reportId);
    expect(v2.report!.amendmentOf).toEqual({ id: r1!.id, revision: 1 });
    expect(
      (await refusalOf(respondToReport(as.buyer!, { reportId: r1!.id, decision: "accepted", password: PW })))
        .status,
    ).toBe(403);
    await respondToReport(as.buyer!, { reportId, decision: "accepted", password: PW });
    expect((await db.select({ s: jobs.status }).from(jobs).where(eq(jobs.id, jobId)))[0]!.s).toBe("accepted");
    expect((await verifyReport(reportId)).signatures!.map((s) => s.meaning)).toContain(
      "Accepted by the customer",
    );
  });
});
