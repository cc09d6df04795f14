/**
 * What the browser needs to know about the four dataset formats (geometry/README.md, "CSV
 * formats"): their columns (geometry/csv/columns.ts, the readers' own list), which are numbers, and
 * header names to map from automatically. The server does not use this: it re-reads every file
 * with geometry/'s readers.
 */
import { CSV_COLUMNS } from "@/geometry/csv/columns";
import { CSV_FORMAT_OF, type DatasetKind } from "@/lib/domain/datasets";

export { DATASET_KIND_LABELS as KIND_LABELS, PHASE_LABELS } from "@/lib/domain/datasets";
export type DatasetKindKey = DatasetKind;

export interface ColumnInfo {
  readonly name: string;
  readonly label: string;
  readonly required: boolean;
  readonly numeric: boolean;
  /** An empty field is allowed (one-sided tolerance). */
  readonly allowEmpty?: boolean;
  /** Other header spellings that map to this column (compared lower case, without spaces, dots, dashes or units in brackets). */
  readonly aliases: readonly string[];
}

export const KIND_HINTS: Record<DatasetKindKey, string> = {
  sphere_probe:
    "One row per probed pose: the commanded primary and secondary angles and the measured sphere centre.",
  tram: "Indicator readings along a travel, for the tram slope and straightness.",
  sweep: "Indicator readings at angles around a circle of known radius, for tilt and flatness.",
  test_part: "Each measured characteristic of the cut test part with its nominal and tolerance.",
  tcp_check:
    "Sphere-probe data taken with the control's tool-centre-point function on, after the new values were entered: where the control reports the sphere centre at each pose.",
  rotary_positioning:
    "ISO 230-2 positioning of one rotary axis: each target angle approached several times from both directions, with the angle measured by a reference (autocollimator and polygon, or an angle encoder).",
};

/** The kinds whose files carry a stated expanded uncertainty, and how the field asks for it. */
export const UNCERTAINTY_WORDS: Partial<
  Record<DatasetKindKey, { label: string; placeholder: string; hint: string }>
> = {
  test_part: {
    label: "Expanded uncertainty U (k = 2) of the part measurement, mm",
    placeholder: "e.g. 0.002",
    hint: "From the measuring machine's calibration; converted for rows in inch or µm. Empty counts as 0.",
  },
  rotary_positioning: {
    label: "Expanded uncertainty U (k = 2) of the angle measurement, ″",
    placeholder: "e.g. 0.5",
    hint: "From the reference's calibration; the guarded decision rule needs it. Empty: not stated.",
  },
};

/** What the form shows for each column: a label and other header spellings that map to it. */
const SPHERE_PROBE_PRESENTATION: Readonly<Record<string, Presentation>> = {
  primary_deg: {
    label: "Primary angle (°)",
    aliases: ["primary", "primaryangle", "c", "cdeg", "c_deg", "rotary"],
  },
  secondary_deg: {
    label: "Secondary angle (°)",
    aliases: ["secondary", "secondaryangle", "a", "b", "adeg", "bdeg", "tilt"],
  },
  x: { label: "Centre x", aliases: ["xmm", "xin", "centrex", "centerx", "xcoord"] },
  y: { label: "Centre y", aliases: ["ymm", "yin", "centrey", "centery", "ycoord"] },
  z: { label: "Centre z", aliases: ["zmm", "zin", "centrez", "centerz", "zcoord"] },
  point: { label: "Point number", aliases: ["pt", "pose", "no", "nr"] },
  repeat: { label: "Repeat", aliases: ["rep", "run"] },
  temp_c: { label: "Temperature (°C)", aliases: ["temp", "temperature", "tempc"] },
  tool_mm: { label: "Tool length (mm)", aliases: ["tool", "toollength", "toolmm"] },
};

