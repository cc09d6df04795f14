/**
 * Server-side validation of an uploaded dataset: the bytes are decoded as UTF-8 and re-parsed with
 * geometry/'s CSV readers (never a parser of our own), whatever the browser said about them. The
 * result is the columns to store in SI-based units (mm, µm, degrees, as the readers give them),
 * the summary shown to people, and the warnings; anything wrong is a 422 whose issues name the
 * row (header = row 1) and column.
 *
 * Column mapping: when the user renamed columns in the browser, the form carries `header`, the
 * replacement header line in the file's own delimiter (e.g. `x,y,z,primary_deg,secondary_deg`).
 * The server swaps it for the file's first line before reading; the stored original is the
 * uploaded bytes, unchanged, and `options.header_replaced` records the line that was replaced.
 */
import { z } from "zod";
import {
  fitSweep,
  fitTram,
  formatIssue,
  GeometryError,
  readSphereProbeCsv,
  readSweepCsv,
  readTestPartCsv,
  readTramCsv,
  readRotaryPositioningCsv,
  rotaryPositioning,
  rotaryPositioningToJson,
  tcpCheck,
  tcpCheckToJson,
  type SphereProbeData,
  type TestPartRow,
  sweepToJson,
  tramToJson,
} from "@/geometry";
import { DATASET_KINDS, PHASES, type DatasetKind } from "@/lib/domain/datasets";
import { HEAD_AXIS_ROLE_WORDS, HEAD_AXIS_ROLES, type HeadAxisRole } from "@/lib/domain/positioning";
import { AppError, invalid, type FieldIssue } from "@/lib/errors";

export { DATASET_KINDS, PHASES, type DatasetKind };

export interface StoredColumn {
  readonly name: string;
  readonly unit: string;
  readonly values: Float64Array;
}

export interface ParsedDataset {
  readonly kind: DatasetKind;
  readonly rows: number;
  readonly columns: readonly StoredColumn[];
  readonly units: Record<string, string | number>;
  readonly options: Record<string, unknown>;
  readonly summary: Record<string, unknown>;
  readonly warnings: string[];
}

const decimal = z.enum(["point", "comma"]).default("point");
const headerLine = z
  .string()
  .max(4096)
  .regex(
    /^[A-Za-z0-9_ ]*([,;][A-Za-z0-9_ ]*)*$/,
    "only letters, digits, spaces and underscores between the file's delimiters",
  )
  .optional();

/** An expanded uncertainty U (k = 2) in `unit`, at most `max`; a blank field means none stated. */
const expandedUncertainty = (unit: { name: string; symbol: string }, max: number) =>
  z.preprocess(
    (v) => (v === "" ? undefined : v),
    z.coerce
      .number({ error: `the expanded uncertainty must be a number (${unit.name})` })
      .finite()
      .min(0, `the expanded uncertainty must be ≥ 0${unit.symbol}`)
      .max(max)
      .optional(),
  );

const sphereProbeForm = z.object({
  units: z.enum(["mm", "in"], { error: "choose mm or in for the x, y, z columns" }),
  decimal,
  header: headerLine,
});

const formSchemas = {
  sphere_probe: sphereProbeForm,
  // The sphere-probe format, taken with the control's tool-centre-point function active.
  tcp_check: sphereProbeForm,
  tram: z.object({
    travel_units: z.enum(["mm", "in"], { error: "choose mm or in for the travel" }),
    reading_units: z.enum(["um", "mm", "in"], { error: "choose um, mm or in for the readings" }),
    decimal,
    header: headerLine,
  }),
  sweep: z.object({
    reading_units: z.enum(["um", "mm", "in"], { error: "choose um, mm or in for the readings" }),
    radius_mm: z.coerce
      .number({ error: "the sweep radius must be a number (mm)" })
      .finite()
      .positive("the sweep radius must be above 0 mm")
      .max(10_000),
    decimal,
    header: headerLine,
  }),
  rotary_positioning: z.object({
    axis: z.enum(HEAD_AXIS_ROLES, { error: "choose the primary (rotary) or the secondary (tilt) axis" }),
    decimal,
    header: headerLine,
    /** Expanded uncertainty U (k = 2) of the angle measurement, arc seconds (for the guarded rule). */
    uncertainty_arcsec: expandedUncertainty({ name: "arc seconds", symbol: "″" }, 36_000),
  }),
  test_part: z.object({
    decimal,
    header: headerLine,
    /** Expanded uncertainty U (k = 2) of the part measurement for length rows, mm (converted to in/µm per row). */
    uncertainty_mm: expandedUncertainty({ name: "mm", symbol: " mm" }, 10),
  }),
} as const;

