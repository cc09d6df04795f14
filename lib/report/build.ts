/**
 * The report's content as a pure view model: db/queries/reports.ts fetches the job, its readings,
 * instruments, test part, approved fit and saved view; the functions here shape them into the
 * ReportData that the PDF (lib/report/document.tsx) and the report page render. No database, no
 * clock: everything the content depends on is an argument, so it is unit-tested on plain values.
 */
import type { HeadFitJson } from "@/geometry";
import type { TestPartResultRow } from "@/geometry/test-part";
import { ROLE_LABELS } from "@/lib/domain/roles";
import { SIGNATURE_LABELS, type SignatureMeaningKey } from "@/lib/domain/signatures";
import { canonicalJson } from "@/lib/canonical-json";
import type { StepDecision } from "@/lib/checklist";
import { limitSourceWords, parameterRows, type ParameterLimit } from "@/lib/fit-display";
import { formatDateTimeUtc } from "@/lib/format";
import { signed } from "@/lib/numbers";
import type { QuantityKind, UnitSystem } from "@/lib/units";
import { shownPoints, shownValue, TEXT_KINDS, type KindStep, type ShownReading } from "@/lib/step-kinds";
import {
  formatAngleExpandedArcsec,
  formatExpanded,
  formatRecorded,
  formatRecordedLimits,
} from "@/lib/recorded-units";
import type { ReportRecords } from "@/lib/report/sections/records";
import { sha256Hex } from "@/lib/report/signing";
import type { Decision, ReportCharts, ReportData, ReportSignature } from "@/lib/report/types";

/** A step's result as the report names it: a reading without a limit is "recorded". */
export function reportDecision(d: StepDecision): Decision {
  return d === "no_limit" ? "recorded" : d;
}

