// The role rules of the product brief (roles table and status flow), checked case by case.
import { describe, expect, it } from "vitest";
import {
  allowedTransitions,
  canReadHeadHistory,
  canReadRegister,
  canReadRegisterOf,
  canSeeJob,
  canTransition,
  jobScope,
  navigationFor,
  readingsRefusal,
  ROLES,
  signatureRefusal,
  type Actor,
} from "@/lib/auth/roles";

const actor = (role: Actor["role"], customerId: string | null = null): Actor => ({
  id: "u1",
  email: "x@y.example",
  name: "X",
  role,
  customerId,
});
const jobA = { customerId: "cA", assignedInstallerId: "u1" };
const jobB = { customerId: "cB", assignedInstallerId: "u2" };

describe("who sees which job", () => {
  it("staff roles other than installer see every customer's jobs", () => {
    for (const r of ["admin", "inspector", "engineer"] as const) {
      expect(canSeeJob(actor(r), jobA)).toBe(true);
      expect(canSeeJob(actor(r), jobB)).toBe(true);
    }
  });
  it("an installer sees only jobs assigned to them", () => {
    expect(canSeeJob(actor("installer"), jobA)).toBe(true);
    expect(canSeeJob(actor("installer"), jobB)).toBe(false);
  });
  it("a customer sees only their own company's jobs", () => {
    expect(canSeeJob(actor("customer", "cA"), jobA)).toBe(true);
    expect(canSeeJob(actor("customer", "cA"), jobB)).toBe(false);
  });
  it("a customer user with no company sees nothing (fails closed)", () => {
    expect(jobScope(actor("customer", null))).toEqual({ kind: "none" });
    expect(canSeeJob(actor("customer", null), jobA)).toBe(false);
  });
});

describe("status flow", () => {
  it("follows draft → measuring → in review → approved → issued → accepted | rejected", () => {
    expect(canTransition("installer", "draft", "measuring")).toBe(true);
    expect(canTransition("installer", "measuring", "in_review")).toBe(true);
    expect(canTransition("engineer", "in_review", "approved")).toBe(true);
    expect(canTransition("engineer", "approved", "issued")).toBe(true);
    expect(allowedTransitions("customer", "issued").sort()).toEqual(["accepted", "rejected"]);
  });
  it("an installer cannot approve or issue", () => {
    expect(canTransition("installer", "in_review", "approved")).toBe(false);
    expect(canTransition("installer", "approved", "issued")).toBe(false);
  });
  it("nothing leaves accepted or rejected, and nobody skips a step", () => {
    for (const r of ROLES) {
      expect(allowedTransitions(r, "accepted")).toEqual([]);
      expect(allowedTransitions(r, "rejected")).toEqual([]);
      expect(canTransition(r, "draft", "issued")).toBe(false);
    }
  });
  it("only customers accept or reject an issued report", () => {
    for (const r of ROLES.filter((x) => x !== "customer"))
      expect(allowedTransitions(r, "issued")).toEqual([]);
  });
});

describe("navigation and registers", () => {
  it("every role has a jobs entry; only the administrator has the registers", () => {
    for (const r of ROLES) expect(navigationFor(r).some((n) => n.href === "/jobs")).toBe(true);
    expect(navigationFor("admin").some((n) => n.href === "/registers")).toBe(true);
    for (const r of ROLES.filter((x) => x !== "admin"))
      expect(navigationFor(r).some((n) => n.href === "/registers")).toBe(false);
  });
  it("engineers read the heads register only; customers none", () => {
    expect(canReadRegister("engineer", "heads")).toBe(true);
    expect(canReadRegister("engineer", "people")).toBe(false);
    expect(canReadRegister("customer", "heads")).toBe(false);
  });
  it("a head's history is read by the office, engineers and its owner, not by installers or inspectors", () => {
    expect(Object.fromEntries(ROLES.map((r) => [r, canReadHeadHistory(r)]))).toEqual({
      admin: true,
      engineer: true,
      customer: true,
      installer: false,
      inspector: false,
    });
  });
});

