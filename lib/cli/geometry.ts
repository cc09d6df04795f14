/**
 * `npm run geometry -- <command> <file.csv> [options]`: the computation of geometry/ on files, for
 * scripts and for checking a result by hand. JSON on stdout; warnings and errors on stderr; exit
 * code 2 for bad input or a wrong command line (1 only for an internal fault).
 * Commands live in one table; each is { usage, summary, options, run } (see ./command.ts).
 */
import { closeSync, fstatSync, openSync, readFileSync } from "node:fs";
import { pathToFileURL } from "node:url";
import {
  evaluateTestPart,
  fitCircle,
  fitSweep,
  fitTram,
  fitTramPlanes,
  formatIssue,
  GeometryError,
  readPointsCsv,
  readSweepCsv,
  readTestPartCsv,
  readTramCsv,
  sweepToJson,
  tramToJson,
} from "@/geometry";
import { readInput, readLargeInput } from "./chunked-csv";
import { pickFields } from "@/geometry/json";
import { choiceOption, CliUsageError, numberOption, type CliCommand, type CliContext } from "./command";
// ── HEAD COMMANDS (fit-head, plan) ─────────────────────────────────────────────────────────────
// ./head-commands.ts (owned by the head-model work) exports
//   `export const headCommands: Record<string, CliCommand> = { "fit-head": …, plan: … }`
// using the CliCommand type of ./command.ts. To register them, uncomment this import and the
// `...headCommands` line in `commands` below.
import { headCommands } from "./head-commands";
import { checkCommands } from "./check-commands";

const circle: CliCommand = {
  usage: "circle <points.csv> [--units mm|in] [--decimal point|comma]",
  summary: "fit a circle to x,y,z points taken while one axis turns: axis direction, a point on it, radius",
  options: ["units", "decimal"],
  run(ctx) {
    const f = fitCircle(readLargeInput(ctx, readPointsCsv));
    f.warnings.forEach((w) => ctx.warn(w));
    return pickFields(f, [
      "centre_mm",
      "normal",
      "radius_mm",
      "rms_um",
      "max_um",
      "radius_U_mm",
      "centre_U_mm",
      "normal_U_arcsec",
    ]);
  },
};

const tram: CliCommand = {
  usage: "tram <tram.csv> [--travel-units mm|in] [--reading-units um|mm|in] [--decimal point|comma]",
  summary: "least-squares line of indicator reading vs travel: slope, angle, straightness, TIR",
  options: ["travel-units", "reading-units", "decimal"],
  run(ctx) {
    const data = readLargeInput(ctx, readTramCsv);
    if (data.plane) {
      const p = fitTramPlanes({ ...data, plane: data.plane });
      p.warnings.forEach((w) => ctx.warn(w));
      return {
        planes: p.planes.map((q) => ({
          plane: q.plane,
          slope_um_per_m: q.slope_um_per_m,
          slope_U_um_per_m: q.slope_U_um_per_m,
          angle_arcsec: q.angle_arcsec,
          ...(q.bar_um_per_m !== undefined ? { bar_um_per_m: q.bar_um_per_m } : {}),
        })),
      };
    }
    const r = fitTram(data);
    return tramToJson(r);
  },
};

const sweep: CliCommand = {
  usage: "sweep <sweep.csv> --radius-mm R [--reading-units um|mm|in] [--decimal point|comma]",
  summary: "tilt and flatness of a face from indicator readings swept around a circle of radius R",
  options: ["radius-mm", "reading-units", "decimal"],
  run(ctx) {
    const radius = numberOption(ctx, "radius-mm", { required: true, positive: true })!;
    const r = fitSweep(readLargeInput(ctx, readSweepCsv), radius);
    r.notes.forEach((n) => ctx.warn(n));
    return sweepToJson(r);
  },
};

const testPart: CliCommand = {
  usage: "test-part <part.csv> [--rule simple|guarded] [--u-mm U] [--decimal point|comma]",
  summary: "judge each test-part characteristic against its tolerance (ISO 14253-1 decision rule)",
  options: ["rule", "u-mm", "decimal"],
  run(ctx) {
    const rows = readInput(ctx, readTestPartCsv);
    const result = evaluateTestPart(rows, {
      rule: choiceOption(ctx, "rule", ["simple", "guarded"] as const, "simple"),
      defaultUMm: numberOption(ctx, "u-mm", { nonNegative: true }),
    });
    result.warnings.forEach((w) => ctx.warn(w));
    return result;
  },
};