/** One signature as the report prints it: name, role and meaning in words, time in UTC. */
export function signatureLine(s: {
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

/** One phase's reading of a step, as the report needs it. */
interface PhaseInput {
  value: number;
  U?: number;
  resolution?: number | null;
  instrument?: string | null;
  shown?: ShownReading;
}

/** What the report needs of one checklist step's comparison row (db/queries/readings ComparisonRow). */
export interface ComparisonInput {
  title: string;
  quantityKind: QuantityKind;
  lowerLimit: number | null;
  upperLimit: number | null;
  limitSource: string;
  limitSourceNote?: string | null;
  decisionRule?: string;
  /**
   * U: the reading's expanded uncertainty (0 when no instrument gives one); resolution of its
   * instrument (canonical); shown: what an answer, record, note or multi-point reading shows.
   */
  pre: PhaseInput | null;
  post: PhaseInput | null;
  change: number | null;
  status: StepDecision;
  /** Answers, records, notes and multi-point readings are shown as their kind (lib/step-kinds). */
  kindStep?: KindStep;
}

/** A decision rule in the few words printed beside each judged row. */
export const RULE_WORDS: Record<string, string> = {
  simple: "simple",
  guarded: "guarded (ISO 14253-1)",
};

/** The job's decision rule as the report's method states it. */
export function decisionRuleText(rule: string): string {
  return rule === "guarded"
    ? "Guarded acceptance per ISO 14253-1 (limits shrunk by U for pass, grown by U for fail)"
    : "Simple acceptance: the expanded uncertainty is stated, not subtracted";
}

/**
 * What a judged row was judged by (ISO/IEC 17025:2017 §7.8.6.1: the decision rule applied, and
 * where the limit comes from): "Rule: simple; limit: Standard: ISO 230-1". Undefined
 * for a row that was not judged (no limit, nothing measured).
 */
export function judgementBasis(
  decision: Decision,
  rule: string,
  source: string | null | undefined,
): string | undefined {
  if (decision === "recorded" || decision === "not_measured") return undefined;
  return `Rule: ${RULE_WORDS[rule] ?? rule}${source ? `; limit: ${source}` : ""}`;
}

/** A step shown as its kind (Yes/No, a value in its own unit, a note, a multi-point result). */
function shownKind(r: ComparisonInput): KindStep | null {
  return r.kindStep && r.kindStep.derivation !== "direct" && r.kindStep.derivation !== "angle_over_distance"
    ? r.kindStep
    : null;
}

/**
 * The checklist readings for the report: the latest current reading of each step and phase,
 * judged under the step's decision rule, in the unit system the job recorded them in (an inch job
 * in inch with mm beside, ISO/IEC 17025:2017 §7.8.2.1), at the instrument's resolution, with the
 * counting reading's U; and the same numbers for the before/after chart (lengths in mm, angles in
 * arc seconds).
 */
export function readingSection(
  rows: readonly ComparisonInput[],
  system: UnitSystem = "metric",
): {
  rows: ReportData["readings"];
  chart: NonNullable<ReportCharts["readings"]>;
} {
  const measured = rows.filter((r) => r.pre || r.post);
  return {
    rows: measured.map((r) => {
      const counting = r.post ?? r.pre!;
      // A length instrument's resolution sets a length step's decimals; an angle derived from a
      // length reading over a travel keeps the angle's usual 0.1″.
      const resOf = (x: { resolution?: number | null } | null) =>
        r.quantityKind === "length" ? (x?.resolution ?? null) : null;
      const res = resOf(counting);
      const kind = shownKind(r);
      const isText = kind !== null && TEXT_KINDS.includes(kind.derivation);
      const phaseText = (x: PhaseInput) =>
        kind && x.shown
          ? shownValue(kind, x.shown, system)
          : formatRecorded(x.value, r.quantityKind, system, { resolution: resOf(x) });
      // A multi-point step prints its points under its title, before and after, as entered.
      const points =
        kind?.derivation === "multi_point"
          ? (
              [
                ["Before", r.pre],
                ["After", r.post],
              ] as const
            )
              .map(([label, x]) => {
                const p = x?.shown ? shownPoints(x.shown, kind.points) : null;
                return p ? `${label}: ${p}` : null;
              })
              .filter(Boolean)
              .join("; ")
          : "";
      return {
        ...(points ? { points } : {}),
        ...withBasis(
          judgementBasis(
            reportDecision(r.status),
            r.decisionRule ?? "simple",
            limitSourceWords(r.limitSource, r.limitSourceNote),
          ),
        ),
        step: r.title,
        limits: formatRecordedLimits(r.lowerLimit, r.upperLimit, r.quantityKind, system),
        pre: r.pre ? phaseText(r.pre) : undefined,
        post: r.post ? phaseText(r.post) : undefined,
        change:
          r.change != null
            ? formatRecorded(r.change, r.quantityKind, system, { signed: true, resolution: res })
            : undefined,
        ...(counting.U !== undefined && !isText
          ? {
              expanded: formatExpanded(counting.U, r.quantityKind, system, {
                resolution: res,
                reason: counting.instrument ? "the instrument states no uncertainty" : "no instrument named",
              }),
            }
          : {}),
        decision: reportDecision(r.status),
        source: r.limitSource.replace("_", " "),
      };
    }),
    chart: measured
      .filter((r) => !r.kindStep || !TEXT_KINDS.includes(r.kindStep.derivation))
      .filter((r) => r.lowerLimit != null || r.upperLimit != null)
      .map((r) => ({
        step: r.title,
        lower: r.lowerLimit,
        upper: r.upperLimit,
        pre: r.pre?.value ?? null,
        post: r.post?.value ?? null,
        unit: r.quantityKind === "length" ? "mm" : "″",
        digits: r.quantityKind === "length" ? 4 : 1,
      })),
  };
}

/** An instrument used for the job's current readings. */
export interface InstrumentInput {
  kind: string;
  serial: string;
  quantityKind: string;
  resolution: number;
  u: number;
  /** Calibration due date, YYYY-MM-DD. */
  due: string;
}

/**
 * Instruments with their calibration status on the day `on` (the day of issue); on an inch job
 * (`system`) the figures of a length instrument print in inch with mm beside.
 */
export function instrumentRows(
  rows: readonly InstrumentInput[],
  on: Date,
  system: UnitSystem = "metric",
): ReportData["instruments"] {
  const day = on.toISOString().slice(0, 10);
  const fmt = (v: number, kind: string) =>
    kind === "angle"
      ? `${v.toFixed(1)}″`
      : system === "inch"
        ? formatRecorded(v, "length", "inch", { resolution: v })
        : v >= 0.001
          ? `${v.toFixed(4)} mm`
          : `${(v * 1000).toFixed(2)} µm`;
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

/** The test part's evaluated rows, each in its own unit and decimals. */
const withBasis = (basis: string | undefined) => (basis ? { basis } : {});

/** The test part's rows, judged under the job's rule against the tolerances in the uploaded file. */
export function testPartRows(rows: readonly TestPartResultRow[], rule = "simple"): ReportData["testPart"] {
  return rows.map((r) => {
    const dp = TEST_PART_DECIMALS[r.unit] ?? 3;
    const v = (x: number) => `${x.toFixed(dp)} ${r.unit === "um" ? "µm" : r.unit}`;
    const sign = (x: number) => `${x >= 0 ? "+" : "−"}${Math.abs(x).toFixed(dp)}`;
    const limits = `${r.lower_limit === null ? "—" : r.lower_limit.toFixed(dp)} / ${r.upper_limit.toFixed(dp)}`;
    return {
      feature: r.feature,
      characteristic: r.characteristic,
      nominal: v(r.nominal),
      measured: v(r.measured),
      deviation: sign(r.deviation),
      limits,
      // Angles' U in arc seconds; an undefined U is a dash with its reason, never "0.000".
      expanded:
        r.unit === "deg" || r.unit === "arcsec"
          ? formatAngleExpandedArcsec(r.U, r.unit)
          : Number.isFinite(r.U) && r.U > 0
            ? r.U.toFixed(dp)
            : "— (not stated)",
      decision: r.decision,
      ...withBasis(judgementBasis(r.decision, rule, "test-part file")),
    };
  });
}

/** The approved fit as the report needs it. */
export interface ApprovedFitInput {
  fit: HeadFitJson;
  /** Per-pose residual vectors (µm), in pose order. */
  residualsUm: ReadonlyArray<readonly number[]>;
  sUm: number;
  approvedBy: string | null;
  approvedAt: Date;
}

/**
 * The head parameters of the approved fit, judged against the limits of the job's procedure
 * version (lib/fit-display parameterRows: the decision rule with the fit's U), with the numbers
 * for the parameter and residual charts and a remark that says where they come from.
 */
export function parameterSection(
  approved: ApprovedFitInput,
  limits: readonly ParameterLimit[],
): { rows: ReportData["parameters"]; note: string; charts: Pick<ReportCharts, "parameters" | "residuals"> } {
  const fit = approved.fit;
  const judged = parameterRows(fit, limits);
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
      ...withBasis(judgementBasis(reportDecision(p.decision), p.decisionRule ?? "simple", p.limitSourceText)),
      decision: reportDecision(p.decision),
      identifiable: p.identifiableText,
    };
  });
  const chartParameters = judged
    .filter((p) => p.toleranceText && !p.heldAtZero)
    .map((p) => {
      const lim = limits.find((l) => l.parameter === p.key)!;
      return {
        symbol: p.iso,
        value: p.value,
        U: fit.parameters.find((q) => q.key === p.key)!.U ?? 0,
        lower: lim.lowerLimit,
        upper: lim.upperLimit,
        unit: p.unit === "um" ? "µm" : "″",
        decision: reportDecision(p.decision),
      };
    });
  const residuals = {
    ...residualChartValues(
      approved.residualsUm.map((r) => Math.max(Math.abs(r[0]!), Math.abs(r[1]!), Math.abs(r[2]!))),
    ),
    totalPoses: approved.residualsUm.length,
    sUm: approved.sUm,
  };
  const judgedCount = judged.filter((p) => p.decision !== "no_limit" && p.decision !== "not_measured").length;
  const undetermined = judged.filter((p) => p.decision === "not_measured").length;
  return {
    rows,
    charts: { ...(chartParameters.length ? { parameters: chartParameters } : {}), residuals },
    note: `Head parameters from the fit approved by ${approved.approvedBy ?? "an engineer"} on ${formatDateTimeUtc(approved.approvedAt)}: residual RMS ${fit.rms_um.toFixed(2)} µm, max ${fit.max_um.toFixed(2)} µm; ${judgedCount ? `${judgedCount} of ${judged.length} parameters judged against the procedure's limits` : "the procedure sets no limits for them, so they are recorded"}${undetermined ? `; ${undetermined} could not be determined from this data and ${undetermined === 1 ? "is" : "are"} not judged` : ""}.`,
  };
}

