/**
 * ISO 230-2 positioning of a rotary axis: deviations measured − target in arc seconds, then the
 * standard's statistics (./positioning.ts) in both directions and per direction.
 */
import { GeometryError } from "./errors";
import { positioningStatistics, type PositioningResult } from "./positioning";
import type { RotaryPositioningData } from "./types";

export const ARCSEC_PER_DEG = 3600;

export interface RotaryPositioningResult extends PositioningResult {
  readonly unit: "arcsec";
  readonly axis?: string;
}

/**
 * Evaluate a rotary axis's positioning (targets and measurements in degrees; every quantity of the
 * result in arc seconds, targets keep their degrees). A deviation beyond the number range after
 * conversion is an error naming its row.
 */
export function rotaryPositioning(data: RotaryPositioningData): RotaryPositioningResult {
  const n = data.rows;
  const deviation = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const d = (data.measuredDeg[i]! - data.targetDeg[i]!) * ARCSEC_PER_DEG;
    if (!Number.isFinite(d)) {
      const row = data.sourceRow ? data.sourceRow[i]! : i + 1;
      throw new GeometryError("bad_number", `row ${row}: measured − target is beyond the number range`, [
        { row, column: "measured_deg", message: "measured − target is beyond the number range" },
      ]);
    }
    deviation[i] = d;
  }
  const stats = positioningStatistics({
    target: data.targetDeg,
    direction: data.direction,
    run: data.run,
    deviation,
    ...(data.sourceRow ? { sourceRow: data.sourceRow } : {}),
  });
  return { unit: "arcsec", ...(data.axis !== undefined ? { axis: data.axis } : {}), ...stats };
}

/** The CLI's JSON shape of a rotary positioning result (see geometry/README.md). */
export function rotaryPositioningToJson(r: RotaryPositioningResult) {
  return {
    unit: r.unit,
    ...(r.axis !== undefined ? { axis: r.axis } : {}),
    targets: r.targets.map((t) => ({
      target_deg: t.target,
      mean_pos: t.mean_pos,
      mean_neg: t.mean_neg,
      s_pos: t.s_pos,
      s_neg: t.s_neg,
      reversal: t.reversal,
    })),
    A: r.A,
    A_pos: r.A_pos,
    A_neg: r.A_neg,
    E: r.E,
    E_pos: r.E_pos,
    E_neg: r.E_neg,
    M: r.M,
    R: r.R,
    R_pos: r.R_pos,
    R_neg: r.R_neg,
    B: r.B,
    B_mean: r.B_mean,
    warnings: r.warnings,
  };
}
