/**
 * Demo data (invented) for the control loop: a tool-centre-point check taken after the values
 * were entered, made with geometry's own forward model. With the control compensating all but a
 * few micrometres, the sphere centre the control reports moves by about that much over the swing.
 */
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { getControlValues, recordControlValues } from "@/db/queries/control-values";
import { controlValueRecords, instruments, jobs, procedureTemplates, templateSteps } from "@/db/schema";
import { DEFAULT_STEPS } from "@/db/seed-checklists";
import { recordBudgetInputs } from "@/db/queries/budget";
import { DEMO_HEAD_CONFIG, demoSphereProbeCsv } from "@/db/seed-analyses";
import {
  demoActor,
  fitAndApprove,
  hasRows,
  insertDemoJob,
  sphereProbeCsvText,
  storeCsv,
} from "@/db/seed-helpers";
import { headPoseGrid, synthesiseSphereProbe, type HeadErrors } from "@/geometry";
import { CONTROL_DECIMALS } from "@/lib/control-values";

/** What is left after compensation in the demo: a few µm and arc seconds (invented). */
export const DEMO_TCP_RESIDUAL_ERRORS: HeadErrors = {
  pivot_length_error_um: 2.5,
  tip_offset_n_um: -1.5,
  secondary_zero_arcsec: 1.2,
};

/** A TCP-check CSV (sphere-probe columns) over 12 primary × 5 secondary angles, one tool. */
export function demoTcpCheckCsv(errors: HeadErrors = DEMO_TCP_RESIDUAL_ERRORS, seed = 57): string {
  const poses = headPoseGrid({ primarySteps: 12, secondaryDeg: [-90, -45, 0, 45, 90] });
  const d = synthesiseSphereProbe(DEMO_HEAD_CONFIG, errors, poses, {
    noiseUm: 0.5,
    seed,
    centreMm: [612.5, -204.0, 388.25],
  });
  return sphereProbeCsvText(d, { toolColumn: false });
}

export const DEMO_CONTROL_JOB = "TR-2026-0059";
export const DEMO_CONTROL_PROCEDURE = "Kinematic values after a crash (demo)";
const TCP_FILENAME = "TR-2026-0059 TCP check after compensation (demo, synthetic).csv";
const PROBE_FILENAME = "TR-2026-0059 sphere probe after the crash (demo, synthetic).csv";

/** What the demo control held before the crash check (invented): nominal pivot, zero offsets at 0. */
const DEMO_AS_FOUND = {
  pivot_length_mm: 152.4,
  tool_offset_along_tilt_mm: 0,
  tool_offset_across_tilt_mm: 0,
  secondary_offset_mm: 0,
  primary_zero_deg: 0,
  secondary_zero_deg: 0,
  secondary_squareness_deg: 0,
} as const;

/** Instruments the budget draws on (invented demo register entries; uncertainties in mm). */
const DEMO_BUDGET_INSTRUMENTS: ReadonlyArray<typeof instruments.$inferInsert> = [
  {
    kind: "Touch probe",
    serial: "TP-0311",
    quantityKind: "length",
    resolution: 0.0001,
    standardUncertainty: 0.0005,
    calibratedOn: "2026-06-02",
    calibrationDueOn: "2027-06-02",
    certificateRef: "CAL-TP-0311-26",
  },
  {
    kind: "Reference sphere",
    serial: "RS-0031",
    quantityKind: "length",
    resolution: 0.0001,
    standardUncertainty: 0.0002,
    calibratedOn: "2026-03-10",
    calibrationDueOn: "2028-03-10",
    certificateRef: "CAL-RS-0031-26",
  },
  {
    kind: "Tool presetter",
    serial: "TPS-0042",
    quantityKind: "length",
    resolution: 0.001,
    standardUncertainty: 0.002,
    calibratedOn: "2026-09-15",
    calibrationDueOn: "2027-09-15",
    certificateRef: "CAL-TPS-0042-26",
  },
];

async function ensureInstrument(values: typeof instruments.$inferInsert): Promise<string> {
  const [found] = await db
    .select({ id: instruments.id })
    .from(instruments)
    .where(eq(instruments.serial, values.serial));
  if (found) return found.id;
  const [row] = await db.insert(instruments).values(values).returning({ id: instruments.id });
  return row!.id;
}