/** A saved 3D view of the approved fit, as the report's figure. */
export interface ViewInput {
  id: string;
  sha256: string;
  factor: number;
  caption: string | null;
  widthPx: number;
  heightPx: number;
  createdAt: Date;
  createdByName: string | null;
}

export function figureOf(view: ViewInput): ReportData["figures"][number] {
  return {
    caption: `3D view of the approved head fit, errors drawn × ${view.factor.toLocaleString("en-GB")}, saved by ${view.createdByName ?? "the engineer"} on ${formatDateTimeUtc(view.createdAt)}${view.caption ? `: ${view.caption}` : ""}`,
    sha256: view.sha256,
    viewId: view.id,
    widthPx: view.widthPx,
    heightPx: view.heightPx,
  };
}

export const SAFETY_NOTES: readonly string[] = [
  "Lift the head only with rated gear at its lifting points; keep hands clear of pinch points between head, collar and spindle nose.",
  "Lock out the machine before working on the spindle; keep clear of the head's sweep when axes move.",
  "The machine builder's and head maker's manuals, local codes and licensed practice take precedence over this report.",
];

/** What the job page knows of the job, machine, head, customer and site (db/queries/jobs JobDetail). */
export interface JobInput {
  job: {
    reference: string;
    kind: string;
    title: string;
    scheduledFor: Date | null;
    airTempC: number | null;
    decisionRule: string;
    notes: string | null;
  };
  customer: { name: string };
  site: { name: string; address: string | null };
  machine: {
    name: string;
    kind: string;
    builder: string | null;
    model: string | null;
    serial: string | null;
    control: string | null;
  };
  head: {
    serial: string;
    maker: string | null;
    model: string | null;
    primaryAxis: string;
    secondaryAxis: string;
    nominalPivotLengthMm: number;
    massKg: number | null;
  };
}

