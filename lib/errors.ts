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
export const unavailable = (message = "The service is briefly unavailable. Try again in a moment.") =>
  new AppError(503, "unavailable", message);

/**
 * PostgreSQL SQLSTATE classes and codes that mean "the database cannot be reached right now"
 * (PostgreSQL manual, Appendix A): 08 connection exception, 57P01–57P03 shutdown / starting up,
 * 53300 too many connections.
 */
const UNREACHABLE_SQLSTATES = new Set(["57P01", "57P02", "57P03", "53300"]);
const UNREACHABLE_NET_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "EPIPE",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENOTFOUND",
  "EAI_AGAIN",
]);
/** node-postgres and pg-pool say these in words only, without a code. */
const UNREACHABLE_MESSAGES = [
  /connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /not queryable/i,
  /the database system is (starting up|shutting down|in recovery mode)/i,
];

/**
 * True when `err` (or an error it wraps: drizzle wraps driver errors in `cause`) says the database
 * is down or restarting, as opposed to a bug or bad data. Those answer 503, not 500.
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  let e: unknown = err;
  for (let depth = 0; depth < 6 && e instanceof Error; depth++) {
    const code = (e as { code?: unknown }).code;
    if (
      typeof code === "string" &&
      (code.startsWith("08") || UNREACHABLE_SQLSTATES.has(code) || UNREACHABLE_NET_CODES.has(code))
    )
      return true;
    if (e instanceof AggregateError && e.errors.some((x) => isDatabaseUnavailable(x))) return true;
    if (UNREACHABLE_MESSAGES.some((re) => re.test(e instanceof Error ? e.message : ""))) return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}
