// Builders for the fit JSON that view models and report sections read (geometry's HeadFitJson),
// for unit tests of what is shown and printed. The values a test passes are invented for display;
// no computation is checked through them.
import type { HeadFitJson } from "@/geometry";

export type FitParameter = HeadFitJson["parameters"][number];

/**
 * A fitted parameter with its expanded uncertainty U (k = 2, so u = U / 2); a null U is a parameter
 * the data could not identify. The unit follows the key's suffix (µm for `_um`, else arc seconds).
 */
export const param = (
  key: FitParameter["key"],
  value: number,
  U: number | null,
  iso = "X",
): FitParameter => ({
  key,
  iso,
  value,
  unit: key.endsWith("_um") ? "um" : "arcsec",
  u: U === null ? null : U / 2,
  U,
  identifiable: U === null ? "no" : "yes",
});

/** A fit of these parameters: sphere at the origin, 1 µm RMS, 2 µm largest, 3 iterations, unless `over` says. */
export const headFitJson = (parameters: FitParameter[], over: Partial<HeadFitJson> = {}): HeadFitJson => ({
  parameters,
  sphere_centre_mm: [0, 0, 0],
  rms_um: 1,
  max_um: 2,
  outliers: [],
  outlier_count: 0,
  iterations: 3,
  warnings: [],
  ...over,
});
