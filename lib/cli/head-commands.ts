/**
 * The head-model commands of `npm run geometry` (registered in ./geometry.ts's command table):
 *
 *   fit-head <sphere.csv> --head head.json [--units mm|in] [--decimal point|comma]
 *     Fit the ten error parameters of the head and the sphere centre to sphere-probe data
 *     (columns primary_deg, secondary_deg, x, y, z, optional point, repeat, temp_c, tool_mm).
 *     Prints the JSON of geometry/README.md: parameters (key, iso, value, unit, u, U, identifiable),
 *     sphere_centre_mm, rms_um, max_um, outliers, iterations, warnings.
 *
 *   plan <poses.csv> --head head.json [--decimal point|comma]
 *     Before probing: which parameters candidate poses will identify and each one's predicted
 *     standard uncertainty per 1 µm of probing noise. The CSV has a header and the columns
 *     primary_deg, secondary_deg (degrees) and optional tool_mm (mm, default 0), e.g.
 *       primary_deg,secondary_deg,tool_mm
 *       0,-90,0
 *       45,-90,0
 *     Prints { poses, tool_lengths_mm, parameters: [{ key, iso, unit, identifiable, pinned,
 *     u_per_um_noise }], advice }.
 *
 * The head file is `{"primary":"C","secondary":"A","pivot_length_mm":152.4}` with optional
 * `"tool_direction":[0,0,-1]`. This module reads files (node:fs); geometry/ does not.
 */
import { readFileSync } from "node:fs";
import {
  budgetToJson,
  fitHead,
  headFitBudget,
  GeometryError,
  headFitToJson,
  parseHeadConfig,
  planHeadPoses,
  readSphereProbeCsv,
  type HeadConfig,
} from "@/geometry";
// The pose list uses the shared table reader of geometry/csv (the same tokeniser and number checks
// as every product CSV); it has no reader of its own in geometry/csv's public index.
import { readTable, type ColumnSpec } from "@/geometry/csv/table";
import { readInput, readLargeInput } from "./chunked-csv";
import { CliUsageError, numberOption, type CliCommand, type CliContext } from "./command";

function readHead(ctx: CliContext): HeadConfig {
  const path = ctx.options.head;
  if (path === undefined || path === true)
    throw new CliUsageError("--head <head.json> is required: the head configuration file");
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch (e) {
    throw new CliUsageError(`cannot read ${path}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new GeometryError(
      "bad_config",
      `the head file ${path} is not valid JSON: ${e instanceof Error ? e.message : String(e)}`,
    );
  }
  return parseHeadConfig(json);
}

const fitHeadCommand: CliCommand = {
  usage:
    "fit-head <sphere.csv> --head head.json [--units mm|in] [--decimal point|comma] [--u-probe-um u] [--u-tool-um u] [--delta-t-k ΔT]",
  summary:
    "fit the head's error parameters (µm, arcsec) with U (k = 2) and identifiability to sphere-probe centres",
  options: ["head", "units", "decimal", "u-probe-um", "u-tool-um", "delta-t-k"],
  run(ctx) {
    const config = readHead(ctx);
    const data = readLargeInput(ctx, readSphereProbeCsv);
    const json = headFitToJson(fitHead(config, data));
    // JCGM 100 budget (geometry/budget.ts) when Type B inputs are given.
    const typeB = {
      uProbeUm: numberOption(ctx, "u-probe-um", { nonNegative: true }),
      uToolUm: numberOption(ctx, "u-tool-um", { nonNegative: true }),
      deltaTK: numberOption(ctx, "delta-t-k", { nonNegative: true }),
      lengthMm: config.pivotLengthMm,
    };
    if (typeB.uProbeUm === undefined && typeB.uToolUm === undefined && typeB.deltaTK === undefined) {
      ctx.warn("U holds the fit's Type A only; give --u-probe-um, --u-tool-um or --delta-t-k for a budget");
      return json;
    }
    const plan = planHeadPoses(config, data);
    const sens = Object.fromEntries(plan.parameters.map((p) => [p.key, p.u_per_um_noise]));
    return { ...json, budget: budgetToJson(headFitBudget(json.parameters, sens, typeB)) };
  },
};

/** The pose list's columns: the commanded angles (degrees) and the tool length (mm, default 0). */
const POSE_COLUMNS: readonly ColumnSpec[] = [
  { name: "primary_deg", kind: "number", required: true },
  { name: "secondary_deg", kind: "number", required: true },
  { name: "tool_mm", kind: "number", required: false },
];

const planCommand: CliCommand = {
  usage: "plan <poses.csv> --head head.json [--decimal point|comma]",
  summary:
    "predict which head parameters candidate poses (primary_deg,secondary_deg[,tool_mm]) identify, and u per µm of noise",
  options: ["head", "decimal"],
  run(ctx) {
    const config = readHead(ctx);
    const t = readInput(ctx, (text, options) => readTable(text, POSE_COLUMNS, options));
    const toolMm = t.numbers.get("tool_mm");
    const plan = planHeadPoses(config, {
      rows: t.rows,
      primaryDeg: t.numbers.get("primary_deg")!,
      secondaryDeg: t.numbers.get("secondary_deg")!,
      ...(toolMm ? { toolMm } : {}),
    });
    return {
      poses: plan.poses,
      tool_lengths_mm: plan.tool_lengths_mm,
      parameters: plan.parameters,
      advice: plan.advice,
    };
  },
};

/** Registered by ./geometry.ts. */
export const headCommands: Record<string, CliCommand> = { "fit-head": fitHeadCommand, plan: planCommand };
