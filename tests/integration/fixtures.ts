// Shared set-ups for the integration tests: who is acting, a job of the test's own on a seeded
// job's customer, machine and head, the demo sphere-probe data uploaded through the real route,
// and the refusal a call ended in. Each goes through the same code the app uses; nothing here
// decides an outcome a test checks. Before writing a set-up into a test file, look here, in
// helpers.ts (session and requests), dataset-helpers.ts (upload routes) and ready-job.ts
// (bringing a job to the state its report needs).
import { and, asc, eq } from "drizzle-orm";
import type { PgColumn, PgInsertValue, PgTable } from "drizzle-orm/pg-core";
import { beforeAll, expect } from "vitest";
import { POST as fitRoute } from "@/app/api/datasets/[id]/analyses/route";
import { POST as readingsPost } from "@/app/api/jobs/[id]/readings/route";
import { db } from "@/db";
import { approveAnalysis, nonConformingParameters } from "@/db/queries/analyses";
import { changeJobStatus } from "@/db/queries/job-status";
import { signJobWork } from "@/db/queries/signatures";
import { getActor } from "@/db/queries/users";
import { demoSphereProbeCsv } from "@/db/seed-analyses";
import { analyses, auditEvents, datasets, instruments, jobs, users } from "@/db/schema";
import type { JobKind, JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { AppError } from "@/lib/errors";
import { upload } from "./dataset-helpers";
import { jobIdByReference, jsonBody, request, signInAs } from "./helpers";
import { jobBaseOf, measureEveryStep, procedureSteps } from "./ready-job";

/**
 * Who the access tables ask about: anonymous, each staff role and each tenant's customer, with the
 * demo user's e-mail (db/seed.ts). The expected outcome for each stays written by hand in the test.
 */
export const WHO = {
  anonymous: null,
  admin: "admin@halvard.example",
  installer: "installer@halvard.example",
  inspector: "inspector@halvard.example",
  engineer: "engineer@halvard.example",
  "customer (Marlow Creek)": "buyer@marlowcreek.example",
  "customer (Tollan)": "buyer@tollan.example",
} as const;
export type Who = keyof typeof WHO;
/** Every demo person who signs in: the four staff roles and both tenants' customers. */
export const PEOPLE = Object.values(WHO).filter((e) => e !== null);

/** The demo users' password (db/seed.ts). */
export const DEMO_PASSWORD = "trammel-demo";
/** The seeded Marlow Creek job (measuring) whose customer, machine, head and procedure test jobs borrow. */
export const BASE_JOB = "TR-2026-0052";
/** The seeded Tollan Mold Works job (in review): the other tenant's job in the access tests. */
export const TOLLAN_JOB = "TR-2026-0048";

/** Signs in as the demo user and returns the actor the app reads for them (role and company). */
export async function signInActor(email: string): Promise<Actor> {
  const id = await signInAs(email);
  const actor = await getActor(id!);
  if (!actor) throw new Error(`no actor for ${email}`);
  return actor;
}

/**
 * Signs in as each demo user in turn (the last one stays signed in) and returns their actors by the
 * part of the e-mail before "@"; the Tollan buyer is "buyer-tollan".
 */
export async function actorsOf(emails: readonly string[]): Promise<Record<string, Actor>> {
  const as: Record<string, Actor> = {};
  for (const e of emails)
    as[e.split("@")[0]! + (e.endsWith("@tollan.example") ? "-tollan" : "")] = await signInActor(e);
  return as;
}

/**
 * The actors of these demo people (every one unless told), keyed as actorsOf keys them and filled
 * in by a beforeAll hook registered here: call it at the top of a test file, before the file's own
 * beforeAll, which then runs after it (vitest runs "before" hooks in order) with the last of them
 * signed in.
 */
export function actorsBeforeAll(emails: readonly string[] = PEOPLE): Record<string, Actor> {
  const as: Record<string, Actor> = {};
  beforeAll(async () => {
    Object.assign(as, await actorsOf(emails));
  });
  return as;
}

export type JobBase = Awaited<ReturnType<typeof jobBaseOf>>;

/** The user id of a demo person by e-mail (db/seed.ts), without signing in. */
export async function demoUserId(email: string): Promise<string> {
  const [u] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  if (!u) throw new Error(`no demo user ${email}`);
  return u.id;
}

/**
 * Inserts a job of the test's own on a seeded job's customer, machine and head (and its procedure
 * when `template` is set), so the seeded jobs keep their states. The reference is `TR-<tag>-…`, unique.
 * Unless told, the job is measuring and assigned to the demo installer.
 */
export async function insertTestJob(opts: {
  tag: string;
  title: string;
  status?: JobStatus;
  assignedInstallerId?: string | null;
  kind?: JobKind;
  template?: boolean;
  base?: JobBase;
}): Promise<string> {
  const base = opts.base ?? (await jobBaseOf(BASE_JOB));
  const installerId =
    opts.assignedInstallerId === undefined
      ? await demoUserId("installer@halvard.example")
      : opts.assignedInstallerId;
  const [row] = await db
    .insert(jobs)
    .values({
      reference: `TR-${opts.tag}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`,
      title: opts.title,
      kind: opts.kind ?? "reverification",
      status: opts.status ?? "measuring",
      customerId: base.customerId,
      machineId: base.machineId,
      headId: base.headId,
      ...(opts.template ? { templateId: base.templateId } : {}),
      assignedInstallerId: installerId,
    })
    .returning();
  return row!.id;
}

/**
 * Uploads the demo sphere-probe CSV to the job through the upload route, signed in as `email`
 * (the demo installer unless told), checks it was stored (201) and returns the dataset's id.
 */
export async function uploadDemoProbe(
  jobId: string,
  opts: { email?: string; phase?: "pre" | "post"; filename?: string } = {},
): Promise<string> {
  await signInAs(opts.email ?? "installer@halvard.example");
  const res = await upload(
    jobId,
    Buffer.from(demoSphereProbeCsv()),
    { kind: "sphere_probe", phase: opts.phase ?? "pre", units: "mm" },
    opts.filename ?? "probe.csv",
  );
  expect(res.status).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

/** Runs the head fit of a dataset through POST /api/datasets/{id}/analyses as whoever is signed in. */
export function runFit(datasetId: string): Promise<Response> {
  return fitRoute(request(`/api/datasets/${datasetId}/analyses`, { method: "POST" }), {
    params: Promise.resolve({ id: datasetId }),
  });
}

/**
 * Uploads the demo sphere-probe CSV to the job as the demo engineer and fits it through the route,
 * checks the new fit was stored (201) and returns the dataset's and the analysis's ids.
 */
export async function fitDemoProbe(
  jobId: string,
  filename: string,
): Promise<{ datasetId: string; analysisId: string }> {
  const datasetId = await uploadDemoProbe(jobId, { email: "engineer@halvard.example", filename });
  const res = await runFit(datasetId);
  expect(res.status).toBe(201);
  return { datasetId, analysisId: ((await res.json()) as { analysis: { id: string } }).analysis.id };
}

/**
 * The head fits db/seed-analyses.ts stores on BASE_JOB, with their sphere-probe datasets, by phase:
 * "pre" (as found) and "post" (after adjustment).
 */
export async function seededFits() {
  const rows = await db
    .select({ analysisId: analyses.id, datasetId: datasets.id, phase: datasets.phase })
    .from(analyses)
    .innerJoin(datasets, eq(datasets.id, analyses.datasetId))
    .where(eq(analyses.jobId, await jobIdByReference(BASE_JOB)));
  const ofPhase = (phase: "pre" | "post") => {
    const fit = rows.find((r) => r.phase === phase);
    if (!fit) throw new Error(`no seeded ${phase} fit on ${BASE_JOB}`);
    return fit;
  };
  return { pre: ofPhase("pre"), post: ofPhase("post") };
}

/**
 * Posts a reading to the job through POST /api/jobs/{id}/readings as whoever is signed in, and
 * returns the answer's status and JSON body.
 */
export async function postReading(jobId: string, body: Record<string, unknown>) {
  const res = await readingsPost(request(`/api/jobs/${jobId}/readings`, jsonBody("POST", body)), {
    params: Promise.resolve({ id: jobId }),
  });
  return { status: res.status, json: await res.json() };
}

/** Inserts one row into a table whose key is `id` and returns that id. */
export async function insertRow<T extends PgTable & { id: PgColumn }>(
  table: T,
  values: PgInsertValue<T>,
): Promise<string> {
  const [row] = await db.insert(table).values(values).returning({ id: table.id });
  return row!.id as string;
}

/** The AppError a call was refused with; fails the test if it succeeded or threw something else. */
export async function refusalOf(p: Promise<unknown>): Promise<AppError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof AppError) return e;
    throw e;
  }
  throw new Error("expected a refusal");
}

