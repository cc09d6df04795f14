import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { jobs, reports, signatures } from "@/db/schema";
import { ROLE_LABELS, SIGNATURE_LABELS } from "@/lib/auth/roles";
import { formatDateTimeUtc } from "@/lib/format";
import { getSigningKey } from "@/lib/report/keys";
import { sha256Hex, verifyManifest, type SignatureManifest } from "@/lib/report/signing";
import type { VerificationResult } from "@/lib/report/types";

export type { VerificationResult };

/**
 * Public verification of an issued revision, from the stored bytes (never a re-render): the
 * stored PDF must still hash to the recorded SHA-256, and every signature over it, and every
 * signature given before issue, must verify with the published key.
 */
export async function verifyReport(
  reportId: string,
  exec: Pick<typeof db, "select"> = db,
): Promise<VerificationResult> {
  if (!/^[0-9a-f-]{36}$/i.test(reportId))
    return { authentic: false, reason: "There is no report with this id." };
  const [r] = await exec
    .select({
      id: reports.id,
      jobId: reports.jobId,
      revision: reports.revision,
      pdf: reports.pdf,
      pdfSha256: reports.pdfSha256,
      issuedAt: reports.issuedAt,
      supersedesId: reports.supersedesId,
      reference: jobs.reference,
    })
    .from(reports)
    .innerJoin(jobs, eq(jobs.id, reports.jobId))
    .where(eq(reports.id, reportId));
  if (!r) return { authentic: false, reason: "There is no report with this id." };
  const key = getSigningKey();
  const sigs = await exec
    .select()
    .from(signatures)
    .where(
      and(
        eq(signatures.jobId, r.jobId),
        sql`(${signatures.reportId} = ${r.id} or (${signatures.reportId} is null and ${signatures.signedAt} <= ${r.issuedAt}))`,
      ),
    )
    .orderBy(asc(signatures.signedAt));
  const checked = sigs.map((s) => {
    const m = s.manifest as SignatureManifest;
    const bindsThis = s.reportId
      ? m.reportId === r.id && m.pdfSha256 === r.pdfSha256 && m.revision === r.revision
      : m.jobId === r.jobId && m.reportId === null;
    const consistent =
      m.meaning === s.meaning && m.signer.id === s.signerId && m.signedAtUtc === s.signedAt.toISOString();
    return {
      meaning: SIGNATURE_LABELS[s.meaning],
      name: s.signerName,
      role: ROLE_LABELS[s.signerRole],
      signedAtUtc: formatDateTimeUtc(s.signedAt),
      valid: bindsThis && consistent && verifyManifest(m, s.signature, key.publicKey),
      comment: s.comment,
    };
  });
  const [newer] = await exec
    .select({ id: reports.id, revision: reports.revision })
    .from(reports)
    .where(eq(reports.supersedesId, r.id));
  const [older] = r.supersedesId
    ? await exec
        .select({ id: reports.id, revision: reports.revision })
        .from(reports)
        .where(eq(reports.id, r.supersedesId))
    : [];
  const bytesIntact = sha256Hex(r.pdf) === r.pdfSha256;
  const allValid =
    checked.length > 0 &&
    checked.every((c) => c.valid) &&
    checked.some((c) => c.meaning === SIGNATURE_LABELS.approved);
  return {
    authentic: bytesIntact && allValid,
    ...(bytesIntact
      ? allValid
        ? {}
        : { reason: "A signature on this report does not verify." }
      : { reason: "The stored file no longer matches its recorded SHA-256." }),
    report: {
      id: r.id,
      reference: r.reference,
      revision: r.revision,
      issuedAtUtc: formatDateTimeUtc(r.issuedAt),
      pdfSha256: r.pdfSha256,
      supersededBy: newer ?? null,
      amendmentOf: older ?? null,
    },
    signatures: checked,
    keyId: key.keyId,
  };
}

/** Verification of a PDF someone holds: its bytes must be exactly those of an issued revision. */
export async function verifyPdfFile(bytes: Uint8Array): Promise<VerificationResult> {
  const hash = sha256Hex(bytes);
  const [r] = await db.select({ id: reports.id }).from(reports).where(eq(reports.pdfSha256, hash));
  if (!r)
    return {
      authentic: false,
      reason:
        "This file is not, byte for byte, a report issued by this service: it was altered, or it is another file.",
    };
  return verifyReport(r.id);
}
