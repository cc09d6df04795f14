import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { jobs, reports, signatures } from "@/db/schema";
import { ROLE_LABELS } from "@/lib/domain/roles";
import { SIGNATURE_LABELS } from "@/lib/domain/signatures";
import { formatDateTimeUtc } from "@/lib/format";
import { getSigningKey } from "@/lib/report/keys";
import { sha256Hex, verifyManifest, type SignatureManifest } from "@/lib/report/signing";
import type { VerificationResult } from "@/lib/report/types";
import { isUuid } from "@/lib/domain/uuid";

export type { VerificationResult };

/**
 * What is read of an issued revision wherever it is listed or checked: which revision of which
 * job, the hashes it vouches for, when, and what it amends.
 */
export const revisionColumns = {
  id: reports.id,
  jobId: reports.jobId,
  revision: reports.revision,
  pdfSha256: reports.pdfSha256,
  contentSha256: reports.contentSha256,
  issuedAt: reports.issuedAt,
  supersedesId: reports.supersedesId,
  amendmentReason: reports.amendmentReason,
};

/**
 * Public verification of an issued revision, from the stored bytes (never a re-render): the
 * stored PDF must still hash to the recorded SHA-256, and every signature over it, and every
 * signature given before issue, must verify with the published key.
 */
export async function verifyReport(
  reportId: string,
  exec: Pick<typeof db, "select"> = db,
): Promise<VerificationResult> {
  const none: VerificationResult = {
    checked: "record",
    authentic: false,
    recordIntact: false,
    statement: NO_RECORD,
    reason: "There is no report with this id.",
  };
  if (!isUuid(reportId)) return none;
  const [r] = await exec
    .select({ ...revisionColumns, pdf: reports.pdf, reference: jobs.reference })
    .from(reports)
    .innerJoin(jobs, eq(jobs.id, reports.jobId))
    .where(eq(reports.id, reportId));
  if (!r) return none;
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
      answer:
        s.reportId === r.id && (s.meaning === "accepted" || s.meaning === "rejected") ? s.meaning : null,
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
  const recordIntact = bytesIntact && allValid;
  const answer = checked.find((c) => c.answer)?.answer ?? "awaiting";
  return {
    checked: "record",
    authentic: false,
    recordIntact,
    statement: recordIntact ? RECORD_HELD : RECORD_BROKEN,
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
      contentSha256: r.contentSha256,
      supersededBy: newer ?? null,
      amendmentOf: older ?? null,
      acceptance: answer,
    },
    signatures: checked.map(({ answer: _answer, ...c }) => c),
    keyId: key.keyId,
  };
}

const NO_RECORD = "The service holds no issued report with this id.";
const RECORD_HELD =
  "This is what the service holds for this report id. It vouches for no file by itself: a copy is authentic only when its bytes are checked here (upload the PDF) and match the SHA-256 of the PDF below.";
const RECORD_BROKEN =
  "The record held for this id does not verify; no copy of it can be vouched for. Contact the issuer.";

/**
 * Verification of a PDF someone holds: its bytes must be exactly those of an issued revision whose
 * stored record verifies. Only this answer says "authentic", with the checked file's SHA-256.
 */
export async function verifyPdfFile(bytes: Uint8Array): Promise<VerificationResult> {
  const hash = sha256Hex(bytes);
  const [r] = await db.select({ id: reports.id }).from(reports).where(eq(reports.pdfSha256, hash));
  if (!r)
    return {
      checked: "file",
      authentic: false,
      recordIntact: false,
      fileSha256: hash,
      statement: "The file was checked and is not vouched for.",
      reason:
        "This file is not, byte for byte, a report issued by this service: it was altered, or it is another file.",
    };
  const held = await verifyReport(r.id);
  return {
    ...held,
    checked: "file",
    authentic: held.recordIntact,
    fileSha256: hash,
    statement: held.recordIntact
      ? "The file was checked: its SHA-256 is that of the issued revision below, and every signature over it verifies."
      : held.statement,
  };
}
