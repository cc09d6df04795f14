/**
 * Configuration of a two-axis head and its ten error parameters (geometry/README.md, "The head model").
 * Machine frame X, Y, Z right-handed (ISO 841); A, B, C rotate about +X, +Y, +Z.
 */
import { GeometryError, type GeometryIssue } from "../errors";

export type AxisLetter = "A" | "B" | "C";
/** Three components (x, y, z); the unit is in the name of whatever holds it. Same shape as circle.ts's Vec3. */
export type HeadVec3 = readonly [number, number, number];
type Vec3 = HeadVec3;

export interface HeadConfig {
  /** Primary rotary axis (the one nearer the host spindle), e.g. "C". */
  readonly primary: AxisLetter;
  /** Secondary (tilt) axis, carried by the primary, e.g. "A". */
  readonly secondary: AxisLetter;
  /** Nominal pivot length L0 in mm: secondary axis to the gauge point along the tool. */
  readonly pivotLengthMm: number;
  /** Tool direction t at zero (unit vector after normalisation); default −Z. */
  readonly toolDirection?: Vec3;
}

/** Unit vectors of a config (mm-free; directions only): p, s, n = p × s, t. */
export interface HeadAxes {
  readonly p: Vec3;
  readonly s: Vec3;
  readonly n: Vec3;
  readonly t: Vec3;
  /** L0 in mm. */
  readonly pivotLengthMm: number;
}

/** The error parameters, in the order used everywhere (API keys of geometry/README.md). */
export const HEAD_PARAMETER_KEYS = [
  "pivot_length_error_um",
  "tip_offset_s_um",
  "tip_offset_n_um",
  "secondary_offset_um",
  "primary_zero_arcsec",
  "secondary_zero_arcsec",
  "secondary_tilt_arcsec",
  "secondary_yaw_arcsec",
  "primary_tilt_s_arcsec",
  "primary_tilt_n_arcsec",
] as const;
export type HeadParameterKey = (typeof HEAD_PARAMETER_KEYS)[number];
export type HeadParameterUnit = "um" | "arcsec";

/** Error values by key, µm or arc seconds as the key says; a missing key means 0. */
export type HeadErrors = Partial<Record<HeadParameterKey, number>>;

/** Parameters pinned at 0 unless the caller frees them: secondary_yaw turns the tilt plane exactly as primary_zero does. */
export const DEFAULT_PINNED: readonly HeadParameterKey[] = ["secondary_yaw_arcsec"];

/** Unit of a parameter, from its key's suffix. */
export function headParameterUnit(key: HeadParameterKey): HeadParameterUnit {
  return key.endsWith("_um") ? "um" : "arcsec";
}

const AXIS_VECTOR: Record<AxisLetter, Vec3> = { A: [1, 0, 0], B: [0, 1, 0], C: [0, 0, 1] };
const LETTERS: readonly AxisLetter[] = ["A", "B", "C"];

/** Cross product a × b. */
export function cross3(a: Vec3, b: Vec3): Vec3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

/**
 * Unit vectors p, s, n = p × s and t of a config (A→+X, B→+Y, C→+Z at zero).
 * Throws GeometryError "bad_config" when the letters are equal (p ∦ s is then impossible), the
 * pivot length is not a positive finite number of mm, or the tool direction is zero or not finite.
 */
export function headAxes(config: HeadConfig): HeadAxes {
  const { primary, secondary } = config;
  if (!LETTERS.includes(primary))
    throw new GeometryError("bad_config", `primary must be A, B or C, not '${String(primary)}'`);
  if (!LETTERS.includes(secondary))
    throw new GeometryError("bad_config", `secondary must be A, B or C, not '${String(secondary)}'`);
  const p = AXIS_VECTOR[primary];
  const s = AXIS_VECTOR[secondary];
  if (p[0] * s[0] + p[1] * s[1] + p[2] * s[2] !== 0) {
    throw new GeometryError(
      "bad_config",
      `the primary and secondary axes must be perpendicular (both are ${primary})`,
    );
  }
  if (!Number.isFinite(config.pivotLengthMm) || config.pivotLengthMm <= 0) {
    throw new GeometryError(
      "bad_config",
      `the pivot length must be a positive number of mm (got ${config.pivotLengthMm})`,
    );
  }
  const t0 = config.toolDirection ?? [0, 0, -1];
  const norm = Math.hypot(t0[0], t0[1], t0[2]);
  if (t0.length !== 3 || !t0.every(Number.isFinite) || !(norm > 0)) {
    throw new GeometryError("bad_config", "the tool direction must be three finite numbers, not all zero");
  }
  return {
    p,
    s,
    n: cross3(p, s),
    t: [t0[0] / norm, t0[1] / norm, t0[2] / norm],
    pivotLengthMm: config.pivotLengthMm,
  };
}

/** The machine direction letter (X, Y, Z) of a coordinate unit vector, sign ignored. */
function directionLetter(v: Vec3): "X" | "Y" | "Z" {
  const i = [0, 1, 2].reduce((b, k) => (Math.abs(v[k]!) > Math.abs(v[b]!) ? k : b), 0);
  return (["X", "Y", "Z"] as const)[i]!;
}
/** The rotary letter (A, B, C) of rotation about a coordinate unit vector, sign ignored. */
function rotationLetter(v: Vec3): AxisLetter {
  return ({ X: "A", Y: "B", Z: "C" } as const)[directionLetter(v)];
}

