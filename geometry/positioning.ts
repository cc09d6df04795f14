/**
 * Positioning accuracy and repeatability by the statistics of ISO 230-2:2014 ("Determination of
 * accuracy and repeatability of positioning of numerically controlled axes"), for a rotary axis.
 *
 * Every target is approached several times (runs j) from the positive and from the negative
 * direction. With x_ij = measured − target (the positioning deviation):
 * - per target and direction: mean x̄_i and sample standard deviation s_i (n − 1 in the divisor);
 * - reversal B_i = x̄_i↑ − x̄_i↓; B = max |B_i|; mean reversal B̄ = mean of B_i;
 * - repeatability R_i↑ = 4 s_i↑ (likewise ↓), R_i = max(2 s_i↑ + 2 s_i↓ + |B_i|, R_i↑, R_i↓);
 *   R↑ = max R_i↑, R↓ = max R_i↓, R = max R_i;
 * - systematic positioning error E↑ = max x̄↑ − min x̄↑ (likewise ↓), E = max − min over the means of
 *   both directions;
 * - mean bidirectional positioning error M = max − min of x̄_i = (x̄_i↑ + x̄_i↓)/2;
 * - accuracy A↑ = max(x̄↑ + 2s↑) − min(x̄↑ − 2s↑) (likewise ↓), A = the same over both directions.
 * Rotary axes use the same formulas with deviations in arc seconds; a target at 360° is a target of
 * its own (not merged with 0°). The standard's default is 5 runs per target and direction; fewer
 * give a warning, fewer than 2 (no standard deviation) an error.
 */
import { GeometryError } from "./errors";

export type ApproachDirection = "pos" | "neg";

/** One row: the target, the approach direction, the run number and the deviation x_ij (caller's unit). */
export interface PositioningRows {
  readonly target: ArrayLike<number>;
  readonly direction: readonly ApproachDirection[];
  readonly run: ArrayLike<number>;
  readonly deviation: ArrayLike<number>;
  /** File row of each data row (header = row 1), for error messages. */
  readonly sourceRow?: ArrayLike<number>;
}

export interface PositioningTarget {
  readonly target: number;
  readonly runs_pos: number;
  readonly runs_neg: number;
  readonly mean_pos: number;
  readonly mean_neg: number;
  readonly s_pos: number;
  readonly s_neg: number;
  /** (x̄↑ + x̄↓)/2. */
  readonly mean_bidirectional: number;
  /** B_i = x̄↑ − x̄↓. */
  readonly reversal: number;
  readonly R_pos: number;
  readonly R_neg: number;
  readonly R: number;
}

export interface PositioningResult {
  /** Targets in increasing order. Every value below is in the deviation's unit. */
  readonly targets: readonly PositioningTarget[];
  readonly A: number;
  readonly A_pos: number;
  readonly A_neg: number;
  readonly E: number;
  readonly E_pos: number;
  readonly E_neg: number;
  readonly M: number;
  readonly R: number;
  readonly R_pos: number;
  readonly R_neg: number;
  readonly B: number;
  readonly B_mean: number;
  readonly warnings: readonly string[];
}

/** Mean and sample standard deviation, computed on values scaled by their largest magnitude so no finite input overflows. */
function meanAndSd(values: readonly number[]): { mean: number; sd: number } {
  let scale = 0;
  for (const v of values) scale = Math.max(scale, Math.abs(v));
  if (scale === 0) return { mean: 0, sd: 0 };
  let m = 0;
  for (const v of values) m += v / scale;
  m /= values.length;
  let ss = 0;
  for (const v of values) ss += (v / scale - m) ** 2;
  return { mean: m * scale, sd: Math.sqrt(ss / (values.length - 1)) * scale };
}

const span = (xs: readonly number[]) => Math.max(...xs) - Math.min(...xs);

/**
 * ISO 230-2 quantities of positioning (see the file header) from deviation rows. Throws
 * GeometryError naming the row or target for: non-finite values, an unknown direction, a run given
 * twice, a target missing a direction or with fewer than 2 runs in one, or results beyond the
 * number range.
 */
