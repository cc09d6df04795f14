/**
 * Commands of `npm run geometry` for checks beyond the head fit (registered in ./geometry.ts):
 *
 *   rotary-positioning <positions.csv> [--decimal point|comma]
 *     ISO 230-2 positioning of a rotary axis from `target_deg,run,direction,measured_deg` (+ axis).
 *     Prints { unit: "arcsec", targets: [{ target_deg, mean_pos, mean_neg, s_pos, s_neg, reversal }],
 *     A, A_pos, A_neg, E, E_pos, E_neg, M, R, R_pos, R_neg, B, B_mean, warnings }.
 *
 *   tcp-check <sphere.csv> [--units mm|in] [--decimal point|comma]
 *     Tool-centre-point check after compensation (sphere-probe CSV taken with the TCP function on).
 *     Prints { range_um: { x, y, z }, max_from_mean_um, worst_row, poses, warnings }.
 */
import {
  readRotaryPositioningCsv,
  readSphereProbeCsv,
  rotaryPositioning,
  rotaryPositioningToJson,
  tcpCheck,
  tcpCheckToJson,
} from "@/geometry";
import { readInput } from "./chunked-csv";
import type { CliCommand } from "./command";

const rotaryPositioningCommand: CliCommand = {
  usage: "rotary-positioning <positions.csv> [--decimal point|comma]",
  summary:
    "ISO 230-2 accuracy, repeatability and reversal of a rotary axis (target_deg,run,direction,measured_deg)",
  options: ["decimal"],
  run(ctx) {
    return rotaryPositioningToJson(rotaryPositioning(readInput(ctx, readRotaryPositioningCsv)));
  },
};

const tcpCheckCommand: CliCommand = {
  usage: "tcp-check <sphere.csv> [--units mm|in] [--decimal point|comma]",
  summary:
    "tool-centre-point check: range of the sphere centre in x, y, z over the swing and the largest distance from the mean",
  options: ["units", "decimal"],
  run(ctx) {
    return tcpCheckToJson(tcpCheck(readInput(ctx, readSphereProbeCsv)));
  },
};

/** Registered by ./geometry.ts. */
export const checkCommands: Record<string, CliCommand> = {
  "rotary-positioning": rotaryPositioningCommand,
  "tcp-check": tcpCheckCommand,
};
