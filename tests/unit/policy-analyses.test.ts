// Who may run a head fit (lib/policy/analyses), from the product's roles (README, "Demo accounts"):
// inspectors handle probe datasets and evaluation, engineers review fits, the administrator runs
// the office; installers upload and customers read. Written out by hand per role and status.
import { describe, expect, it } from "vitest";
import { JOB_STATUSES, type JobStatus } from "@/lib/domain/jobs";
import { type Role } from "@/lib/domain/roles";
import { fitApprovalRefusal, headFitRefusal, viewSaveRefusal } from "@/lib/policy/analyses";

const actor = (role: Role) => ({ id: "u1", email: "x@y.example", name: "X", role, customerId: null });

describe("headFitRefusal", () => {
  const open: JobStatus[] = ["draft", "measuring", "in_review"];
  it("engineer, inspector and admin may run a fit while the job is open", () => {
    for (const role of ["engineer", "inspector", "admin"] as Role[])
      for (const s of open) expect(headFitRefusal(actor(role), { status: s })).toBeNull();
  });
  it("installer and customer never may, with a reason naming who does", () => {
    for (const role of ["installer", "customer"] as Role[])
      for (const s of JOB_STATUSES)
        expect(headFitRefusal(actor(role), { status: s })).toMatch(
          /application engineer, an inspector or an administrator/,
        );
  });
  it("once approved (or later) no new fit is run: the parameter set is fixed", () => {
    for (const s of ["approved", "issued", "accepted", "rejected"] as JobStatus[])
      expect(headFitRefusal(actor("engineer"), { status: s })).toMatch(/fixed/);
  });
});

describe("fitApprovalRefusal and viewSaveRefusal", () => {
  it("only an engineer approves, and only while the job is in review", () => {
    expect(fitApprovalRefusal(actor("engineer"), { status: "in_review" })).toBeNull();
    for (const role of ["admin", "inspector", "installer", "customer"] as Role[])
      expect(fitApprovalRefusal(actor(role), { status: "in_review" })).toMatch(/application engineer/);
    for (const s of JOB_STATUSES.filter((x) => x !== "in_review"))
      expect(fitApprovalRefusal(actor("engineer"), { status: s })).toMatch(/submitted it for review/);
  });
  it("only an engineer saves views for the report", () => {
    expect(viewSaveRefusal(actor("engineer"))).toBeNull();
    for (const role of ["admin", "inspector", "installer", "customer"] as Role[])
      expect(viewSaveRefusal(actor(role))).toMatch(/application engineer/);
  });
});
