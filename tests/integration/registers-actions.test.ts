// The registers pages' retire / bring back control and recalibration form, called as the forms
// call them (FormData), against the real database. Who may call them is in action-matrix.test.ts.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { db } from "@/db";
import { instrumentCalibrations, instruments, machines, sites } from "@/db/schema";
import { insertRow } from "./fixtures";
import { formData, signInAs } from "./helpers";

vi.mock("next/cache", () => ({ revalidatePath: vi.fn(), revalidateTag: vi.fn() }));
const { recordCalibrationAction, retireRegisterRowAction } = await import("@/app/(app)/registers/actions");

describe("register page actions (administrator)", () => {
  let machineId = "";
  let instrumentId = "";
  beforeAll(async () => {
    await signInAs("admin@halvard.example");
    const [site] = await db.select({ id: sites.id }).from(sites).limit(1);
    const u = Date.now().toString(36);
    machineId = await insertRow(machines, { siteId: site!.id, name: `Form mill ${u}` });
    instrumentId = await insertRow(instruments, {
      kind: "dial test indicator",
      serial: `FORM-${u}`,
      resolution: 0.001,
      standardUncertainty: 0.001,
      calibratedOn: "2024-05-01",
      calibrationDueOn: "2025-05-01",
      retired: true,
      retiredAt: new Date("2025-05-02T00:00:00Z"),
    });
  });

  it("retires a machine and brings it back", async () => {
    const r1 = await retireRegisterRowAction(
      formData({ register: "machines", id: machineId, retired: "true" }),
    );
    expect(r1).toEqual({ ok: true, data: { retired: true } });
    const [m1] = await db.select({ at: machines.retiredAt }).from(machines).where(eq(machines.id, machineId));
    expect(m1!.at).toBeInstanceOf(Date);
    const r2 = await retireRegisterRowAction(
      formData({ register: "machines", id: machineId, retired: "false" }),
    );
    expect(r2.ok).toBe(true);
    const [m2] = await db.select({ at: machines.retiredAt }).from(machines).where(eq(machines.id, machineId));
    expect(m2!.at).toBeNull();
  });

  it("an unknown register or a missing row is refused", async () => {
    const bad = await retireRegisterRowAction(
      formData({ register: "people", id: machineId, retired: "true" }),
    );
    expect(bad).toMatchObject({ ok: false, code: "invalid" });
    const none = await retireRegisterRowAction(
      formData({ register: "heads", id: "00000000-0000-4000-8000-000000000000", retired: "true" }),
    );
    expect(none).toMatchObject({ ok: false, code: "not_found" });
  });

  it("a recalibration from the form brings a retired, past-due instrument back into use", async () => {
    const r = await recordCalibrationAction(
      formData({
        instrumentId,
        calibratedOn: "2026-06-01",
        dueOn: "2027-06-01",
        certificateRef: "FORM-CERT-1",
        laboratory: "Invented Metrology Lab",
      }),
    );
    expect(r.ok).toBe(true);
    const [i] = await db.select().from(instruments).where(eq(instruments.id, instrumentId));
    expect(i).toMatchObject({ retired: false, retiredAt: null, calibrationDueOn: "2027-06-01" });
    const rows = await db
      .select()
      .from(instrumentCalibrations)
      .where(eq(instrumentCalibrations.instrumentId, instrumentId));
    expect(rows).toHaveLength(1);
    const early = await recordCalibrationAction(
      formData({
        instrumentId,
        calibratedOn: "2026-07-01",
        dueOn: "2026-01-01",
        certificateRef: "X",
        laboratory: "Lab",
      }),
    );
    expect(early).toMatchObject({ ok: false, code: "invalid", fieldErrors: { dueOn: expect.any(Array) } });
  });
});
