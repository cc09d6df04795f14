// Shared helpers for the CSV reader tests: fixtures by name, and the thrown GeometryError.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { GeometryError } from "@/geometry";
import { thrownAs } from "../thrown";

export function fixture(name: string): string {
  return readFileSync(join(import.meta.dirname, "../../fixtures/csv", name), "utf8");
}

export function thrown(fn: () => unknown): GeometryError {
  return thrownAs(GeometryError, fn);
}