/** A deviation as recorded (db deviations row). */
export interface DeviationInput {
  subjectLabel: string;
  decision: string;
  justification: string;
  approvedByName: string;
  createdAt: Date;
}

const NOT_CONFORMING: ReadonlySet<Decision> = new Set(["fail", "undecided"]);

/**
 * The statement of conformity (ISO/IEC 17025:2017 §7.8.6.1): conforms when every judged result
 * passes; conforms with the listed deviations accepted when each FAIL or undecided result is
 * carried as a deviation; does not conform otherwise. The decision rule is stated with it.
 */
export function conformityStatement(
  decisions: readonly Decision[],
  /** How many of the FAIL or undecided results a deviation recorded for that same result carries. */
  carried: number,
  decisionRule: string,
): NonNullable<ReportData["conformity"]> {
  const judged = decisions.filter((x) => x !== "recorded" && x !== "not_measured");
  const open = judged.filter((x) => NOT_CONFORMING.has(x)).length;
  if (judged.length === 0)
    return { verdict: "not_judged", text: "No result was judged against a limit; the values are recorded." };
  if (open === 0)
    return {
      verdict: "conforms",
      text: `Conforms: all ${judged.length} judged results are within their limits. Decision rule: ${decisionRule}.`,
    };
  if (carried >= open)
    return {
      verdict: "conforms_with_deviations",
      text: `Conforms with the listed deviations accepted: ${open} of ${judged.length} judged results are outside their limits or undecided and are carried as deviations (section 8). Decision rule: ${decisionRule}.`,
    };
  return {
    verdict: "does_not_conform",
    text: `Does not conform: ${open} of ${judged.length} judged results are outside their limits or undecided. Decision rule: ${decisionRule}.`,
  };
}

