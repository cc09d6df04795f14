/**
 * The one error type geometry/ throws for impossible or malformed input.
 * `row` is 1-based as a user counts data rows (the header is row 1, so the first data row is 2
 * when the input came from a CSV file); `column` is the header name as the user wrote it.
 */
export type GeometryErrorCode =
  | "empty"
  | "header"
  | "missing_column"
  | "duplicate_column"
  | "bad_number"
  | "bad_value"
  | "decimal_comma"
  | "ragged_row"
  | "quote"
  | "too_few_rows"
  | "degenerate"
  | "duplicate_pose"
  | "bad_config"
  | "bad_option"
  | "no_convergence";

export interface GeometryIssue {
  row?: number;
  column?: string;
  message: string;
}

export class GeometryError extends Error {
  readonly code: GeometryErrorCode;
  readonly issues: readonly GeometryIssue[];
  constructor(code: GeometryErrorCode, message: string, issues: readonly GeometryIssue[] = []) {
    super(message);
    this.name = "GeometryError";
    this.code = code;
    this.issues = issues.length > 0 ? issues : [{ message }];
  }
}

/**
 * Throw bad_number naming the first top-level number of `result` that is not finite, e.g. "the
 * sweep's tilt_arcsec is beyond the number range; check the units" (`what` = "the sweep").
 */
export function assertFiniteFields(result: object, what: string): void {
  for (const [key, v] of Object.entries(result))
    if (typeof v === "number" && !Number.isFinite(v))
      throw new GeometryError("bad_number", `${what}'s ${key} is beyond the number range; check the units`);
}
