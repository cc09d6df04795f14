import "server-only";
import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { listProcedures } from "@/db/queries/procedures";
import {
  procedureTemplates,
  templateParameterLimits,
  templatePositioningLimits,
  templateSteps,
} from "@/db/schema";
import { type Actor } from "@/lib/domain/roles";
import { isUuid } from "@/lib/domain/uuid";
import { registerReadRefusal } from "@/lib/policy/registers";
import { forbidden } from "@/lib/errors";

/** Every procedure version with its steps and head-parameter limits (see listProcedures). */
export async function listTemplatesWithSteps(actor: Actor) {
  return listProcedures(actor);
}

/**
 * One procedure version with its steps, head-parameter limits and rotary-axis positioning limits;
 * null when there is none (404). */
export async function getTemplate(actor: Actor, id: string) {
  const refusal = registerReadRefusal(actor, "procedures");
  if (refusal) throw forbidden(refusal);
  if (!isUuid(id)) return null;
  const [t] = await db.select().from(procedureTemplates).where(eq(procedureTemplates.id, id));
  if (!t) return null;
  const [steps, parameterLimits, positioningLimits] = await Promise.all([
    db
      .select()
      .from(templateSteps)
      .where(eq(templateSteps.templateId, id))
      .orderBy(asc(templateSteps.position)),
    db.select().from(templateParameterLimits).where(eq(templateParameterLimits.templateId, id)),
    db
      .select()
      .from(templatePositioningLimits)
      .where(eq(templatePositioningLimits.templateId, id))
      .orderBy(asc(templatePositioningLimits.axis), asc(templatePositioningLimits.quantity)),
  ]);
  return { ...t, steps, parameterLimits, positioningLimits };
}
