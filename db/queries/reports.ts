import "server-only";
import { and, asc, desc, eq, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { getJobDetail, type JobDetail } from "@/db/queries/jobs";
import { getTestPartEvaluation, listDatasets } from "@/db/queries/datasets";
import { getComparison } from "@/db/queries/readings";
import { getApprovedAnalysis } from "@/db/queries/analyses";
import { latestJobView } from "@/db/queries/analysis-views";
import { parameterLimitsOfTemplate } from "@/db/queries/parameter-limits";
import { checkPasswordReentry } from "@/db/queries/sign-in";
import { parameterRows } from "@/lib/fit-display";
import { signed } from "@/lib/numbers";
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
import {
  ROLE_LABELS,
  SIGNATURE_LABELS,
  signatureRefusal,
  type Actor,
  type SignatureMeaningKey,
} from "@/lib/auth/roles";
import { canonicalJson } from "@/lib/canonical-json";
import { publicUrl } from "@/lib/env";
import { forbidden, invalid, notFound } from "@/lib/errors";
import { formatDateTimeUtc, JOB_KIND_LABELS } from "@/lib/format";
import { getSigningKey } from "@/lib/report/keys";
import { formatLimits, formatValue } from "@/lib/units";
import { renderReportPdf } from "@/lib/report/render";
import { sha256Hex, signManifest, verifyManifest, type SignatureManifest } from "@/lib/report/signing";
import type { Decision, ReportCharts, ReportData, ReportSignature } from "@/lib/report/types";
import { isUuid } from "@/lib/domain/uuid";

/** Re-entry of the password at signing (21 CFR 11.200), counted by the sign-in limiter (db/queries/sign-in). */
async function requirePasswordReentry(actor: Actor, password: string): Promise<void> {
  await checkPasswordReentry(actor, password);
}

async function visibleJob(actor: Actor, jobId: string): Promise<JobDetail> {
  const d = await getJobDetail(actor, jobId);
  if (!d) throw notFound("job");
  return d;
}

/** A hash of what has been recorded on the job, so a pre-issue signature says what it covered. */
async function jobStateSha256(jobId: string): Promise<string> {
  const [job] = await db
    .select({ status: jobs.status, updatedAt: jobs.updatedAt })
    .from(jobs)
    .where(eq(jobs.id, jobId));
  const rs = await db
    .select({
      id: readings.id,
      value: readings.value,
      phase: readings.phase,
      supersededById: readings.supersededById,
    })
    .from(readings)
    .where(eq(readings.jobId, jobId))
    .orderBy(asc(readings.id));
  const ds = await db
    .select({ id: datasets.id, sha256: datasets.sha256, status: datasets.status })
    .from(datasets)
    .where(eq(datasets.jobId, jobId))
    .orderBy(asc(datasets.id));
  return sha256Hex(canonicalJson({ job, readings: rs, datasets: ds }));
}

function manifestFor(
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

/** Signs the job's work before issue: performed (assigned installer) or inspected (inspector). */
export async function signJobWork(
  actor: Actor,
  input: { jobId: string; meaning: "performed" | "inspected"; password: string; comment?: string },
) {
  const d = await visibleJob(actor, input.jobId);
  const refusal = signatureRefusal(actor, input.meaning, d.job);
  if (refusal) throw forbidden(refusal);
  await requirePasswordReentry(actor, input.password);
  const existing = await db
    .select({ id: signatures.id })
    .from(signatures)
    .where(
      and(
        eq(signatures.jobId, d.job.id),
        eq(signatures.meaning, input.meaning),
        eq(signatures.signerId, actor.id),
        isNull(signatures.reportId),
      ),
    );
  if (existing.length > 0)
    throw invalid(`You have already signed this job as ${SIGNATURE_LABELS[input.meaning].toLowerCase()}.`);
  const signedAt = new Date();
  const manifest = manifestFor(
    actor,
    input.meaning,
    d.job,
    { stateSha256: await jobStateSha256(d.job.id) },
    signedAt,
  );
  const signature = signManifest(manifest, getSigningKey());
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(signatures)
      .values({
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
      })
      .returning();
    await appendAudit(tx, {
      actorId: actor.id,
      actorEmail: actor.email,
      action: `signature.${input.meaning}`,
      entityType: "signature",
      entityId: row!.id,
      jobId: d.job.id,
      newValues: { meaning: input.meaning, signedAtUtc: manifest.signedAtUtc },
    });
    return row!;
  });
}

