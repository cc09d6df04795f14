// Who may run a head fit, from the product brief's roles table (docs/product.md, "Who uses it"):
// inspectors handle probe datasets and evaluation, engineers review fits, the administrator runs
// the office; installers upload and customers read. Written out by hand per role and status.
import { describe, expect, it } from "vitest";
import { headFitRefusal, JOB_STATUSES, type JobStatus, type Role } from "@/lib/auth/roles";

describe("headFitRefusal", () => {
  const open: JobStatus[] = ["draft", "measuring", "in_review"];
  it("engineer, inspector and admin may run a fit while the job is open", () => {
    for (const role of ["engineer", "inspector", "admin"] as Role[])
      for (const s of open) expect(headFitRefusal(role, s)).toBeNull();
  });
  it("installer and customer never may, with a reason naming who does", () => {
    for (const role of ["installer", "customer"] as Role[])
      for (const s of JOB_STATUSES)
        expect(headFitRefusal(role, s)).toMatch(/application engineer, an inspector or an administrator/);
  });
  it("once approved (or later) no new fit is run: the parameter set is fixed", () => {
    for (const s of ["approved", "issued", "accepted", "rejected"] as JobStatus[])
      expect(headFitRefusal("engineer", s)).toMatch(/fixed/);
  });
});
