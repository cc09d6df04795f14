/**
 * A procedure as the builder and the API send it, and the pure rules that turn it into stored
 * steps: limits are written in the step's own unit (mm, µm, in or ″) and stored canonically (mm
 * or arc seconds); every judged step names where its limit comes from. The same schema serves
 * `POST /api/procedures`, `POST /api/procedures/{id}/versions` and the builder's form, so an
 * error names the same field (`steps.3.upper`) everywhere.
 */
import { z } from "zod";
import { JOB_KINDS, type JobKind } from "@/lib/domain/jobs";
import {
  JUDGED_STEP_KINDS,
  LIMIT_SOURCES,
  MULTI_POINT_RESULTS,
  STEP_KINDS,
  type LimitSource,
  type StepKind,
} from "@/lib/domain/procedures";
import { fromCanonical, toCanonical, unitKind, type EntryUnit } from "@/lib/units";
import { HEAD_PARAMETER_KEYS, type HeadParameterKey } from "@/geometry/head/config";
import {
  HEAD_AXIS_ROLES,
  POSITIONING_QUANTITIES,
  type HeadAxisRole,
  type PositioningQuantity,
} from "@/lib/domain/positioning";

export const LIMIT_UNITS = ["mm", "um", "in", "arcsec"] as const satisfies readonly EntryUnit[];

/** The API's step kinds: ours, plus "reading" as the plain word for a single reading. */
const API_STEP_KINDS = [...STEP_KINDS, "reading"] as const;
/** The API's job kinds: ours, plus "recheck" for a periodic re-verification. */
const API_JOB_KINDS = [...JOB_KINDS, "recheck"] as const;

const text = (max: number) =>
  z.preprocess(
    (v) => (typeof v === "string" && v.trim() === "" ? null : v),
    z.string().trim().max(max).nullish(),
  );
/** An optional choice: a form's empty option ("") means none. */
const choice = <T extends z.ZodType>(schema: T) =>
  z.preprocess((v) => (v === "" ? null : v), schema.nullish());
const limit = z.preprocess(
  (v) => (v === "" ? null : typeof v === "string" ? Number(v) : v),
  z.number({ message: "Enter a number." }).finite("Enter a finite number.").nullish(),
);

export const procedureStepSchema = z.object({
  title: z.string().trim().min(1, "Give the step a title.").max(200),
  kind: z.enum(API_STEP_KINDS),
  instructions: text(4000),
  safety: text(2000),
  quantity: text(200),
  /** The unit the limits (and the readings of a multi-point step) are written in. */
  unit: choice(z.enum(LIMIT_UNITS)),
  lower: limit,
  upper: limit,
  decisionRule: choice(z.enum(["simple", "guarded"])),
  limitSource: choice(z.enum(LIMIT_SOURCES)),
  limitSourceNote: text(1000),
  /** multi_point: the named points in entry order. */
  points: z.preprocess(
    // A form writes the points as one line: "12, 3, 6, 9".
    (v) =>
      typeof v === "string"
        ? v
            .split(",")
            .map((x) => x.trim())
            .filter(Boolean)
        : v,
    z
      .array(z.string().trim().min(1, "A point needs a name.").max(12))
      .max(24, "At most 24 points.")
      .nullish(),
  ),
  pointResult: choice(z.enum(MULTI_POINT_RESULTS)),
  /** angle_over_distance: the distance the reading is taken over, mm. */
  distanceMm: z.preprocess(
    (v) => (v === "" ? null : typeof v === "string" ? Number(v) : v),
    z.number({ message: "Enter a number." }).positive("The distance must be positive.").nullish(),
  ),
  /** record: the unit the value is written in ("N·m", "mm"). */
  recordUnit: text(20),
  photoRequired: z.boolean().nullish(),
});
export type ProcedureStepInput = z.input<typeof procedureStepSchema>;

/** A limit for one fitted head parameter, in µm or arc seconds as the parameter's key says. */
export const parameterLimitSchema = z.object({
  parameter: z.enum(HEAD_PARAMETER_KEYS),
  lower: limit,
  upper: limit,
  decisionRule: choice(z.enum(["simple", "guarded"])),
  limitSource: choice(z.enum(LIMIT_SOURCES)),
  limitSourceNote: text(1000),
});