function signatureLine(s: {
  signerName: string;
  signerRole: string;
  meaning: SignatureMeaningKey;
  signedAt: Date;
}): ReportSignature {
  return {
    name: s.signerName,
    role: ROLE_LABELS[s.signerRole as keyof typeof ROLE_LABELS] ?? s.signerRole,
    meaning: SIGNATURE_LABELS[s.meaning],
    signedAtUtc: formatDateTimeUtc(s.signedAt),
  };
}

/**
 * The checklist readings for the report: the comparison the installer and reviewers saw (latest
 * current reading of each step and phase, judged under the step's decision rule with U from the
 * instrument), formatted in metric units; and the same numbers for the before/after chart
 * (lengths in mm, angles in arc seconds, as the table).
 */
async function reportReadings(
  actor: Actor,
  jobId: string,
): Promise<{ rows: ReportData["readings"]; chart: NonNullable<ReportCharts["readings"]> }> {
  const c = await getComparison(actor, jobId);
  if (!c) return { rows: [], chart: [] };
  const measured = c.rows.filter((r) => r.pre || r.post);
  const rows = measured.map((r) => ({
    step: r.title,
    limits: formatLimits(r.lowerLimit, r.upperLimit, r.quantityKind, "metric"),
    pre: r.pre ? formatValue(r.pre.value, r.quantityKind, "metric") : undefined,
    post: r.post ? formatValue(r.post.value, r.quantityKind, "metric") : undefined,
    change: r.change != null ? formatValue(r.change, r.quantityKind, "metric", { signed: true }) : undefined,
    decision: r.status === "no_limit" ? ("recorded" as const) : r.status,
    source: r.limitSource.replace("_", " "),
  }));
  const chart = measured
    .filter((r) => r.lowerLimit != null || r.upperLimit != null)
    .map((r) => ({
      step: r.title,
      lower: r.lowerLimit,
      upper: r.upperLimit,
      pre: r.pre?.value ?? null,
      post: r.post?.value ?? null,
      unit: r.quantityKind === "length" ? "mm" : "″",
      digits: r.quantityKind === "length" ? 4 : 1,
    }));
  return { rows, chart };
}

/** Instruments used for the job's current readings, with calibration status on the day of issue. */
async function reportInstruments(jobId: string, on: Date): Promise<ReportData["instruments"]> {
  const rows = await db
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
  const day = on.toISOString().slice(0, 10);
  const fmt = (v: number, kind: string) =>
    kind === "angle" ? `${v.toFixed(1)}″` : v >= 0.001 ? `${v.toFixed(4)} mm` : `${(v * 1000).toFixed(2)} µm`;
  return rows.map((r) => ({
    kind: r.kind,
    serial: r.serial,
    resolution: fmt(r.resolution, r.quantityKind),
    uncertainty: fmt(r.u, r.quantityKind),
    calibrationDue: r.due,
    status: r.due >= day ? "In calibration" : "Past due",
  }));
}

const TEST_PART_DECIMALS: Record<string, number> = { mm: 3, in: 4, um: 1, deg: 3, arcsec: 1 };

/** The latest test-part dataset (after adjustment preferred), judged under the job's decision rule. */
async function reportTestPart(actor: Actor, jobId: string): Promise<ReportData["testPart"]> {
  const list = ((await listDatasets(actor, jobId)) ?? []).filter(
    (x) => x.kind === "test_part" && x.status === "stored",
  );
  const pick = list.find((x) => x.phase === "post") ?? list[0];
  if (!pick) return [];
  const ev = await getTestPartEvaluation(actor, pick.id);
  if (!ev?.evaluation) return [];
  return ev.evaluation.rows.map((r) => {
    const dp = TEST_PART_DECIMALS[r.unit] ?? 3;
    const v = (x: number) => `${x.toFixed(dp)} ${r.unit === "um" ? "µm" : r.unit}`;
    const signed = (x: number) => `${x >= 0 ? "+" : "−"}${Math.abs(x).toFixed(dp)}`;
    const limits = `${r.lower_limit === null ? "—" : r.lower_limit.toFixed(dp)} / ${r.upper_limit.toFixed(dp)}`;
    return {
      feature: r.feature,
      characteristic: r.characteristic,
      nominal: v(r.nominal),
      measured: v(r.measured),
      deviation: signed(r.deviation),
      limits,
      expanded: r.U.toFixed(dp),
      decision: r.decision,
    };
  });
}

