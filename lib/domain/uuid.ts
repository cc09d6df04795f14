/**
 * The one UUID check of the app. Every id that arrives from outside (a path segment, a form
 * field, a query string) goes through `isUuid` before it reaches the database: PostgreSQL's
 * `uuid` type refuses anything else with an error, which would otherwise surface as a 500.
 * Anything that is not a UUID is "not found" — the same answer as a UUID of no record — so a
 * probe learns nothing from the shape of its guess.
 */
import { notFound as pageNotFound } from "next/navigation";
import { z } from "zod";
import { notFound } from "@/lib/errors";

/** RFC 9562 text form: 8-4-4-4-12 hexadecimal digits, either case, nothing before or after. */
const UUID_TEXT = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(value: unknown): value is string {
  return typeof value === "string" && value.length === 36 && UUID_TEXT.test(value);
}

/** For route handlers and queries: the id itself, or a thrown 404 `not_found` (JSON through lib/http). */
export function uuidOr404(value: unknown, what = "record"): string {
  if (!isUuid(value)) throw notFound(what);
  return value;
}

/** For pages: the id itself, or Next's not-found page. */
export function pageUuid(value: unknown): string {
  if (!isUuid(value)) pageNotFound();
  return value;
}

/** The same check for zod schemas (form fields and JSON bodies that carry ids). */
export function zUuid(message = "Not a valid id.") {
  return z.string().refine(isUuid, { message });
}
