// Every server action × every role (anonymous, each staff role, each tenant's customer), against
// the real database, called exactly as a form calls it. The expected answers are written out by
// hand from the product's rules (README.md, "Who uses it", and the status flow), not computed from
// lib/policy. "pass" means the call got past every access check: it succeeded, or failed for a
// reason that is not about who is asking (a field to correct). Each cell that changes something
// gets a job of its own, so cells never depend on each other's order. The last test fails when an
// action file exports an action this matrix does not list.
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { db } from "@/db";
import { runHeadFit } from "@/db/queries/analyses";
import { saveAnalysisView } from "@/db/queries/analysis-views";
import { recordReading } from "@/db/queries/readings";
import { issueReport } from "@/db/queries/reports";
import { signJobWork } from "@/db/queries/signatures";
import { getActor } from "@/db/queries/users";
import { analyses, jobs, users } from "@/db/schema";
import type { JobStatus } from "@/lib/domain/jobs";
import type { ActionResult } from "@/lib/actions";
import {
  BASE_JOB,
  DEMO_PASSWORD as PW,
  demoUserId,
  firstStepOf,
  insertTestJob,
  instrumentIdBySerial,
  signInActor,
  WHO,
  type Who,
  uploadDemoProbe,
  type JobBase,
} from "./fixtures";
import { PNG } from "pngjs";
import { jobIdByReference, signInAs } from "./helpers";
import { jobBaseOf } from "./ready-job";

// Outside a Next request there is no cache to revalidate; the actions' access checks run unchanged.
vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));

const checklist = await import("@/app/(app)/jobs/[id]/checklist/actions");
const report = await import("@/app/(app)/jobs/[id]/report/actions");
const analysis = await import("@/app/(app)/jobs/[id]/analysis/actions");
const registers = await import("@/app/(app)/registers/actions");
const setPassword = await import("@/app/(auth)/set-password/actions");
const people = await import("@/app/(app)/registers/people/actions");
const forgotPassword = await import("@/app/(auth)/forgot-password/actions");
const procedures = await import("@/app/(app)/registers/procedures/actions");
const jobOffice = await import("@/app/(app)/jobs/actions");
const settings = await import("@/app/(app)/registers/settings/actions");
const control = await import("@/app/(app)/jobs/[id]/control/actions");

const EMAIL = WHO;
type Outcome = "pass" | "unauthorized" | "forbidden" | "not_found";
const ACCESS_CODES = new Set(["unauthorized", "forbidden", "not_found"]);
/** Refusals about the input, not the person: a field to correct, a one-time link already used, or a job not yet ready for its report. */
const DOMAIN_CODES = new Set(["invalid", "token_invalid", "not_ready"]);

let marlow: JobBase;
let installerId = "";
let stepId = "";
let instrumentId = "";

/** A job of the Marlow Creek tenant, assigned to the demo installer, in the given status. */
const freshJob = (status: JobStatus) =>
  insertTestJob({
    tag: "ACT",
    title: "Action matrix job",
    status,
    template: true,
    base: marlow,
    assignedInstallerId: installerId,
  });

async function actorOf(email: string) {
  const [u] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  return (await getActor(u!.id))!;
}

async function outcome(result: Promise<ActionResult<unknown>>): Promise<Outcome | `error: ${string}`> {
  const r = await result;
  if (r.ok) return "pass";
  if (ACCESS_CODES.has(r.code)) return r.code as Outcome;
  // Past the access checks, only a field to correct counts; a server error is a failure of its own.
  return DOMAIN_CODES.has(r.code) ? "pass" : `error: ${r.code} ${r.message}`;
}

/** The hand-written table: action → who → expected outcome, and how to call it for that person. */
const MATRIX: Record<
  string,
  { expect: Record<Who, Outcome>; call: (who: Who) => Promise<ActionResult<unknown>> }
> = {};
const staffOnly = (allowed: Who[]): Record<Who, Outcome> =>
  Object.fromEntries(
    (Object.keys(EMAIL) as Who[]).map((w) => [
      w,
      w === "anonymous" ? "unauthorized" : allowed.includes(w) ? "pass" : "forbidden",
    ]),
  ) as Record<Who, Outcome>;
/** Job-scoped: like staffOnly, but the other tenant's customer is told the job does not exist. */
const onMarlowJob = (allowed: Who[]) => ({
  ...staffOnly(allowed),
  "customer (Tollan)": "not_found" as const,
});

