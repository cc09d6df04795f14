// Shared helpers for the CSV reader tests: fixtures by name, and the thrown GeometryError.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { GeometryError } from "@/geometry";

export function fixture(name: string): string {
  return readFileSync(join(import.meta.dirname, "../../fixtures/csv", name), "utf8");
}

export function thrown(fn: () => unknown): GeometryError {
  try {
    fn();
  } catch (e) {
    if (e instanceof GeometryError) return e;
    throw e;
  }
  throw new Error("expected a GeometryError, nothing was thrown");
}
