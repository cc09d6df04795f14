import "server-only";
import { checkPasswordReentry } from "@/db/queries/sign-in";
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { insertJobRecord } from "@/db/queries/audit";
import { getJobDetail, rowsOfJob, visibleJob } from "@/db/queries/jobs";
import { datasets, photos, readings, signatures } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { SIGNATURE_LABELS, type SignatureMeaningKey } from "@/lib/domain/signatures";
import { sameSignerRefusal, signatureRefusal } from "@/lib/policy/signatures";
import { env } from "@/lib/env";
import { canonicalJson } from "@/lib/canonical-json";
import { forbidden, invalid } from "@/lib/errors";
import { getSigningKey } from "@/lib/report/keys";
import { sha256Hex, signManifest, type SignatureManifest } from "@/lib/report/signing";

/**
 * Signatures on a job: the password re-entry every signature asks for, the manifest each one
 * signs, the pre-issue signatures (performed, inspected) over a hash of the job's recorded state,
 * and the list of a job's signatures. Issue and the customer's answer sign inside
 * db/queries/reports.ts, in the same transaction as the report they bind to.
 */

/** Re-entry of the password at signing (21 CFR 11.200): the signer proves it is them, now. */
export async function requirePasswordReentry(actor: Actor, password: string): Promise<void> {
  await checkPasswordReentry(actor, password);
}

/** What the job-state hash covers of each reading, dataset and photo (see jobStateSha256). */
const STATE_COLUMNS = {
  readings: {
    id: readings.id,
    value: readings.value,
    phase: readings.phase,
    instrumentId: readings.instrumentId,
    supersededById: readings.supersededById,
  },
  datasets: { id: datasets.id, sha256: datasets.sha256, status: datasets.status },
  photos: { id: photos.id, sha256: photos.sha256, readingId: photos.readingId },
};

/**
 * A hash of what has been recorded on the job (its current and superseded readings, with value,
 * phase and instrument, its datasets with their SHA-256 and status, and its photos with their
 * SHA-256 and the reading each shows), so a pre-issue signature says what it covered: a reading,
 * dataset or photo recorded later changes it, and the readiness check (lib/report/readiness.ts)
 * then asks for the signature again. Status changes do not change it.
 *
 * The control's values (as found and as left, db/queries/control-values.ts) are deliberately not
 * part of it. "Performed" and "inspected" vouch for the measurements taken on the head; the values
 * to enter follow from the approved fit, and the as-left values are typed into the control and
 * recorded only after approval, when the inspector has usually signed already: counting them here
 * would make every inspection stale by the normal order of the work, and would let a value the
 * inspector never saw pass as inspected after re-signing by habit. Each record carries its own
 * author, time and audit event instead, and the issued report vouches for them: they are printed
 * in 5.1 and are part of the report's content, whose SHA-256 (lib/report/build.ts) the approval
 * signature covers with the PDF. The TCP check taken after approval is a dataset, so it does make
 * the signatures stale: it is a measurement on the head.
 */
export async function jobStateSha256(jobId: string): Promise<string> {
  const [rs, ds, ph] = await Promise.all([
    rowsOfJob(readings, STATE_COLUMNS.readings, jobId, asc(readings.id)),
    rowsOfJob(datasets, STATE_COLUMNS.datasets, jobId, asc(datasets.id)),
    rowsOfJob(photos, STATE_COLUMNS.photos, jobId, asc(photos.id)),
  ]);
  // Left out when the job has none, so a job without photos keeps the hash its signatures were
  // given over before photos counted.
  return sha256Hex(
    canonicalJson({ state: 2, readings: rs, datasets: ds, ...(ph.length ? { photos: ph } : {}) }),
  );
}