/** At most this many points in the residual chart: each is the largest residual of its bucket of poses. */
const RESIDUAL_CHART_POINTS = 240;

/** Bucket maxima of the per-pose residuals (largest component, as the 3 s outlier rule uses), so peaks survive the thinning. */
export function residualChartValues(
  valuesUm: readonly number[],
  maxPoints = RESIDUAL_CHART_POINTS,
): { valuesUm: number[]; perPoint: number } {
  const perPoint = Math.max(1, Math.ceil(valuesUm.length / maxPoints));
  const out: number[] = [];
  for (let i = 0; i < valuesUm.length; i += perPoint) out.push(Math.max(...valuesUm.slice(i, i + perPoint)));
  return { valuesUm: out.map((v) => Math.round(v * 1000) / 1000), perPoint };
}

/**
 * The head parameters of the fit the engineer approved, judged against the limits of the job's
 * procedure version (lib/fit-display parameterRows: the decision rule with the fit's U), with the
 * numbers for the parameter and residual charts.
 */
async function reportParameters(
  actor: Actor,
  d: JobDetail,
): Promise<{
  rows: ReportData["parameters"];
  note?: string;
  charts: Pick<ReportCharts, "parameters" | "residuals">;
  analysisId?: string;
}> {
  const approved = await getApprovedAnalysis(actor, d.job.id);
  if (!approved) return { rows: [], charts: {} };
  const result = approved.detail.analysis.result;
  const fit = result.fit;
  const limits = await parameterLimitsOfTemplate(d.job.templateId);
  const judged = parameterRows(fit, limits);
  const decisionOf = (x: (typeof judged)[number]["decision"]): Decision =>
    x === "no_limit" ? "recorded" : x;
  const rows = judged.map((p) => {
    const unit = p.unit === "um" ? " µm" : "″";
    const value = `${signed(p.value, 1)}${unit}`;
    return {
      name: p.words,
      symbol: p.iso,
      value: p.heldAtZero ? `${value} (held)` : value,
      expanded: p.heldAtZero ? "—" : `${fit.parameters.find((q) => q.key === p.key)!.U!.toFixed(1)}${unit}`,
      ...(p.toleranceText ? { tolerance: p.toleranceText } : {}),
      ...(p.limitSourceText ? { limitSource: p.limitSourceText } : {}),
      decision: decisionOf(p.decision),
      identifiable: p.identifiableText,
    };
  });
  const chartParameters = judged
    .filter((p) => p.toleranceText && !p.heldAtZero)
    .map((p) => {
      const lim = limits.find((l) => l.parameter === p.key)!;
      const U = fit.parameters.find((q) => q.key === p.key)!.U ?? 0;
      return {
        symbol: p.iso,
        value: p.value,
        U,
        lower: lim.lowerLimit,
        upper: lim.upperLimit,
        unit: p.unit === "um" ? "µm" : "″",
        decision: decisionOf(p.decision),
      };
    });
  const residuals = {
    ...residualChartValues(
      result.poses.residual_um.map((r) => Math.max(Math.abs(r[0]), Math.abs(r[1]), Math.abs(r[2]))),
    ),
    totalPoses: result.poses.row.length,
    sUm: result.s_um,
  };
  const judgedCount = judged.filter((p) => p.decision !== "no_limit" && p.decision !== "not_measured").length;
  const undetermined = judged.filter((p) => p.decision === "not_measured").length;
  return {
    rows,
    analysisId: approved.detail.analysis.id,
    charts: { ...(chartParameters.length ? { parameters: chartParameters } : {}), residuals },
    note: `Head parameters from the fit approved by ${approved.approvedBy} on ${formatDateTimeUtc(approved.approvedAt)}: residual RMS ${fit.rms_um.toFixed(2)} µm, max ${fit.max_um.toFixed(2)} µm; ${judgedCount ? `${judgedCount} of ${judged.length} parameters judged against the procedure's limits` : "the procedure sets no limits for them, so they are recorded"}${undetermined ? `; ${undetermined} could not be determined from this data and ${undetermined === 1 ? "is" : "are"} not judged` : ""}.`,
  };
}