beforeAll(async () => {
  marlow = await jobBaseOf(BASE_JOB);
  installerId = (await signInAs("installer@halvard.example"))!;
  stepId = await firstStepOf(marlow.templateId);
  instrumentId = await instrumentIdBySerial();
});

// ---- job work ----
MATRIX.recordReadingAction = {
  // The assigned installer or an engineer; never the office (segregation of duties, ISO/IEC 17025:2017 §7.5.1).
  expect: onMarlowJob(["installer", "engineer"]),
  call: async () =>
    checklist.recordReadingAction({
      jobId: await freshJob("measuring"),
      stepId,
      phase: "pre",
      value: "0.0004",
      unit: "in",
      instrumentId,
    }),
};
MATRIX.changeStatusAction = {
  // measuring → in review: the installer (or the office) submits the work.
  expect: onMarlowJob(["admin", "installer"]),
  call: async () => checklist.changeStatusAction({ jobId: await freshJob("measuring"), to: "in_review" }),
};
MATRIX.setUnitSystemAction = {
  // Anyone signed in chooses their own display units.
  expect: {
    ...staffOnly([
      "admin",
      "installer",
      "inspector",
      "engineer",
      "customer (Marlow Creek)",
      "customer (Tollan)",
    ]),
  },
  call: async (who) => {
    const email = EMAIL[who];
    const [u] = email
      ? await db.select({ unitSystem: users.unitSystem }).from(users).where(eq(users.email, email))
      : [];
    return checklist.setUnitSystemAction({ unitSystem: u?.unitSystem ?? "metric", path: "/jobs/x" });
  },
};
MATRIX.signWorkAction = {
  // Signing as inspected is the inspector's; a customer of the job's tenant is refused, another's is not told the job exists.
  expect: onMarlowJob(["inspector"]),
  call: async () =>
    report.signWorkAction({ jobId: await freshJob("measuring"), meaning: "inspected", password: PW }),
};
MATRIX.issueReportAction = {
  // Engineers only, checked before the job is looked up: everyone else is refused outright.
  expect: staffOnly(["engineer"]),
  call: async () => report.issueReportAction({ jobId: await freshJob("approved"), password: PW }),
};
MATRIX.respondAction = {
  // Customers only at the door; then only the job's own tenant finds the report.
  expect: { ...staffOnly(["customer (Marlow Creek)"]), "customer (Tollan)": "not_found" },
  call: async (who) => {
    // A job without a procedure: ready for issue once the work is signed as performed and inspected.
    const jobId = await freshJob("approved");
    await db.update(jobs).set({ templateId: null }).where(eq(jobs.id, jobId));
    await signJobWork(await actorOf("installer@halvard.example"), {
      jobId,
      meaning: "performed",
      password: PW,
    });
    await signJobWork(await actorOf("inspector@halvard.example"), {
      jobId,
      meaning: "inspected",
      password: PW,
    });
    const { reportId } = await issueReport(await actorOf("engineer@halvard.example"), {
      jobId,
      password: PW,
    });
    await signInAs(EMAIL[who]);
    return report.respondAction({ jobId, reportId, decision: "accepted", password: PW });
  },
};
MATRIX.recordDeviationAction = {
  // Engineers only, checked at the door; the engineer carries a FAIL reading of a job in review.
  expect: staffOnly(["engineer"]),
  call: async (who) => {
    const jobId = await freshJob("measuring");
    await recordReading(await actorOf("installer@halvard.example"), jobId, {
      stepId,
      phase: "pre",
      value: 0.5,
      unit: "mm",
      instrumentId,
    });
    await db.update(jobs).set({ status: "in_review" }).where(eq(jobs.id, jobId));
    await signInAs(EMAIL[who]);
    return report.recordDeviationAction({
      jobId,
      subject: `step:${stepId}`,
      justification: "Accepted by the customer's engineer on site for this test.",
    });
  },
};
MATRIX.runFitAction = {
  expect: onMarlowJob(["admin", "inspector", "engineer"]),
  call: async (who) => {
    const jobId = await freshJob("measuring");
    const datasetId = await uploadDemoProbe(jobId);
    await signInAs(EMAIL[who]);
    return analysis.runFitAction({ jobId, datasetId });
  },
};
MATRIX.approveFitAction = {
  expect: staffOnly(["engineer"]),
  call: async (who) => {
    const { jobId, analysisId } = await freshFit();
    const a = { id: analysisId };
    await db.update(jobs).set({ status: "in_review" }).where(eq(jobs.id, jobId));
    await signInAs(EMAIL[who]);
    return analysis.approveFitAction({ jobId, analysisId: a.id, password: PW });
  },
};