/** What a signature signs: who, meaning, when, and the report bytes or the job state it covers. */
export function manifestFor(
  actor: Actor,
  meaning: SignatureMeaningKey,
  job: { id: string; reference: string },
  subject: { reportId: string; revision: number; pdfSha256: string } | { stateSha256: string },
  signedAt: Date,
): SignatureManifest {
  const key = getSigningKey();
  return {
    jobId: job.id,
    jobReference: job.reference,
    reportId: "reportId" in subject ? subject.reportId : null,
    revision: "revision" in subject ? subject.revision : null,
    pdfSha256: "pdfSha256" in subject ? subject.pdfSha256 : null,
    stateSha256: "stateSha256" in subject ? subject.stateSha256 : null,
    signer: { id: actor.id, name: actor.name, role: actor.role, email: actor.email },
    meaning,
    signedAtUtc: signedAt.toISOString(),
    keyId: key.keyId,
  };
}

/**
 * Refuses (403) a signature the same person may not give because they gave a conflicting one on
 * this job (performed against parameters approved or approved), unless ALLOW_SAME_SIGNER.
 */
export async function refuseSameSigner(actor: Actor, jobId: string, meaning: SignatureMeaningKey) {
  const given = await db
    .select({ meaning: signatures.meaning, signerId: signatures.signerId })
    .from(signatures)
    .where(eq(signatures.jobId, jobId));
  const refusal = sameSignerRefusal(actor, { meaning, given, allowSameSigner: env.ALLOW_SAME_SIGNER });
  if (refusal) throw forbidden(refusal);
}

/** Signs the job's work before issue: performed (assigned installer) or inspected (inspector). */
export async function signJobWork(
  actor: Actor,
  input: { jobId: string; meaning: "performed" | "inspected"; password: string; comment?: string },
) {
  const d = await visibleJob(actor, input.jobId);
  const refusal = signatureRefusal(actor, { meaning: input.meaning, job: d.job });
  if (refusal) throw forbidden(refusal);
  await refuseSameSigner(actor, d.job.id, input.meaning);
  await requirePasswordReentry(actor, input.password);
  // One current signature per signer and meaning; a stale one (the record changed after it) is signed again.
  const stateSha256 = await jobStateSha256(d.job.id);
  const existing = (await preIssueSignatures(d.job.id)).filter(
    (s) => s.meaning === input.meaning && s.signerId === actor.id,
  );
  if (existing.some((s) => (s.manifest as SignatureManifest).stateSha256 === stateSha256))
    throw invalid(`You have already signed this job as ${SIGNATURE_LABELS[input.meaning].toLowerCase()}.`);
  const signedAt = new Date();
  const manifest = manifestFor(actor, input.meaning, d.job, { stateSha256 }, signedAt);
  const signature = signManifest(manifest, getSigningKey());
  return db.transaction(async (tx) => {
    return insertJobRecord(
      tx,
      actor,
      signatures,
      {
        jobId: d.job.id,
        meaning: input.meaning,
        signerId: actor.id,
        signerName: actor.name,
        signerRole: actor.role,
        signedAt,
        comment: input.comment ?? null,
        manifest,
        signature,
        keyId: manifest.keyId,
      },
      {
        action: `signature.${input.meaning}`,
        entityType: "signature",
        newValues: () => ({ meaning: input.meaning, signedAtUtc: manifest.signedAtUtc }),
      },
    );
  });
}

/** The signatures given before issue (performed, inspected), oldest first. */
export async function preIssueSignatures(jobId: string) {
  return db
    .select()
    .from(signatures)
    .where(and(eq(signatures.jobId, jobId), isNull(signatures.reportId)))
    .orderBy(asc(signatures.signedAt));
}

/** The job's signatures, oldest first; null when the actor may not see the job. */
export async function listJobSignatures(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  return rowsOfJob(
    signatures,
    {
      id: signatures.id,
      reportId: signatures.reportId,
      meaning: signatures.meaning,
      signerId: signatures.signerId,
      signerName: signatures.signerName,
      signerRole: signatures.signerRole,
      signedAt: signatures.signedAt,
      comment: signatures.comment,
    },
    jobId,
    asc(signatures.signedAt),
  );
}
