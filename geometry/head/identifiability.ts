/**
 * Which error parameters a set of poses can determine (geometry/README.md, "Identifiability
 * computed, never assumed").
 *
 * Method: the Jacobian J of the sphere-centre residuals with respect to [c, parameters] is built at
 * zero error from the poses alone (the classification depends on where the head was probed, not on
 * the noise or on the error values found), columns scaled to unit norm. Its singular values are
 * the square roots of the eigenvalues of the scaled normal matrix D⁻¹JᵀJD⁻¹ (ml-matrix symmetric
 * eigen-decomposition), relative to the largest:
 * - below 1e-6: the parameters with a component |v_j| ≥ 0.1 in that singular vector are *not
 *   identifiable* from this data ("no");
 * - below 1e-3: they are *weakly identifiable* ("weak").
 * For each inseparable group, one parameter (the first in PIN_ORDER) is held at 0 and the others
 * keep carrying the group's combined effect; the whole group is reported "no" and a warning says
 * why and what data would separate it. Pinning only one per group, not all, keeps the combined
 * effect out of the residuals, which would otherwise inflate s and every other uncertainty.
 * Parameters held at 0 by default or by the caller are classified by asking whether freeing them
 * (alone, beside the free set) would be possible.
 */
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { GeometryError } from "../errors";
import {
  DEFAULT_PINNED,
  headAxes,
  headParameterSymbols,
  headParameterUnit,
  HEAD_PARAMETER_KEYS,
  type HeadAxes,
  type HeadConfig,
  type HeadParameterKey,
  type HeadParameterUnit,
} from "./config";
import { NP } from "./kernel";
import { headNormalEquations, type PoseColumns } from "./normal";

export type Identifiability = "yes" | "weak" | "no";

/** Relative singular value below which a direction is not identifiable. */
export const NOT_IDENTIFIABLE_BELOW = 1e-6;
/** Relative singular value below which a direction is weakly identifiable. */
export const WEAKLY_IDENTIFIABLE_BELOW = 1e-3;
const PARTICIPATION = 0.1;

/** Which parameter of an inseparable group is held at 0 first. */
const PIN_ORDER: readonly HeadParameterKey[] = [
  "secondary_yaw_arcsec",
  "tip_offset_n_um",
  "secondary_offset_um",
  "tip_offset_s_um",
  "pivot_length_error_um",
  "primary_tilt_n_arcsec",
  "primary_tilt_s_arcsec",
  "secondary_tilt_arcsec",
  "secondary_zero_arcsec",
  "primary_zero_arcsec",
];

export interface ParameterSelection {
  /** Parameters to hold at 0 (in addition to the defaults). */
  readonly pin?: readonly HeadParameterKey[];
  /** Parameters to fit even if pinned by default (e.g. secondary_yaw_arcsec). */
  readonly free?: readonly HeadParameterKey[];
}

export interface ParameterIdentifiability {
  readonly key: HeadParameterKey;
  readonly identifiable: Identifiability;
  /** Held at 0 in the fit (by default, by the caller, or because it could not be separated). */
  readonly pinned: boolean;
  readonly pinnedBy?: "default" | "caller" | "inseparable";
}

export interface IdentifiabilityReport {
  readonly parameters: readonly ParameterIdentifiability[];
  /** Indices (HEAD_PARAMETER_KEYS order) of the parameters the fit will estimate. */
  readonly freeIndices: readonly number[];
  /** Singular values of the final column-scaled Jacobian relative to the largest, descending. */
  readonly relativeSingularValues: readonly number[];
  readonly warnings: readonly string[];
  /** JᵀJ at zero error over [c, all ten parameters] (13×13 row-major), for the planner. */
  readonly fullNormal: Float64Array;
}

/** Validate the pin / free lists and return the starting free set (indices). */
export function initialFreeSet(selection: ParameterSelection = {}): number[] {
  const check = (list: readonly string[] | undefined, name: string) => {
    for (const k of list ?? []) {
      if (!(HEAD_PARAMETER_KEYS as readonly string[]).includes(k)) {
        throw new GeometryError(
          "bad_option",
          `${name}: unknown parameter '${k}' (one of ${HEAD_PARAMETER_KEYS.join(", ")})`,
        );
      }
    }
  };
  check(selection.pin, "pin");
  check(selection.free, "free");
  const both = (selection.pin ?? []).filter((k) => (selection.free ?? []).includes(k));
  if (both.length > 0)
    throw new GeometryError("bad_option", `${both.join(", ")} cannot be both pinned and free`);
  const out: number[] = [];
  HEAD_PARAMETER_KEYS.forEach((k, j) => {
    const pinned =
      (selection.pin ?? []).includes(k) ||
      (DEFAULT_PINNED.includes(k) && !(selection.free ?? []).includes(k));
    if (!pinned) out.push(j);
  });
  return out;
}

interface Spectrum {
  rel: number[];
  vectors: number[][]; // per direction, components over the unknowns
}