/**
 * The control-loop demo (invented): after a spindle collision on G-7, the engineer recorded the
 * control's values as found, the head was probed and its fit approved, the values to enter were
 * entered and read back as left, and a TCP check was taken with the control's function on. Runs
 * once: a job that already has control records is left as it is.
 */
export async function seedControlLoop(password: string): Promise<void> {
  const [template] = await db.select().from(jobs).where(eq(jobs.reference, "TR-2026-0057"));
  if (!template) return;
  const engineer = await demoActor("engineer@halvard.example");
  const installer = await demoActor("installer@halvard.example");
  // A procedure version of the demo's own: one checklist step, a TCP check required with limits of
  // 15 µm range per axis and 10 µm from the mean (invented for the demo, like the customer's spec).
  let [procedure] = await db
    .select()
    .from(procedureTemplates)
    .where(and(eq(procedureTemplates.name, DEMO_CONTROL_PROCEDURE), eq(procedureTemplates.version, 1)));
  if (!procedure) {
    [procedure] = await db
      .insert(procedureTemplates)
      .values({
        name: DEMO_CONTROL_PROCEDURE,
        version: 1,
        description: "Demo: record the control's values, fit, enter, read back and check the TCP.",
        tcpCheckRequired: true,
        tcpRangeLimitUm: 15,
        tcpDeviationLimitUm: 10,
        tcpLimitSource: "customer_spec",
        tcpLimitSourceNote: "The demo customer's acceptance sheet (invented).",
        createdById: engineer.id,
      })
      .returning();
    // One checklist step, the collar face (the demo's copy of the installation procedure's first step).
    await db.insert(templateSteps).values({ ...DEFAULT_STEPS[0]!, templateId: procedure!.id });
  }
  let [job] = await db.select().from(jobs).where(eq(jobs.reference, DEMO_CONTROL_JOB));
  if (!job) {
    job = await insertDemoJob(engineer, {
      reference: DEMO_CONTROL_JOB,
      title: "Kinematic values after spindle collision on G-7",
      kind: "after_crash",
      status: "in_review",
      customerId: template.customerId,
      machineId: template.machineId,
      headId: template.headId,
      templateId: procedure!.id,
      assignedInstallerId: installer.id,
      decisionRule: "simple",
      scheduledFor: new Date("2026-11-27T07:00:00Z"),
      airTempC: 20.4,
      createdById: engineer.id,
    });
  }
  if (
    job.status !== "in_review" ||
    (await hasRows(controlValueRecords, eq(controlValueRecords.jobId, job.id)))
  )
    return;
  await recordControlValues(engineer, job.id, {
    stage: "as_found",
    unitSystem: "metric",
    values: { ...DEMO_AS_FOUND },
    note: "Read from the control's kinematic table before any change (demo).",
  });
  const probe = await storeCsv(
    installer,
    job.id,
    { kind: "sphere_probe", phase: "post", units: "mm" },
    PROBE_FILENAME,
    demoSphereProbeCsv(),
  );
  const analysis = await fitAndApprove(engineer, probe.id, password);
  // The budget's Type B inputs from the register (the demo's probe, sphere and presetter), ΔT ±1 K.
  const [probeId, sphereId, presetterId] = await Promise.all(DEMO_BUDGET_INSTRUMENTS.map(ensureInstrument));
  await recordBudgetInputs(engineer, {
    analysisId: analysis.id,
    probeInstrumentId: probeId,
    sphereInstrumentId: sphereId,
    presetterInstrumentId: presetterId,
    deltaTK: 1,
  });
  const loop = (await getControlValues(engineer, job.id))!.loop;
  // As left: the values to enter as typed into the control, at the digits the page shows them.
  const asLeft = Object.fromEntries(
    loop.rows
      .filter((r) => r.toEnter !== null)
      .map((r) => [
        r.key,
        Number(r.toEnter!.toFixed(r.kind === "length" ? CONTROL_DECIMALS.mm : CONTROL_DECIMALS.deg)),
      ]),
  );
  await recordControlValues(engineer, job.id, {
    stage: "as_left",
    unitSystem: "metric",
    values: asLeft,
    note: "Read back from the control after entering (demo).",
  });
  await storeCsv(
    installer,
    job.id,
    { kind: "tcp_check", phase: "post", units: "mm" },
    TCP_FILENAME,
    demoTcpCheckCsv(),
  );
}
