import "server-only";
import { asc, desc, eq, max } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { instrumentCalibrations, instruments } from "@/db/schema";
import { type Actor } from "@/lib/domain/roles";
import { registerEditRefusal, registerReadRefusal } from "@/lib/policy/registers";
import { forbidden, invalid } from "@/lib/errors";
import { toCanonical } from "@/lib/units";
import type {
  calibrationCreateSchema,
  instrumentCreateSchema,
  instrumentPatchSchema,
} from "@/lib/validations/registers";
import { isUuid } from "@/lib/domain/uuid";
import {
  assertRegisterEdit,
  insertRegisterRow,
  uniqueAs,
  updateAudited,
  updateRegisterRow,
} from "@/db/queries/registers-admin";

export async function listInstruments(actor: Actor) {
  const refusal = registerReadRefusal(actor, "instruments");
  if (refusal) throw forbidden(refusal);
  return db
    .select()
    .from(instruments)
    .orderBy(asc(instruments.retired), asc(instruments.kind), asc(instruments.serial));
}

/** Adds an instrument (administrator), resolution and uncertainty converted to mm or arcsec; audited. */
export async function createInstrument(actor: Actor, input: z.infer<typeof instrumentCreateSchema>) {
  const refusal = registerEditRefusal(actor, "instruments");
  if (refusal) throw forbidden(refusal);
  // The serial's unique constraint refuses a second instrument, as it does when a serial is changed.
  return uniqueAs("serial", "An instrument with that serial is already registered.", () =>
    insertRegisterRow(
      actor,
      instruments,
      "instrument",
      {
        kind: input.kind,
        serial: input.serial,
        maker: input.maker || null,
        quantityKind: input.quantityKind,
        resolution: toCanonical(input.resolution, input.unit),
        standardUncertainty: toCanonical(input.standardUncertainty, input.unit),
        calibratedOn: input.calibratedOn || null,
        calibrationDueOn: input.calibrationDueOn,
        certificateRef: input.certificateRef || null,
        rangeMin: input.rangeMin !== undefined ? toCanonical(input.rangeMin, input.unit) : null,
        rangeMax: input.rangeMax !== undefined ? toCanonical(input.rangeMax, input.unit) : null,
      },
      (row) => ({ serial: row.serial, kind: row.kind, calibrationDueOn: row.calibrationDueOn }),
    ),
  );
}

/**
 * Corrects an instrument's description (kind, serial, maker, resolution and uncertainty in the
 * unit given, which must suit its quantity); audited. Calibration is a record of its own.
 */
export async function updateInstrument(
  actor: Actor,
  id: string,
  input: z.infer<typeof instrumentPatchSchema>,
) {
  assertRegisterEdit(actor, "instruments");
  if (!isUuid(id)) return null;
  if (input.unit !== undefined) {
    const [row] = await db
      .select({ q: instruments.quantityKind })
      .from(instruments)
      .where(eq(instruments.id, id));
    if (!row) return null;
    if ((row.q === "angle") !== (input.unit === "arcsec"))
      throw invalid("Angle instruments use arcsec; length instruments mm, in or µm.", [
        { field: "unit", message: `Not a unit of ${row.q}.` },
      ]);
  }
  const unit = input.unit;
  return uniqueAs("serial", "An instrument with that serial is already registered.", () =>
    updateRegisterRow(
      actor,
      "instruments",
      instruments,
      "instrument",
      id,
      {
        kind: input.kind,
        serial: input.serial,
        maker: input.maker === undefined ? undefined : input.maker.trim() || null,
        resolution: unit && input.resolution !== undefined ? toCanonical(input.resolution, unit) : undefined,
        standardUncertainty:
          unit && input.standardUncertainty !== undefined
            ? toCanonical(input.standardUncertainty, unit)
            : undefined,
        rangeMin: unit && input.rangeMin !== undefined ? toCanonical(input.rangeMin, unit) : undefined,
        rangeMax: unit && input.rangeMax !== undefined ? toCanonical(input.rangeMax, unit) : undefined,
      },
      input.retired,
    ),
  );
}

/**
 * Records a recalibration: a new calibration row (the history is kept), its dates and certificate
 * copied onto the instrument, and the instrument back in use (not retired), in one transaction,
 * audited. A calibration dated in the future, or not after the one before, is refused by field.
 */
export async function recordCalibration(
  actor: Actor,
  id: string,
  input: z.infer<typeof calibrationCreateSchema>,
) {
  assertRegisterEdit(actor, "instruments");
  if (!isUuid(id)) return null;
  const today = new Date().toISOString().slice(0, 10);
  if (input.calibratedOn > today)
    throw invalid("The calibration date is in the future.", [
      { field: "calibratedOn", message: "Not after today." },
    ]);
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(instruments).where(eq(instruments.id, id)).for("update");
    if (!before) return null;
    const [last] = await tx
      .select({ calibratedOn: max(instrumentCalibrations.calibratedOn) })
      .from(instrumentCalibrations)
      .where(eq(instrumentCalibrations.instrumentId, id));
    const previous = last?.calibratedOn ?? before.calibratedOn;
    if (previous && input.calibratedOn < previous)
      throw invalid(`The instrument was last calibrated on ${previous}; a recalibration follows it.`, [
        { field: "calibratedOn", message: `Before the calibration of ${previous}.` },
      ]);
    const [calibration] = await tx
      .insert(instrumentCalibrations)
      .values({ instrumentId: id, ...input, recordedById: actor.id })
      .returning();
    const instrument = await updateAudited(
      tx,
      actor,
      instruments,
      id,
      {
        calibratedOn: input.calibratedOn,
        calibrationDueOn: input.dueOn,
        certificateRef: input.certificateRef,
        retired: false,
        retiredAt: null,
      },
      {
        action: "instrument.calibrated",
        entityType: "instrument",
        oldValues: {
          calibratedOn: before.calibratedOn,
          calibrationDueOn: before.calibrationDueOn,
          certificateRef: before.certificateRef,
          retired: before.retired,
        },
        newValues: () => ({ calibrationId: calibration!.id, ...input, retired: false }),
      },
    );
    return { calibration: calibration!, instrument };
  });
}

/** An instrument's calibrations, newest first (the register page shows them under the instrument). */
export async function listCalibrations(actor: Actor) {
  const refusal = registerReadRefusal(actor, "instruments");
  if (refusal) throw forbidden(refusal);
  return db
    .select()
    .from(instrumentCalibrations)
    .orderBy(asc(instrumentCalibrations.instrumentId), desc(instrumentCalibrations.calibratedOn));
}
