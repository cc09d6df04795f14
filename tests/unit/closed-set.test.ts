// closedSet: a closed set's values are its labels map's keys, in the order written.
// Reference for the order: ECMAScript 2024 §10.1.11.1 OrdinaryOwnPropertyKeys (integer-index keys
// first in ascending numeric order, then string keys in the order they were created).
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { z } from "zod";
import { describe, expect, it } from "vitest";
import { closedSet } from "@/lib/domain/closed-set";
import { CONTROL_VALUE_STAGES } from "@/lib/domain/control-values";
import { ANALYSIS_KINDS, DATASET_KINDS, DATASET_STATUSES, PHASES } from "@/lib/domain/datasets";
import { DECISION_RULES } from "@/lib/domain/decisions";
import { AXIS_LETTERS } from "@/lib/domain/heads";
import { JOB_KINDS, JOB_STATUSES, STATUS_LABELS } from "@/lib/domain/jobs";
import { HEAD_AXIS_ROLES } from "@/lib/domain/positioning";
import { LIMIT_SOURCES, MULTI_POINT_RESULTS, STEP_KINDS } from "@/lib/domain/procedures";
import { ROLES } from "@/lib/domain/roles";
import { OUTBOX_STATUSES } from "@/lib/domain/outbox";
import { SIGNATURE_MEANINGS } from "@/lib/domain/signatures";
import { QUANTITY_KINDS, UNIT_SYSTEMS } from "@/lib/domain/units";

describe("closedSet", () => {
  it("gives the keys in the order written and the map itself as the labels", () => {
    const labels = { zulu: "Z", alpha: "A", mike: "M" };
    const set = closedSet(labels);
    expect(set.values).toEqual(["zulu", "alpha", "mike"]);
    expect(set.labels).toBe(labels);
  });

  it("keeps the written order for any distinct keys that are not array indexes", () => {
    const key = fc.stringMatching(/^[a-z_][a-z0-9_]{0,11}$/);
    fc.assert(
      fc.property(fc.uniqueArray(key, { minLength: 1, maxLength: 12 }), (keys) => {
        const labels = Object.fromEntries(keys.map((k) => [k, k.toUpperCase()]));
        expect(closedSet(labels).values).toEqual(keys);
      }),
    );
  });

  it("refuses an empty set and an array-index key, whose order JavaScript would not keep", () => {
    expect(() => closedSet({})).toThrow("at least one value");
    expect(() => closedSet({ b: "B", "12": "Twelve" })).toThrow('"12" looks like an array index');
    expect(() => closedSet({ "0": "Zero" })).toThrow('"0"');
    // Not array indexes: a leading zero, a sign or a decimal point keep their place.
    expect(closedSet({ b: "B", "012": "x", "-1": "y", "1.5": "z" }).values).toEqual([
      "b",
      "012",
      "-1",
      "1.5",
    ]);
  });

  it("serves z.enum as it is", () => {
    const status = z.enum(JOB_STATUSES);
    expect(status.parse("on_hold")).toBe("on_hold");
    expect(status.safeParse("paused").success).toBe(false);
    expect(STATUS_LABELS.on_hold).toBe("On hold");
  });
});

/**
 * The database's enums as the applied migrations built them, in order. Reference: PostgreSQL 16
 * manual, CREATE TYPE … AS ENUM and ALTER TYPE … ADD VALUE [BEFORE | AFTER] (a new value goes
 * last unless placed).
 */
function enumsFromMigrations(): Map<string, string[]> {
  const dir = path.join(process.cwd(), "db/migrations");
  const files = readdirSync(dir).filter((f) => f.endsWith(".sql"));
  const enums = new Map<string, string[]>();
  const statement =
    /(?<verb>CREATE|ALTER) TYPE "public"\."(?<name>\w+)" (?:AS ENUM\((?<list>[^)]*)\)|ADD VALUE '(?<added>[^']*)'(?: (?<where>BEFORE|AFTER) '(?<anchor>[^']*)')?)/g;
  for (const file of files.sort()) {
    for (const m of readFileSync(path.join(dir, file), "utf8").matchAll(statement)) {
      const { verb, name = "", list = "", added = "", where, anchor = "" } = m.groups ?? {};
      if (verb === "CREATE") {
        enums.set(
          name,
          [...list.matchAll(/'([^']*)'/g)].map((q) => q[1] ?? ""),
        );
        continue;
      }
      const values = enums.get(name) ?? [];
      const at = where ? values.indexOf(anchor) + (where === "AFTER" ? 1 : 0) : values.length;
      values.splice(at, 0, added);
    }
  }
  return enums;
}

const DATABASE_ENUMS = [
  ["role", ROLES],
  ["job_kind", JOB_KINDS],
  ["job_status", JOB_STATUSES],
  ["phase", PHASES],
  ["step_derivation", STEP_KINDS],
  ["multi_point_result", MULTI_POINT_RESULTS],
  ["limit_source", LIMIT_SOURCES],
  ["unit_system", UNIT_SYSTEMS],
  ["quantity_kind", QUANTITY_KINDS],
  ["outbox_status", OUTBOX_STATUSES],
  ["analysis_kind", ANALYSIS_KINDS],
  ["dataset_kind", DATASET_KINDS],
  ["signature_meaning", SIGNATURE_MEANINGS],
  ["head_axis_role", HEAD_AXIS_ROLES],
  ["control_value_stage", CONTROL_VALUE_STAGES],
  ["decision_rule", DECISION_RULES],
  ["axis_letter", AXIS_LETTERS],
  ["dataset_status", DATASET_STATUSES],
] as const;

describe("closed sets and the database enums made from them", () => {
  const enums = enumsFromMigrations();
  it.each(DATABASE_ENUMS)("%s holds the set's values in the set's order", (name, values) => {
    expect(enums.get(name)).toEqual([...values]);
  });
  it("checks every enum the migrations made", () => {
    expect([...enums.keys()].sort()).toEqual(DATABASE_ENUMS.map(([name]) => name).sort());
  });
  it("builds every enum of db/schema.ts from a set in lib/domain, never from a list written there", () => {
    const schema = readFileSync(path.join(process.cwd(), "db/schema.ts"), "utf8");
    expect([...schema.matchAll(/pgEnum\("(\w+)",\s*\[/g)].map((m) => m[1])).toEqual([]);
    expect(schema.match(/pgEnum\(/g)).toHaveLength(DATABASE_ENUMS.length);
  });
});
