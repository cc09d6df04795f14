/**
 * Tool-centre-point check after compensation: sphere-probe data taken with the control's TCP
 * function active. Each row is where the control reports the sphere centre at one pose; with a
 * perfect compensation every row is the same point. Reported: the range (max − min) of x, y and z
 * over all poses, and the largest distance of a row from the mean centre, in µm. The limits come
 * from the procedure (judge them with decide()).
 */
import { GeometryError } from "./errors";
import { pickFields } from "./json";
import { assertFiniteDeep } from "./positioning";

export interface TcpCheckInput {
  readonly primaryDeg: ArrayLike<number>;
  readonly secondaryDeg: ArrayLike<number>;
  readonly xMm: ArrayLike<number>;
  readonly yMm: ArrayLike<number>;
  readonly zMm: ArrayLike<number>;
  readonly toolMm?: ArrayLike<number>;
  /** File row of each data row (header = row 1). */
  readonly sourceRow?: ArrayLike<number>;
}

export interface TcpCheckResult {
  readonly range_um: { readonly x: number; readonly y: number; readonly z: number };
  /** Largest distance of a row's centre from the mean centre, µm. */
  readonly max_from_mean_um: number;
  /** File row (or 1-based index) of that row. */
  readonly worst_row: number;
  readonly poses: number;
  readonly mean_centre_mm: readonly [number, number, number];
  readonly warnings: readonly string[];
}

/** Fewest poses for a meaningful check (common practice: at least 5 points, as for sphere probing). */
export const TCP_MIN_POSES = 5;

/**
 * Evaluate a TCP check (see the file header). Errors: non-finite values, fewer than 2 rows, all rows
 * at one pose (the swing that the check is about is missing), results beyond the number range.
 */
export function tcpCheck(input: TcpCheckInput): TcpCheckResult {
  const n = input.xMm.length;
  if (
    input.yMm.length !== n ||
    input.zMm.length !== n ||
    input.primaryDeg.length !== n ||
    input.secondaryDeg.length !== n
  )
    throw new GeometryError("bad_option", "the columns have different lengths");
  const rowOf = (i: number) => (input.sourceRow ? input.sourceRow[i]! : i + 1);
  if (n < 2) throw new GeometryError("too_few_rows", `a TCP check needs poses over the swing (got ${n} row)`);
  const cols = [input.xMm, input.yMm, input.zMm, input.primaryDeg, input.secondaryDeg];
  for (let i = 0; i < n; i++)
    for (const c of cols)
      if (!Number.isFinite(c[i]!))
        throw new GeometryError("bad_number", `row ${rowOf(i)} is not finite`, [
          { row: rowOf(i), message: "every value must be a finite number" },
        ]);
  let spreadPose = false;
  for (let i = 1; i < n && !spreadPose; i++)
    spreadPose =
      input.primaryDeg[i] !== input.primaryDeg[0] || input.secondaryDeg[i] !== input.secondaryDeg[0];
  if (!spreadPose)
    throw new GeometryError(
      "degenerate",
      "all rows are at one pose (same primary_deg and secondary_deg): the TCP check needs the head swung through several poses",
    );
  const warnings: string[] = [];
  if (n < TCP_MIN_POSES)
    warnings.push(`only ${n} poses; at least ${TCP_MIN_POSES} over the swing are usual (common practice)`);
  // Work relative to the first row, scaled by the largest offset, so no finite input overflows.
  const ref = [input.xMm[0]!, input.yMm[0]!, input.zMm[0]!];
  const range = [0, 0, 0];
  const mean = [0, 0, 0];
  const scale = [0, 0, 0];
  for (let k = 0; k < 3; k++) {
    const c = cols[k]!;
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = 0; i < n; i++) {
      lo = Math.min(lo, c[i]!);
      hi = Math.max(hi, c[i]!);
      scale[k] = Math.max(scale[k]!, Math.abs(c[i]! / 2 - ref[k]! / 2));
    }
    range[k] = (hi - lo) * 1000;
    const s = scale[k]! || 1;
    let m = 0;
    for (let i = 0; i < n; i++) m += (c[i]! / 2 - ref[k]! / 2) / s / n;
    mean[k] = m * s; // half the mean offset from row 1
  }
  let worst = 0;
  let worstD = -1;
  for (let i = 0; i < n; i++) {
    const d = Math.hypot(...[0, 1, 2].map((k) => cols[k]![i]! / 2 - ref[k]! / 2 - mean[k]!)) * 2;
    if (d > worstD) {
      worstD = d;
      worst = i;
    }
  }
  if (input.toolMm) {
    const tools = new Set(Array.from(input.toolMm as ArrayLike<number>));
    if (tools.size > 1)
      warnings.push("rows carry different tool lengths; the TCP check is normally taken with one tool");
  }
  const result: TcpCheckResult = {
    range_um: { x: range[0]!, y: range[1]!, z: range[2]! },
    max_from_mean_um: worstD * 1000,
    worst_row: rowOf(worst),
    poses: n,
    mean_centre_mm: [ref[0]! + 2 * mean[0]!, ref[1]! + 2 * mean[1]!, ref[2]! + 2 * mean[2]!],
    warnings,
  };
  assertFiniteDeep(result, "the sphere centres span more than the number range");
  return result;
}

/** The CLI's JSON shape (see geometry/README.md). */
export function tcpCheckToJson(r: TcpCheckResult) {
  return pickFields(r, ["range_um", "max_from_mean_um", "worst_row", "poses", "warnings"]);
}