/**
 * An upper limit in arc seconds for one ISO 230-2 quantity (bidirectional A, E, M, R or B) of one
 * rotary axis of the head; an empty limit means that quantity is recorded, not judged.
 */
export const positioningLimitSchema = z.object({
  axis: z.enum(HEAD_AXIS_ROLES, { message: "Choose the primary (rotary) or the secondary (tilt) axis." }),
  quantity: z.enum(POSITIONING_QUANTITIES, { message: "Choose one of A, E, M, R or B (ISO 230-2)." }),
  upper: limit,
  limitSource: choice(z.enum(LIMIT_SOURCES)),
  limitSourceNote: text(1000),
});

/**
 * What judges the head as a whole: the tool-centre-point check after compensation (limits in µm,
 * with their source) and the limits of the fitted head parameters. Left out (undefined), a new
 * version keeps what the version it replaces had; the builder always sends them.
 */
const wholeHeadFields = {
  tcpCheckRequired: z.boolean().optional(),
  tcpRangeLimitUm: limit.optional(),
  tcpDeviationLimitUm: limit.optional(),
  tcpLimitSource: choice(z.enum(LIMIT_SOURCES)).optional(),
  tcpLimitSourceNote: text(1000).optional(),
  parameterLimits: z.array(parameterLimitSchema).max(HEAD_PARAMETER_KEYS.length).optional(),
  positioningLimits: z
    .array(positioningLimitSchema)
    .max(HEAD_AXIS_ROLES.length * POSITIONING_QUANTITIES.length)
    .optional(),
};

export const procedureSchema = z.object({
  name: z.string().trim().min(3, "Give the procedure a name.").max(160),
  description: text(2000),
  /** One job kind (the API's short form) or several; none = every kind. */
  jobKind: z.enum(API_JOB_KINDS).nullish(),
  jobKinds: z.preprocess(
    // Form check boxes give false (none ticked), one value, or a list.
    (v) => (v === false ? null : typeof v === "string" ? [v] : v),
    z.array(z.enum(API_JOB_KINDS)).max(API_JOB_KINDS.length).nullish(),
  ),
  headModel: text(120),
  steps: z.array(procedureStepSchema).min(1, "A procedure needs at least one step.").max(80),
  ...wholeHeadFields,
});
export type ProcedureInput = z.input<typeof procedureSchema>;

/** A new version takes the same body; its name must be the procedure's own (or left out). */
export const procedureVersionSchema = procedureSchema.extend({
  name: procedureSchema.shape.name.optional(),
});

/** One stored step, as template_steps holds it (without its template). */
export interface StepRow {
  position: number;
  title: string;
  instructions: string | null;
  quantity: string;
  quantityKind: "length" | "angle";
  derivation: StepKind;
  distanceMm: number | null;
  lowerLimit: number | null;
  upperLimit: number | null;
  limitUnit: EntryUnit | null;
  decisionRule: "simple" | "guarded";
  limitSource: LimitSource;
  limitSourceNote: string | null;
  safetyNote: string | null;
  points: string[] | null;
  pointResult: (typeof MULTI_POINT_RESULTS)[number] | null;
  recordUnit: string | null;
  photoRequired: boolean;
}

/** The TCP-check columns of procedure_templates. */
export interface TcpRows {
  tcpCheckRequired: boolean;
  tcpRangeLimitUm: number | null;
  tcpDeviationLimitUm: number | null;
  tcpLimitSource: LimitSource | null;
  tcpLimitSourceNote: string | null;
}

/** One row of template_parameter_limits (without its template). */
export interface ParameterLimitRow {
  parameter: HeadParameterKey;
  lowerLimit: number | null;
  upperLimit: number | null;
  decisionRule: "simple" | "guarded";
  limitSource: LimitSource;
  limitSourceNote: string | null;
}

/** One row of template_positioning_limits (without its template). */
export interface PositioningLimitRow {
  axis: HeadAxisRole;
  quantity: PositioningQuantity;
  upperLimitArcsec: number;
  limitSource: LimitSource;
  limitSourceNote: string | null;
}