/** The audit events of this action on a job (`jobId`) or on one record (`entityId`), oldest first. */
export function auditEventsOf(on: { jobId: string } | { entityId: string }, action: string) {
  const subject = "jobId" in on ? eq(auditEvents.jobId, on.jobId) : eq(auditEvents.entityId, on.entityId);
  return db
    .select()
    .from(auditEvents)
    .where(and(subject, eq(auditEvents.action, action)))
    .orderBy(asc(auditEvents.id));
}

/** Drizzle wraps the driver's error; the database's own message is in `cause`. */
export async function dbError(p: Promise<unknown>): Promise<string> {
  try {
    await p;
  } catch (e) {
    const err = e as Error & { cause?: Error };
    return err.cause?.message ?? err.message;
  }
  return "no error";
}

/** The id of the first step of a procedure (by position). */
export async function firstStepOf(templateId: string): Promise<string> {
  const [step] = await procedureSteps(templateId);
  return step!.id;
}

/** The ids of a procedure's steps by their position (1, 2, …). */
export async function stepIdsByPosition(templateId: string): Promise<Record<number, string>> {
  const rows = await procedureSteps(templateId);
  return Object.fromEntries(rows.map((s) => [s.position, s.id]));
}

/** The ids of every registered instrument by serial. */
export async function instrumentIdsBySerial(): Promise<Record<string, string>> {
  const rows = await db.select({ id: instruments.id, serial: instruments.serial }).from(instruments);
  return Object.fromEntries(rows.map((i) => [i.serial, i.id]));
}