/**
 * The statement of conformity of a job's judged rows (readings, head parameters, test part, the
 * tool-centre-point check after compensation and each rotary axis's positioning test, one result
 * each) and recorded deviations: one function for the issued report and the job's overview page.
 * A FAIL or undecided check or test blocks issue unless a deviation carries it; carried, the
 * report conforms with deviations, as for a parameter.
 */
export function reportConformity(
  i: Pick<
    ReportInputs,
    "readings" | "parameters" | "testPart" | "carried" | "controlValues" | "rotaryPositioning"
  >,
  rule: string,
): NonNullable<ReportData["conformity"]> {
  const decisions = [
    ...i.readings.rows.map((r) => r.decision),
    ...(i.parameters?.rows ?? []).map((r) => r.decision),
    ...i.testPart.map((r) => r.decision),
    ...(i.controlValues?.tcpCheck ? [i.controlValues.tcpCheck.decision] : []),
    ...(i.rotaryPositioning ?? []).map((t) => t.decision),
  ];
  return conformityStatement(decisions, i.carried, decisionRuleText(rule));
}

export function deviationRows(list: readonly DeviationInput[]): NonNullable<ReportData["deviations"]> {
  return list.map((x) => ({
    result: x.subjectLabel,
    decision: x.decision === "fail" ? "FAIL" : x.decision,
    justification: x.justification,
    approvedBy: x.approvedByName,
    recordedAtUtc: formatDateTimeUtc(x.createdAt),
  }));
}

export interface ReportInputs {
  meta: {
    reportId: string;
    revision: number;
    issuedAt: Date;
    /** The approval that issues the report; absent in a draft preview (`draft`), which has no signature. */
    approval?: ReportSignature;
    draft?: boolean;
    amendment?: ReportData["amendment"];
  };
  d: JobInput;
  jobKindLabel: string;
  template: { name: string; version: number } | null;
  instruments: ReportData["instruments"];
  readings: ReturnType<typeof readingSection>;
  /** The appendix of photos (sections/photo-rows.ts); absent or empty when no step asks for one. */
  photos?: ReportData["photos"];
  parameters: ReturnType<typeof parameterSection> | null;
  testPart: ReportData["testPart"];
  figures: ReportData["figures"];
  /** Pre-issue signatures, oldest first. */
  signatures: ReportSignature[];
  deviations: readonly DeviationInput[];
  /**
   * How many of the job's FAIL or undecided results are carried by a deviation recorded for that
   * same result (matched by subject, db/queries/readiness.carriedResultCount): a deviation for
   * another result, or for one measured again since, carries nothing.
   */
  carried: number;
  verifyUrl: string;
  /** The issuer as the settings held it at issue (lib/report/sections/records for the rest). */
  issuer: ReportData["issuer"];
  /** The record details (ISO/IEC 17025:2017 §7.8.2.1); absent only where a caller has none to give. */
  records?: ReportRecords;
  /** lib/report/sections/control.ts; null or absent when no control values were recorded. */
  controlValues?: ReportData["controlValues"] | null;
  budget?: ReportData["budget"] | null;
  /** lib/report/sections/positioning.ts; empty or absent when no rotary axis was tested. */
  rotaryPositioning?: ReportData["rotaryPositioning"] | null;
}

const METHOD_READINGS = "Indicator readings against the checklist limits";
const METHOD_POSITIONING = "positioning of the rotary axes by ISO 230-2";
const METHOD_FIT =
  "kinematic fit from sphere-probe data (geometry model stated in the product documentation)";

/**
 * The method the report states (ISO/IEC 17025:2017 §7.8.2.1 c): what this job did, so a job
 * without an approved fit does not claim one. Readings are named unless the fit is all there is.
 */