describe("who signs what (21 CFR 11.50 meanings)", () => {
  const job = (status: import("@/lib/auth/roles").JobStatus) => ({
    status,
    customerId: "cA",
    assignedInstallerId: "u1",
  });
  it("the assigned installer signs performed; another installer cannot", () => {
    expect(signatureRefusal(actor("installer"), "performed", job("measuring"))).toBeNull();
    expect(signatureRefusal({ ...actor("installer"), id: "u9" }, "performed", job("measuring"))).toMatch(
      /assigned/,
    );
  });
  it("only an inspector signs inspected, and not after issue", () => {
    expect(signatureRefusal(actor("inspector"), "inspected", job("in_review"))).toBeNull();
    expect(signatureRefusal(actor("engineer"), "inspected", job("in_review"))).toMatch(/inspector/);
    expect(signatureRefusal(actor("inspector"), "inspected", job("issued"))).toMatch(/while/);
  });
  it("only an engineer approves, and only an approved job", () => {
    expect(signatureRefusal(actor("engineer"), "approved", job("approved"))).toBeNull();
    expect(signatureRefusal(actor("engineer"), "approved", job("in_review"))).toMatch(/approved/);
    expect(signatureRefusal(actor("installer"), "approved", job("approved"))).toMatch(/engineer/);
  });
  it("only the job's own customer accepts or rejects an issued report", () => {
    expect(signatureRefusal(actor("customer", "cA"), "accepted", job("issued"))).toBeNull();
    expect(signatureRefusal(actor("customer", "cB"), "accepted", job("issued"))).toMatch(/own users/);
    expect(signatureRefusal(actor("customer", "cA"), "rejected", job("approved"))).toMatch(/issued/);
    expect(signatureRefusal(actor("admin"), "accepted", job("issued"))).toMatch(/own users/);
  });
});

describe("checklist readings and the status moves of the checklist", () => {
  const job = (
    status: Parameters<typeof readingsRefusal>[1]["status"],
    assignedInstallerId: string | null = "u1",
  ) => ({ status, assignedInstallerId });
  it("the assigned installer records readings while the job is draft or measuring", () => {
    expect(readingsRefusal(actor("installer"), job("measuring"))).toBeNull();
    expect(readingsRefusal(actor("installer"), job("draft"))).toBeNull();
  });
  it("readings are locked from review on, including an issued job", () => {
    for (const s of ["in_review", "approved", "issued", "accepted", "rejected"] as const)
      expect(readingsRefusal(actor("installer"), job(s))).toMatch(/locked/);
  });
  it("another installer, an inspector, an engineer and a customer may not record", () => {
    expect(readingsRefusal(actor("installer"), job("measuring", "u2"))).toMatch(/assigned/);
    for (const r of ["inspector", "engineer", "customer"] as const)
      expect(readingsRefusal(actor(r, "cA"), job("measuring"))).not.toBeNull();
    expect(readingsRefusal(actor("admin"), job("measuring", "u2"))).toBeNull();
  });
  it("an installer submits for review but cannot approve; only an engineer approves", () => {
    expect(canTransition("installer", "measuring", "in_review")).toBe(true);
    expect(canTransition("installer", "in_review", "approved")).toBe(false);
    expect(canTransition("inspector", "in_review", "approved")).toBe(false);
    expect(canTransition("engineer", "in_review", "approved")).toBe(true);
  });
  it("instruments and procedures are readable by staff, the outbox by the administrator only", () => {
    expect(canReadRegisterOf("installer", "instruments")).toBe(true);
    expect(canReadRegisterOf("customer", "instruments")).toBe(false);
    expect(canReadRegisterOf("engineer", "outbox")).toBe(false);
    expect(canReadRegisterOf("admin", "outbox")).toBe(true);
    expect(canReadRegisterOf("engineer", "people")).toBe(false);
  });
});