export function positioningStatistics(rows: PositioningRows, minRuns = 5): PositioningResult {
  const n = rows.target.length;
  if (rows.direction.length !== n || rows.run.length !== n || rows.deviation.length !== n)
    throw new GeometryError("bad_option", "target, direction, run and deviation lengths differ");
  if (n === 0) throw new GeometryError("too_few_rows", "no positioning rows");
  const where = (i: number) => (rows.sourceRow ? rows.sourceRow[i]! : i + 1);
  const groups = new Map<number, { pos: number[]; neg: number[]; seen: Set<string> }>();
  for (let i = 0; i < n; i++) {
    const t = rows.target[i]!;
    const x = rows.deviation[i]!;
    const run = rows.run[i]!;
    const dir = rows.direction[i];
    if (!Number.isFinite(t) || !Number.isFinite(x) || !Number.isFinite(run))
      throw new GeometryError("bad_number", `row ${where(i)}: not a finite number`, [
        { row: where(i), message: "target, run and deviation must be finite numbers" },
      ]);
    if (dir !== "pos" && dir !== "neg")
      throw new GeometryError("bad_value", `row ${where(i)}: direction must be pos or neg`, [
        { row: where(i), column: "direction", message: `'${String(dir)}' is not pos or neg` },
      ]);
    let g = groups.get(t);
    if (!g) groups.set(t, (g = { pos: [], neg: [], seen: new Set() }));
    const key = `${dir}:${run}`;
    if (g.seen.has(key))
      throw new GeometryError(
        "duplicate_pose",
        `row ${where(i)}: run ${run} ${dir} at target ${t} is given twice`,
        [{ row: where(i), column: "run", message: `run ${run} (${dir}) at target ${t} is given twice` }],
      );
    g.seen.add(key);
    g[dir].push(x);
  }
  const warnings: string[] = [];
  const targets: PositioningTarget[] = [];
  const fewRuns: number[] = [];
  for (const t of [...groups.keys()].sort((a, b) => a - b)) {
    const g = groups.get(t)!;
    for (const dir of ["pos", "neg"] as const) {
      if (g[dir].length < 2)
        throw new GeometryError(
          "too_few_rows",
          `target ${t}: ${g[dir].length} run${g[dir].length === 1 ? "" : "s"} in the ${dir} direction; ` +
            "each target needs at least 2 runs in each direction (ISO 230-2's default is 5)",
        );
    }
    if (g.pos.length < minRuns || g.neg.length < minRuns) fewRuns.push(t);
    const p = meanAndSd(g.pos);
    const q = meanAndSd(g.neg);
    const reversal = p.mean - q.mean;
    const Rp = 4 * p.sd;
    const Rn = 4 * q.sd;
    targets.push({
      target: t,
      runs_pos: g.pos.length,
      runs_neg: g.neg.length,
      mean_pos: p.mean,
      mean_neg: q.mean,
      s_pos: p.sd,
      s_neg: q.sd,
      mean_bidirectional: p.mean / 2 + q.mean / 2,
      reversal,
      R_pos: Rp,
      R_neg: Rn,
      R: Math.max(2 * p.sd + 2 * q.sd + Math.abs(reversal), Rp, Rn),
    });
  }
  if (fewRuns.length > 0)
    warnings.push(
      `fewer than ${minRuns} runs per direction at target${fewRuns.length === 1 ? "" : "s"} ${fewRuns.join(", ")}; ` +
        `ISO 230-2's default is ${minRuns}`,
    );
  if (targets.length < 2) warnings.push("only one target: E, M and A describe a single position");
  const mp = targets.map((t) => t.mean_pos);
  const mn = targets.map((t) => t.mean_neg);
  const hiP = targets.map((t) => t.mean_pos + 2 * t.s_pos);
  const loP = targets.map((t) => t.mean_pos - 2 * t.s_pos);
  const hiN = targets.map((t) => t.mean_neg + 2 * t.s_neg);
  const loN = targets.map((t) => t.mean_neg - 2 * t.s_neg);
  const result: PositioningResult = {
    targets,
    A: Math.max(...hiP, ...hiN) - Math.min(...loP, ...loN),
    A_pos: Math.max(...hiP) - Math.min(...loP),
    A_neg: Math.max(...hiN) - Math.min(...loN),
    E: span([...mp, ...mn]),
    E_pos: span(mp),
    E_neg: span(mn),
    M: span(targets.map((t) => t.mean_bidirectional)),
    R: Math.max(...targets.map((t) => t.R)),
    R_pos: Math.max(...targets.map((t) => t.R_pos)),
    R_neg: Math.max(...targets.map((t) => t.R_neg)),
    B: Math.max(...targets.map((t) => Math.abs(t.reversal))),
    B_mean: targets.reduce((s, t) => s + t.reversal / targets.length, 0),
    warnings,
  };
  assertFiniteDeep(result, "the positioning deviations span more than the number range");
  return result;
}

/** Throw a GeometryError (code bad_number) with `message` if any number inside `value` is not finite. */
export function assertFiniteDeep(value: unknown, message: string): void {
  const visit = (v: unknown, path: string): void => {
    if (typeof v === "number") {
      if (!Number.isFinite(v))
        throw new GeometryError("bad_number", `${message} (${path || "value"} is ${v})`);
    } else if (Array.isArray(v) || ArrayBuffer.isView(v)) {
      Array.prototype.forEach.call(v, (e: unknown, i: number) => visit(e, `${path}[${i}]`));
    } else if (v !== null && typeof v === "object") {
      for (const [k, e] of Object.entries(v)) visit(e, path ? `${path}.${k}` : k);
    }
  };
  visit(value, "");
}
