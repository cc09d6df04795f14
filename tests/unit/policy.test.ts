// The access rules of lib/policy (who uses the product, and the status flow), checked case by case.
import { describe, expect, it } from "vitest";
import type { JobStatus } from "@/lib/domain/jobs";
import { ROLES, type Actor } from "@/lib/domain/roles";
import { headHistoryRefusal, headHistoryScope } from "@/lib/policy/heads";
import { datasetDeleteRefusal, uploadRefusal } from "@/lib/policy/datasets";
import {
  allowedTransitions,
  jobCreateRefusal,
  jobRefusal,
  jobScope,
  transitionRefusal,
} from "@/lib/policy/jobs";
import { navigationFor } from "@/lib/policy/navigation";
import { readingsRefusal } from "@/lib/policy/readings";
import { REGISTERS, registerEditRefusal, registerReadRefusal } from "@/lib/policy/registers";
import {
  amendRefusal,
  draftPreviewRefusal,
  provisionalConformityRefusal,
  reportIssuerRefusal,
  reportResponderRefusal,
} from "@/lib/policy/reports";
import { sameSignerRefusal, signatureRefusal } from "@/lib/policy/signatures";

const actor = (role: Actor["role"], customerId: string | null = null): Actor => ({
  id: "u1",
  email: "x@y.example",
  name: "X",
  role,
  customerId,
});
const jobA = { customerId: "cA", assignedInstallerId: "u1" };
const jobB = { customerId: "cB", assignedInstallerId: "u2" };
/** Whether the role may move a job from one status to another. */
const mayMove = (role: Actor["role"], from: JobStatus, to: JobStatus) =>
  transitionRefusal(actor(role), { job: { status: from }, to }) === null;
/** Why `who` may not sign with this meaning a job of customer cA, assigned to installer u1, in this status. */
const signRefusal = (
  who: Actor,
  meaning: Parameters<typeof signatureRefusal>[1]["meaning"],
  status: JobStatus,
) => signatureRefusal(who, { meaning, job: { status, customerId: "cA", assignedInstallerId: "u1" } });

describe("who sees which job", () => {
  it("staff roles other than installer see every customer's jobs", () => {
    for (const r of ["admin", "inspector", "engineer"] as const) {
      expect(jobRefusal(actor(r), jobA)).toBeNull();
      expect(jobRefusal(actor(r), jobB)).toBeNull();
    }
  });
  it("an installer sees only jobs assigned to them", () => {
    expect(jobRefusal(actor("installer"), jobA)).toBeNull();
    expect(jobRefusal(actor("installer"), jobB)).not.toBeNull();
  });
  it("a customer sees only their own company's jobs", () => {
    expect(jobRefusal(actor("customer", "cA"), jobA)).toBeNull();
    expect(jobRefusal(actor("customer", "cA"), jobB)).not.toBeNull();
  });
  it("a customer user with no company sees nothing (fails closed)", () => {
    expect(jobScope(actor("customer", null))).toEqual({ kind: "none" });
    expect(jobRefusal(actor("customer", null), jobA)).not.toBeNull();
  });
});

describe("status flow", () => {
  it("follows draft → measuring → in review → approved → issued → accepted | rejected", () => {
    expect(mayMove("installer", "draft", "measuring")).toBe(true);
    expect(mayMove("installer", "measuring", "in_review")).toBe(true);
    expect(mayMove("engineer", "in_review", "approved")).toBe(true);
    expect(mayMove("engineer", "approved", "issued")).toBe(true);
    expect(allowedTransitions(actor("customer"), { status: "issued" }).sort()).toEqual([
      "accepted",
      "rejected",
    ]);
  });
  it("an installer cannot approve or issue", () => {
    expect(mayMove("installer", "in_review", "approved")).toBe(false);
    expect(mayMove("installer", "approved", "issued")).toBe(false);
  });
  it("nothing leaves accepted or rejected, and nobody skips a step", () => {
    for (const r of ROLES) {
      expect(allowedTransitions(actor(r), { status: "accepted" })).toEqual([]);
      expect(allowedTransitions(actor(r), { status: "rejected" })).toEqual([]);
      expect(mayMove(r, "draft", "issued")).toBe(false);
    }
  });
  it("only customers accept or reject an issued report", () => {
    for (const r of ROLES.filter((x) => x !== "customer"))
      expect(allowedTransitions(actor(r), { status: "issued" })).toEqual([]);
  });
});

