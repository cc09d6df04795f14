import "server-only";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { listUsableInstruments } from "@/db/queries/readings";
import { visibleJob } from "@/db/queries/jobs";
import { insertJobRecord } from "@/db/queries/audit";
import { instruments, jobInstruments } from "@/db/schema";
import { DATA_INSTRUMENT_USE_LABELS, type DataInstrumentUse } from "@/lib/domain/instruments";
import type { Actor } from "@/lib/domain/roles";
import { forbidden, invalid } from "@/lib/errors";
import { jobInstrumentRefusal } from "@/lib/policy/job-instruments";

/**
 * The instruments behind a job's measurement data (job_instruments): the touch probe, the
 * reference sphere with its calibrated diameter, any CMM. Recorded once each, audited in the same
 * transaction; the report prints them with their calibration.
 */

/** Records that an instrument from the register was used on the job for `use`. 404/403/422 with the reason. */
export async function recordJobInstrument(
  actor: Actor,
  input: { jobId: string; instrumentId: string; use: DataInstrumentUse },
) {
  const d = await visibleJob(actor, input.jobId);
  const refusal = jobInstrumentRefusal(actor, d.job);
  if (refusal) throw forbidden(refusal);
  const [inst] = await db.select().from(instruments).where(eq(instruments.id, input.instrumentId));
  if (!inst || inst.retired)
    throw invalid("Choose an instrument in use from the register.", [
      { field: "instrumentId", message: "Not in the register, or retired." },
    ]);
  const today = new Date().toISOString().slice(0, 10);
  if (inst.calibrationDueOn < today)
    throw invalid(
      `${inst.serial} fell due for calibration on ${inst.calibrationDueOn}; it may not be used.`,
      [{ field: "instrumentId", message: "Past its calibration due date." }],
    );
  if (input.use === "reference_sphere" && !(inst.calibratedSizeMm && inst.calibratedSizeMm > 0))
    throw invalid(
      `${inst.serial} has no calibrated diameter in the register; the administrator enters it from the certificate.`,
      [{ field: "instrumentId", message: "No calibrated diameter." }],
    );
  const recorded = await listJobInstruments(d.job.id);
  if (recorded.some((r) => r.instrumentId === inst.id && r.use === input.use))
    throw invalid(
      `${inst.serial} is already recorded as ${DATA_INSTRUMENT_USE_LABELS[input.use].toLowerCase()}.`,
    );
  return db.transaction(async (tx) => {
    return insertJobRecord(
      tx,
      actor,
      jobInstruments,
      { jobId: d.job.id, instrumentId: inst.id, use: input.use, recordedById: actor.id },
      {
        action: "job_instrument.recorded",
        entityType: "job_instrument",
        newValues: () => ({ instrument: inst.serial, use: input.use }),
      },
    );
  });
}

/** The job's data instruments with their register entries, for a caller that checked the job's access. */
export async function listJobInstruments(jobId: string) {
  return db
    .select({
      id: jobInstruments.id,
      use: jobInstruments.use,
      instrumentId: instruments.id,
      kind: instruments.kind,
      serial: instruments.serial,
      certificateRef: instruments.certificateRef,
      calibratedOn: instruments.calibratedOn,
      calibrationDueOn: instruments.calibrationDueOn,
      calibratedSizeMm: instruments.calibratedSizeMm,
      recordedAt: jobInstruments.recordedAt,
    })
    .from(jobInstruments)
    .innerJoin(instruments, eq(instruments.id, jobInstruments.instrumentId))
    .where(eq(jobInstruments.jobId, jobId))
    .orderBy(asc(jobInstruments.recordedAt));
}

/** Instruments in use (not retired, in calibration today) for the picker, labelled kind and serial. */
export async function listInstrumentsForPicker(): Promise<Array<{ id: string; label: string }>> {
  const today = new Date().toISOString().slice(0, 10);
  const rows = await listUsableInstruments();
  return rows
    .filter((r) => r.calibrationDueOn >= today)
    .map((r) => ({ id: r.id, label: `${r.kind} ${r.serial}` }));
}
