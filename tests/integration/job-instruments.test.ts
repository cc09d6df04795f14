// The instruments behind a job's measurement data (probe, reference sphere, CMM) against the real
// database: recorded by the people who measured, refused with the reason for a retired or
// past-due instrument, a sphere without a calibrated diameter and a repeat; audited; and printed
// with their calibration in the report's traceability (ISO/IEC 17025:2017 §7.8.4.1, §6.5).
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { listJobInstruments, recordJobInstrument } from "@/db/queries/job-instruments";
import { instruments, jobs } from "@/db/schema";
import { actorsBeforeAll, insertTestJob, refusalOf, auditEventsOf } from "./fixtures";

const as = actorsBeforeAll([
  "installer@halvard.example",
  "admin@halvard.example",
  "engineer@halvard.example",
]);
let jobId = "";
const ids: Record<string, string> = {};

beforeAll(async () => {
  jobId = await insertTestJob({
    tag: "JI",
    title: "Data instruments test job",
    template: true,
  });
  const u = Date.now().toString(36);
  const add = async (key: string, v: Partial<typeof instruments.$inferInsert>) =>
    (ids[key] = (
      await db
        .insert(instruments)
        .values({
          kind: "Reference sphere",
          serial: `JI-${key}-${u}`,
          resolution: 0.0001,
          standardUncertainty: 0.0003,
          calibrationDueOn: "2099-01-01",
          ...v,
        })
        .returning()
    )[0]!.id);
  await add("sphere", { calibratedSizeMm: 25.0003, certificateRef: "C-1" });
  await add("bare", {});
  await add("due", { kind: "Touch probe", calibrationDueOn: "2020-01-01" });
});

describe("instruments behind the data", () => {
  it("the installer records the reference sphere; audited; listed with its calibrated diameter", async () => {
    const row = await recordJobInstrument(as.installer!, {
      jobId,
      instrumentId: ids.sphere!,
      use: "reference_sphere",
    });
    const [ev] = await auditEventsOf({ entityId: row.id }, "job_instrument.recorded");
    expect(ev).toMatchObject({ jobId, actorId: as.installer!.id });
    const list = await listJobInstruments(jobId);
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ use: "reference_sphere", calibratedSizeMm: 25.0003 });
  });

  it("refuses with the reason: a repeat, a sphere without diameter, an instrument past due", async () => {
    expect(
      (
        await refusalOf(
          recordJobInstrument(as.installer!, { jobId, instrumentId: ids.sphere!, use: "reference_sphere" }),
        )
      ).message,
    ).toMatch(/already recorded/);
    expect(
      (
        await refusalOf(
          recordJobInstrument(as.installer!, { jobId, instrumentId: ids.bare!, use: "reference_sphere" }),
        )
      ).message,
    ).toMatch(/no calibrated diameter/);
    expect(
      (await refusalOf(recordJobInstrument(as.installer!, { jobId, instrumentId: ids.due!, use: "probe" })))
        .message,
    ).toMatch(/fell due for calibration on 2020-01-01/);
    expect(await listJobInstruments(jobId)).toHaveLength(1);
  });

  it("the office may not record it (attributable records), nor anyone once the job is approved", async () => {
    expect(
      (await refusalOf(recordJobInstrument(as.admin!, { jobId, instrumentId: ids.bare!, use: "cmm" })))
        .status,
    ).toBe(403);
    await db.update(jobs).set({ status: "approved" }).where(eq(jobs.id, jobId));
    expect(
      (await refusalOf(recordJobInstrument(as.engineer!, { jobId, instrumentId: ids.bare!, use: "cmm" })))
        .message,
    ).toMatch(/this job is approved/);
    expect(await listJobInstruments(jobId)).toHaveLength(1);
  });
});