/** Eigen-decomposition of the column-scaled normal matrix for unknowns [c, params in `sel`]. */
function spectrum(full: Float64Array, sel: readonly number[]): Spectrum {
  const idx = [0, 1, 2, ...sel.map((j) => 3 + j)];
  const m = idx.length;
  const N = 3 + NP;
  const d = idx.map((a) => Math.sqrt(full[a * N + a]!) || 1);
  const A = new Matrix(m, m);
  for (let i = 0; i < m; i++)
    for (let j = 0; j < m; j++) A.set(i, j, full[idx[i]! * N + idx[j]!]! / (d[i]! * d[j]!));
  const e = new EigenvalueDecomposition(A, { assumeSymmetric: true });
  const values = e.realEigenvalues;
  const V = e.eigenvectorMatrix;
  const max = Math.max(...values);
  const order = values.map((_, i) => i).sort((a, b) => values[b]! - values[a]!);
  return {
    rel: order.map((i) => Math.sqrt(Math.max(values[i]!, 0) / max)),
    vectors: order.map((i) => Array.from({ length: m }, (_, r) => V.get(r, i))),
  };
}

/** Number of distinct values (exact) of a column (1 when absent), and their span. */
function spread(a: Float64Array | undefined, wrap360 = false): { count: number; span: number } {
  if (!a) return { count: 1, span: 0 };
  const seen = new Set<number>();
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < a.length; i++) {
    const v = wrap360 ? ((a[i]! % 360) + 360) % 360 : a[i]!;
    seen.add(v);
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return { count: seen.size, span: seen.size > 0 ? hi - lo : 0 };
}

/** Tool lengths closer than this (mm) separate the length-like parameters only weakly (common practice: ≥ 50 mm apart). */
const TOOL_SPREAD_MM = 50;

/** Plain-words advice on what data would separate a group, from the group and the poses. */
export function separationAdvice(group: readonly HeadParameterKey[], poses: PoseColumns): string {
  const has = (k: HeadParameterKey) => group.includes(k);
  if (group.length === 2 && has("primary_zero_arcsec") && has("secondary_yaw_arcsec")) {
    return "no sphere-probe pose separates them (both turn the tilt plane about the primary axis); only a reference outside this data, such as the tilt axis indicated against a machine axis with the primary at zero, would";
  }
  const toolSpread = spread(poses.toolMm);
  const tools = toolSpread.count;
  const secSpread = spread(poses.secondaryDeg);
  const sec = { length: secSpread.count };
  const secSpan = secSpread.span;
  const prim = { length: spread(poses.primaryDeg, true).count };
  const parts: string[] = [];
  const lengthLike = group.some((k) =>
    [
      "pivot_length_error_um",
      "tip_offset_n_um",
      "tip_offset_s_um",
      "secondary_zero_arcsec",
      "secondary_offset_um",
    ].includes(k),
  );
  if (tools < 2 && lengthLike)
    parts.push("poses with a second tool length (a gauge tool of a different length)");
  else if (lengthLike && toolSpread.span < TOOL_SPREAD_MM)
    parts.push(
      `tool lengths further apart (these span only ${+toolSpread.span.toPrecision(3)} mm; ${TOOL_SPREAD_MM} mm or more is common practice)`,
    );
  if (sec.length < 3 || secSpan < 90)
    parts.push(
      `secondary angles over a wider range, e.g. −90° to +90° (these span ${+secSpan.toPrecision(3)}°)`,
    );
  if (prim.length < 4) parts.push("more primary angles spread around the full turn");
  if (parts.length === 0)
    parts.push("more poses at other primary and secondary angles, or a second tool length");
  return parts.join(", and ");
}

/** A parameter as the fit and the planner list it: its key, symbol and unit, and whether the poses identify it. */
export interface HeadParameterStanding {
  readonly key: HeadParameterKey;
  /** Symbol beside the key (ISO 230-1 style where one applies; see headParameterSymbols). */
  readonly iso: string;
  readonly unit: HeadParameterUnit;
  readonly identifiable: Identifiability;
}

/**
 * Every parameter in HEAD_PARAMETER_KEYS order with its standing in `report` and its column among
 * the report's free parameters (−1 when it is held at 0).
 */
export function parameterStandings(
  config: HeadConfig,
  report: IdentifiabilityReport,
): Array<HeadParameterStanding & { readonly column: number }> {
  const symbols = headParameterSymbols(config);
  return HEAD_PARAMETER_KEYS.map((key, j) => ({
    key,
    iso: symbols[key],
    unit: headParameterUnit(key),
    identifiable: report.parameters[j]!.identifiable,
    column: report.freeIndices.indexOf(j),
  }));
}

/**
 * Classify every parameter for these poses (method in the file header). Throws GeometryError
 * "degenerate" when the sphere centre itself cannot be determined. `zeroErrorNormal`, when given,
 * is JᵀJ at zero error over [c, all ten parameters] (13×13 row-major) for these poses.
 */
