/**
 * Demo data for checklists (invented): the default procedure for installing a two-axis head,
 * the instrument register (one indicator past its calibration due date, to show the refusal),
 * pre/post-adjustment readings on the Marlow Creek jobs TR-2026-0041 and TR-2026-0052, and the
 * readings of the Tollan job TR-2026-0048.
 * Idempotent: the template and instruments are matched by natural keys; readings are added to a
 * job only while it has none.
 */
import { and, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import {
  instruments,
  jobs,
  procedureTemplates,
  readings,
  templateParameterLimits,
  templateSteps,
  users,
} from "@/db/schema";
import { hasRows } from "@/db/seed-helpers";
import { deriveReading } from "@/lib/checklist";
import type { EntryUnit } from "@/lib/units";

const IN = 25.4; // mm per inch, exactly (NIST SP 811)

export const DEFAULT_TEMPLATE_NAME = "Two-axis head installation";

const LOCKOUT =
  "Lock out and tag out the machine before working on the spindle nose or collar. Follow the machine builder's manual, local codes and licensed practice.";
const LIFT =
  "The head is heavy: lift it only with rated gear at the maker's lifting points, never stand or reach under a suspended load, and keep fingers out of the gap between head and collar while the spline engages (pinch point). The head maker's and machine builder's manuals, local codes and licensed practice come first.";
const JOG =
  "Axes move under power while you indicate: jog at low feed, keep hands and the indicator stand clear of the head's sweep, and keep the enabling device in reach. Follow the machine builder's manual, local codes and licensed practice.";
const CUT =
  "The spindle rotates and chips fly: guards closed, eye protection on, nobody inside the machine's working area. Follow the machine builder's manual, local codes and licensed practice.";

type StepInsert = Omit<typeof templateSteps.$inferInsert, "templateId">;

/** Indicating a face across the head at an axis zero: the same limit for either axis. */
const ACROSS_HEAD_LIMIT = {
  quantityKind: "length",
  derivation: "direct",
  lowerLimit: -0.0004 * IN,
  upperLimit: 0.0004 * IN,
  decisionRule: "simple",
  limitSource: "maker_manual",
  limitSourceNote: "As entered from the head maker's manual (figure invented for the demo).",
  safetyNote: JOG,
} satisfies Partial<StepInsert>;

/** The tilt axis checked with a test bar over 4 in of Z travel, as both procedures do it. */
const TEST_BAR_TILT = {
  title: "Check the tilt axis with a test bar travelled in Z",
  quantity: "Tilt of the tool axis from Z",
  quantityKind: "angle",
  derivation: "angle_over_distance",
  distanceMm: 4 * IN,
  lowerLimit: -10,
  upperLimit: 10,
  decisionRule: "simple",
  limitSource: "maker_manual",
  safetyNote: JOG,
} satisfies Partial<StepInsert>;

/** The default steps. Limits in canonical units: mm for length, arcsec for angle. */
export const DEFAULT_STEPS: ReadonlyArray<StepInsert> = [
  {
    position: 1,
    title: "Mount the adapter collar and prove its face",
    instructions:
      "Clean the spindle nose and the collar, fit and torque the collar, then sweep its face with a test indicator one full turn and record the total indicator reading (TIR). Shim or re-seat the collar if it is out.",
    quantity: "Collar face flatness (TIR)",
    quantityKind: "length",
    derivation: "direct",
    lowerLimit: null,
    upperLimit: 0.0005 * IN,
    decisionRule: "simple",
    limitSource: "common_practice",
    limitSourceNote:
      "0.0005 in TIR is common practice, an editable default; use the head maker's figure where it gives one.",
    safetyNote: LOCKOUT,
  },
  {
    position: 2,
    title: "Close the head onto the collar",
    instructions:
      "Lower the head until the spline engages and measure the head-to-collar gap with feeler gauges before the bolts draw it closed; then tighten the bolts in the maker's sequence.",
    quantity: "Head-to-collar gap before the bolts draw it closed",
    quantityKind: "length",
    derivation: "direct",
    lowerLimit: IN / 16,
    upperLimit: IN / 8,
    decisionRule: "simple",
    limitSource: "common_practice",
    limitSourceNote: "1/16 to 1/8 in is common practice, an editable default.",
    safetyNote: LIFT,
  },
  {
    position: 3,
    title: "Indicate the primary axis to zero across the head",
    instructions:
      "Indicate the reference face across the head at the primary axis zero; record the difference end to end (signed). Adjust the zero offset until it is inside the limit.",
    quantity: "Primary axis: indicator difference across the head",
    ...ACROSS_HEAD_LIMIT,
  },
  {
    position: 4,
    title: "Indicate the secondary axis to zero across the head",
    instructions:
      "Indicate the reference face across the head at the secondary (tilt) axis zero; record the signed difference end to end.",
    quantity: "Secondary axis: indicator difference across the head",
    ...ACROSS_HEAD_LIMIT,
  },
  {
    position: 5,
    ...TEST_BAR_TILT,
    instructions:
      "Hold a 1/2 in test bar or drill blank in the head, indicate its side and travel Z over the stated distance; record the change in reading. Trammel converts reading over travel to an angle (arc seconds).",
    limitSourceNote:
      "As entered from the head maker's manual (figure invented for the demo); the test bar is common practice.",
  },
  {
    position: 6,
    title: "Cut the test part and measure the step between passes",
    instructions:
      "Face a test block in two overlapping passes with the head at its zero and measure the step between the passes with an indicator.",
    quantity: "Step between adjacent passes",
    quantityKind: "length",
    derivation: "direct",
    lowerLimit: null,
    upperLimit: 0.0005 * IN,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: "Customer specification (figure invented for the demo).",
    safetyNote: CUT,
  },
];

export const COLLISION_TEMPLATE_NAME = "Two-axis head check after a collision";

/**
 * A demo procedure with every kind of step the tablet takes (invented): a yes/no check, readings
 * at clock positions with their TIR and a photo of the dial, values for the record, a reading
 * over a travel and a note. The after-collision draft TR-2026-0057 follows it.
 */
export const COLLISION_STEPS: ReadonlyArray<StepInsert> = [
  {
    position: 1,
    title: "Lock out the machine before touching the head",
    instructions:
      "Isolate and lock out the machine's power, and check that the head is supported, before anyone reaches to the couplers or the collar.",
    quantity: "Machine locked out and head supported",
    quantityKind: "length",
    derivation: "check",
    lowerLimit: null,
    upperLimit: null,
    decisionRule: "simple",
    limitSource: "common_practice",
    limitSourceNote: "Lock-out before hands go near drives is common practice; local codes decide how.",
    safetyNote: LOCKOUT,
  },
  {
    position: 2,
    title: "Indicate the collar at four clock positions",
    instructions:
      "Sweep the collar's outside diameter with a test indicator and read it at 12, 3, 6 and 9 o'clock as seen from the front of the machine; the run-out is the largest minus the smallest reading. Photograph the dial at the high point.",
    quantity: "Collar run-out (TIR)",
    quantityKind: "length",
    derivation: "multi_point",
    points: ["12", "3", "6", "9"],
    pointResult: "tir",
    lowerLimit: null,
    upperLimit: 0.0005 * IN,
    decisionRule: "simple",
    limitSource: "common_practice",
    limitSourceNote: "0.0005 in TIR is common practice, an editable default.",
    photoRequired: true,
    safetyNote: LOCKOUT,
  },
  {
    position: 3,
    title: "Torque the collar bolts",
    instructions:
      "Torque the collar bolts in a cross pattern to the head maker's figure and record the torque applied.",
    quantity: "Collar bolt torque applied",
    quantityKind: "length",
    derivation: "record",
    recordUnit: "N·m",
    lowerLimit: null,
    upperLimit: null,
    decisionRule: "simple",
    limitSource: "maker_manual",
    limitSourceNote: "The torque comes from the head maker's manual.",
  },
  {
    position: 4,
    title: "Record the shims fitted under the collar",
    instructions:
      "Record the total shim thickness and where the shims sit (clock positions). Photograph them before the collar goes back.",
    quantity: "Shim thickness fitted",
    quantityKind: "length",
    derivation: "record",
    recordUnit: "mm",
    lowerLimit: null,
    upperLimit: null,
    decisionRule: "simple",
    limitSource: "common_practice",
    limitSourceNote: "Kept for the record; not judged.",
    photoRequired: true,
    safetyNote: LOCKOUT,
  },
  {
    position: 5,
    ...TEST_BAR_TILT,
    instructions:
      "Hold a test bar in the head, indicate its side and travel Z over the stated distance; record the change in reading.",
    limitSourceNote: "As entered from the head maker's manual (figure invented for the demo).",
  },
  {
    position: 6,
    title: "Describe the damage found",
    instructions: "Write what was found: marks on the collar, the spline, the couplers; anything replaced.",
    quantity: "Condition after the collision",
    quantityKind: "length",
    derivation: "note",
    lowerLimit: null,
    upperLimit: null,
    decisionRule: "simple",
    limitSource: "common_practice",
    limitSourceNote: "Not judged.",
  },
];

/** The instrument register (invented). Resolution and standard uncertainty in mm (length) or arcsec (angle). */
export const DEMO_INSTRUMENTS: ReadonlyArray<typeof instruments.$inferInsert> = [
  {
    kind: "Dial test indicator",
    serial: "DTI-0112",
    maker: "Invented Gauge Co.",
    model: "T-1",
    quantityKind: "length",
    resolution: 0.0001 * IN,
    standardUncertainty: 0.0012,
    calibratedOn: "2026-06-15",
    calibrationDueOn: "2027-06-15",
    certificateRef: "CAL-26-0612 (invented)",
  },
  {
    kind: "Digital indicator",
    serial: "DI-0208",
    maker: "Invented Gauge Co.",
    model: "D-12",
    quantityKind: "length",
    resolution: 0.001,
    standardUncertainty: 0.0015,
    // Its display reads ±12.7 mm about the zero set (invented demo figure).
    rangeMin: -12.7,
    rangeMax: 12.7,
    calibratedOn: "2026-03-31",
    calibrationDueOn: "2027-03-31",
    certificateRef: "CAL-26-0331 (invented)",
  },
  {
    kind: "Feeler gauge set",
    serial: "FG-0031",
    maker: "Invented Gauge Co.",
    model: "F-26",
    quantityKind: "length",
    resolution: 0.01,
    standardUncertainty: 0.005,
    calibratedOn: "2026-09-01",
    calibrationDueOn: "2027-09-01",
    certificateRef: "CAL-26-0901 (invented)",
  },
  {
    kind: "Electronic level",
    serial: "EL-0007",
    maker: "Invented Level Works",
    model: "L-2",
    quantityKind: "angle",
    resolution: 0.2,
    standardUncertainty: 0.5,
    calibratedOn: "2026-05-20",
    calibrationDueOn: "2027-05-20",
    certificateRef: "CAL-26-0520 (invented)",
  },
  {
    kind: "Dial test indicator",
    serial: "DTI-0417",
    maker: "Invented Gauge Co.",
    model: "T-1",
    quantityKind: "length",
    resolution: 0.0001 * IN,
    standardUncertainty: 0.0012,
    calibratedOn: "2025-09-30",
    calibrationDueOn: "2026-09-30",
    certificateRef: "CAL-25-0930 (invented; past due)",
  },
];

type DemoReading = {
  step: number;
  phase: "pre" | "post";
  value: number;
  unit: EntryUnit;
  instrument: string;
  note?: string;
  minutes: number;
};

/** Before and after shimming the collar and setting the zeros (invented values, entered in inch as the installer works). */
const READINGS_0041: DemoReading[] = [
  {
    step: 1,
    phase: "pre",
    value: 0.0009,
    unit: "in",
    instrument: "DTI-0112",
    note: "High spot at 4 o'clock",
    minutes: 0,
  },
  {
    step: 1,
    phase: "post",
    value: 0.0003,
    unit: "in",
    instrument: "DTI-0112",
    note: "After a 0.0005 in shim at 4 o'clock",
    minutes: 35,
  },
  { step: 2, phase: "pre", value: 0.094, unit: "in", instrument: "FG-0031", minutes: 60 },
  {
    step: 2,
    phase: "post",
    value: 0.093,
    unit: "in",
    instrument: "FG-0031",
    note: "Gap checked again after the collar was shimmed",
    minutes: 140,
  },
  { step: 3, phase: "pre", value: 0.0006, unit: "in", instrument: "DTI-0112", minutes: 90 },
  {
    step: 3,
    phase: "post",
    value: 0.0001,
    unit: "in",
    instrument: "DTI-0112",
    note: "Zero offset adjusted",
    minutes: 110,
  },
  { step: 4, phase: "pre", value: -0.0003, unit: "in", instrument: "DTI-0112", minutes: 120 },
  { step: 4, phase: "post", value: -0.0001, unit: "in", instrument: "DTI-0112", minutes: 130 },
  {
    step: 5,
    phase: "pre",
    value: 0.0008,
    unit: "in",
    instrument: "DTI-0112",
    note: "Over 4 in of Z travel",
    minutes: 150,
  },
  { step: 5, phase: "post", value: 0.0001, unit: "in", instrument: "DTI-0112", minutes: 175 },
  { step: 6, phase: "post", value: 0.0002, unit: "in", instrument: "DI-0208", minutes: 220 },
];

/** The re-verification under way: all pre readings, the collar re-proved after shimming. */
const READINGS_0052: DemoReading[] = [
  {
    step: 1,
    phase: "pre",
    value: 0.0007,
    unit: "in",
    instrument: "DTI-0112",
    note: "Collar has settled since installation",
    minutes: 0,
  },
  { step: 2, phase: "pre", value: 0.088, unit: "in", instrument: "FG-0031", minutes: 20 },
  { step: 3, phase: "pre", value: 0.0002, unit: "in", instrument: "DTI-0112", minutes: 40 },
  { step: 4, phase: "pre", value: 0.0005, unit: "in", instrument: "DTI-0112", minutes: 55 },
  { step: 5, phase: "pre", value: 0.0003, unit: "in", instrument: "DTI-0112", minutes: 70 },
];

const DEMO_LIMIT_NOTE = "Demo value, invented for the example scenario";

/**
 * Limits for the fitted head parameters in the default procedure (µm, arc seconds). Invented demo
 * values: a real job takes them from the head maker's acceptance sheet or the customer's order.
 */
export const DEFAULT_PARAMETER_LIMITS: ReadonlyArray<
  Omit<typeof templateParameterLimits.$inferInsert, "templateId">
> = [
  {
    parameter: "pivot_length_error_um",
    lowerLimit: -50,
    upperLimit: 50,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
  {
    parameter: "tip_offset_s_um",
    lowerLimit: -20,
    upperLimit: 20,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
  {
    parameter: "tip_offset_n_um",
    lowerLimit: -20,
    upperLimit: 20,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
  {
    parameter: "secondary_offset_um",
    lowerLimit: -20,
    upperLimit: 20,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
  {
    parameter: "primary_zero_arcsec",
    lowerLimit: -30,
    upperLimit: 30,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
  {
    parameter: "secondary_zero_arcsec",
    lowerLimit: -30,
    upperLimit: 30,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
  {
    parameter: "secondary_tilt_arcsec",
    lowerLimit: -20,
    upperLimit: 20,
    decisionRule: "guarded",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
  {
    parameter: "secondary_yaw_arcsec",
    lowerLimit: -20,
    upperLimit: 20,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
  {
    parameter: "primary_tilt_s_arcsec",
    lowerLimit: -15,
    upperLimit: 15,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
  {
    parameter: "primary_tilt_n_arcsec",
    lowerLimit: -15,
    upperLimit: 15,
    decisionRule: "simple",
    limitSource: "customer_spec",
    limitSourceNote: DEMO_LIMIT_NOTE,
  },
];

/** Adds the default parameter limits to the demo template version when it has none (demo databases made before they existed). */
async function ensureParameterLimits(templateId: string) {
  if (await hasRows(templateParameterLimits, eq(templateParameterLimits.templateId, templateId))) return;
  await db
    .insert(templateParameterLimits)
    .values(DEFAULT_PARAMETER_LIMITS.map((l) => ({ ...l, templateId })));
}

async function ensureTemplate(
  adminId: string | null,
  name = DEFAULT_TEMPLATE_NAME,
  steps = DEFAULT_STEPS,
  description = "Mount the collar, close the head, set both axis zeros, check the tilt axis with a test bar, cut a test part. Limits marked common practice are editable defaults.",
) {
  const [found] = await db
    .select()
    .from(procedureTemplates)
    .where(and(eq(procedureTemplates.name, name), eq(procedureTemplates.version, 1)));
  if (found) return found;
  return db.transaction(async (tx) => {
    const [t] = await tx
      .insert(procedureTemplates)
      .values({
        name,
        version: 1,
        description,
        createdById: adminId,
      })
      .returning();
    await tx.insert(templateSteps).values(steps.map((s) => ({ ...s, templateId: t!.id })));
    await appendAudit(
      tx,
      { id: adminId, email: "admin@halvard.example" },
      {
        action: "template.created",
        entity: { type: "procedure_template", id: t!.id },
        newValues: { name: t!.name, version: 1, steps: steps.length, note: "demo data (invented)" },
      },
    );
    return t!;
  });
}

async function seedReadings(reference: string, start: Date, list: DemoReading[], installerId: string) {
  const [job] = await db.select().from(jobs).where(eq(jobs.reference, reference));
  if (!job?.templateId) return;
  if (await hasRows(readings, eq(readings.jobId, job.id))) return;
  const steps = await db.select().from(templateSteps).where(eq(templateSteps.templateId, job.templateId));
  const insts = await db.select().from(instruments);
  await db.transaction(async (tx) => {
    for (const r of list) {
      const step = steps.find((s) => s.position === r.step)!;
      const inst = insts.find((i) => i.serial === r.instrument)!;
      const derived = deriveReading(step, { value: r.value, unit: r.unit });
      const [row] = await tx
        .insert(readings)
        .values({
          jobId: job.id,
          stepId: step.id,
          phase: r.phase,
          value: derived.value,
          enteredValue: r.value,
          enteredUnit: r.unit,
          inputs: derived.inputs,
          instrumentId: inst.id,
          note: r.note ?? null,
          takenAt: new Date(start.getTime() + r.minutes * 60_000),
          recordedById: installerId,
        })
        .returning();
      await appendAudit(
        tx,
        { id: installerId, email: "installer@halvard.example" },
        {
          action: "reading.recorded",
          entity: { type: "reading", id: row!.id },
          jobId: job.id,
          newValues: {
            step: r.step,
            phase: r.phase,
            value: derived.value,
            enteredValue: r.value,
            enteredUnit: r.unit,
            instrument: r.instrument,
            note: "demo data (invented)",
          },
        },
      );
    }
  });
}

/** The Tollan installation, measured once (no adjustment needed on the checklist; invented values, in inch). */
const READINGS_0048: DemoReading[] = [
  { step: 1, phase: "pre", value: 0.0003, unit: "in", instrument: "DTI-0112", minutes: 0 },
  { step: 2, phase: "pre", value: 0.09, unit: "in", instrument: "FG-0031", minutes: 40 },
  { step: 3, phase: "pre", value: 0.0002, unit: "in", instrument: "DTI-0112", minutes: 70 },
  { step: 4, phase: "pre", value: -0.0002, unit: "in", instrument: "DTI-0112", minutes: 90 },
  {
    step: 5,
    phase: "pre",
    value: 0.0002,
    unit: "in",
    instrument: "DTI-0112",
    note: "Over 4 in of Z travel",
    minutes: 120,
  },
  { step: 6, phase: "pre", value: 0.0003, unit: "in", instrument: "DI-0208", minutes: 200 },
];

export async function seedChecklists(): Promise<void> {
  const [admin] = await db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, "admin@halvard.example"));
  const [installer] = await db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, "installer@halvard.example"));
  for (const i of DEMO_INSTRUMENTS)
    await db.insert(instruments).values(i).onConflictDoNothing({ target: instruments.serial });
  const template = await ensureTemplate(admin?.id ?? null);
  await ensureParameterLimits(template.id);
  // The after-collision draft follows the procedure with every kind of step; the other demo jobs
  // follow the default procedure, version 1.
  const collision = await ensureTemplate(
    admin?.id ?? null,
    COLLISION_TEMPLATE_NAME,
    COLLISION_STEPS,
    "Lock out, indicate the collar at clock positions, record torque and shims, check the tilt axis, describe the damage.",
  );
  await db
    .update(jobs)
    .set({ templateId: collision.id })
    .where(and(eq(jobs.reference, "TR-2026-0057"), isNull(jobs.templateId)));
  await db.update(jobs).set({ templateId: template.id }).where(isNull(jobs.templateId));
  if (!installer) return;
  await seedReadings("TR-2026-0041", new Date("2026-10-12T07:30:00Z"), READINGS_0041, installer.id);
  await seedReadings("TR-2026-0052", new Date("2026-12-01T07:30:00Z"), READINGS_0052, installer.id);
  await seedReadings("TR-2026-0048", new Date("2026-11-20T07:30:00Z"), READINGS_0048, installer.id);
}