export const uploadFormSchema = z.object({
  kind: z.enum(DATASET_KINDS, {
    error: "kind must be sphere_probe, tram, sweep, test_part, tcp_check or rotary_positioning",
  }),
  phase: z.enum(PHASES, { error: "phase must be pre or post" }),
});

function zodIssues(err: z.ZodError): FieldIssue[] {
  return err.issues.map((i) => ({ field: i.path.join(".") || "form", message: i.message }));
}

/** The form fields of an upload (kind, phase, unit fields) checked; 422 naming the field otherwise. */
export function parseUploadForm(fields: Readonly<Record<string, string>>) {
  const base = uploadFormSchema.safeParse(fields);
  if (!base.success) throw invalid("Some fields of the upload need attention.", zodIssues(base.error));
  const extra = formSchemas[base.data.kind].safeParse(fields);
  if (!extra.success) throw invalid("Some fields of the upload need attention.", zodIssues(extra.error));
  return {
    ...base.data,
    ...(extra.data as {
      decimal: "point" | "comma";
      header?: string;
      units?: "mm" | "in";
      travel_units?: "mm" | "in";
      reading_units?: "um" | "mm" | "in";
      radius_mm?: number;
      uncertainty_mm?: number;
      axis?: HeadAxisRole;
      uncertainty_arcsec?: number;
    }),
  };
}
export type UploadForm = ReturnType<typeof parseUploadForm>;

/** UTF-8 text of the file (a BOM is dropped); 422 naming the row of the first invalid byte. */
export function decodeUtf8(bytes: Uint8Array): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    const loose = new TextDecoder("utf-8").decode(bytes);
    const at = loose.indexOf("\uFFFD");
    let row = 1;
    for (let i = 0; i < at; i++) {
      const c = loose.charCodeAt(i);
      if (c === 10 || (c === 13 && loose.charCodeAt(i + 1) !== 10)) row++;
    }
    throw new AppError(422, "invalid_csv", `row ${row}: the file is not UTF-8 text`, [
      { row, message: "the file is not valid UTF-8 text; save it as CSV UTF-8" },
    ]);
  }
}

/** The limits every uploaded CSV file is held to before a reader sees it. */
export const CSV_MAX_COLUMNS = 200;
export const CSV_MAX_CELL_CHARS = 1000;
const MAX_LIMIT_ISSUES = 20;

/** "x" for a named header cell, "column 7" otherwise (1-based, as a spreadsheet counts). */
function columnName(names: readonly string[], index: number): string {
  const n = names[index]?.trim();
  return n ? n : `column ${index + 1}`;
}

/**
 * One pass over the text (RFC 4180 quoting: delimiters and line breaks inside quotes are data)
 * that refuses, naming row and column, what no reader should be handed: a NUL or other control
 * character in a cell (PostgreSQL cannot store NUL in text or jsonb, and no number or name holds
 * one), a cell longer than CSV_MAX_CELL_CHARS, a record with more than CSV_MAX_COLUMNS cells.
 * Tab, carriage return and line feed are allowed. Reading stops at the first record that is too
 * wide, so a file with a million columns costs one line's scan. Rows count as in a spreadsheet:
 * the header is row 1.
 */
