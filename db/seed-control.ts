/**
 * Demo data (invented) for the control loop: a tool-centre-point check taken after the values
 * were entered, made with geometry's own forward model. With the control compensating all but a
 * few micrometres, the sphere centre the control reports moves by about that much over the swing.
 */
import { headPoseGrid, synthesiseSphereProbe, type HeadErrors } from "@/geometry";
import { DEMO_HEAD_CONFIG } from "@/db/seed-analyses";

/** What is left after compensation in the demo: a few µm and arc seconds (invented). */
export const DEMO_TCP_RESIDUAL_ERRORS: HeadErrors = {
  pivot_length_error_um: 2.5,
  tip_offset_n_um: -1.5,
  secondary_zero_arcsec: 1.2,
};

/** A TCP-check CSV (sphere-probe columns) over 12 primary × 5 secondary angles, one tool. */
export function demoTcpCheckCsv(errors: HeadErrors = DEMO_TCP_RESIDUAL_ERRORS, seed = 57): string {
  const poses = headPoseGrid({ primarySteps: 12, secondaryDeg: [-90, -45, 0, 45, 90] });
  const d = synthesiseSphereProbe(DEMO_HEAD_CONFIG, errors, poses, {
    noiseUm: 0.5,
    seed,
    centreMm: [612.5, -204.0, 388.25],
  });
  const lines = ["primary_deg,secondary_deg,x,y,z"];
  for (let i = 0; i < d.rows; i++)
    lines.push(
      [
        d.primaryDeg[i]!,
        d.secondaryDeg[i]!,
        d.xMm[i]!.toFixed(5),
        d.yMm[i]!.toFixed(5),
        d.zMm[i]!.toFixed(5),
      ].join(","),
    );
  return lines.join("\n") + "\n";
}
