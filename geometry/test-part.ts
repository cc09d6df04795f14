/**
 * Test-part evaluation: each measured characteristic against its tolerance, with the expanded
 * uncertainty and the decision rule of ISO 14253-1 (see decision.ts).
 */
import { decide, type Decision, type DecisionReason, type DecisionRule } from "./decision";
import { GeometryError } from "./errors";
import type { TestPartRow } from "./types";
import { MM_PER_INCH } from "./units";

export interface TestPartOptions {
  readonly rule: DecisionRule;
  /** Default expanded uncertainty U (k = 2) for length rows, mm; converted to the row's unit (mm, in, um). */
  readonly defaultUMm?: number;
  /** Default U for rows in other units, in that unit (e.g. { arcsec: 2 }). Overrides defaultUMm for that unit. */
  readonly defaultUByUnit?: Readonly<Record<string, number>>;
  /** Per-row U in the row's own unit; undefined entries fall back to the defaults. */
  readonly uPerRow?: readonly (number | undefined)[];
}

export interface TestPartResultRow {
  readonly feature: string;
  readonly characteristic: string;
  /** Unit of every value of this row (the row's own unit). */
  readonly unit: string;
  readonly nominal: number;
  readonly measured: number;
  /** measured − nominal. */
  readonly deviation: number;
  /** Absolute limits nominal + lower_tol, nominal + upper_tol; lower null for a one-sided tolerance. */
  readonly lower_limit: number | null;
  readonly upper_limit: number;
  /** The row's U; 0 when none was given (then `reason` says so under the guarded rule). */
  readonly U: number;
  readonly decision: Decision;
  /** "U missing": the guarded rule had no U for this row, so it is undecided. */
  readonly reason?: DecisionReason;
  readonly sourceRow?: number;
}

export interface TestPartResult {
  readonly rule: DecisionRule;
  readonly rows: readonly TestPartResultRow[];
  readonly totals: {
    readonly pass: number;
    readonly fail: number;
    readonly undecided: number;
    readonly total: number;
  };
  readonly warnings: readonly string[];
}

const LENGTH_PER_MM: Readonly<Record<string, number>> = { mm: 1, in: 1 / MM_PER_INCH, um: 1000 };

/**
 * Evaluate rows: deviation = measured − nominal; limits nominal + tolerances; U per row, else the
 * default for the row's unit (a mm default converted to in by ÷ 25.4, to µm by × 1000), else none
 * with a warning; decision by the chosen rule (ISO 14253-1 simple or guarded acceptance). Without U
 * the simple rule decides as usual (U shown as 0) and the guarded rule gives "undecided" with
 * reason "U missing".
 */
export function evaluateTestPart(rows: readonly TestPartRow[], options: TestPartOptions): TestPartResult {
  const warnings: string[] = [];
  const { defaultUMm, defaultUByUnit, uPerRow } = options;
  if (defaultUMm !== undefined && !(Number.isFinite(defaultUMm) && defaultUMm >= 0))
    throw new GeometryError("bad_option", "the default expanded uncertainty must be a number ≥ 0 (mm)");
  const noU = new Set<string>();
  const out: TestPartResultRow[] = rows.map((r, i) => {
    let U = uPerRow?.[i];
    if (U === undefined) U = defaultUByUnit?.[r.unit];
    if (U === undefined && defaultUMm !== undefined && LENGTH_PER_MM[r.unit] !== undefined)
      U = defaultUMm * LENGTH_PER_MM[r.unit]!;
    const missing = U === undefined;
    if (missing) noU.add(r.unit);
    const lower = r.lowerTol === null ? null : r.nominal + r.lowerTol;
    const upper = r.nominal + r.upperTol;
    const where = r.sourceRow ?? i + 1;
    if (
      !Number.isFinite(r.measured - r.nominal) ||
      !Number.isFinite(upper) ||
      (lower !== null && !Number.isFinite(lower))
    )
      throw new GeometryError(
        "bad_number",
        `row ${where}: the deviation or a limit is beyond the number range`,
        [
          {
            row: where,
            message: "nominal, measured and tolerances give a deviation or a limit beyond the number range",
          },
        ],
      );
    const d = decide({ measured: r.measured, lower, upper, U: U ?? null, rule: options.rule, unit: r.unit });
    return {
      feature: r.feature,
      characteristic: r.characteristic,
      unit: r.unit,
      nominal: r.nominal,
      measured: r.measured,
      deviation: r.measured - r.nominal,
      lower_limit: lower,
      upper_limit: upper,
      U: U ?? 0,
      decision: d.decision,
      ...(d.reason ? { reason: d.reason } : {}),
      ...(r.sourceRow !== undefined ? { sourceRow: r.sourceRow } : {}),
    };
  });
  for (const u of noU)
    warnings.push(
      options.rule === "guarded"
        ? `no expanded uncertainty given for rows in ${u}; the guarded rule cannot decide them: undecided — U missing`
        : `no expanded uncertainty given for rows in ${u}; U taken as 0`,
    );
  const count = (k: Decision) => out.filter((r) => r.decision === k).length;
  return {
    rule: options.rule,
    rows: out,
    totals: { pass: count("pass"), fail: count("fail"), undecided: count("undecided"), total: out.length },
    warnings,
  };
}