export function analyseHeadIdentifiability(
  config: HeadConfig | HeadAxes,
  poses: PoseColumns,
  selection: ParameterSelection = {},
  zeroErrorNormal?: Float64Array,
): IdentifiabilityReport {
  const axes = "p" in config ? config : headAxes(config);
  const symbols = "p" in config ? undefined : headParameterSymbols(config);
  const label = (k: HeadParameterKey) => (symbols ? `${k} (${symbols[k]})` : k);
  const N = 3 + NP;
  const all = HEAD_PARAMETER_KEYS.map((_, j) => j);
  // The fit passes JᵀJ at zero error from its own first pass (the same matrix: it does not depend
  // on the measurements), saving a pass over the poses.
  const full = zeroErrorNormal ?? new Float64Array(N * N);
  if (!zeroErrorNormal)
    headNormalEquations(
      axes,
      poses,
      null,
      null,
      all,
      new Float64Array(NP),
      new Float64Array(N),
      full,
      new Float64Array(N),
    );

  const startFree = initialFreeSet(selection);
  let free = [...startFree];
  const status = new Map<number, ParameterIdentifiability>();
  const warnings: string[] = [];
  const participants = (sp: Spectrum, k: number, sel: readonly number[]) =>
    sel.filter((_, j) => Math.abs(sp.vectors[k]![3 + j]!) >= PARTICIPATION);

  for (;;) {
    const sp = spectrum(full, free);
    const k = sp.rel.length - 1; // smallest
    if (!(sp.rel[k]! < NOT_IDENTIFIABLE_BELOW)) break;
    const group = participants(sp, k, free);
    if (group.length === 0) {
      throw new GeometryError(
        "degenerate",
        "these poses cannot determine the sphere centre; probe at more primary and secondary angles",
      );
    }
    const keys = group.map((j) => HEAD_PARAMETER_KEYS[j]!);
    const pinKey = PIN_ORDER.find((key) => keys.includes(key))!;
    const pinJ = HEAD_PARAMETER_KEYS.indexOf(pinKey);
    for (const j of group)
      status.set(j, {
        key: HEAD_PARAMETER_KEYS[j]!,
        identifiable: "no",
        pinned: j === pinJ,
        ...(j === pinJ ? { pinnedBy: "inseparable" as const } : {}),
      });
    free = free.filter((j) => j !== pinJ);
    const others = keys.filter((key) => key !== pinKey);
    const carry =
      others.length > 0
        ? `; ${others.map(label).join(" and ")} ${others.length > 1 ? "carry" : "carries"} their combined effect, so ${others.length > 1 ? "their values are" : "its value is"} not ${others.length > 1 ? "theirs" : "its"} alone`
        : "";
    warnings.push(
      `${keys.map(label).join(" and ")} cannot be separated from this data; ${label(pinKey)} is held at 0${carry}. To separate them: ${separationAdvice(keys, poses)}.`,
    );
  }

  const final = spectrum(full, free);
  final.rel.forEach((rel, k) => {
    if (rel >= WEAKLY_IDENTIFIABLE_BELOW) return;
    const group = participants(final, k, free).filter((j) => !status.has(j));
    if (group.length === 0) return;
    const keys = group.map((j) => HEAD_PARAMETER_KEYS[j]!);
    for (const j of group)
      status.set(j, { key: HEAD_PARAMETER_KEYS[j]!, identifiable: "weak", pinned: false });
    warnings.push(
      `${keys.map(label).join(" and ")} ${keys.length > 1 ? "are" : "is"} only weakly determined by these poses (relative singular value ${rel.toExponential(1)}): expect large, correlated uncertainties. To strengthen: ${separationAdvice(keys, poses)}.`,
    );
  });

  // Parameters held at 0 from the start: could they be freed beside the final free set?
  for (const j of all) {
    if (startFree.includes(j)) continue;
    const key = HEAD_PARAMETER_KEYS[j]!;
    const byDefault = !(selection.pin ?? []).includes(key);
    const sel = [...free, j].sort((a, b) => a - b);
    const sp = spectrum(full, sel);
    let identifiable: Identifiability = "yes";
    let group: number[] = [];
    for (let k = 0; k < sp.rel.length; k++) {
      const rel = sp.rel[k]!;
      const g = participants(sp, k, sel);
      if (!g.includes(j)) continue;
      if (rel < NOT_IDENTIFIABLE_BELOW) {
        identifiable = "no";
        group = g;
      } else if (rel < WEAKLY_IDENTIFIABLE_BELOW && identifiable === "yes") identifiable = "weak";
    }
    status.set(j, { key, identifiable, pinned: true, pinnedBy: byDefault ? "default" : "caller" });
    if (byDefault && identifiable === "no") {
      const others = group.filter((i) => i !== j).map((i) => HEAD_PARAMETER_KEYS[i]!);
      warnings.push(
        `${label(key)} is held at 0 by default: it cannot be separated from ${others.map(label).join(" and ")}${others.length > 0 ? `, which ${others.length > 1 ? "carry" : "carries"} the combined effect` : ""}; ${separationAdvice([key, ...others], poses)}.`,
      );
    }
  }

  const parameters = HEAD_PARAMETER_KEYS.map(
    (key, j) => status.get(j) ?? { key, identifiable: "yes" as const, pinned: false },
  );
  return { parameters, freeIndices: free, relativeSingularValues: final.rel, warnings, fullNormal: full };
}