export function checkCsvLimits(text: string): void {
  const start = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let firstEnd = start;
  while (firstEnd < text.length && text.charCodeAt(firstEnd) !== 10 && text.charCodeAt(firstEnd) !== 13)
    firstEnd++;
  const header = text.slice(start, Math.min(firstEnd, start + 64 * 1024));
  const delim = header.split(";").length > header.split(",").length ? 59 : 44;
  const issues: FieldIssue[] = [];
  const names: string[] = [];
  let row = 1;
  let col = 0;
  let cellStart = start;
  /** Inside a quoted field; `blank` while the cell so far is only spaces (a quote may open it). */
  let inQuotes = false;
  let blank = true;
  let reported = false;
  const nextCell = (at: number) => {
    if (row === 1 && names.length < CSV_MAX_COLUMNS)
      names.push(text.slice(cellStart, at).trim().replace(/^"|"$/g, ""));
    cellStart = at + 1;
    blank = true;
    reported = false;
  };
  for (let i = start; i < text.length && issues.length < MAX_LIMIT_ISSUES; i++) {
    const c = text.charCodeAt(i);
    if (inQuotes) {
      if (c === 34) {
        if (text.charCodeAt(i + 1) === 34) i++;
        else inQuotes = false;
      }
    } else if (c === delim) {
      nextCell(i);
      if (++col >= CSV_MAX_COLUMNS) {
        issues.push({
          row,
          message: `more than ${CSV_MAX_COLUMNS} columns; a file may have at most ${CSV_MAX_COLUMNS}`,
        });
        break;
      }
      continue;
    } else if (c === 10 || c === 13) {
      nextCell(i);
      if (c === 13 && text.charCodeAt(i + 1) === 10) i++;
      cellStart = i + 1;
      row++;
      col = 0;
      continue;
    } else if (c === 34 && blank) {
      inQuotes = true;
      continue;
    } else if (c !== 32) blank = false;
    if (reported) continue;
    const control = (c < 32 && c !== 9 && c !== 10 && c !== 13) || (c >= 127 && c < 160);
    if (control) {
      const what =
        c === 0 ? "a NUL byte" : `a control character (U+${c.toString(16).toUpperCase().padStart(4, "0")})`;
      issues.push({
        row,
        column: columnName(names, col),
        message: `the cell holds ${what}; remove it and upload again`,
      });
      reported = true;
    } else if (i - cellStart >= CSV_MAX_CELL_CHARS) {
      issues.push({
        row,
        column: columnName(names, col),
        message: `the cell is longer than ${CSV_MAX_CELL_CHARS} characters`,
      });
      reported = true;
    }
  }
  if (issues.length === 0) return;
  const first = issues[0]!;
  const where = [`row ${first.row}`, first.column ? `column ${first.column}` : null]
    .filter(Boolean)
    .join(", ");
  const more = issues.length > 1 ? ` (and ${issues.length - 1} more)` : "";
  throw new AppError(422, "invalid_csv", `${where}: ${first.message}${more}`, issues);
}

/** Swap the first line of `text` (after a BOM) for `header`. */
function replaceHeader(text: string, header: string): { text: string; replaced: string } {
  const start = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let end = start;
  while (end < text.length && text.charCodeAt(end) !== 10 && text.charCodeAt(end) !== 13) end++;
  return { text: header + text.slice(end), replaced: text.slice(start, end) };
}

function geometryFailure(err: GeometryError): AppError {
  const issues = err.issues.map((i) => ({
    ...(i.row !== undefined ? { row: i.row } : {}),
    ...(i.column !== undefined ? { column: i.column } : {}),
    message: i.message,
  }));
  return new AppError(422, "invalid_csv", err.message, issues);
}

function range(values: Float64Array): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

function copyColumn(name: string, unit: string, values: ArrayLike<number>): StoredColumn {
  const out = values instanceof Float64Array ? values : Float64Array.from(values);
  for (let i = 0; i < out.length; i++) {
    if (!Number.isFinite(out[i]!))
      throw new AppError(422, "invalid_csv", `column ${name}: a value is not a finite number`, [
        { column: name, message: "not a finite number" },
      ]);
  }
  return { name, unit, values: out };
}