/** A fresh Marlow Creek job with sphere-probe data uploaded by the installer and fitted by the engineer. */
async function freshFit() {
  const jobId = await freshJob("measuring");
  const datasetId = await uploadDemoProbe(jobId);
  const engineer = await signInActor("engineer@halvard.example");
  const { analysis: a } = await runHeadFit(engineer, datasetId);
  return { jobId, analysisId: a.id, engineer };
}

/** A saved 3D view (600 × 400 px) of a fresh fit on a fresh Marlow Creek job, saved by the engineer. */
async function freshView(): Promise<{ jobId: string; viewId: string }> {
  const { jobId, analysisId, engineer } = await freshFit();
  const png = PNG.sync.write(new PNG({ width: 600, height: 400 }));
  const v = await saveAnalysisView(engineer, analysisId, {
    png,
    factor: 1000,
    overlayAnalysisId: null,
    caption: null,
  });
  return { jobId, viewId: v.id };
}
// The people who measured record the probe, sphere or CMM behind the data; not the office, not customers.
MATRIX.recordJobInstrumentAction = {
  expect: { ...onMarlowJob(["installer", "inspector", "engineer"]) },
  call: async () =>
    report.recordJobInstrumentAction({ jobId: await freshJob("measuring"), instrumentId, use: "probe" }),
};

// The engineer who saves the views ticks them for the report; leaving a view out passes the door
// whatever the fit's state, so the cell is about who asks.
MATRIX.chooseReportViewAction = {
  expect: onMarlowJob(["engineer"]),
  call: async (who) => {
    const { jobId, viewId } = await freshView();
    await signInAs(EMAIL[who]);
    return analysis.chooseReportViewAction({ jobId, viewId, include: false });
  },
};

MATRIX.recordControlValuesAction = {
  // The control's values are the application engineer's to record, refused to anyone else before
  // the job is looked up (so another tenant's customer is refused, not told the job is missing).
  expect: staffOnly(["engineer"]),
  call: async () =>
    control.recordControlValuesAction({
      jobId: await freshJob("measuring"),
      stage: "as_found",
      unitSystem: "metric",
      pivot_length_mm: "152.4",
    }),
};

MATRIX.recordBudgetInputsAction = {
  // The budget's inputs are the application engineer's, refused to anyone else before the analysis
  // is looked up. The engineer's call chooses no instrument on the seeded TR-2026-0052 fit (Type A only).
  expect: staffOnly(["engineer"]),
  call: async () => {
    const [a] = await db
      .select({ id: analyses.id })
      .from(analyses)
      .where(eq(analyses.jobId, await jobIdByReference("TR-2026-0052")))
      .limit(1);
    return control.recordBudgetInputsAction({
      jobId: await jobIdByReference("TR-2026-0052"),
      analysisId: a!.id,
      deltaTK: "0.5",
    });
  },
};

// ---- registers: the administrator's. An empty form passes the door for the admin and is then
// refused for its fields ("invalid"), so nothing is created; everyone else is refused at the door.
for (const name of [
  "createInstrumentAction",
  "inviteUserAction",
  "updateUserAction",
  "mountHeadAction",
  "createCustomerAction",
  "createSiteAction",
  "createMachineAction",
  "createHeadAction",
  "retireRegisterRowAction",
  "recordCalibrationAction",
] as const) {
  MATRIX[name] = {
    expect: staffOnly(["admin"]),
    call: async () => (registers[name] as (raw: unknown) => Promise<ActionResult<unknown>>)({}),
  };
}

// ---- procedure builder: the office and the application engineers write procedures; an empty
// body gets past the access check to a field to correct.
for (const name of [
  "createProcedureAction",
  "saveProcedureVersionAction",
  "setProcedureRetiredAction",
] as const) {
  MATRIX[name] = {
    expect: staffOnly(["admin", "engineer"]),
    call: async () => (procedures[name] as (raw: unknown) => Promise<ActionResult<unknown>>)({}),
  };
}
// ---- issuer details: the administrator's. An empty form passes the door for the admin and is then
// refused for its fields, so nothing is saved; everyone else is refused at the door.
MATRIX.updateIssuerSettingsAction = {
  expect: staffOnly(["admin"]),
  call: async () => settings.updateIssuerSettingsAction({ contactEmail: 42 }),
};