export interface ProcedureRows {
  name: string | null;
  description: string | null;
  jobKinds: JobKind[] | null;
  headModel: string | null;
  steps: StepRow[];
  /** null: not sent; a new version keeps the TCP check of the version it replaces. */
  tcp: TcpRows | null;
  /** null: not sent; a new version keeps the parameter limits of the version it replaces. */
  parameterLimits: ParameterLimitRow[] | null;
  /** null: not sent; a new version keeps the positioning limits of the version it replaces. */
  positioningLimits: PositioningLimitRow[] | null;
}

export interface ProcedureIssue {
  field: string;
  message: string;
}

const normaliseJobKind = (k: (typeof API_JOB_KINDS)[number]): JobKind =>
  k === "recheck" ? "reverification" : k;

/**
 * Check a parsed procedure against the rules zod cannot see per field, and turn it into stored
 * rows. Returns the rows, or every problem found with its field (`steps.2.limitSource`).
 */
export function procedureRows(
  input: z.output<typeof procedureSchema> | z.output<typeof procedureVersionSchema>,
): { rows: ProcedureRows; issues: [] } | { rows: null; issues: ProcedureIssue[] } {
  const issues: ProcedureIssue[] = [];
  const steps: StepRow[] = input.steps.map((s, i) => {
    const at = (f: string) => `steps.${i}.${f}`;
    const kind: StepKind = s.kind === "reading" ? "direct" : s.kind;
    const judged = JUDGED_STEP_KINDS.includes(kind);
    const measured = judged && kind !== "check";
    const unit = s.unit ?? null;
    if (measured && !unit) issues.push({ field: at("unit"), message: "Say which unit the limits are in." });
    if (measured && s.lower == null && s.upper == null)
      issues.push({ field: at("upper"), message: "A judged step needs a lower or an upper limit." });
    if (s.lower != null && s.upper != null && s.lower > s.upper)
      issues.push({ field: at("lower"), message: "The lower limit is above the upper limit." });
    if (s.decisionRule === "guarded" && s.upper == null)
      issues.push({ field: at("upper"), message: "Guarded acceptance needs an upper limit." });
    if (judged && !s.limitSource)
      issues.push({
        field: at("limitSource"),
        message:
          "Say where the limit comes from (a standard and clause, the maker's figure, the customer's specification, or \"common practice, no published source\").",
      });
    if (judged && (s.limitSource === "standard" || s.limitSource === "customer_spec") && !s.limitSourceNote)
      issues.push({
        field: at("limitSourceNote"),
        message:
          s.limitSource === "standard"
            ? "Name the standard and its clause."
            : "Name the customer's specification.",
      });
    if (kind === "multi_point") {
      const pts = s.points ?? [];
      if (pts.length < 2)
        issues.push({ field: at("points"), message: "A multi-point step needs two or more points." });
      if (new Set(pts).size !== pts.length)
        issues.push({ field: at("points"), message: "Each point needs its own name." });
      if (!s.pointResult)
        issues.push({ field: at("pointResult"), message: "Say what is derived: TIR, flatness or the mean." });
      if (s.pointResult === "flatness" && pts.length < 4)
        issues.push({ field: at("points"), message: "Flatness needs four or more points." });
    }
    if (kind === "angle_over_distance" && !s.distanceMm)
      issues.push({ field: at("distanceMm"), message: "Give the distance the reading is taken over (mm)." });
    if (kind === "record" && !s.recordUnit)
      issues.push({
        field: at("recordUnit"),
        message: "Give the unit the value is recorded in (N·m, mm …).",
      });
    // An angle from a reading over a distance is judged in ″; the reading itself is length.
    const quantityKind = kind === "angle_over_distance" ? "angle" : unit ? unitKind(unit) : "length";
    if (kind === "angle_over_distance" && unit && unit !== "arcsec")
      issues.push({ field: at("unit"), message: "An angle's limits are in arc seconds (″)." });
    const canon = (v: number | null | undefined) =>
      v == null || !measured || !unit ? null : toCanonical(v, unit);
    return {
      position: i + 1,
      title: s.title,
      instructions: s.instructions ?? null,
      quantity: s.quantity ?? s.title,
      quantityKind,
      derivation: kind,
      distanceMm: kind === "angle_over_distance" ? (s.distanceMm ?? null) : null,
      lowerLimit: canon(s.lower),
      upperLimit: canon(s.upper),
      limitUnit: measured ? unit : null,
      decisionRule: measured ? (s.decisionRule ?? "simple") : "simple",
      // Steps that are not judged carry no limit; "common practice" is the neutral word.
      limitSource: judged ? (s.limitSource ?? "common_practice") : "common_practice",
      limitSourceNote: judged ? (s.limitSourceNote ?? null) : null,
      safetyNote: s.safety ?? null,
      points: kind === "multi_point" ? (s.points ?? []) : null,
      pointResult: kind === "multi_point" ? (s.pointResult ?? null) : null,
      recordUnit: kind === "record" ? (s.recordUnit ?? null) : null,
      photoRequired: s.photoRequired ?? false,
    };
  });
  const sourceIssues = (at: (f: string) => string, source: string | null | undefined, note: unknown) => {
    if (!source)
      issues.push({
        field: at("limitSource"),
        message:
          "Say where the limit comes from (a standard and clause, the maker's figure, the customer's specification, or \"common practice, no published source\").",
      });
    if ((source === "standard" || source === "customer_spec") && !note)
      issues.push({
        field: at("limitSourceNote"),
        message:
          source === "standard" ? "Name the standard and its clause." : "Name the customer's specification.",
      });
  };
  let tcp: TcpRows | null = null;
  const tcpSent =
    input.tcpCheckRequired !== undefined ||
    input.tcpRangeLimitUm !== undefined ||
    input.tcpDeviationLimitUm !== undefined;
  if (tcpSent) {
    const range = input.tcpRangeLimitUm ?? null;
    const deviation = input.tcpDeviationLimitUm ?? null;
    if (range !== null && range <= 0)
      issues.push({ field: "tcpRangeLimitUm", message: "A range limit is a positive number of µm." });
    if (deviation !== null && deviation <= 0)
      issues.push({ field: "tcpDeviationLimitUm", message: "A distance limit is a positive number of µm." });
    const limited = range !== null || deviation !== null;
    // The TCP fields are named tcpLimitSource / tcpLimitSourceNote.
    if (limited)
      sourceIssues(
        (f) => `tcp${f[0]!.toUpperCase()}${f.slice(1)}`,
        input.tcpLimitSource,
        input.tcpLimitSourceNote,
      );
    tcp = {
      tcpCheckRequired: input.tcpCheckRequired ?? false,
      tcpRangeLimitUm: range,
      tcpDeviationLimitUm: deviation,
      tcpLimitSource: limited ? (input.tcpLimitSource ?? null) : null,
      tcpLimitSourceNote: limited ? (input.tcpLimitSourceNote ?? null) : null,
    };
  }
  /**
   * The rows of one list of limits: null when the list is not sent (a new version keeps what it
   * had); a second entry for the same key is named; `row` checks one entry and returns its row, or
   * null when it sets no limit (recorded, not judged).
   */
  const limitRows = <L, R>(
    list: readonly L[] | undefined,
    name: string,
    duplicate: { field: string; message: string; key: (l: L) => string },
    row: (l: L, at: (f: string) => string) => R | null,
  ): R[] | null => {
    if (list === undefined) return null;
    const seen = new Set<string>();
    const out: R[] = [];
    list.forEach((l, i) => {
      const at = (f: string) => `${name}.${i}.${f}`;
      const key = duplicate.key(l);
      if (seen.has(key)) issues.push({ field: at(duplicate.field), message: duplicate.message });
      seen.add(key);
      const r = row(l, at);
      if (r) out.push(r);
    });
    return out;
  };
  const parameterLimits = limitRows(
    input.parameterLimits,
    "parameterLimits",
    { field: "parameter", message: "This parameter has a limit already.", key: (l) => l.parameter },
    (l, at): ParameterLimitRow | null => {
      const lower = l.lower ?? null;
      const upper = l.upper ?? null;
      // Both limits empty: the parameter is recorded, not judged.
      if (lower === null && upper === null) return null;
      if (lower !== null && upper !== null && lower > upper)
        issues.push({ field: at("lower"), message: "The lower limit is above the upper limit." });
      if (l.decisionRule === "guarded" && upper === null)
        issues.push({ field: at("upper"), message: "Guarded acceptance needs an upper limit." });
      sourceIssues(at, l.limitSource, l.limitSourceNote);
      return {
        parameter: l.parameter,
        lowerLimit: lower,
        upperLimit: upper,
        decisionRule: l.decisionRule ?? "simple",
        limitSource: l.limitSource ?? "common_practice",
        limitSourceNote: l.limitSourceNote ?? null,
      };
    },
  );
  const positioningLimits = limitRows(
    input.positioningLimits,
    "positioningLimits",
    {
      field: "quantity",
      message: "This axis has a limit for this quantity already.",
      key: (l) => `${l.axis}:${l.quantity}`,
    },
    (l, at): PositioningLimitRow | null => {
      const upper = l.upper ?? null;
      // An empty limit: the quantity is recorded, not judged.
      if (upper === null) return null;
      if (upper <= 0)
        issues.push({
          field: at("upper"),
          message: "A positioning limit is a positive number of arc seconds.",
        });
      sourceIssues(at, l.limitSource, l.limitSourceNote);
      return {
        axis: l.axis,
        quantity: l.quantity,
        upperLimitArcsec: upper,
        limitSource: l.limitSource ?? "common_practice",
        limitSourceNote: l.limitSourceNote ?? null,
      };
    },
  );
  if (issues.length) return { rows: null, issues };
  const kinds = [...(input.jobKind ? [input.jobKind] : []), ...(input.jobKinds ?? [])].map(normaliseJobKind);
  return {
    rows: {
      name: input.name ?? null,
      description: input.description ?? null,
      jobKinds: kinds.length ? [...new Set(kinds)] : null,
      headModel: input.headModel ?? null,
      steps,
      tcp,
      parameterLimits,
      positioningLimits,
    },
    issues: [],
  };
}

