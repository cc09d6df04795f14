/**
 * Shared data shapes of geometry/. Column arrays are Float64Array so that 10^6-row inputs stay
 * compact; every length is in mm and every angle in degrees at this edge (names carry the unit).
 */

/**
 * Named number columns as a fit takes them: any array of numbers per name (a reader's Float64Array,
 * or a plain array from a caller). `K` names the columns of the data shape `T` the fit reads.
 */
export type NumberColumns<T, K extends keyof T> = { readonly [P in K]: ArrayLike<number> };

/** Sphere-probe data: one row per probed pose, the measured sphere centre in machine coordinates. */
export interface SphereProbeData {
  readonly rows: number;
  readonly primaryDeg: Float64Array;
  readonly secondaryDeg: Float64Array;
  readonly xMm: Float64Array;
  readonly yMm: Float64Array;
  readonly zMm: Float64Array;
  /** Tool length per row (mm), added to the pivot length along the tool direction; absent = 0. */
  readonly toolMm?: Float64Array;
  /** Optional point and repeat indices from the file (point, repeat columns). */
  readonly point?: Float64Array;
  readonly repeat?: Float64Array;
  readonly tempC?: Float64Array;
  /** Row number in the source file (header = row 1) for each data row, for error messages. */
  readonly sourceRow?: Int32Array;
}

/** Indicator tram: readings along a travel. */
export interface TramData {
  readonly rows: number;
  readonly travelMm: Float64Array;
  readonly readingUm: Float64Array;
  readonly note?: readonly (string | undefined)[];
  /** Optional plane of each row (XZ or YZ) and bar position (0 or 180°): tram in two planes. */
  readonly plane?: readonly ("XZ" | "YZ")[];
  readonly barDeg?: Float64Array;
  readonly sourceRow?: Int32Array;
}

/** Indicator sweep: readings at angles around a circle of known radius (entered separately). */
export interface SweepData {
  readonly rows: number;
  readonly angleDeg: Float64Array;
  readonly readingUm: Float64Array;
  readonly sourceRow?: Int32Array;
}

/** One measured characteristic of a test part, in the unit of its row (default mm). */
export interface TestPartRow {
  readonly feature: string;
  readonly characteristic: string;
  readonly nominal: number;
  readonly measured: number;
  /**
   * Signed tolerance limits relative to nominal (lower usually ≤ 0, upper ≥ 0). `lowerTol` is null
   * for a one-sided tolerance (upper limit only: flatness, squareness magnitude — ISO 14253-1).
   */
  readonly lowerTol: number | null;
  readonly upperTol: number;
  readonly unit: string;
  readonly sourceRow?: number;
}

/** Rotary positioning (ISO 230-2): each row one approach of a target angle from one direction. */
export interface RotaryPositioningData {
  readonly rows: number;
  readonly targetDeg: Float64Array;
  readonly run: Float64Array;
  /** "pos": approached in the positive sense; "neg": in the negative sense. */
  readonly direction: readonly ("pos" | "neg")[];
  readonly measuredDeg: Float64Array;
  /** The axis letter when the file names it (one axis per file). */
  readonly axis?: string;
  readonly sourceRow?: Int32Array;
}
