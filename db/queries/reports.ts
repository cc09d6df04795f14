import "server-only";
import { and, asc, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { getJobDetail, rowsOfJob, type JobDetail, visibleJob } from "@/db/queries/jobs";
import { getTestPartEvaluation, listDatasets } from "@/db/queries/datasets";
import { getComparison } from "@/db/queries/readings";
import { getApprovedAnalysis } from "@/db/queries/analyses";
import { reportFigureViews } from "@/db/queries/report-views";
import { reportBudget } from "@/db/queries/budget";
import { reportControlValues } from "@/db/queries/control-values";
import { parameterLimitsOfTemplate } from "@/db/queries/parameter-limits";
import { jobRotaryPositioning, positioningJobOf } from "@/db/queries/positioning";
import { HEAD_AXIS_ROLES } from "@/lib/domain/positioning";
import { positioningSection } from "@/lib/report/sections/positioning";
import { carriedResultCount, countingTestPart, listDeviations, readinessInput } from "@/db/queries/readiness";
import {
  jobStateSha256,
  manifestFor,
  preIssueSignatures,
  refuseSameSigner,
  requirePasswordReentry,
} from "@/db/queries/signatures";
import {
  datasets,
  instruments,
  jobs,
  outbox,
  procedureTemplates,
  readings,
  reports,
  signatures,
  users,
} from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { signatureRefusal } from "@/lib/policy/signatures";
import { publicUrl } from "@/lib/env";
import { forbidden, invalid, notFound } from "@/lib/errors";
import { JOB_KIND_LABELS } from "@/lib/domain/jobs";
import { formatDateTimeUtc } from "@/lib/format";
import { amendRefusal, draftPreviewRefusal, provisionalConformityRefusal } from "@/lib/policy/reports";
import {
  buildReportContent,
  figureOf,
  instrumentRows,
  parameterSection,
  readingSection,
  reportConformity,
  signatureLine,
  testPartRows,
  type ReportInputs,
} from "@/lib/report/build";
import { getSigningKey } from "@/lib/report/keys";
import { NotReadyError, readiness } from "@/lib/report/readiness";
import { renderReportPdf } from "@/lib/report/render";
import { NOT_RECORDED, recordsSection } from "@/lib/report/sections/records";
import { recordsInputOf } from "@/db/queries/report-records";
import { sha256Hex, signManifest, type SignatureManifest } from "@/lib/report/signing";
import type { ReportData } from "@/lib/report/types";
import { photoAppendixRows } from "@/lib/report/sections/photo-rows";
import { jobPhotosForReport } from "@/db/queries/photos";
import { revisionColumns } from "@/db/queries/verification";
import { activeUsers, lockJob } from "./locks";
import { isUuid } from "@/lib/domain/uuid";

/**
 * Reports: what goes into one (fetched here, shaped by lib/report/build.ts), issuing a revision,
 * the customer's answer, and reading issued reports back. Pre-issue signatures live in
 * db/queries/signatures.ts, public verification in db/queries/verification.ts.
 */

/** Instruments used for the job's current readings. */
async function jobInstruments(jobId: string) {
  return db
    .selectDistinct({
      kind: instruments.kind,
      serial: instruments.serial,
      quantityKind: instruments.quantityKind,
      resolution: instruments.resolution,
      u: instruments.standardUncertainty,
      due: instruments.calibrationDueOn,
    })
    .from(readings)
    .innerJoin(instruments, eq(instruments.id, readings.instrumentId))
    .where(and(eq(readings.jobId, jobId), isNull(readings.supersededById)))
    .orderBy(asc(instruments.serial));
}

/** The latest test-part dataset (after adjustment preferred), judged under the job's decision rule. */
async function jobTestPart(actor: Actor, jobId: string, rule: string): Promise<ReportData["testPart"]> {
  const pick = countingTestPart((await listDatasets(actor, jobId)) ?? []);
  if (!pick) return [];
  const ev = await getTestPartEvaluation(actor, pick.id);
  return ev?.evaluation ? testPartRows(ev.evaluation.rows, rule) : [];
}

/** The fit the engineer approved with the procedure's limits, shaped for the report. */
async function approvedParameters(actor: Actor, d: JobDetail) {
  const approved = await getApprovedAnalysis(actor, d.job.id);
  if (!approved) return null;
  const result = approved.detail.analysis.result;
  const section = parameterSection(
    {
      fit: result.fit,
      residualsUm: result.poses.residual_um,
      sUm: result.s_um,
      approvedBy: approved.approvedBy,
      approvedAt: approved.approvedAt,
    },
    await parameterLimitsOfTemplate(d.job.templateId),
  );
  const [source] = await db
    .select({ phase: datasets.phase })
    .from(datasets)
    .where(eq(datasets.id, approved.detail.analysis.datasetId));
  return {
    section,
    analysisId: approved.detail.analysis.id,
    source: {
      filename: approved.detail.dataset.originalFilename,
      sha256: approved.detail.dataset.sha256,
      phase: source?.phase ?? "pre",
      geometryVersion: approved.detail.analysis.geometryVersion,
    },
  };
}

/** The report's 5.4: the positioning test that counts for each rotary axis (the job's access is checked by the caller). */
async function reportPositioning(d: JobDetail) {
  const p = await jobRotaryPositioning(positioningJobOf(d));
  return positioningSection(
    HEAD_AXIS_ROLES.flatMap((a) => (p.latest[a] ? [p.latest[a]] : [])),
    d.job.decisionRule,
  );
}

/** Fetches everything the report shows and assembles it (lib/report/build.ts). */
export async function buildReportData(
  actor: Actor,
  d: JobDetail,
  meta: ReportInputs["meta"],
): Promise<{ data: ReportData; images: Map<string, Buffer> }> {
  const [
    sigs,
    state,
    params,
    comparison,
    template,
    instrumentList,
    testPart,
    carried,
    recordsBase,
    carriedCount,
  ] = await Promise.all([
    preIssueSignatures(d.job.id),
    jobStateSha256(d.job.id),
    approvedParameters(actor, d),
    getComparison(actor, d.job.id),
    d.job.templateId
      ? db
          .select({ name: procedureTemplates.name, version: procedureTemplates.version })
          .from(procedureTemplates)
          .where(eq(procedureTemplates.id, d.job.templateId))
      : Promise.resolve([]),
    jobInstruments(d.job.id),
    jobTestPart(actor, d.job.id, d.job.decisionRule),
    listDeviations(d.job.id),
    recordsInputOf(d),
    carriedResultCount(actor, d),
  ]);
  // The saved 3D views the engineer ticked for the report, of the approved fit and large enough
  // (lib/report/view-choice; the job's access was checked above).
  const images = new Map<string, Buffer>();
  const figures: ReportData["figures"] = [];
  for (const view of params ? await reportFigureViews(d.job.id) : []) {
    if (view.analysisId !== params?.analysisId) continue;
    const sha256 = sha256Hex(view.png);
    images.set(sha256, view.png);
    figures.push(figureOf({ ...view, sha256 }));
  }
  const readingRows = readingSection(comparison?.rows ?? [], recordsBase.unitSystem);
  const records = recordsSection({
    ...recordsBase,
    item: {
      head: `two-axis head ${[d.head.maker, d.head.model].filter(Boolean).join(" ") || "(maker and model not recorded)"}, serial ${d.head.serial}`,
      machine: `${d.machine.name} (${[d.machine.builder, d.machine.model].filter(Boolean).join(" ") || "builder and model not recorded"}, serial ${d.machine.serial ?? "not recorded"}) at ${d.customer.name}, ${d.site.name}`,
    },
    did: {
      readings: readingRows.rows.length > 0,
      fit: Boolean(params),
      testPart: testPart.length > 0,
      procedure: template[0] ? `${template[0].name}, version ${template[0].version}` : null,
      decisionRule: d.job.decisionRule,
    },
    issuedAt: meta.draft ? null : meta.issuedAt,
    fits: params ? [params.source] : [],
    deviationCount: carried.length,
  });
  const issuer = recordsBase.issuer;
  const data = buildReportContent({
    meta,
    d,
    issuer: {
      name: issuer.name,
      ...(issuer.address ? { address: issuer.address.replace(/\s*\n\s*/g, ", ") } : {}),
      ...(records.issuer.contact !== NOT_RECORDED ? { contact: records.issuer.contact } : {}),
    },
    records,
    jobKindLabel: JOB_KIND_LABELS[d.job.kind],
    template: template[0] ?? null,
    instruments: instrumentRows(instrumentList, meta.issuedAt, recordsBase.unitSystem),
    readings: readingRows,
    photos: photoAppendixRows(comparison?.rows ?? [], await jobPhotosForReport(d.job.id)),
    parameters: params?.section ?? null,
    testPart,
    figures,
    // The pre-issue signatures that cover the record as issued (a stale one was signed again).
    signatures: sigs
      .filter((s) => (s.manifest as SignatureManifest).stateSha256 === state)
      .map(signatureLine),
    deviations: carried,
    carried: carriedCount,
    verifyUrl: `${publicUrl}/verify/${meta.reportId}`,
    controlValues: await reportControlValues(actor, d.job),
    budget: await reportBudget(actor, d),
    rotaryPositioning: await reportPositioning(d),
  });
  return { data, images };
}

/**
 * The job's statement of conformity for its overview page, computed by the report's own function
 * (lib/report/build.reportConformity) over the same rows: the issued revision's statement once a
 * report is issued, otherwise the record as it stands (provisional). Null when the job is not
 * visible, or when the statement is provisional and the actor may not see it (customers see the
 * issued statement only: lib/policy/reports.provisionalConformityRefusal).
 */
export async function getJobConformity(
  actor: Actor,
  jobId: string,
): Promise<{ conformity: NonNullable<ReportData["conformity"]>; issuedRevision: number | null } | null> {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  const current = await currentReportRow(d.job.id);
  if (current) {
    const content = await getReportContent(actor, current.id);
    return content?.conformity ? { conformity: content.conformity, issuedRevision: current.revision } : null;
  }
  if (provisionalConformityRefusal(actor)) return null;
  const [params, comparison, testPart, carried, controlValues, rotaryPositioning] = await Promise.all([
    approvedParameters(actor, d),
    getComparison(actor, d.job.id),
    jobTestPart(actor, d.job.id, d.job.decisionRule),
    carriedResultCount(actor, d),
    reportControlValues(actor, d.job),
    reportPositioning(d),
  ]);
  return {
    conformity: reportConformity(
      {
        readings: readingSection(comparison?.rows ?? []),
        parameters: params?.section ?? null,
        testPart,
        carried,
        controlValues,
        rotaryPositioning,
      },
      d.job.decisionRule,
    ),
    issuedRevision: null,
  };
}

/**
 * The draft preview of the job's report: the PDF as it would be issued now, watermarked DRAFT,
 * with no signature and no verification block, rendered on request and never stored (so nothing
 * is audited: it changes no record). Null when the job is not visible; 403 for a customer
 * (lib/policy/reports.draftPreviewRefusal).
 */
export async function renderDraftReport(
  actor: Actor,
  jobId: string,
): Promise<{ pdf: Buffer; reference: string } | null> {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  const refusal = draftPreviewRefusal(actor);
  if (refusal) throw forbidden(refusal);
  const current = await currentReportRow(d.job.id);
  const { data, images } = await buildReportData(actor, d, {
    reportId: "draft (no report id until issue)",
    revision: (current?.revision ?? 0) + 1,
    issuedAt: new Date(),
    draft: true,
  });
  return { pdf: await renderReportPdf(data, undefined, images), reference: d.job.reference };
}

export interface IssueOptions {
  /** Test hook: called after the PDF is rendered and before anything is stored. */
  afterRender?: () => void | Promise<void>;
}

/**
 * Issues the job's report: the engineer re-enters the password; the PDF is rendered once; then
 * in one transaction the report row (bytes and hash), the approval signature over those bytes,
 * the job's status, the audit event and the customers' e-mails are committed — or nothing is.
 * With `amendment`, issues a new revision that supersedes the current one.
 */
export async function issueReport(
  actor: Actor,
  input: { jobId: string; password: string; amendmentReason?: string },
  options: IssueOptions = {},
) {
  const d = await visibleJob(actor, input.jobId);
  const current = await currentReportRow(d.job.id);
  const amending = Boolean(current);
  if (amending) {
    const refusal = amendRefusal(actor, { status: d.job.status, hasIssuedRevision: true });
    if (refusal) throw forbidden(refusal);
    if (!input.amendmentReason?.trim())
      throw invalid("Say what the amendment corrects.", [
        { field: "amendmentReason", message: "Required for a new revision." },
      ]);
  } else {
    const refusal = signatureRefusal(actor, { meaning: "approved", job: d.job });
    if (refusal) throw forbidden(refusal);
  }
  await refuseSameSigner(actor, d.job.id, "approved");
  await requirePasswordReentry(actor, input.password);
  const ready = readiness(await readinessInput(actor, d));
  if (!ready.ready) throw new NotReadyError(ready.blockers);

  const reportId = crypto.randomUUID();
  const revision = (current?.revision ?? 0) + 1;
  const issuedAt = new Date();
  const approval = signatureLine({
    signerName: actor.name,
    signerRole: actor.role,
    meaning: "approved",
    signedAt: issuedAt,
  });
  const { data: content, images } = await buildReportData(actor, d, {
    reportId,
    revision,
    issuedAt,
    approval,
    ...(current
      ? { amendment: { supersedesRevision: current.revision, reason: input.amendmentReason!.trim() } }
      : {}),
  });
  const pdf = await renderReportPdf(content, undefined, images);
  const pdfSha256 = sha256Hex(pdf);
  const manifest = manifestFor(actor, "approved", d.job, { reportId, revision, pdfSha256 }, issuedAt);
  const signature = signManifest(manifest, getSigningKey());
  await options.afterRender?.();

  const customerUsers = await activeUsers(eq(users.customerId, d.job.customerId));
  return db.transaction(async (tx) => {
    // Lock the job so two engineers cannot issue the same revision.
    const locked = await lockJob(tx, d.job.id);
    if (!locked || locked.status !== d.job.status)
      throw invalid("The job changed while the report was prepared; open it again.");
    await tx.insert(reports).values({
      id: reportId,
      jobId: d.job.id,
      revision,
      supersedesId: current?.id ?? null,
      amendmentReason: input.amendmentReason?.trim() || null,
      pdf,
      pdfSha256,
      contentSha256: content.contentSha256,
      content,
      issuedAt,
      issuedById: actor.id,
    });
    await tx.insert(signatures).values({
      jobId: d.job.id,
      reportId,
      meaning: "approved",
      signerId: actor.id,
      signerName: actor.name,
      signerRole: actor.role,
      signedAt: issuedAt,
      manifest,
      signature,
      keyId: manifest.keyId,
    });
    await tx.update(jobs).set({ status: "issued" }).where(eq(jobs.id, d.job.id));
    await appendAudit(tx, actor, {
      action: amending ? "report.amended" : "report.issued",
      entity: { type: "report", id: reportId },
      jobId: d.job.id,
      oldValues: { status: d.job.status, revision: current?.revision ?? null },
      newValues: { status: "issued", revision, pdfSha256 },
    });
    for (const u of customerUsers) {
      await tx.insert(outbox).values({
        dedupeKey: `report-issued:${reportId}:${u.id}`,
        toAddress: u.email,
        subject: `Acceptance report ${d.job.reference} revision ${revision} is ready for you`,
        textBody: `Hello ${u.name},\n\nThe acceptance report for ${d.job.title} (${d.job.reference}, revision ${revision}) has been issued.\nRead it, download the signed PDF and accept or reject it here:\n${publicUrl}/jobs/${d.job.id}/report\n\nAnyone holding the PDF can check it at ${publicUrl}/verify/${reportId}.\n`,
        jobId: d.job.id,
      });
    }
    return { reportId, revision, pdfSha256 };
  });
}

async function currentReportRow(jobId: string) {
  const rows = await db
    .select({ id: reports.id, revision: reports.revision })
    .from(reports)
    .where(eq(reports.jobId, jobId))
    .orderBy(desc(reports.revision))
    .limit(1);
  return rows[0] ?? null;
}

/** The customer's counter-signature: accept, or reject with a required comment. */
export async function respondToReport(
  actor: Actor,
  input: { reportId: string; decision: "accepted" | "rejected"; password: string; comment?: string },
) {
  const report = await getReportMeta(actor, input.reportId);
  if (!report) throw notFound("report");
  const d = await visibleJob(actor, report.jobId);
  const refusal = signatureRefusal(actor, { meaning: input.decision, job: d.job });
  if (refusal) throw forbidden(refusal);
  if (report.supersededById) throw forbidden("A newer revision supersedes this report; respond to that one.");
  const comment = input.comment?.trim() ?? "";
  if (input.decision === "rejected" && !comment)
    throw invalid("Say why the report is rejected.", [
      { field: "comment", message: "A comment is required to reject." },
    ]);
  await requirePasswordReentry(actor, input.password);
  const signedAt = new Date();
  const manifest = manifestFor(
    actor,
    input.decision,
    d.job,
    { reportId: report.id, revision: report.revision, pdfSha256: report.pdfSha256 },
    signedAt,
  );
  const signature = signManifest(manifest, getSigningKey());
  const engineers = await activeUsers(eq(users.role, "engineer"));
  return db.transaction(async (tx) => {
    const locked = await lockJob(tx, d.job.id);
    if (locked?.status !== "issued") throw invalid("This report has already been answered.");
    const [row] = await tx
      .insert(signatures)
      .values({
        jobId: d.job.id,
        reportId: report.id,
        meaning: input.decision,
        signerId: actor.id,
        signerName: actor.name,
        signerRole: actor.role,
        signedAt,
        comment: comment || null,
        manifest,
        signature,
        keyId: manifest.keyId,
      })
      .returning();
    await tx.update(jobs).set({ status: input.decision }).where(eq(jobs.id, d.job.id));
    await appendAudit(tx, actor, {
      action: `report.${input.decision}`,
      entity: { type: "report", id: report.id },
      jobId: d.job.id,
      oldValues: { status: "issued" },
      newValues: { status: input.decision, comment: comment || null },
    });
    for (const e of engineers) {
      await tx.insert(outbox).values({
        dedupeKey: `report-${input.decision}:${report.id}:${e.id}`,
        toAddress: e.email,
        subject: `${d.customer.name} ${input.decision} report ${d.job.reference} revision ${report.revision}`,
        textBody: `${actor.name} (${d.customer.name}) ${input.decision} the acceptance report ${d.job.reference} revision ${report.revision} at ${formatDateTimeUtc(signedAt)}.${comment ? `\n\nComment: ${comment}` : ""}\n\n${publicUrl}/jobs/${d.job.id}/report\n`,
        jobId: d.job.id,
      });
    }
    return row!;
  });
}

/** Report metadata for a user who may see its job; null otherwise (including another tenant's). */
export async function getReportMeta(actor: Actor, reportId: string) {
  if (!isUuid(reportId)) return null;
  const [r] = await db.select(revisionColumns).from(reports).where(eq(reports.id, reportId));
  if (!r) return null;
  if (!(await getJobDetail(actor, r.jobId))) return null;
  const [newer] = await db.select({ id: reports.id }).from(reports).where(eq(reports.supersedesId, r.id));
  return { ...r, supersededById: newer?.id ?? null };
}

export async function getReportContent(actor: Actor, reportId: string): Promise<ReportData | null> {
  const meta = await getReportMeta(actor, reportId);
  if (!meta) return null;
  const [r] = await db.select({ content: reports.content }).from(reports).where(eq(reports.id, reportId));
  return r ? (r.content as ReportData) : null;
}

/** The stored PDF bytes, exactly as issued and signed. */
export async function getReportPdf(
  actor: Actor,
  reportId: string,
): Promise<{ pdf: Buffer; reference: string; revision: number } | null> {
  const meta = await getReportMeta(actor, reportId);
  if (!meta) return null;
  const [r] = await db
    .select({ pdf: reports.pdf, reference: jobs.reference, revision: reports.revision })
    .from(reports)
    .innerJoin(jobs, eq(jobs.id, reports.jobId))
    .where(eq(reports.id, reportId));
  return r ?? null;
}

export async function listJobReports(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  return rowsOfJob(reports, revisionColumns, jobId, desc(reports.revision));
}
