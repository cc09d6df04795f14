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
import type { instrumentCreateSchema } from "@/lib/validations/registers";

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
