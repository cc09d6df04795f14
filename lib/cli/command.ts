/**
 * The shape of a `npm run geometry` command, shared by the dispatcher (geometry.ts) and the command
 * modules that register into it (head-commands.ts, check-commands.ts), so neither imports the
 * other's internals; and the options and warnings every command reads and prints the same way.
 */
import { formatIssue, type CsvWarning } from "@/geometry";

/** Parsed command line after the command name: the input file and its `--name value` options. */
export interface CliContext {
  /** Path of the input file as given. */
  readonly file: string;
  /** The file's text (UTF-8), read on first use (a command may read the file in blocks instead). */
  readonly text: string;
  /** Options without the leading dashes; a bare flag is `true`. */
  readonly options: Readonly<Record<string, string | true>>;
  /** Report a warning (printed on stderr; stdout stays pure JSON). */
  warn(message: string): void;
}

export interface CliCommand {
  /** One line shown in the help, e.g. "sweep <file.csv> --radius-mm R [--reading-units um|mm|in]". */
  readonly usage: string;
  readonly summary: string;
  /** Option names the command accepts (without dashes); others are refused. */
  readonly options: readonly string[];
  /** Returns the JSON value to print on stdout; throws GeometryError or CliUsageError on bad input. */
  run(ctx: CliContext): unknown | Promise<unknown>;
}

/** A wrong command line (unknown option, missing value); exit code 2 like bad input. */
export class CliUsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "CliUsageError";
  }
}

/** A string option restricted to a set of values, with a default. */
export function choiceOption<T extends string>(
  ctx: CliContext,
  name: string,
  choices: readonly T[],
  fallback: T,
): T {
  const v = ctx.options[name];
  if (v === undefined) return fallback;
  if (v === true || !(choices as readonly string[]).includes(v)) {
    throw new CliUsageError(
      `--${name} must be one of ${choices.join(", ")}${v === true ? "" : ` (got '${v}')`}`,
    );
  }
  return v as T;
}

/** A finite number option; `positive` (> 0) or `nonNegative` (≥ 0) when the quantity needs it. */
export function numberOption(
  ctx: CliContext,
  name: string,
  opts: { positive?: boolean; nonNegative?: boolean; required?: boolean } = {},
): number | undefined {
  const v = ctx.options[name];
  if (v === undefined) {
    if (opts.required) throw new CliUsageError(`--${name} is required`);
    return undefined;
  }
  const n = v === true || v.trim() === "" ? NaN : Number(v);
  if (!Number.isFinite(n))
    throw new CliUsageError(`--${name} needs a finite number (got '${v === true ? "" : v}')`);
  if (opts.positive && !(n > 0)) throw new CliUsageError(`--${name} must be greater than 0 (got ${n})`);
  if (opts.nonNegative && !(n >= 0)) throw new CliUsageError(`--${name} must be 0 or more (got ${n})`);
  return n;
}

/** --decimal point|comma: the decimal mark the CSV file is written with. */
const decimalOf = (ctx: CliContext) => choiceOption(ctx, "decimal", ["point", "comma"] as const, "point");

/** A length unit option, mm or in (default mm): --units, --travel-units. */
const lengthUnitsOf = (ctx: CliContext, name = "units") =>
  choiceOption(ctx, name, ["mm", "in"] as const, "mm");

/** --reading-units um|mm|in: the unit the indicator readings are written in (default µm). */
const readingUnitsOf = (ctx: CliContext) =>
  choiceOption(ctx, "reading-units", ["um", "mm", "in"] as const, "um");

/**
 * The options of the geometry/csv readers as the command line gives them, each with its default
 * (the dispatcher has already refused an option the command does not take).
 */
export function csvOptionsOf(ctx: CliContext) {
  return {
    units: lengthUnitsOf(ctx),
    travelUnits: lengthUnitsOf(ctx, "travel-units"),
    readingUnits: readingUnitsOf(ctx),
    decimal: decimalOf(ctx),
  };
}
export type CsvOptions = ReturnType<typeof csvOptionsOf>;

/** A CSV reader's warnings on stderr, one line each naming its row and column. */
export function passWarnings(ctx: CliContext, warnings: readonly CsvWarning[]): void {
  warnings.forEach((w) => ctx.warn(formatIssue(w)));
}