/**
 * Symbol shown beside each key, derived from the axis letters.
 * ISO 230-1 location and orientation errors of an axis, E<direction>0<axis> (0 = a property of the
 * axis line, not a function of its angle): a linear offset of the axis line along X/Y/Z gives
 * E(X|Y|Z)0<axis>; an orientation (squareness) error about X/Y/Z gives E(A|B|C)0<axis>; the
 * zero-position error of an axis is the rotation about itself, E<axis>0<axis>. For C/A this gives
 * EY0A, EB0A, EC0A, EA0C, EB0C, EC0C, EA0A as geometry/README.md lists (EC0A for secondary_yaw follows
 * the same rule). The symbol carries no sign: the sign of a value follows this model's definition.
 *
 * The pivot length error and the two gauge-point offsets are not errors of an axis line in ISO
 * 230-1 (they describe the tool's gauge point relative to the secondary axis), so they get plain
 * descriptive symbols instead: "ΔL" for the pivot length, and "Δ<direction>_tool" for the offset of
 * the gauge point along the machine direction that s or n has at zero (for C/A: ΔX_tool along s,
 * ΔY_tool along n, the latter being what the trade calls the pivot offset).
 */
export function headParameterSymbols(config: HeadConfig): Record<HeadParameterKey, string> {
  const { p, s, n } = headAxes(config);
  const P = config.primary;
  const S = config.secondary;
  return {
    pivot_length_error_um: "ΔL",
    tip_offset_s_um: `Δ${directionLetter(s)}_tool`,
    tip_offset_n_um: `Δ${directionLetter(n)}_tool`,
    secondary_offset_um: `E${directionLetter(n)}0${S}`,
    primary_zero_arcsec: `E${P}0${P}`,
    secondary_zero_arcsec: `E${S}0${S}`,
    secondary_tilt_arcsec: `E${rotationLetter(n)}0${S}`,
    secondary_yaw_arcsec: `E${rotationLetter(p)}0${S}`,
    primary_tilt_s_arcsec: `E${rotationLetter(s)}0${P}`,
    primary_tilt_n_arcsec: `E${rotationLetter(n)}0${P}`,
  };
}

/**
 * Parse the head file `{"primary":"C","secondary":"A","pivot_length_mm":152.4,"tool_direction":[0,0,-1]}`
 * (snake_case; tool_direction optional, default [0,0,−1]; lengths in mm). Throws GeometryError
 * "bad_config" whose issues name each wrong field (issue.column = the field name).
 */
export function parseHeadConfig(json: unknown): HeadConfig {
  if (typeof json !== "object" || json === null || Array.isArray(json)) {
    throw new GeometryError(
      "bad_config",
      "the head file must be a JSON object with primary, secondary and pivot_length_mm",
    );
  }
  const o = json as Record<string, unknown>;
  const issues: GeometryIssue[] = [];
  const known = ["primary", "secondary", "pivot_length_mm", "tool_direction"];
  for (const k of Object.keys(o)) {
    if (!known.includes(k))
      issues.push({ column: k, message: `unknown field '${k}' (the fields are ${known.join(", ")})` });
  }
  const letter = (field: "primary" | "secondary"): AxisLetter | undefined => {
    const v = o[field];
    if (v === undefined)
      issues.push({ column: field, message: `${field} is missing: give the axis letter A, B or C` });
    else if (typeof v !== "string" || !LETTERS.includes(v as AxisLetter))
      issues.push({
        column: field,
        message: `${field} must be the axis letter "A", "B" or "C" (got ${JSON.stringify(v)})`,
      });
    else return v as AxisLetter;
    return undefined;
  };
  const primary = letter("primary");
  const secondary = letter("secondary");
  if (primary !== undefined && primary === secondary) {
    issues.push({
      column: "secondary",
      message: `secondary must be a different axis from primary (both are ${primary}); the two axes must be perpendicular`,
    });
  }
  const L = o.pivot_length_mm;
  if (L === undefined)
    issues.push({
      column: "pivot_length_mm",
      message: "pivot_length_mm is missing: the nominal pivot length in mm",
    });
  else if (typeof L !== "number" || !Number.isFinite(L) || L <= 0)
    issues.push({
      column: "pivot_length_mm",
      message: `pivot_length_mm must be a positive number of mm (got ${JSON.stringify(L)})`,
    });
  let toolDirection: Vec3 | undefined;
  const t = o.tool_direction;
  if (t !== undefined) {
    if (
      !Array.isArray(t) ||
      t.length !== 3 ||
      !t.every((v) => typeof v === "number" && Number.isFinite(v)) ||
      t.every((v) => v === 0)
    ) {
      issues.push({
        column: "tool_direction",
        message: `tool_direction must be three numbers, not all zero, e.g. [0, 0, -1] (got ${JSON.stringify(t)})`,
      });
    } else toolDirection = [t[0] as number, t[1] as number, t[2] as number];
  }
  if (issues.length > 0) {
    const message =
      issues.length === 1
        ? `head file: ${issues[0]!.message}`
        : `head file: ${issues.map((i) => i.message).join("; ")}`;
    throw new GeometryError("bad_config", message, issues);
  }
  const config: HeadConfig = {
    primary: primary!,
    secondary: secondary!,
    pivotLengthMm: L as number,
    ...(toolDirection ? { toolDirection } : {}),
  };
  headAxes(config);
  return config;
}
