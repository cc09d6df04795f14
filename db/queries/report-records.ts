import "server-only";
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { getIssuer } from "@/db/queries/issuer";
import type { JobDetail } from "@/db/queries/jobs";
import { datasets, environmentRecords, instrumentCalibrations, readings } from "@/db/schema";
import { listJobInstruments } from "@/db/queries/job-instruments";
import { instrumentsInReadings } from "@/db/queries/readings";
import { DATA_INSTRUMENT_PURPOSE, type DataInstrumentUse } from "@/lib/domain/instruments";
import { recordedUnitSystem } from "@/lib/recorded-units";
import type { Phase } from "@/lib/report/readiness";
import type { RecordsInput } from "@/lib/report/sections/records";
import { softwareVersion } from "@/lib/version";

/**
 * What the report's record details (lib/report/sections/records.ts) need from the database, for
 * a job whose access the caller has already checked (buildReportData gets it from getJobDetail).
 */

/** The unit system the job's current readings were entered in (lib/recorded-units). */
export async function jobUnitSystem(jobId: string) {
  const rows = await db
    .select({ unit: readings.enteredUnit })
    .from(readings)
    .where(and(eq(readings.jobId, jobId), isNull(readings.supersededById)));
  return recordedUnitSystem(rows.map((r) => r.unit));
}

/**
 * The instruments behind the current readings, then those recorded for the measurement data
 * (probe, reference sphere with its calibrated diameter, CMM), each with the calibration in force
 * when it was last used: the latest calibration row dated on or before that day (certificate,
 * date, laboratory), else the certificate and date kept on the instrument itself.
 */
async function traceability(jobId: string): Promise<RecordsInput["instruments"]> {
  const used = await instrumentsInReadings(jobId);
  const forData = await listJobInstruments(jobId);
  const all = [
    ...used.map((u) => ({ ...u, dueOn: u.calibrationDueOn, label: u.kind })),
    ...forData.map((x) => ({
      id: x.instrumentId,
      label: `${x.kind} (${DATA_INSTRUMENT_PURPOSE[x.use as DataInstrumentUse] ?? x.use})${
        x.use === "reference_sphere" && x.calibratedSizeMm
          ? `, calibrated diameter ${x.calibratedSizeMm.toFixed(4)} mm`
          : ""
      }`,
      serial: x.serial,
      certificateRef: x.certificateRef,
      calibratedOn: x.calibratedOn,
      dueOn: x.calibrationDueOn,
      lastUsedOn: x.recordedAt.toISOString().slice(0, 10),
    })),
  ];
  if (all.length === 0) return [];
  const cals = await db
    .select()
    .from(instrumentCalibrations)
    .where(
      inArray(
        instrumentCalibrations.instrumentId,
        all.map((u) => u.id),
      ),
    )
    .orderBy(asc(instrumentCalibrations.calibratedOn), asc(instrumentCalibrations.createdAt));
  return all.map((u) => {
    const inForce = cals.filter((c) => c.instrumentId === u.id && c.calibratedOn <= u.lastUsedOn).at(-1);
    return inForce
      ? {
          kind: u.label,
          serial: u.serial,
          certificateRef: inForce.certificateRef,
          calibratedOn: inForce.calibratedOn,
          laboratory: inForce.laboratory,
          dueOn: inForce.dueOn,
        }
      : {
          kind: u.label,
          serial: u.serial,
          certificateRef: u.certificateRef,
          calibratedOn: u.calibratedOn,
          laboratory: null,
          dueOn: u.dueOn,
        };
  });
}

/** Everything the record details need, but the parts buildReportData already knows (what the job did, the fit). */
export async function recordsInputOf(
  d: JobDetail,
): Promise<Omit<RecordsInput, "did" | "fits" | "issuedAt" | "item" | "deviationCount">> {
  const jobId = d.job.id;
  const [issuer, span, env, unitSystem, instrumentRows] = await Promise.all([
    getIssuer(),
    db.execute<{ first: string | null; last: string | null }>(sql`
      select min(t) as first, max(t) as last from (
        select ${readings.takenAt} as t from ${readings} where ${readings.jobId} = ${jobId}
        union all
        select ${datasets.uploadedAt} from ${datasets}
          where ${datasets.jobId} = ${jobId} and ${datasets.deletedAt} is null
      ) w`),
    db
      .select()
      .from(environmentRecords)
      .where(eq(environmentRecords.jobId, jobId))
      .orderBy(asc(environmentRecords.takenAt)),
    jobUnitSystem(jobId),
    traceability(jobId),
  ]);
  const w = span.rows[0];
  return {
    issuer,
    job: {
      orderReference: d.job.orderReference,
      customerContactName: d.job.customerContactName,
      customerContactEmail: d.job.customerContactEmail,
      conditionAsFound: d.job.conditionAsFound,
      nextRecheckOn: d.job.nextRecheckOn,
    },
    work: { first: w?.first ? new Date(w.first) : null, last: w?.last ? new Date(w.last) : null },
    environment: env.map((e) => ({
      phase: e.phase as Phase,
      airTempC: e.airTempC,
      machineTempC: e.machineTempC,
      takenAt: e.takenAt,
      note: e.note,
    })),
    unitSystem,
    instruments: instrumentRows,
    software: softwareVersion(),
  };
}