describe("navigation and registers", () => {
  it("every role has a jobs entry; only the administrator has the registers", () => {
    for (const r of ROLES) expect(navigationFor(actor(r)).some((n) => n.href === "/jobs")).toBe(true);
    expect(navigationFor(actor("admin")).some((n) => n.href === "/registers")).toBe(true);
    for (const r of ROLES.filter((x) => x !== "admin"))
      expect(navigationFor(actor(r)).some((n) => n.href === "/registers")).toBe(false);
  });
  it("engineers read the heads register only; customers none", () => {
    expect(registerReadRefusal(actor("engineer"), "heads") === null).toBe(true);
    expect(registerReadRefusal(actor("engineer"), "people") === null).toBe(false);
    expect(registerReadRefusal(actor("customer"), "heads") === null).toBe(false);
  });
  it("a head's history is read by the office, engineers, installers, inspectors and its owner, each in a scope", () => {
    expect(Object.fromEntries(ROLES.map((r) => [r, headHistoryRefusal(actor(r)) === null]))).toEqual({
      admin: true,
      engineer: true,
      customer: true,
      installer: true,
      inspector: true,
    });
    expect(Object.fromEntries(ROLES.map((r) => [r, headHistoryScope(actor(r))]))).toEqual({
      admin: "all",
      engineer: "all",
      installer: "through-jobs",
      inspector: "through-jobs",
      customer: "own",
    });
  });
});

describe("who signs what (21 CFR 11.50 meanings)", () => {
  it("the assigned installer signs performed; another installer cannot", () => {
    expect(signRefusal(actor("installer"), "performed", "measuring")).toBeNull();
    expect(signRefusal({ ...actor("installer"), id: "u9" }, "performed", "measuring")).toMatch(/assigned/);
  });
  it("only an inspector signs inspected, and not after issue", () => {
    expect(signRefusal(actor("inspector"), "inspected", "in_review")).toBeNull();
    expect(signRefusal(actor("engineer"), "inspected", "in_review")).toMatch(/inspector/);
    expect(signRefusal(actor("inspector"), "inspected", "issued")).toMatch(/while/);
  });
  it("only an engineer approves, and only an approved job", () => {
    expect(signRefusal(actor("engineer"), "approved", "approved")).toBeNull();
    expect(signRefusal(actor("engineer"), "approved", "in_review")).toMatch(/approved/);
    expect(signRefusal(actor("installer"), "approved", "approved")).toMatch(/engineer/);
  });
  it("only the job's own customer accepts or rejects an issued report", () => {
    expect(signRefusal(actor("customer", "cA"), "accepted", "issued")).toBeNull();
    expect(signRefusal(actor("customer", "cB"), "accepted", "issued")).toMatch(/own users/);
    expect(signRefusal(actor("customer", "cA"), "rejected", "approved")).toMatch(/issued/);
    expect(signRefusal(actor("admin"), "accepted", "issued")).toMatch(/own users/);
  });
});

