// Who writes procedures (lib/policy/procedures), from the product's rules (issue: "procedure
// builder (office and engineers)"): the administrator and the application engineers write and
// retire them; installers, inspectors and customers do not. A retired procedure is brought back
// before it changes. Written out by hand per role.
import { describe, expect, it } from "vitest";
import { type Role } from "@/lib/domain/roles";
import { procedureEditRefusal, procedureRetireRefusal } from "@/lib/policy/procedures";

const actor = (role: Role) => ({
  id: "u1",
  email: "x@y.example",
  name: "X",
  role,
  customerId: role === "customer" ? "c1" : null,
});

describe("procedureEditRefusal", () => {
  it("the administrator and engineers may create and change procedures", () => {
    for (const role of ["admin", "engineer"] as Role[]) {
      expect(procedureEditRefusal(actor(role), null)).toBeNull();
      expect(procedureEditRefusal(actor(role), { retiredAt: null })).toBeNull();
    }
  });
  it("installers, inspectors and customers may not, with a reason naming who does", () => {
    for (const role of ["installer", "inspector", "customer"] as Role[])
      expect(procedureEditRefusal(actor(role), null)).toMatch(/office and the application engineers/);
  });
  it("a retired procedure is brought back before it changes", () => {
    expect(procedureEditRefusal(actor("admin"), { retiredAt: new Date() })).toMatch(/retired/);
  });
});

describe("procedureRetireRefusal", () => {
  it("matches who writes procedures", () => {
    expect(procedureRetireRefusal(actor("admin"))).toBeNull();
    expect(procedureRetireRefusal(actor("engineer"))).toBeNull();
    for (const role of ["installer", "inspector", "customer"] as Role[])
      expect(procedureRetireRefusal(actor(role))).toMatch(/office and the application engineers/);
  });
});