/** The id of a registered instrument by serial (the seed's dial indicator is "DTI-0112"). */
export async function instrumentIdBySerial(serial = "DTI-0112"): Promise<string> {
  const [inst] = await db
    .select({ id: instruments.id })
    .from(instruments)
    .where(eq(instruments.serial, serial));
  return inst!.id;
}

/**
 * Approves a fit as the engineer does in the browser: confirming each parameter that does not
 * conform (the server refuses until every one is confirmed), with the password entered again.
 */
export async function approveConfirmed(engineer: Actor, analysisId: string, password = DEMO_PASSWORD) {
  const open = await nonConformingParameters(engineer, analysisId);
  return approveAnalysis(
    engineer,
    analysisId,
    password,
    open.map((p) => p.key),
  );
}

/** The installer signs the job's work as performed, then the inspector as inspected (21 CFR 11.50 meanings). */
export async function signPerformedAndInspected(as: Record<string, Actor>, jobId: string) {
  await signJobWork(as.installer!, { jobId, meaning: "performed", password: DEMO_PASSWORD });
  await signJobWork(as.inspector!, { jobId, meaning: "inspected", password: DEMO_PASSWORD });
}

/**
 * Takes a job with a fit through review as its people do: the installer measures every step in
 * `phase`, the installer and the inspector sign, the installer sends the job to review and the
 * engineer approves the fit (approveConfirmed). Open FAIL results are left for the test to carry.
 */
export async function measureSignAndApprove(
  as: Record<string, Actor>,
  jobId: string,
  analysisId: string,
  phase: "pre" | "post" = "pre",
) {
  await measureEveryStep(as.installer!, jobId, phase);
  await signPerformedAndInspected(as, jobId);
  await changeJobStatus(as.installer!, jobId, "in_review");
  await approveConfirmed(as.engineer!, analysisId);
}