describe("parameters approved, and one person not signing both performed and an approval", () => {
  it("only an engineer approves parameters, and only while the job is in review", () => {
    expect(signRefusal(actor("engineer"), "parameters_approved", "in_review")).toBeNull();
    expect(signRefusal(actor("engineer"), "parameters_approved", "measuring")).toMatch(
      /submitted it for review/,
    );
    for (const r of ["admin", "inspector", "installer"] as const)
      expect(signRefusal(actor(r), "parameters_approved", "in_review")).toMatch(/engineer/);
  });
  // Segregation of duties (ISO/IEC 17025:2017 §7.8.2.1 o; 21 CFR 11.50): common practice.
  const given = [{ meaning: "performed" as const, signerId: "u1" }];
  it("the performer may not approve the parameters or issue the report unless the company allows it", () => {
    for (const meaning of ["parameters_approved", "approved"] as const) {
      expect(sameSignerRefusal(actor("engineer"), { meaning, given, allowSameSigner: false })).toMatch(
        /signed this work as performed/,
      );
      expect(sameSignerRefusal(actor("engineer"), { meaning, given, allowSameSigner: true })).toBeNull();
      expect(sameSignerRefusal({ id: "u2" }, { meaning, given, allowSameSigner: false })).toBeNull();
    }
  });
  it("the approver may not sign the work as performed; other meanings do not clash", () => {
    const approved = [{ meaning: "parameters_approved" as const, signerId: "u1" }];
    expect(
      sameSignerRefusal(actor("installer"), {
        meaning: "performed",
        given: approved,
        allowSameSigner: false,
      }),
    ).toMatch(/You approved this job/);
    expect(
      sameSignerRefusal(actor("inspector"), { meaning: "inspected", given, allowSameSigner: false }),
    ).toBeNull();
  });
});

