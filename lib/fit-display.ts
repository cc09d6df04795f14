/**
 * What the analysis page shows of a stored head fit, as plain data: each parameter with its
 * symbol, value, expanded uncertainty and identifiability in words, and — once approved — the
 * values to enter in the control in control-neutral words. Pure; the numbers are geometry's
 * (headFitToJson), only rounded for display.
 */
import { headAxes, type AxisLetter, type HeadConfig, type HeadParameterKey } from "@/geometry";
import type { HeadFitJson } from "@/geometry";
import type { DecisionRule } from "@/geometry/decision";
import { judge, type StepDecision } from "@/lib/checklist";
import { LIMIT_SOURCE_LABELS, type LimitSource } from "@/lib/domain/procedures";
import { signed } from "@/lib/numbers";
import { UNIT_SYMBOL } from "@/lib/units";

export const PARAMETER_WORDS: Record<HeadParameterKey, string> = {
  pivot_length_error_um: "Pivot length error (tilt axis to gauge point, along the tool)",
  tip_offset_s_um: "Gauge point offset along the tilt axis",
  tip_offset_n_um: "Gauge point offset across the tilt axis (pivot offset)",
  secondary_offset_um: "Tilt axis passing beside the primary axis",
  primary_zero_arcsec: "Zero-position error of the primary axis",
  secondary_zero_arcsec: "Zero-position error of the tilt axis",
  secondary_tilt_arcsec: "Squareness of the tilt axis to the primary axis",
  secondary_yaw_arcsec: "Tilt axis turned about the primary axis",
  primary_tilt_s_arcsec: "Tilt of the primary axis about the tilt axis",
  primary_tilt_n_arcsec: "Tilt of the primary axis across the tilt axis",
};

export const IDENTIFIABILITY_WORDS = { yes: "Yes", weak: "Weak", no: "Not separable" } as const;

export interface ParameterRow {
  key: HeadParameterKey;
  iso: string;
  words: string;
  value: number;
  unit: "um" | "arcsec";
  /** Displayed value, e.g. "+37.88 µm"; "held at 0" for a pinned parameter. */
  valueText: string;
  UText: string;
  identifiable: "yes" | "weak" | "no";
  identifiableText: string;
  heldAtZero: boolean;
  /** The job's limit for this parameter, e.g. "± 40.0 µm", or null when none is set (recorded). */
  toleranceText: string | null;
  /** Where the limit comes from, in words ("Customer specification: …"). */
  limitSourceText: string | null;
  decisionRule: DecisionRule | null;
  /** Pass, fail or undecided by the rule with U; no_limit when none is set; not_measured when the data could not determine it. */
  decision: StepDecision;
  decisionText: string;
}

/** A limit for one fitted parameter (template_parameter_limits), in the parameter's unit (µm or ″). */
export interface ParameterLimit {
  readonly parameter: string;
  readonly lowerLimit: number | null;
  readonly upperLimit: number | null;
  readonly decisionRule: DecisionRule;
  readonly limitSource: LimitSource;
  readonly limitSourceNote: string | null;
}

/** Where a limit comes from, in the printed words, with its note: "Standard: ISO 230-1". One wording for every section. */
export function limitSourceWords(source: string, note: string | null | undefined): string {
  const words = LIMIT_SOURCE_LABELS[source as LimitSource] ?? source.replace("_", " ");
  return `${words}${note ? `: ${note}` : ""}`;
}

const PARAMETER_DECISION_TEXT: Record<StepDecision, string> = {
  pass: "Pass",
  fail: "Fail",
  undecided: "Undecided",
  no_limit: "Recorded",
  not_measured: "Not determined",
};

/** "± 40.0 µm" (or "± 20.0″") for a symmetric limit, "−5.0 … +10.0 µm", "≤ +10.0 µm" or "≥ −5.0 µm" otherwise. */
export function limitText(lower: number | null, upper: number | null, unit: "um" | "arcsec"): string | null {
  const d = 1;
  const withUnit = (t: string) => (unit === "arcsec" ? `${t}″` : `${t} µm`);
  if (lower == null && upper == null) return null;
  if (lower != null && upper != null && Math.abs(lower + upper) <= 1e-12 * Math.max(1, Math.abs(upper)))
    return withUnit(`± ${upper.toFixed(d)}`);
  if (lower != null && upper != null) return withUnit(`${signed(lower, d)} … ${signed(upper, d)}`);
  if (upper != null) return withUnit(`≤ ${signed(upper, d)}`);
  return withUnit(`≥ ${signed(lower as number, d)}`);
}

/**
 * The fitted parameters as table rows, each judged against the job's limit for it (if any) with
 * the limit's decision rule and the parameter's expanded uncertainty U (ISO 14253-1, through
 * lib/checklist's judge). A parameter the data could not determine (held at 0) is not judged.
 */
