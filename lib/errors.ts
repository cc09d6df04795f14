/**
 * Errors the app raises on purpose. lib/http.ts maps them to JSON responses; server actions map
 * them to form messages. Anything else is a 500 with no detail.
 */
export interface FieldIssue {
  row?: number;
  column?: string;
  field?: string;
  message: string;
}

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: readonly FieldIssue[],
  ) {
    super(message);
    this.name = "AppError";
  }
}

export const unauthorized = (message = "Sign in to continue.") => new AppError(401, "unauthorized", message);
export const forbidden = (message = "Your role may not do this.") => new AppError(403, "forbidden", message);
/** Also used for another tenant's record: never reveal that it exists. */
export const notFound = (what = "record") => new AppError(404, "not_found", `No such ${what}.`);
export const invalid = (message: string, issues?: readonly FieldIssue[]) =>
  new AppError(422, "invalid", message, issues);
export const tooLarge = (message: string) => new AppError(413, "too_large", message);
export const tooManyRequests = (message: string) => new AppError(429, "rate_limited", message);
