/**
 * Limits for the fitted head parameters, read from the procedure template version a job started
 * with (template_parameter_limits). A job without a template, or a parameter without a row, has
 * no limit: its value is recorded, not judged.
 */
import "server-only";
import { getJobDetail, rowsOfTemplate } from "@/db/queries/jobs";
import { templateParameterLimits } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import type { ParameterLimit } from "@/lib/fit-display";

/** The limits of a template version (no access check: callers have checked the job or register). */
export async function parameterLimitsOfTemplate(templateId: string | null): Promise<ParameterLimit[]> {
  return rowsOfTemplate(templateParameterLimits, templateId, templateParameterLimits.parameter);
}

/** The parameter limits that apply to a job the actor may see; null when the job is not theirs to see. */
export async function listJobParameterLimits(actor: Actor, jobId: string): Promise<ParameterLimit[] | null> {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  return parameterLimitsOfTemplate(d.job.templateId);
}