/** Assembles everything the report shows from the database. */
export async function buildReportData(
  actor: Actor,
  d: JobDetail,
  meta: {
    reportId: string;
    revision: number;
    issuedAt: Date;
    approval: ReportSignature;
    amendment?: ReportData["amendment"];
  },
): Promise<{ data: ReportData; images: Map<string, Buffer> }> {
  const sigs = await db
    .select()
    .from(signatures)
    .where(and(eq(signatures.jobId, d.job.id), isNull(signatures.reportId)))
    .orderBy(asc(signatures.signedAt));
  const [params, readingsPart, template] = await Promise.all([
    reportParameters(actor, d),
    reportReadings(actor, d.job.id),
    d.job.templateId
      ? db
          .select({ name: procedureTemplates.name, version: procedureTemplates.version })
          .from(procedureTemplates)
          .where(eq(procedureTemplates.id, d.job.templateId))
      : Promise.resolve([]),
  ]);
  // The latest picture of the 3D view saved for the approved fit (the job's access was checked above).
  const view = params.analysisId ? await latestJobView(d.job.id) : null;
  const images = new Map<string, Buffer>();
  const figures: ReportData["figures"] = [];
  if (view && view.analysisId === params.analysisId) {
    const sha = sha256Hex(view.png);
    images.set(sha, view.png);
    figures.push({
      caption: `3D view of the approved head fit, errors drawn × ${view.factor.toLocaleString("en-GB")}, saved by ${view.createdByName ?? "the engineer"} on ${formatDateTimeUtc(view.createdAt)}${view.caption ? `: ${view.caption}` : ""}`,
      sha256: sha,
      viewId: view.id,
      widthPx: view.widthPx,
      heightPx: view.heightPx,
    });
  }
  const data: Omit<ReportData, "contentSha256"> = {
    reportId: meta.reportId,
    reference: d.job.reference,
    revision: meta.revision,
    ...(meta.amendment ? { amendment: meta.amendment } : {}),
    issuedAtUtc: formatDateTimeUtc(meta.issuedAt),
    issuer: { name: "Halvard Field Service" },
    customer: {
      name: d.customer.name,
      site: d.site.name,
      ...(d.site.address ? { address: d.site.address } : {}),
    },
    machine: {
      name: d.machine.name,
      kind: d.machine.kind,
      builderModel: [d.machine.builder, d.machine.model].filter(Boolean).join(" ") || undefined,
      serial: d.machine.serial ?? undefined,
      control: d.machine.control ?? undefined,
    },
    head: {
      serial: d.head.serial,
      makerModel: [d.head.maker, d.head.model].filter(Boolean).join(" ") || undefined,
      axes: `${d.head.primaryAxis} primary / ${d.head.secondaryAxis} secondary`,
      nominalPivotLength: `${d.head.nominalPivotLengthMm.toFixed(3)} mm`,
      mass: d.head.massKg ? `${d.head.massKg} kg` : undefined,
    },
    work: {
      kind: JOB_KIND_LABELS[d.job.kind],
      title: d.job.title,
      dates: d.job.scheduledFor
        ? `from ${formatDateTimeUtc(d.job.scheduledFor)}`
        : "as recorded in the activity log",
      airTemperature:
        d.job.airTempC != null ? `${d.job.airTempC.toFixed(1)} °C air temperature as entered` : undefined,
      procedure: template[0]
        ? `${template[0].name}, version ${template[0].version}`
        : "Checklist as recorded on the job (no procedure version)",
      method:
        "Indicator readings against the checklist limits; kinematic fit from sphere-probe data (geometry model stated in the product documentation)",
      decisionRule:
        d.job.decisionRule === "guarded"
          ? "Guarded acceptance per ISO 14253-1 (limits shrunk by U for pass, grown by U for fail)"
          : "Simple acceptance: the expanded uncertainty is stated, not subtracted",
    },
    instruments: await reportInstruments(d.job.id, meta.issuedAt),
    readings: readingsPart.rows,
    parameters: params.rows,
    testPart: await reportTestPart(actor, d.job.id),
    figures,
    charts: { ...(readingsPart.chart.length ? { readings: readingsPart.chart } : {}), ...params.charts },
    remarks: [...(params.note ? [params.note] : []), ...(d.job.notes ? [d.job.notes] : [])],
    safety: [
      "Lift the head only with rated gear at its lifting points; keep hands clear of pinch points between head, collar and spindle nose.",
      "Lock out the machine before working on the spindle; keep clear of the head's sweep when axes move.",
      "The machine builder's and head maker's manuals, local codes and licensed practice take precedence over this report.",
    ],
    signatures: [...sigs.map(signatureLine), meta.approval],
    verifyUrl: `${publicUrl}/verify/${meta.reportId}`,
  };
  return { data: { ...data, contentSha256: sha256Hex(canonicalJson(data)) }, images };
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
    if (actor.role !== "engineer") throw forbidden("Only an application engineer issues an amendment.");
    if (!input.amendmentReason?.trim())
      throw invalid("Say what the amendment corrects.", [
        { field: "amendmentReason", message: "Required for a new revision." },
      ]);
    if (d.job.status !== "issued" && d.job.status !== "rejected")
      throw forbidden("An amendment follows an issued or rejected report.");
  } else {
    const refusal = signatureRefusal(actor, "approved", d.job);
    if (refusal) throw forbidden(refusal);
  }
  await requirePasswordReentry(actor, input.password);

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

  const customerUsers = await db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(and(eq(users.customerId, d.job.customerId), eq(users.disabled, false)));
  return db.transaction(async (tx) => {
    // Lock the job so two engineers cannot issue the same revision.
    const [locked] = await tx
      .select({ status: jobs.status })
      .from(jobs)
      .where(eq(jobs.id, d.job.id))
      .for("update");
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
    await appendAudit(tx, {
      actorId: actor.id,
      actorEmail: actor.email,
      action: amending ? "report.amended" : "report.issued",
      entityType: "report",
      entityId: reportId,
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
  const refusal = signatureRefusal(actor, input.decision, d.job);
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
  const engineers = await db
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(and(eq(users.role, "engineer"), eq(users.disabled, false)));
  return db.transaction(async (tx) => {
    const [locked] = await tx
      .select({ status: jobs.status })
      .from(jobs)
      .where(eq(jobs.id, d.job.id))
      .for("update");
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
    await appendAudit(tx, {
      actorId: actor.id,
      actorEmail: actor.email,
      action: `report.${input.decision}`,
      entityType: "report",
      entityId: report.id,
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
  const [r] = await db
    .select({
      id: reports.id,
      jobId: reports.jobId,
      revision: reports.revision,
      pdfSha256: reports.pdfSha256,
      contentSha256: reports.contentSha256,
      issuedAt: reports.issuedAt,
      supersedesId: reports.supersedesId,
      amendmentReason: reports.amendmentReason,
    })
    .from(reports)
    .where(eq(reports.id, reportId));
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
  return db
    .select({
      id: reports.id,
      revision: reports.revision,
      issuedAt: reports.issuedAt,
      pdfSha256: reports.pdfSha256,
      supersedesId: reports.supersedesId,
      amendmentReason: reports.amendmentReason,
    })
    .from(reports)
    .where(eq(reports.jobId, jobId))
    .orderBy(desc(reports.revision));
}

export async function listJobSignatures(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  return db
    .select({
      id: signatures.id,
      reportId: signatures.reportId,
      meaning: signatures.meaning,
      signerId: signatures.signerId,
      signerName: signatures.signerName,
      signerRole: signatures.signerRole,
      signedAt: signatures.signedAt,
      comment: signatures.comment,
    })
    .from(signatures)
    .where(eq(signatures.jobId, jobId))
    .orderBy(asc(signatures.signedAt));
}

export interface VerificationResult {
  authentic: boolean;
  reason?: string;
  report?: {
    id: string;
    reference: string;
    revision: number;
    issuedAtUtc: string;
    pdfSha256: string;
    supersededBy: { id: string; revision: number } | null;
    amendmentOf: { id: string; revision: number } | null;
  };
  signatures?: Array<{
    meaning: string;
    name: string;
    role: string;
    signedAtUtc: string;
    valid: boolean;
    comment: string | null;
  }>;
  keyId?: string;
}

/**
 * Public verification of an issued revision, from the stored bytes (never a re-render): the
 * stored PDF must still hash to the recorded SHA-256, and every signature over it, and every
 * signature given before issue, must verify with the published key.
 */
export async function verifyReport(
  reportId: string,
  exec: Pick<typeof db, "select"> = db,
): Promise<VerificationResult> {
  if (!isUuid(reportId)) return { authentic: false, reason: "There is no report with this id." };
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
