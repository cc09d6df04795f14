/**
 * Which poses a sphere-probe run covered, against the axes' full range, and what to probe on the
 * next visit. Pure. The primary axis is a rotary axis with a full turn (0° … 360°, read modulo
 * 360°); its turn is split into twelve 30° sectors. For the tilt axis the head register keeps no
 * travel, so its span is reported as probed and compared with ±90° only as a common working range
 * (common practice for fork and nutating heads; the head maker's travel governs).
 * Identifiability advice comes from geometry's pose planner (planHeadPoses) on the same poses.
 */
import { planHeadPoses, type HeadConfig, type HeadPlanResult } from "@/geometry";
import { endSentence } from "@/lib/format";

export const PRIMARY_SECTOR_DEG = 30;
export const TILT_REFERENCE_DEG = 90;

export interface PoseCoverage {
  poses: number;
  /** Distinct primary angles (modulo 360°, rounded to 0.001°), ascending. */
  primaryAnglesDeg: number[];
  /** Each 30° sector of the turn [k·30°, (k+1)·30°): probed or not. */
  primarySectors: boolean[];
  /** Largest arc of the turn with no probed angle, degrees. */
  largestPrimaryGapDeg: number;
  secondaryMinDeg: number;
  secondaryMaxDeg: number;
  secondaryAnglesDeg: number[];
  toolLengthsMm: number[];
}

const round3 = (v: number) => Math.round(v * 1000) / 1000;

/** Primary angle in [0, 360). */
export function turnAngle(deg: number): number {
  const r = ((deg % 360) + 360) % 360;
  return round3(r) === 360 ? 0 : round3(r);
}

export function poseCoverage(
  primaryDeg: ArrayLike<number>,
  secondaryDeg: ArrayLike<number>,
  toolMm: ArrayLike<number>,
): PoseCoverage {
  const n = primaryDeg.length;
  if (n === 0 || secondaryDeg.length !== n || toolMm.length !== n)
    throw new RangeError("poseCoverage: the pose columns must be non-empty and of one length");
  const prim = new Set<number>();
  const sec = new Set<number>();
  const tools = new Set<number>();
  let smin = Infinity;
  let smax = -Infinity;
  for (let i = 0; i < n; i++) {
    prim.add(turnAngle(primaryDeg[i]!));
    const s = round3(secondaryDeg[i]!);
    sec.add(s);
    smin = Math.min(smin, s);
    smax = Math.max(smax, s);
    tools.add(round3(toolMm[i]!));
  }
  const primaryAnglesDeg = [...prim].sort((a, b) => a - b);
  const primarySectors = Array.from({ length: 360 / PRIMARY_SECTOR_DEG }, (_, k) =>
    primaryAnglesDeg.some((a) => a >= k * PRIMARY_SECTOR_DEG && a < (k + 1) * PRIMARY_SECTOR_DEG),
  );
  // Gaps between consecutive angles round the circle; one angle leaves a 360° gap.
  let largestPrimaryGapDeg = 360;
  if (primaryAnglesDeg.length > 1) {
    largestPrimaryGapDeg = 0;
    for (let i = 0; i < primaryAnglesDeg.length; i++) {
      const a = primaryAnglesDeg[i]!;
      const b = i + 1 < primaryAnglesDeg.length ? primaryAnglesDeg[i + 1]! : primaryAnglesDeg[0]! + 360;
      largestPrimaryGapDeg = Math.max(largestPrimaryGapDeg, round3(b - a));
    }
  }
  return {
    poses: n,
    primaryAnglesDeg,
    primarySectors,
    largestPrimaryGapDeg,
    secondaryMinDeg: smin,
    secondaryMaxDeg: smax,
    secondaryAnglesDeg: [...sec].sort((a, b) => a - b),
    toolLengthsMm: [...tools].sort((a, b) => a - b),
  };
}

const deg = (v: number) => `${v < 0 ? "−" : ""}${Math.abs(v).toFixed(Number.isInteger(v) ? 0 : 1)}°`;

/** Plain-words advice for the next visit from the coverage (gaps in the turn, a narrow tilt span); tool lengths are the planner's to judge. */
export function coverageAdvice(c: PoseCoverage): string[] {
  const out: string[] = [];
  const missing = c.primarySectors.flatMap((hit, k) => (hit ? [] : [k]));
  if (missing.length === c.primarySectors.length - 1 || c.primaryAnglesDeg.length < 3)
    out.push(
      `The primary axis was probed at only ${c.primaryAnglesDeg.length} angle${c.primaryAnglesDeg.length === 1 ? "" : "s"}: probe at least 8 angles spread round the full turn.`,
    );
  else if (missing.length)
    out.push(
      `${missing.length} of the ${c.primarySectors.length} ${PRIMARY_SECTOR_DEG}° sectors of the primary turn were not probed (${missing.map((k) => `${k * PRIMARY_SECTOR_DEG}–${(k + 1) * PRIMARY_SECTOR_DEG}°`).join(", ")}); the largest gap is ${c.largestPrimaryGapDeg.toFixed(0)}°. Probing them makes the fit less sensitive to a local error of the rotary axis.`,
    );
  const span = c.secondaryMaxDeg - c.secondaryMinDeg;
  if (c.secondaryAnglesDeg.length < 3)
    out.push(
      `The tilt axis was probed at only ${c.secondaryAnglesDeg.length} angle${c.secondaryAnglesDeg.length === 1 ? "" : "s"}: probe at least 3, spread over its working range, to separate its zero from its squareness.`,
    );
  // Under half of the ±90° reference span (180°) is narrow.
  else if (span < TILT_REFERENCE_DEG)
    out.push(
      `The tilt axis was probed over ${deg(c.secondaryMinDeg)} … ${deg(c.secondaryMaxDeg)} (${span.toFixed(0)}° of travel); a wider span, towards ±${TILT_REFERENCE_DEG}° where the head allows it (common practice; the maker's travel governs), makes the tilt-axis parameters better determined.`,
    );
  return out;
}

export interface NextVisitPlan {
  coverage: PoseCoverage;
  /** geometry's planner on the probed poses: predicted u per µm of probing noise and its advice. */
  plan: HeadPlanResult | null;
  advice: string[];
}

/** Coverage, the planner's forecast for the same poses, and the combined advice (coverage first, then the planner's, without repeats). */
export function nextVisitPlan(
  config: HeadConfig,
  primaryDeg: ArrayLike<number>,
  secondaryDeg: ArrayLike<number>,
  toolMm: ArrayLike<number>,
): NextVisitPlan {
  const coverage = poseCoverage(primaryDeg, secondaryDeg, toolMm);
  let plan: HeadPlanResult | null = null;
  try {
    plan = planHeadPoses(config, {
      rows: primaryDeg.length,
      primaryDeg: Float64Array.from(primaryDeg),
      secondaryDeg: Float64Array.from(secondaryDeg),
      toolMm: Float64Array.from(toolMm),
    });
  } catch {
    plan = null;
  }
  const fromPlan = (plan?.advice ?? []).map((a) => endSentence(a.charAt(0).toUpperCase() + a.slice(1)));
  return { coverage, plan, advice: [...coverageAdvice(coverage), ...fromPlan] };
}