export const PRESENTATION: Record<DatasetKindKey, Readonly<Record<string, Presentation>>> = {
  sphere_probe: SPHERE_PROBE_PRESENTATION,
  tcp_check: SPHERE_PROBE_PRESENTATION,
  tram: {
    travel: { label: "Travel", aliases: ["position", "pos", "distance", "x", "z"] },
    reading: { label: "Reading", aliases: ["indicator", "dial", "value", "tir"] },
    note: { label: "Note", aliases: ["comment", "remark"] },
    plane: { label: "Plane (XZ or YZ)", aliases: ["plane_name", "tramplane"] },
    bar_deg: {
      label: "Test bar turned (0 or 180°)",
      aliases: ["bar", "bar_angle", "bar_rotation", "barangle", "bardeg"],
    },
  },
  sweep: {
    angle_deg: { label: "Angle (°)", aliases: ["angle", "deg", "theta", "position"] },
    reading: { label: "Reading", aliases: ["indicator", "dial", "value"] },
  },
  test_part: {
    feature: { label: "Feature", aliases: ["name", "element", "featurename"] },
    characteristic: { label: "Characteristic", aliases: ["property", "check", "quantity"] },
    nominal: { label: "Nominal", aliases: ["nom", "target"] },
    measured: { label: "Measured", aliases: ["actual", "meas", "value"] },
    lower_tol: { label: "Lower tolerance", aliases: ["lowertol", "lowtol", "tolminus", "mintol", "lower"] },
    upper_tol: { label: "Upper tolerance", aliases: ["uppertol", "uptol", "tolplus", "maxtol", "upper"] },
    unit: { label: "Unit", aliases: ["units", "uom"] },
  },
  rotary_positioning: {
    target_deg: { label: "Target angle (°)", aliases: ["target", "targetangle", "nominal", "commanded"] },
    run: { label: "Run", aliases: ["j", "cycle", "repeat", "rep"] },
    direction: { label: "Direction (pos or neg)", aliases: ["dir", "approach", "sense"] },
    measured_deg: { label: "Measured angle (°)", aliases: ["measured", "actual", "angle", "reference"] },
    axis: { label: "Axis letter", aliases: ["axisletter", "axisname"] },
  },
};

interface Presentation {
  readonly label: string;
  readonly aliases: readonly string[];
}

function columnsOf(kind: DatasetKindKey): readonly ColumnInfo[] {
  const shown = PRESENTATION[kind];
  return CSV_COLUMNS[CSV_FORMAT_OF[kind]].map((c) => ({
    name: c.name,
    label: shown[c.name]!.label,
    required: c.required,
    numeric: c.kind === "number",
    ...(c.allowEmpty ? { allowEmpty: true } : {}),
    aliases: shown[c.name]!.aliases,
  }));
}

/** The columns of each format, in geometry's order, with the form's labels and aliases. */
export const COLUMNS: Record<DatasetKindKey, readonly ColumnInfo[]> = {
  sphere_probe: columnsOf("sphere_probe"),
  tram: columnsOf("tram"),
  sweep: columnsOf("sweep"),
  test_part: columnsOf("test_part"),
  tcp_check: columnsOf("tcp_check"),
  rotary_positioning: columnsOf("rotary_positioning"),
};

export function normaliseHeader(h: string): string {
  return h
    .replace(/\(.*?\)|\[.*?\]/g, "")
    .toLowerCase()
    .replace(/[\s.\-_/]/g, "");
}

/** Canonical column → index of the file's header it maps to (or -1), guessed from the names. */
export function guessMapping(kind: DatasetKindKey, headers: readonly string[]): Record<string, number> {
  const norm = headers.map(normaliseHeader);
  const taken = new Set<number>();
  const out: Record<string, number> = {};
  // Exact names first, then aliases, so "x" is never stolen by an alias of another column.
  for (const pass of ["exact", "alias"] as const) {
    for (const c of COLUMNS[kind]) {
      if (out[c.name] !== undefined && out[c.name]! >= 0) continue;
      const wanted = pass === "exact" ? [normaliseHeader(c.name)] : c.aliases.map(normaliseHeader);
      const i = norm.findIndex((h, k) => !taken.has(k) && wanted.includes(h));
      out[c.name] = i;
      if (i >= 0) taken.add(i);
    }
  }
  return out;
}