describe("report drafts and the provisional statement of conformity", () => {
  it("staff preview the draft and see the provisional statement; customers never", () => {
    for (const r of ["admin", "installer", "inspector", "engineer"] as const) {
      expect(draftPreviewRefusal(actor(r))).toBeNull();
      expect(provisionalConformityRefusal(actor(r))).toBeNull();
    }
    expect(draftPreviewRefusal(actor("customer", "cA"))).toMatch(/staff/);
    expect(provisionalConformityRefusal(actor("customer", "cA"))).toMatch(/once the report is issued/);
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
  it("another installer, an inspector, a customer and the office may not record; an engineer may", () => {
    // Segregation of duties (ISO/IEC 17025:2017 §7.5.1): a reading is the record of the person who took it.
    expect(readingsRefusal(actor("installer"), job("measuring", "u2"))).toMatch(/assigned/);
    for (const r of ["inspector", "customer"] as const)
      expect(readingsRefusal(actor(r, "cA"), job("measuring"))).not.toBeNull();
    expect(readingsRefusal(actor("admin"), job("measuring", "u2"))).toMatch(/never from the office/);
    expect(readingsRefusal(actor("admin"), job("measuring", "u1"))).toMatch(/never from the office/);
    expect(readingsRefusal(actor("engineer"), job("measuring", "u2"))).toBeNull();
    expect(readingsRefusal(actor("engineer"), job("approved", "u2"))).toMatch(/locked/);
  });
  it("an installer submits for review but cannot approve; only an engineer approves", () => {
    expect(mayMove("installer", "measuring", "in_review")).toBe(true);
    expect(mayMove("installer", "in_review", "approved")).toBe(false);
    expect(mayMove("inspector", "in_review", "approved")).toBe(false);
    expect(mayMove("engineer", "in_review", "approved")).toBe(true);
  });
  it("instruments and procedures are readable by staff, the outbox by the administrator only", () => {
    expect(registerReadRefusal(actor("installer"), "instruments") === null).toBe(true);
    expect(registerReadRefusal(actor("customer"), "instruments") === null).toBe(false);
    expect(registerReadRefusal(actor("engineer"), "outbox") === null).toBe(false);
    expect(registerReadRefusal(actor("admin"), "outbox") === null).toBe(true);
    expect(registerReadRefusal(actor("engineer"), "people") === null).toBe(false);
  });
});

describe("moves on someone else's job, amendments, data and registers", () => {
  it("an installer moves only jobs assigned to them", () => {
    const theirs = { status: "measuring" as const, assignedInstallerId: "u1" };
    const others = { status: "measuring" as const, assignedInstallerId: "u2" };
    expect(transitionRefusal(actor("installer"), { job: theirs, to: "in_review" })).toBeNull();
    expect(transitionRefusal(actor("installer"), { job: others, to: "in_review" })).toMatch(/may not move/);
    expect(allowedTransitions(actor("installer"), others)).toEqual([]);
  });
  it("an amendment is issued by an engineer after an issued or rejected report", () => {
    const issued = { status: "issued", hasIssuedRevision: true };
    expect(amendRefusal(actor("engineer"), issued)).toBeNull();
    expect(amendRefusal(actor("engineer"), { status: "rejected", hasIssuedRevision: true })).toBeNull();
    expect(amendRefusal(actor("engineer"), { status: "approved", hasIssuedRevision: true })).toMatch(
      /follows an issued/,
    );
    expect(amendRefusal(actor("engineer"), { status: "issued", hasIssuedRevision: false })).toMatch(
      /no issued revision/,
    );
    expect(amendRefusal(actor("admin"), issued)).toMatch(/application engineer/);
  });
  it("the service company's people upload while the job is open and delete before review", () => {
    for (const r of ["admin", "installer", "inspector", "engineer"] as const) {
      expect(uploadRefusal(actor(r), { status: "in_review" })).toBeNull();
      expect(datasetDeleteRefusal(actor(r), { status: "measuring" })).toBeNull();
      expect(datasetDeleteRefusal(actor(r), { status: "in_review" })).toMatch(/before review/);
      expect(uploadRefusal(actor(r), { status: "approved" }, "sphere_probe")).toMatch(
        /only a tool-centre-point check/,
      );
      expect(uploadRefusal(actor(r), { status: "approved" }, "tcp_check")).toBeNull();
      // A rotary positioning test does not enter the fit: it is taken after approval too.
      expect(uploadRefusal(actor(r), { status: "approved" }, "rotary_positioning")).toBeNull();
      expect(uploadRefusal(actor(r), { status: "issued" }, "tcp_check")).toMatch(
        /draft, measuring or in review/,
      );
    }
    expect(uploadRefusal(actor("customer", "cA"), { status: "measuring" })).toMatch(/may not upload/);
    expect(datasetDeleteRefusal(actor("customer", "cA"), { status: "measuring" })).toMatch(/may not delete/);
  });
  it("only the administrator keeps registers", () => {
    for (const reg of REGISTERS) {
      expect(registerEditRefusal(actor("admin"), reg)).toBeNull();
      for (const r of ["installer", "inspector", "engineer", "customer"] as const)
        expect(registerEditRefusal(actor(r, "cA"), reg)).not.toBeNull();
    }
  });
  it("opening a job is the office's", () => {
    expect(jobCreateRefusal(actor("admin"))).toBeNull();
    expect(jobCreateRefusal(actor("engineer"))).toBeNull();
    for (const r of ["installer", "inspector", "customer"] as const)
      expect(jobCreateRefusal(actor(r))).toMatch(/office/);
  });
});

describe("the rules server actions check before anything else", () => {
  it("reports are issued by engineers and answered by a customer company's users", () => {
    expect(reportIssuerRefusal(actor("engineer"))).toBeNull();
    for (const r of ["admin", "installer", "inspector", "customer"] as const)
      expect(reportIssuerRefusal(actor(r, "cA"))).toMatch(/application engineer/);
    expect(reportResponderRefusal(actor("customer", "cA"))).toBeNull();
    expect(reportResponderRefusal(actor("customer", null))).toMatch(/customer's own users/);
    for (const r of ["admin", "installer", "inspector", "engineer"] as const)
      expect(reportResponderRefusal(actor(r))).toMatch(/customer's own users/);
  });
});