/** The point names a builder offers: clock positions, or N equal points named P1 … PN. */
export function equalPoints(n: number): string[] {
  return Array.from({ length: n }, (_, i) => `P${i + 1}`);
}

/**
 * Saving a procedure: a version no job has used yet is changed in place; once a job uses it, the
 * change becomes the next version and the old one stays exactly as the job saw it.
 */
export function versionPlan(jobsUsingIt: number): "replace" | "new_version" {
  return jobsUsingIt > 0 ? "new_version" : "replace";
}

/** Move one step up (-1) or down (+1); out of range leaves the list as it was. */
export function moveStep<T>(steps: readonly T[], index: number, by: -1 | 1): T[] {
  const to = index + by;
  const out = steps.slice();
  if (index < 0 || index >= steps.length || to < 0 || to >= steps.length) return out;
  [out[index], out[to]] = [out[to]!, out[index]!];
  return out;
}

/** A stored step as the builder and the API read it back: limits in the step's own unit. */
export function stepInputFromRow(r: Omit<StepRow, "limitUnit"> & { limitUnit: string | null }) {
  const unit = (LIMIT_UNITS as readonly string[]).includes(r.limitUnit ?? "")
    ? (r.limitUnit as EntryUnit)
    : r.lowerLimit != null || r.upperLimit != null
      ? r.quantityKind === "angle"
        ? "arcsec"
        : "mm"
      : null;
  const back = (v: number | null) =>
    v == null || !unit ? null : Number(fromCanonical(v, unit).toPrecision(12));
  return {
    title: r.title,
    kind: r.derivation,
    instructions: r.instructions,
    safety: r.safetyNote,
    quantity: r.quantity,
    unit,
    lower: back(r.lowerLimit),
    upper: back(r.upperLimit),
    decisionRule: r.decisionRule,
    limitSource: r.limitSource,
    limitSourceNote: r.limitSourceNote,
    points: r.points,
    pointResult: r.pointResult,
    distanceMm: r.distanceMm,
    recordUnit: r.recordUnit,
    photoRequired: r.photoRequired,
  } satisfies z.input<typeof procedureStepSchema>;
}
