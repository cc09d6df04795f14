// Every access rule lives in lib/policy: this scans the app's source for role checks written
// anywhere else (comparing the acting user's role, `.includes(role)`, `X_ROLES` lists, a switch on
// the role) and fails on one. The scanner itself is tested on planted violations below.
import { describe, expect, it } from "vitest";
import { expectNothingFound } from "./source-scan";

const SCANNED = ["app", "components", "db", "lib", "proxy.ts", "instrumentation.ts"];
/** lib/policy owns the rules; lib/domain defines the roles themselves; the seed writes demo people. */
const ALLOWED = [/^lib\/policy\//, /^lib\/domain\//, /^db\/seed\.ts$/, /^db\/migrations\//];

const CHECKS: ReadonlyArray<{ name: string; pattern: RegExp }> = [
  {
    name: "comparison with the actor's role",
    pattern: /(?<![\w.])role\s*[!=]==|\b(?:actor|user)\.role\s*[!=]==/,
  },
  { name: "list membership of a role", pattern: /\.includes\(\s*(?:(?:actor|user)\.)?role\s*\)/ },
  { name: "a list of roles", pattern: /\b[A-Z][A-Z0-9]*_ROLES\b/ },
  { name: "a switch on the role", pattern: /switch\s*\(\s*(?:(?:actor|user)\.)?role\s*\)/ },
  { name: "a list of roles given to a wrapper", pattern: /\broles\s*:\s*\[/ },
];

/** The role checks in one file's text, as "line: what". */
export function roleChecks(text: string): string[] {
  const found: string[] = [];
  text.split("\n").forEach((line, i) => {
    for (const c of CHECKS) if (c.pattern.test(line)) found.push(`${i + 1}: ${c.name}`);
  });
  return found;
}

describe("role checks live only in lib/policy", () => {
  it("finds none anywhere else in the app's source", () => expectNothingFound(SCANNED, ALLOWED, roleChecks));

  it("catches each kind of role check when one is planted", () => {
    expect(roleChecks(`if (actor.role !== "admin") throw forbidden();`)).toHaveLength(1);
    expect(roleChecks(`{user.role === "engineer" ? <Approve /> : null}`)).toHaveLength(1);
    expect(roleChecks(`return role === "installer" ? "My jobs" : "Jobs";`)).toHaveLength(1);
    expect(roleChecks(`if (!roles.includes(actor.role)) throw forbidden();`)).toHaveLength(1);
    expect(roleChecks(`const UPLOAD_ROLES: readonly Role[] = ["admin"];`)).toHaveLength(1);
    expect(roleChecks(`switch (actor.role) {`)).toHaveLength(1);
    expect(roleChecks(`action({ schema, roles: ["admin"] }, async () => {})`)).toHaveLength(1);
  });

  it("leaves data about other people alone (a listed person's role is not an access check)", () => {
    expect(roleChecks(`isCustomer={p.role === "customer"}`)).toEqual([]);
    expect(roleChecks(`if (input.role && input.role !== before.role) {`)).toEqual([]);
  });
});