/** Re-parse and validate the file's text for its kind; throws AppError 422 with row/column issues. */
export function parseDatasetText(form: UploadForm, input: string): ParsedDataset {
  const options: Record<string, unknown> = { decimal: form.decimal };
  let text = input;
  if (form.header !== undefined && form.header.trim() !== "") {
    const r = replaceHeader(input, form.header);
    text = r.text;
    options.header = form.header;
    options.header_replaced = r.replaced.slice(0, 4096);
  }
  try {
    switch (form.kind) {
      case "sphere_probe": {
        const d = readSphereProbeCsv(text, { units: form.units!, decimal: form.decimal });
        const columns = [
          ...poseColumns(d),
          ...(d.point ? [copyColumn("point", "1", d.point)] : []),
          ...(d.repeat ? [copyColumn("repeat", "1", d.repeat)] : []),
          ...(d.tempC ? [copyColumn("temp_c", "degC", d.tempC)] : []),
        ];
        return done(form, d.rows, columns, { units: form.units! }, options, {}, d.warnings);
      }
      case "tram": {
        const d = readTramCsv(text, {
          travelUnits: form.travel_units!,
          readingUnits: form.reading_units!,
          decimal: form.decimal,
        });
        const columns = [
          copyColumn("travel_mm", "mm", d.travelMm),
          copyColumn("reading_um", "um", d.readingUm),
        ];
        const extra: string[] = [];
        const fit = fitOrNote(extra, "no line fit", () => tramToJson(fitTram(d)));
        return done(
          form,
          d.rows,
          columns,
          { travel_units: form.travel_units!, reading_units: form.reading_units! },
          options,
          { tram: fit },
          d.warnings,
          extra,
        );
      }
      case "sweep": {
        const d = readSweepCsv(text, { readingUnits: form.reading_units!, decimal: form.decimal });
        const columns = [
          copyColumn("angle_deg", "deg", d.angleDeg),
          copyColumn("reading_um", "um", d.readingUm),
        ];
        const extra: string[] = [];
        const fit = fitOrNote(extra, "no sweep fit", () => sweepToJson(fitSweep(d, form.radius_mm!)));
        return done(
          form,
          d.rows,
          columns,
          { reading_units: form.reading_units!, radius_mm: form.radius_mm! },
          options,
          { sweep: fit },
          d.warnings,
          extra,
        );
      }
      case "tcp_check": {
        // Evaluated at upload (geometry/tcp-check.ts): a set with no swing is refused naming why.
        const d = readSphereProbeCsv(text, { units: form.units!, decimal: form.decimal });
        const r = tcpCheck(d);
        const columns = [...poseColumns(d)];
        const tcp = { ...tcpCheckToJson(r), mean_centre_mm: r.mean_centre_mm };
        return done(form, d.rows, columns, { units: form.units! }, options, { tcp }, d.warnings, [
          ...r.warnings,
        ]);
      }
      case "rotary_positioning": {
        // Evaluated at upload (geometry/rotary-positioning.ts, ISO 230-2): too few runs are refused
        // naming the target and direction. The axis is the form's; a letter in the file is kept.
        const d = readRotaryPositioningCsv(text, { decimal: form.decimal });
        const rotary = rotaryPositioningToJson(rotaryPositioning(d));
        const columns = [
          copyColumn("target_deg", "deg", d.targetDeg),
          copyColumn("run", "1", d.run),
          copyColumn(
            "direction_pos",
            "1",
            d.direction.map((x) => (x === "pos" ? 1 : 0)),
          ),
          copyColumn("measured_deg", "deg", d.measuredDeg),
        ];
        const units: Record<string, string | number> = {
          axis: form.axis!,
          ...(form.uncertainty_arcsec !== undefined ? { uncertainty_arcsec: form.uncertainty_arcsec } : {}),
        };
        return done(form, d.rows, columns, units, options, { rotary }, d.warnings, [...rotary.warnings]);
      }
      case "test_part": {
        const rows = readTestPartCsv(text, { decimal: form.decimal });
        const plain: TestPartRow[] = rows.map((r) => ({ ...r }));
        const units: Record<string, number> =
          form.uncertainty_mm !== undefined ? { uncertainty_mm: form.uncertainty_mm } : {};
        return done(form, rows.length, [], units, options, { test_part_rows: plain }, rows.warnings);
      }
    }
  } catch (err) {
    if (err instanceof GeometryError) throw geometryFailure(err);
    throw err;
  }
}