export function parameterRows(fit: HeadFitJson, limits: readonly ParameterLimit[] = []): ParameterRow[] {
  return fit.parameters.map((p) => {
    const held = p.U === null;
    const lim = limits.find((l) => l.parameter === p.key);
    const decision: StepDecision =
      !lim || (lim.lowerLimit == null && lim.upperLimit == null)
        ? "no_limit"
        : held
          ? "not_measured"
          : judge(
              {
                quantityKind: "length",
                derivation: "direct",
                distanceMm: null,
                lowerLimit: lim.lowerLimit,
                upperLimit: lim.upperLimit,
                decisionRule: lim.decisionRule,
              },
              p.value,
              p.U ?? 0,
            );
    return {
      key: p.key,
      iso: p.iso,
      words: PARAMETER_WORDS[p.key],
      value: p.value,
      unit: p.unit,
      valueText: held ? "held at 0" : `${signed(p.value, 2)} ${UNIT_SYMBOL[p.unit]}`,
      UText: held || p.U === null ? "—" : `± ${p.U.toFixed(2)} ${UNIT_SYMBOL[p.unit]}`,
      identifiable: p.identifiable,
      identifiableText: IDENTIFIABILITY_WORDS[p.identifiable],
      heldAtZero: held,
      toleranceText: lim ? limitText(lim.lowerLimit, lim.upperLimit, p.unit) : null,
      limitSourceText: lim ? limitSourceWords(lim.limitSource, lim.limitSourceNote) : null,
      decisionRule: lim ? lim.decisionRule : null,
      decision,
      decisionText: PARAMETER_DECISION_TEXT[decision],
    };
  });
}

/** A parameter the approver is warned about before approving: it fails its limit or is undecided. */
export interface NonConformingParameter {
  key: string;
  label: string;
  decisionText: string;
  valueText: string;
  toleranceText: string | null;
}

/** The rows that do not conform (fail, or undecided under the rule with U), named for the warning. */
export function nonConformingParameters(rows: readonly ParameterRow[]): NonConformingParameter[] {
  return rows
    .filter((p) => p.decision === "fail" || p.decision === "undecided")
    .map((p) => ({
      key: p.key,
      label: `${p.iso} (${p.words})`,
      decisionText: p.decisionText,
      valueText: p.valueText,
      toleranceText: p.toleranceText,
    }));
}

export interface ControlValue {
  label: string;
  /** Value as entered, with unit. */
  text: string;
  /** How it is made and which way positive points. */
  note: string;
}

const DIR: Record<string, string> = {
  "1,0,0": "+X",
  "-1,0,0": "−X",
  "0,1,0": "+Y",
  "0,-1,0": "−Y",
  "0,0,1": "+Z",
  "0,0,-1": "−Z",
};
const dirName = (v: readonly number[]) =>
  DIR[v.map((x) => Math.round(x)).join(",")] ?? `(${v.map((x) => x.toFixed(3)).join(", ")})`;

/**
 * The approved parameters as values for the control, in the control's usual quantities: the pivot
 * length as nominal + error in mm, offsets in mm, zero shifts and axis tilts in degrees. Held
 * parameters are left out (they are 0 by the fit's assumption, said in the warnings).
 */
export function controlValues(fit: HeadFitJson, config: HeadConfig): ControlValue[] {
  const { s, n } = headAxes(config);
  const v = (k: HeadParameterKey) => fit.parameters.find((p) => p.key === k);
  const out: ControlValue[] = [];
  const L = v("pivot_length_error_um");
  if (L)
    out.push({
      label: "Pivot length",
      text: `${(config.pivotLengthMm + L.value / 1000).toFixed(4)} mm`,
      note: `nominal ${config.pivotLengthMm.toFixed(4)} mm ${L.value < 0 ? "−" : "+"} ${Math.abs(L.value / 1000).toFixed(4)} mm; from the tilt axis to the gauge point along the tool`,
    });
  const mm = (k: HeadParameterKey, label: string, along: string) => {
    const p = v(k);
    if (!p || p.U === null) return;
    out.push({
      label,
      text: `${signed(p.value / 1000, 4)} mm`,
      note: `positive along ${along} with both axes at zero`,
    });
  };
  mm(
    "tip_offset_s_um",
    "Gauge point offset along the tilt axis",
    `${dirName(s)} (the ${config.secondary} axis direction)`,
  );
  mm("tip_offset_n_um", "Gauge point offset across the tilt axis", dirName(n));
  mm(
    "secondary_offset_um",
    `${config.secondary} axis line offset from the ${config.primary} axis`,
    dirName(n),
  );
  const deg = (k: HeadParameterKey, label: string, about: string) => {
    const p = v(k);
    if (!p || p.U === null) return;
    out.push({
      label,
      text: `${signed(p.value / 3600, 5)}°`,
      note: `${signed(p.value, 1)}″; positive is a right-hand turn about ${about}`,
    });
  };
  const axisLetter = (a: AxisLetter) => `+${({ A: "X", B: "Y", C: "Z" } as const)[a]}`;
  deg(
    "primary_zero_arcsec",
    `${config.primary} axis zero shift`,
    `${axisLetter(config.primary)} (the ${config.primary} axis)`,
  );
  deg(
    "secondary_zero_arcsec",
    `${config.secondary} axis zero shift`,
    `${axisLetter(config.secondary)} (the ${config.secondary} axis)`,
  );
  deg("secondary_tilt_arcsec", `${config.secondary} axis squareness to ${config.primary}`, dirName(n));
  deg(
    "secondary_yaw_arcsec",
    `${config.secondary} axis turned about ${config.primary}`,
    axisLetter(config.primary),
  );
  deg("primary_tilt_s_arcsec", `${config.primary} axis tilt about ${dirName(s)}`, dirName(s));
  deg("primary_tilt_n_arcsec", `${config.primary} axis tilt about ${dirName(n)}`, dirName(n));
  return out;
}