function methodOf(i: Pick<ReportInputs, "readings" | "parameters">): string {
  if (!i.parameters) return METHOD_READINGS;
  if (!i.readings.rows.length) return METHOD_FIT.charAt(0).toUpperCase() + METHOD_FIT.slice(1);
  return `${METHOD_READINGS}; ${METHOD_FIT}`;
}

/** Assembles the report's content and names it by the SHA-256 of its canonical JSON. */
export function buildReportContent(i: ReportInputs): ReportData {
  const { d, meta } = i;
  const decisionRule = decisionRuleText(d.job.decisionRule);
  const data: Omit<ReportData, "contentSha256"> = {
    ...(meta.draft ? { draft: true } : {}),
    reportId: meta.reportId,
    reference: d.job.reference,
    revision: meta.revision,
    ...(meta.amendment ? { amendment: meta.amendment } : {}),
    issuedAtUtc: meta.draft ? null : formatDateTimeUtc(meta.issuedAt),
    issuer: i.issuer,
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
      kind: i.jobKindLabel,
      title: d.job.title,
      dates: d.job.scheduledFor
        ? `from ${formatDateTimeUtc(d.job.scheduledFor)}`
        : "as recorded in the activity log",
      airTemperature:
        d.job.airTempC != null ? `${d.job.airTempC.toFixed(1)} °C air temperature as entered` : undefined,
      procedure: i.template
        ? `${i.template.name}, version ${i.template.version}`
        : "Checklist as recorded on the job (no procedure version)",
      method: i.rotaryPositioning?.length ? `${methodOf(i)}; ${METHOD_POSITIONING}` : methodOf(i),
      decisionRule,
    },
    instruments: i.instruments,
    readings: i.readings.rows,
    parameters: i.parameters?.rows ?? [],
    testPart: i.testPart,
    figures: i.figures,
    charts: {
      ...(i.readings.chart.length ? { readings: i.readings.chart } : {}),
      ...(i.parameters?.charts ?? {}),
    },
    conformity: reportConformity(i, d.job.decisionRule),
    deviations: deviationRows(i.deviations),
    ...(i.controlValues ? { controlValues: i.controlValues } : {}),
    ...(i.budget ? { budget: i.budget } : {}),
    ...(i.rotaryPositioning?.length ? { rotaryPositioning: i.rotaryPositioning } : {}),
    remarks: [...(i.parameters ? [i.parameters.note] : []), ...(d.job.notes ? [d.job.notes] : [])],
    ...(i.photos?.length ? { photos: i.photos } : {}),
    safety: [...SAFETY_NOTES],
    signatures: meta.draft || !meta.approval ? [] : [...i.signatures, meta.approval],
    verifyUrl: i.verifyUrl,
    ...(i.records ? { records: i.records } : {}),
  };
  return { ...data, contentSha256: sha256Hex(canonicalJson(data)) };
}

/** A label and its value; a row without a value is left out where it is shown. */
export type FactRow = [label: string, value: string | undefined];

/**
 * The report's identification and work facts as label–value rows: the page
 * (components/report/report-view.tsx) and the PDF (lib/report/document.tsx) both show these.
 */
export function reportFacts(data: ReportData): { machine: FactRow[]; head: FactRow[]; work: FactRow[] } {
  return {
    machine: [
      ["Customer", data.customer.name],
      ["Site", [data.customer.site, data.customer.address].filter(Boolean).join(", ")],
      ["Host machine", `${data.machine.name} (${data.machine.kind})`],
      ["Builder, model", data.machine.builderModel],
      ["Machine serial", data.machine.serial],
      ["Control", data.machine.control],
    ],
    head: [
      ["Head serial", data.head.serial],
      ["Maker, model", data.head.makerModel],
      ["Axes", data.head.axes],
      ["Nominal pivot length", data.head.nominalPivotLength],
      ["Mass", data.head.mass],
    ],
    work: [
      ["Job", `${data.work.title} (${data.work.kind})`],
      ["Dates of work", data.work.dates],
      ["Procedure", data.work.procedure],
      ["Method", data.work.method],
      ["Decision rule", data.work.decisionRule],
      ["Environment", data.work.airTemperature],
    ],
  };
}
