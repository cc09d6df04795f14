/**
 * What the browser needs to know about the four dataset formats (docs/product.md, "CSV formats"):
 * their columns, which are numbers, the unit questions, and header names to map from
 * automatically. The server does not use this: it re-reads every file with geometry/'s readers.
 */
export type DatasetKindKey = "sphere_probe" | "tram" | "sweep" | "test_part";

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

export const KIND_LABELS: Record<DatasetKindKey, string> = {
  sphere_probe: "Sphere probing",
  tram: "Indicator tram",
  sweep: "Indicator sweep",
  test_part: "Test-part measurements",
};

export const KIND_HINTS: Record<DatasetKindKey, string> = {
  sphere_probe:
    "One row per probed pose: the commanded primary and secondary angles and the measured sphere centre.",
  tram: "Indicator readings along a travel, for the tram slope and straightness.",
  sweep: "Indicator readings at angles around a circle of known radius, for tilt and flatness.",
  test_part: "Each measured characteristic of the cut test part with its nominal and tolerance.",
};

export const PHASE_LABELS = { pre: "Before adjustment", post: "After adjustment" } as const;

export const COLUMNS: Record<DatasetKindKey, readonly ColumnInfo[]> = {
  sphere_probe: [
    {
      name: "primary_deg",
      label: "Primary angle (°)",
      required: true,
      numeric: true,
      aliases: ["primary", "primaryangle", "c", "cdeg", "c_deg", "rotary"],
    },
    {
      name: "secondary_deg",
      label: "Secondary angle (°)",
      required: true,
      numeric: true,
      aliases: ["secondary", "secondaryangle", "a", "b", "adeg", "bdeg", "tilt"],
    },
    {
      name: "x",
      label: "Centre x",
      required: true,
      numeric: true,
      aliases: ["xmm", "xin", "centrex", "centerx", "xcoord"],
    },
    {
      name: "y",
      label: "Centre y",
      required: true,
      numeric: true,
      aliases: ["ymm", "yin", "centrey", "centery", "ycoord"],
    },
    {
      name: "z",
      label: "Centre z",
      required: true,
      numeric: true,
      aliases: ["zmm", "zin", "centrez", "centerz", "zcoord"],
    },
    {
      name: "point",
      label: "Point number",
      required: false,
      numeric: true,
      aliases: ["pt", "pose", "no", "nr"],
    },
    { name: "repeat", label: "Repeat", required: false, numeric: true, aliases: ["rep", "run"] },
    {
      name: "temp_c",
      label: "Temperature (°C)",
      required: false,
      numeric: true,
      aliases: ["temp", "temperature", "tempc"],
    },
    {
      name: "tool_mm",
      label: "Tool length (mm)",
      required: false,
      numeric: true,
      aliases: ["tool", "toollength", "toolmm"],
    },
  ],
  tram: [
    {
      name: "travel",
      label: "Travel",
      required: true,
      numeric: true,
      aliases: ["position", "pos", "distance", "x", "z"],
    },
    {
      name: "reading",
      label: "Reading",
      required: true,
      numeric: true,
      aliases: ["indicator", "dial", "value", "tir"],
    },
    { name: "note", label: "Note", required: false, numeric: false, aliases: ["comment", "remark"] },
  ],
  sweep: [
    {
      name: "angle_deg",
      label: "Angle (°)",
      required: true,
      numeric: true,
      aliases: ["angle", "deg", "theta", "position"],
    },
    {
      name: "reading",
      label: "Reading",
      required: true,
      numeric: true,
      aliases: ["indicator", "dial", "value"],
    },
  ],
  test_part: [
    {
      name: "feature",
      label: "Feature",
      required: true,
      numeric: false,
      aliases: ["name", "element", "featurename"],
    },
    {
      name: "characteristic",
      label: "Characteristic",
      required: true,
      numeric: false,
      aliases: ["property", "check", "quantity"],
    },
    { name: "nominal", label: "Nominal", required: true, numeric: true, aliases: ["nom", "target"] },
    {
      name: "measured",
      label: "Measured",
      required: true,
      numeric: true,
      aliases: ["actual", "meas", "value"],
    },
    {
      name: "lower_tol",
      label: "Lower tolerance",
      required: true,
      numeric: true,
      allowEmpty: true,
      aliases: ["lowertol", "lowtol", "tolminus", "mintol", "lower"],
    },
    {
      name: "upper_tol",
      label: "Upper tolerance",
      required: true,
      numeric: true,
      aliases: ["uppertol", "uptol", "tolplus", "maxtol", "upper"],
    },
    { name: "unit", label: "Unit", required: false, numeric: false, aliases: ["units", "uom"] },
  ],
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
