import "server-only";
import { and, asc, eq, max } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { copyPositioningLimits, listProcedures } from "@/db/queries/procedures";
import { procedureTemplates, templateParameterLimits, templateSteps } from "@/db/schema";
import { HEAD_PARAMETER_KEYS, type HeadParameterKey } from "@/geometry";
import { type Actor } from "@/lib/domain/roles";
import { isUuid } from "@/lib/domain/uuid";
import { registerEditRefusal, registerReadRefusal } from "@/lib/policy/registers";
import { forbidden, invalid, notFound } from "@/lib/errors";

/** Every procedure version with its steps and head-parameter limits (see listProcedures). */
export async function listTemplatesWithSteps(actor: Actor) {
  return listProcedures(actor);
}

/** One procedure version with its steps and head-parameter limits; null when there is none (404). */
export async function getTemplate(actor: Actor, id: string) {
  const refusal = registerReadRefusal(actor, "procedures");
  if (refusal) throw forbidden(refusal);
  if (!isUuid(id)) return null;
  const [t] = await db.select().from(procedureTemplates).where(eq(procedureTemplates.id, id));
  if (!t) return null;
  const [steps, parameterLimits] = await Promise.all([
    db
      .select()
      .from(templateSteps)
      .where(eq(templateSteps.templateId, id))
      .orderBy(asc(templateSteps.position)),
    db.select().from(templateParameterLimits).where(eq(templateParameterLimits.templateId, id)),
  ]);
  return { ...t, steps, parameterLimits };
}

export interface StepLimitEdit {
  position: number;
  lowerLimit: number | null;
  upperLimit: number | null;
  decisionRule: "simple" | "guarded";
  limitSource: "standard" | "maker_manual" | "common_practice" | "customer_spec";
  limitSourceNote: string | null;
}

/** A limit for one fitted head parameter in a new version (µm or arc seconds); both limits empty removes it. */
export interface ParameterLimitEdit {
  parameter: HeadParameterKey;
  lowerLimit: number | null;
  upperLimit: number | null;
  decisionRule: "simple" | "guarded";
  limitSource: "standard" | "maker_manual" | "common_practice" | "customer_spec";
  limitSourceNote: string | null;
}

/**
 * Editing a procedure makes a new version: the steps are copied with the edits, the new version
 * becomes current, and jobs keep the version they started with (jobs.template_id). Audited.
 */
export async function createTemplateVersion(
  actor: Actor,
  templateId: string,
  edits: readonly StepLimitEdit[],
  parameterEdits: readonly ParameterLimitEdit[] = [],
) {
  const refusal = registerEditRefusal(actor, "procedures");
  if (refusal) throw forbidden(refusal);
  const [base] = await db.select().from(procedureTemplates).where(eq(procedureTemplates.id, templateId));
  if (!base) throw notFound("procedure");
  const steps = await db
    .select()
    .from(templateSteps)
    .where(eq(templateSteps.templateId, base.id))
    .orderBy(asc(templateSteps.position));
  for (const e of edits) {
    if (!steps.some((s) => s.position === e.position))
      throw invalid(`Step ${e.position} is not in this procedure.`, [
        { field: `steps.${e.position}`, message: "No such step." },
      ]);
    if (e.lowerLimit != null && e.upperLimit != null && e.lowerLimit > e.upperLimit)
      throw invalid(`Step ${e.position}: the lower limit is above the upper limit.`, [
        { field: `steps.${e.position}.lowerLimit`, message: "Above the upper limit." },
      ]);
    if (e.decisionRule === "guarded" && e.upperLimit == null)
      throw invalid(`Step ${e.position}: guarded acceptance needs an upper limit.`, [
        { field: `steps.${e.position}.upperLimit`, message: "Required for guarded acceptance." },
      ]);
  }
  for (const e of parameterEdits) {
    const field = `param.${e.parameter}`;
    if (!(HEAD_PARAMETER_KEYS as readonly string[]).includes(e.parameter))
      throw invalid(`${e.parameter} is not a head parameter.`, [{ field, message: "No such parameter." }]);
    if (e.lowerLimit != null && e.upperLimit != null && e.lowerLimit > e.upperLimit)
      throw invalid(`${e.parameter}: the lower limit is above the upper limit.`, [
        { field: `${field}.lowerLimit`, message: "Above the upper limit." },
      ]);
    if (e.decisionRule === "guarded" && e.upperLimit == null && e.lowerLimit != null)
      throw invalid(`${e.parameter}: guarded acceptance needs an upper limit.`, [
        { field: `${field}.upperLimit`, message: "Required for guarded acceptance." },
      ]);
  }
  return db.transaction(async (tx) => {
    const [{ v } = { v: 0 }] = await tx
      .select({ v: max(procedureTemplates.version) })
      .from(procedureTemplates)
      .where(eq(procedureTemplates.name, base.name));
    await tx
      .update(procedureTemplates)
      .set({ isCurrent: false })
      .where(and(eq(procedureTemplates.name, base.name), eq(procedureTemplates.isCurrent, true)));
    const [t] = await tx
      .insert(procedureTemplates)
      .values({
        name: base.name,
        version: (v ?? 0) + 1,
        description: base.description,
        // What the procedure applies to goes with it into the new version.
        jobKinds: base.jobKinds,
        headModel: base.headModel,
        isCurrent: true,
        createdById: actor.id,
      })
      .returning();
    if (steps.length)
      await tx.insert(templateSteps).values(
        steps.map(({ id: _id, templateId: _t, ...s }) => {
          const e = edits.find((x) => x.position === s.position);
          return {
            ...s,
            templateId: t!.id,
            ...(e
              ? {
                  lowerLimit: e.lowerLimit,
                  upperLimit: e.upperLimit,
                  decisionRule: e.decisionRule,
                  limitSource: e.limitSource,
                  limitSourceNote: e.limitSourceNote,
                }
              : {}),
          };
        }),
      );
    // The head-parameter limits go with the procedure into its new version, with the edits applied
    // (an edit with both limits empty removes that parameter's limit).
    const limits = await tx
      .select()
      .from(templateParameterLimits)
      .where(eq(templateParameterLimits.templateId, base.id));
    const kept = limits
      .filter((l) => !parameterEdits.some((e) => e.parameter === l.parameter))
      .map(({ id: _id, templateId: _t, ...l }) => l);
    const edited = parameterEdits.filter((e) => e.lowerLimit != null || e.upperLimit != null);
    const next = [...kept, ...edited].map((l) => ({ ...l, templateId: t!.id }));
    if (next.length) await tx.insert(templateParameterLimits).values(next);
    await copyPositioningLimits(tx, base.id, t!.id);
    await appendAudit(tx, actor, {
      action: "template.versioned",
      entity: { type: "procedure_template", id: t!.id },
      oldValues: { id: base.id, version: base.version },
      newValues: { version: t!.version, edits, parameterEdits },
    });
    return t!;
  });
}