/** The columns of a sphere-probe file (and of a TCP check): the pose, the centre, the tool length if given. */
function poseColumns(d: SphereProbeData): StoredColumn[] {
  return [
    copyColumn("primary_deg", "deg", d.primaryDeg),
    copyColumn("secondary_deg", "deg", d.secondaryDeg),
    copyColumn("x_mm", "mm", d.xMm),
    copyColumn("y_mm", "mm", d.yMm),
    copyColumn("z_mm", "mm", d.zMm),
    ...(d.toolMm ? [copyColumn("tool_mm", "mm", d.toolMm)] : []),
  ];
}

/** The fit for the dataset's summary, or null with why not added to `notes` when geometry cannot fit the data. */
function fitOrNote<T>(notes: string[], what: string, fit: () => T): T | null {
  try {
    return fit();
  } catch (e) {
    if (!(e instanceof GeometryError)) throw e;
    notes.push(`${what}: ${e.message}`);
    return null;
  }
}

function done(
  form: UploadForm,
  rows: number,
  columns: StoredColumn[],
  units: Record<string, string | number>,
  options: Record<string, unknown>,
  summary: Record<string, unknown>,
  warnings: readonly { row?: number; column?: string; message: string }[],
  extra: string[] = [],
): ParsedDataset {
  const ranges = Object.fromEntries(columns.map((c) => [c.name, { unit: c.unit, ...range(c.values) }]));
  return {
    kind: form.kind,
    rows,
    columns,
    units,
    options,
    summary: { ...summary, columns: ranges },
    warnings: [...warnings.map(formatIssue), ...extra],
  };
}

/**
 * A rotary positioning file that names its axis letter must name the letter the job's head has for
 * the axis chosen at upload (a C-axis file filed as the tilt axis of a C/A head is refused, 422).
 */
export function checkPositioningAxisLetter(
  parsed: ParsedDataset,
  head: { primaryAxis: string; secondaryAxis: string },
): void {
  if (parsed.kind !== "rotary_positioning") return;
  const letter = (parsed.summary.rotary as { axis?: string }).axis;
  const axis = parsed.units.axis as HeadAxisRole;
  const expected = axis === "primary" ? head.primaryAxis : head.secondaryAxis;
  if (letter !== undefined && letter !== expected)
    throw invalid(
      `The file is for axis ${letter}; the head's ${HEAD_AXIS_ROLE_WORDS[axis]} is ${expected}.`,
      [
        {
          field: "axis",
          message: `the file's axis column says ${letter}, the head's ${HEAD_AXIS_ROLE_WORDS[axis]} is ${expected}`,
        },
      ],
    );
}

/** Bytes → validated dataset (decode, the limits, then the readers). */
export function parseDatasetFile(form: UploadForm, bytes: Uint8Array): ParsedDataset {
  const text = decodeUtf8(bytes);
  checkCsvLimits(text);
  return parseDatasetText(form, text);
}

const LITTLE_ENDIAN = new Uint8Array(new Float64Array([1]).buffer)[7] === 0x3f;

/** Float64Array ↔ little-endian bytea (a view, not a copy, on a little-endian machine). */
export function columnToBytes(values: Float64Array): Buffer {
  if (LITTLE_ENDIAN) return Buffer.from(values.buffer, values.byteOffset, values.byteLength);
  const out = Buffer.allocUnsafe(values.length * 8);
  for (let i = 0; i < values.length; i++) out.writeDoubleLE(values[i]!, i * 8);
  return out;
}

export function bytesToColumn(data: Buffer): Float64Array {
  const out = new Float64Array(data.length >>> 3);
  for (let i = 0; i < out.length; i++) out[i] = data.readDoubleLE(i * 8);
  return out;
}
