// Shared helpers for the CSV reader tests: fixtures by name, and the thrown GeometryError.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { expect } from "vitest";
import { GeometryError, type GeometryErrorCode, type GeometryIssue } from "@/geometry";
import { thrownAs } from "../thrown";

export function fixture(name: string): string {
  return readFileSync(join(import.meta.dirname, "../../fixtures/csv", name), "utf8");
}

export function thrown(fn: () => unknown): GeometryError {
  return thrownAs(GeometryError, fn);
}

/** The reader refuses: it throws a GeometryError with this code and exactly these issues, returned. */
export function refused(
  read: () => unknown,
  code: GeometryErrorCode,
  issues: GeometryIssue[],
): GeometryError {
  const e = thrown(read);
  expect(e.code).toBe(code);
  expect(e.issues).toEqual(issues);
  return e;
}
