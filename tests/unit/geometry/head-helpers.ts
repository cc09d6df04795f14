// Shared by the head-fit tests: the C/A head, invented error values (for tests only), and a helper
// that returns the GeometryError a call throws.
import type { HeadConfig, HeadErrors } from "@/geometry";

export const CA: HeadConfig = { primary: "C", secondary: "A", pivotLengthMm: 152.4 };
export const ERR: HeadErrors = {
  pivot_length_error_um: 50,
  tip_offset_s_um: -30,
  tip_offset_n_um: 80,
  secondary_offset_um: 20,
  primary_zero_arcsec: 100,
  secondary_zero_arcsec: -60,
  secondary_tilt_arcsec: 40,
  primary_tilt_s_arcsec: -25,
  primary_tilt_n_arcsec: 15,
};

/** The GeometryError f throws; any other outcome fails the test. */
export { thrown } from "./csv-helpers";

/** The keys of fit-head's JSON, in order (geometry/README.md, command line). */
export const HEAD_FIT_JSON_KEYS = [
  "parameters",
  "sphere_centre_mm",
  "rms_um",
  "max_um",
  "outliers",
  "outlier_count",
  "iterations",
  "warnings",
];