/** Every command, by name. Head commands come from ./head-commands.ts. */
export const commands: Readonly<Record<string, CliCommand>> = {
  circle,
  tram,
  sweep,
  "test-part": testPart,
  ...headCommands, // HEAD COMMANDS: see the import above.
  ...checkCommands, // rotary-positioning, tcp-check: ./check-commands.ts
};

function help(): string {
  const lines = Object.entries(commands).map(([, c]) => `  ${c.usage}\n      ${c.summary}`);
  return `usage: npm run geometry -- <command> <file> [options]\n\ncommands:\n${lines.join("\n")}\n`;
}

function parseArgs(argv: readonly string[]): {
  name: string;
  file: string;
  options: Record<string, string | true>;
} {
  const [name, ...rest] = argv;
  if (name === undefined) throw new CliUsageError("no command given");
  const positional: string[] = [];
  const options: Record<string, string | true> = {};
  for (let i = 0; i < rest.length; i++) {
    const a = rest[i]!;
    if (a.startsWith("--")) {
      const eq = a.indexOf("=");
      const key = eq === -1 ? a.slice(2) : a.slice(2, eq);
      if (key in options) throw new CliUsageError(`--${key} is given twice`);
      if (eq !== -1) options[key] = a.slice(eq + 1);
      else if (i + 1 < rest.length && !rest[i + 1]!.startsWith("--")) options[key] = rest[++i]!;
      else options[key] = true;
    } else {
      positional.push(a);
    }
  }
  if (positional.length !== 1)
    throw new CliUsageError(`${name} needs exactly one input file (got ${positional.length})`);
  return { name, file: positional[0]!, options };
}

/** Run the CLI; returns the exit code. Output goes through the given writers (tests pass their own). */
export async function main(
  argv: readonly string[],
  out: (s: string) => void = (s) => process.stdout.write(s),
  err: (s: string) => void = (s) => process.stderr.write(s),
): Promise<number> {
  if (argv.length === 0 || argv[0] === "--help" || argv[0] === "help") {
    (argv.length === 0 ? err : out)(help());
    return argv.length === 0 ? 2 : 0;
  }
  try {
    const { name, file, options } = parseArgs(argv);
    const command = Object.hasOwn(commands, name) ? commands[name] : undefined;
    if (!command)
      throw new CliUsageError(`unknown command '${name}'; one of: ${Object.keys(commands).join(", ")}`);
    for (const key of Object.keys(options)) {
      if (!command.options.includes(key))
        throw new CliUsageError(`${name} has no option --${key} (usage: ${command.usage})`);
    }
    const cannotRead = (e: unknown) =>
      new CliUsageError(`cannot read ${file}: ${(e as NodeJS.ErrnoException).code ?? String(e)}`);
    try {
      const fd = openSync(file, "r");
      const isDirectory = fstatSync(fd).isDirectory();
      closeSync(fd);
      if (isDirectory) throw Object.assign(new Error("a directory"), { code: "EISDIR" });
    } catch (e) {
      throw cannotRead(e);
    }
    // The text is read when a command asks for it: sweep, circle and tram read large files in blocks.
    let text: string | undefined;
    const ctx: CliContext = {
      file,
      get text() {
        try {
          return (text ??= readFileSync(file, "utf8"));
        } catch (e) {
          throw cannotRead(e);
        }
      },
      options,
      warn: (m) => err(`warning: ${m}\n`),
    };
    const result = await command.run(ctx);
    out(
      `${JSON.stringify(result, (_k, v: unknown) => (v instanceof Float64Array ? Array.from(v) : v), 2)}\n`,
    );
    return 0;
  } catch (e) {
    if (e instanceof GeometryError) {
      err(
        `error: ${e.issues.length > 1 ? `${e.issues.length} problems in the input` : formatIssue(e.issues[0]!)}\n`,
      );
      if (e.issues.length > 1) for (const i of e.issues) err(`  ${formatIssue(i)}\n`);
      return 2;
    }
    if (e instanceof CliUsageError) {
      err(`error: ${e.message}\n`);
      return 2;
    }
    err(`internal error: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
    return 1;
  }
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  void main(process.argv.slice(2)).then((code) => {
    process.exitCode = code;
  });
}
