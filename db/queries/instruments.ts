import "server-only";
import { asc, eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { instruments } from "@/db/schema";
import { type Actor } from "@/lib/domain/roles";
import { registerEditRefusal, registerReadRefusal } from "@/lib/policy/registers";
import { forbidden, invalid } from "@/lib/errors";
import { toCanonical } from "@/lib/units";
import type { instrumentCreateSchema, instrumentPatchSchema } from "@/lib/validations/registers";
import { isUuid } from "@/lib/domain/uuid";
import { assertRegisterEdit, uniqueAs, updateRegisterRow } from "@/db/queries/registers-admin";

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
  const [dupe] = await db
    .select({ id: instruments.id })
    .from(instruments)
    .where(eq(instruments.serial, input.serial));
  if (dupe)
    throw invalid("An instrument with that serial is already registered.", [
      { field: "serial", message: "Already registered." },
    ]);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(instruments)
      .values({
        kind: input.kind,
        serial: input.serial,
        maker: input.maker || null,
        quantityKind: input.quantityKind,
        resolution: toCanonical(input.resolution, input.unit),
        standardUncertainty: toCanonical(input.standardUncertainty, input.unit),
        calibratedOn: input.calibratedOn || null,
        calibrationDueOn: input.calibrationDueOn,
        certificateRef: input.certificateRef || null,
      })
      .returning();
    await appendAudit(tx, {
      actorId: actor.id,
      actorEmail: actor.email,
      action: "instrument.created",
      entityType: "instrument",
      entityId: row!.id,
      newValues: { serial: row!.serial, kind: row!.kind, calibrationDueOn: row!.calibrationDueOn },
    });
    return row!;
  });
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
    updateRegisterRow(actor, "instruments", instruments, "instrument", id, {
      kind: input.kind,
      serial: input.serial,
      maker: input.maker === undefined ? undefined : input.maker.trim() || null,
      resolution: unit && input.resolution !== undefined ? toCanonical(input.resolution, unit) : undefined,
      standardUncertainty:
        unit && input.standardUncertainty !== undefined
          ? toCanonical(input.standardUncertainty, unit)
          : undefined,
    }),
  );
}