// ---- set password: anonymous by design, the one-time token is the credential; a wrong token is
// refused for its field, whoever asks.
MATRIX.setPasswordAction = {
  expect: Object.fromEntries((Object.keys(EMAIL) as Who[]).map((w) => [w, "pass"])) as Record<Who, Outcome>,
  call: async () =>
    setPassword.setPasswordAction({
      token: "not-a-real-token-".padEnd(43, "x"),
      password: "a long enough new password",
      confirm: "a long enough new password",
    }),
};

// ---- account recovery: only the administrator clears a sign-in delay or sends a reset link.
const engineerId = () => demoUserId("engineer@halvard.example");
MATRIX.clearSignInDelayAction = {
  expect: staffOnly(["admin"]),
  call: async () => people.clearSignInDelayAction({ userId: await engineerId() }),
};
MATRIX.sendResetLinkAction = {
  expect: staffOnly(["admin"]),
  call: async () => people.sendResetLinkAction({ userId: await engineerId() }),
};
// ---- the office's job actions (app/(app)/jobs/actions.ts): the office opens, edits, holds and
// cancels; the job's installer and customer see the job but may not change it; the other tenant is not told it exists.
MATRIX.openJobAction = {
  expect: staffOnly(["admin", "engineer"]),
  call: async () =>
    jobOffice.openJobAction({
      machineId: marlow.machineId,
      headId: marlow.headId,
      kind: "reverification",
      title: "Opened from the action matrix",
      templateId: marlow.templateId,
      decisionRule: "simple",
    }),
};
MATRIX.updateJobAction = {
  expect: onMarlowJob(["admin", "engineer"]),
  call: async () => jobOffice.updateJobAction({ jobId: await freshJob("draft"), orderReference: "PO-ACT-1" }),
};
MATRIX.moveJobAction = {
  expect: onMarlowJob(["admin", "engineer"]),
  call: async () =>
    jobOffice.moveJobAction({ jobId: await freshJob("measuring"), action: "cancel", reason: "Matrix check" }),
};
// ---- forgot password: anonymous by design, the same answer for every address.
MATRIX.requestPasswordResetAction = {
  expect: Object.fromEntries((Object.keys(EMAIL) as Who[]).map((w) => [w, "pass"])) as Record<Who, Outcome>,
  call: async () => forgotPassword.requestPasswordResetAction({ email: "nobody@halvard.example" }),
};

describe("server action access matrix", () => {
  for (const [name, { expect: cells, call }] of Object.entries(MATRIX)) {
    describe(name, () => {
      for (const who of Object.keys(EMAIL) as Who[]) {
        it(`${who}: ${cells[who]}`, async () => {
          await signInAs(EMAIL[who]);
          const p = call(who);
          expect(await outcome(p)).toBe(cells[who]);
        }, 30_000);
      }
    });
  }

  it("a refused call changes nothing: the installer cannot move another installer's job", async () => {
    const jobId = await freshJob("measuring");
    await db.update(jobs).set({ assignedInstallerId: null }).where(eq(jobs.id, jobId));
    await signInAs("installer@halvard.example");
    expect(await outcome(checklist.changeStatusAction({ jobId, to: "in_review" }))).toBe("not_found");
    const [j] = await db.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, jobId));
    expect(j!.status).toBe("measuring");
  });

  it("covers every action exported from an actions.ts file", async () => {
    const files: string[] = [];
    const walk = (dir: string) => {
      for (const f of readdirSync(dir)) {
        const p = path.join(dir, f);
        if (statSync(p).isDirectory()) walk(p);
        else if (f === "actions.ts") files.push(p);
      }
    };
    walk("app");
    expect(files.length).toBeGreaterThanOrEqual(5);
    const exported: string[] = [];
    for (const f of files) {
      const mod = (await import(/* @vite-ignore */ path.resolve(f))) as Record<string, unknown>;
      for (const [k, v] of Object.entries(mod)) if (typeof v === "function") exported.push(k);
    }
    expect(exported.filter((k) => !(k in MATRIX))).toEqual([]);
  });
});
