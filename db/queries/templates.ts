import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { listProcedures, templateContents } from "@/db/queries/procedures";
import { procedureTemplates } from "@/db/schema";
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
  const contentsOf = await templateContents([id]);
  return { ...t, ...contentsOf(id) };
}
