/**
 * Demo data for the report's record details (invented): the calibration history of the demo
 * instruments with the laboratory that issued each certificate, the probe, reference sphere and
 * CMM behind the data of the installation job TR-2026-0041, and the air and machine
 * temperatures at the machine during the installation job TR-2026-0041. Idempotent; runs before
 * the demo report is issued (db/seed-reports.ts), so the issued report prints them.
 */
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { insertJobRecord, type JobRecordEvent } from "@/db/queries/audit";
import { hasRows } from "@/db/seed-helpers";
import {
  environmentRecords,
  instrumentCalibrations,
  instruments,
  jobInstruments,
  jobs,
  users,
} from "@/db/schema";

/** An invented laboratory per instrument kind (demo scenario only). */
const LAB: Record<string, string> = {
  "Dial test indicator": "Invented Dimensional Lab, cert. body no. 0000 (invented)",
  "Digital indicator": "Invented Dimensional Lab, cert. body no. 0000 (invented)",
  "Feeler gauge set": "Invented Gauge Calibration Ltd (invented)",
  "Electronic level": "Invented Angle Standards Lab (invented)",
  "Touch probe": "Invented Probe Service (invented)",
  "Reference sphere": "Invented Dimensional Lab, cert. body no. 0000 (invented)",
  "Coordinate measuring machine": "Invented CMM Verification Ltd (invented)",
};

/** The equipment behind the demo's measurement data (invented): probe, reference sphere, CMM. */
const DATA_INSTRUMENTS: ReadonlyArray<typeof instruments.$inferInsert & { use: string }> = [
  {
    kind: "Touch probe",
    serial: "TP-0301",
    maker: "Invented Probe Co.",
    quantityKind: "length",
    resolution: 0.0001,
    standardUncertainty: 0.0005,
    calibratedOn: "2026-07-01",
    calibrationDueOn: "2027-07-01",
    certificateRef: "CAL-26-0701 (invented)",
    use: "probe",
  },
  {
    kind: "Reference sphere",
    serial: "RS-0025",
    maker: "Invented Sphere Works",
    quantityKind: "length",
    resolution: 0.0001,
    standardUncertainty: 0.0003,
    calibratedOn: "2026-02-10",
    calibrationDueOn: "2028-02-10",
    certificateRef: "CAL-26-0210 (invented)",
    calibratedSizeMm: 25.4012,
    use: "reference_sphere",
  },
  {
    kind: "Coordinate measuring machine",
    serial: "CMM-0009",
    maker: "Invented Metrology",
    quantityKind: "length",
    resolution: 0.0001,
    standardUncertainty: 0.0012,
    calibratedOn: "2026-04-15",
    calibrationDueOn: "2027-04-15",
    certificateRef: "CAL-26-0415 (invented)",
    use: "cmm",
  },
];

const ENVIRONMENT_0041 = [
  {
    phase: "pre" as const,
    at: "2026-10-12T06:55:00Z",
    air: 20.4,
    machine: 20.1,
    note: "Before work; machine idle overnight",
  },
  { phase: "post" as const, at: "2026-10-12T09:40:00Z", air: 20.9, machine: 20.6, note: null },
];

export async function seedRecords(): Promise<void> {
  for (const { use: _use, ...i } of DATA_INSTRUMENTS)
    await db.insert(instruments).values(i).onConflictDoNothing({ target: instruments.serial });
  const list = await db.select().from(instruments);
  for (const i of list) {
    if (!i.calibratedOn || !i.certificateRef) continue;
    if (await hasRows(instrumentCalibrations, eq(instrumentCalibrations.instrumentId, i.id))) continue;
    await db.insert(instrumentCalibrations).values({
      instrumentId: i.id,
      calibratedOn: i.calibratedOn,
      dueOn: i.calibrationDueOn,
      certificateRef: i.certificateRef,
      laboratory: LAB[i.kind] ?? "Invented Calibration Lab (invented)",
    });
  }

  const [job] = await db.select({ id: jobs.id }).from(jobs).where(eq(jobs.reference, "TR-2026-0041"));
  if (!job) return;
  if (await hasRows(environmentRecords, eq(environmentRecords.jobId, job.id))) return;
  const [installer] = await db
    .select({ id: users.id, email: users.email })
    .from(users)
    .where(eq(users.email, "installer@halvard.example"));
  // Recorded by the demo installer on the job, each with its audit event as the app records it.
  const recordAsInstaller = <T extends typeof jobInstruments | typeof environmentRecords>(
    table: T,
    values: Omit<T["$inferInsert"], "jobId" | "recordedById">,
    event: JobRecordEvent<T["$inferSelect"]>,
  ) =>
    db.transaction((tx) =>
      insertJobRecord(
        tx,
        installer ?? null,
        table,
        { ...values, jobId: job.id, recordedById: installer?.id ?? null } as T["$inferInsert"],
        event,
      ),
    );
  for (const d of DATA_INSTRUMENTS) {
    const inst = list.find((x) => x.serial === d.serial)!;
    await recordAsInstaller(
      jobInstruments,
      { instrumentId: inst.id, use: d.use, recordedAt: new Date("2026-10-12T07:20:00Z") },
      {
        action: "job_instrument.recorded",
        entityType: "job_instrument",
        newValues: () => ({ instrument: d.serial, use: d.use, note: "demo data (invented)" }),
      },
    );
  }
  for (const e of ENVIRONMENT_0041)
    await recordAsInstaller(
      environmentRecords,
      { phase: e.phase, airTempC: e.air, machineTempC: e.machine, note: e.note, takenAt: new Date(e.at) },
      {
        action: "environment.recorded",
        entityType: "environment_record",
        newValues: () => ({
          phase: e.phase,
          airTempC: e.air,
          machineTempC: e.machine,
          note: "demo data (invented)",
        }),
      },
    );
}
