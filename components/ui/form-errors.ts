/**
 * How a server action's refusal is shown in a form: each field error beside the field it names,
 * and the message once, above or beside the submit button. Errors naming no field of the form
 * (a whole-form "_" issue, a CSV column) are added to that message so nothing is silently lost.
 */
import type { ActionResult } from "@/lib/actions";

export type ActionFailure = Extract<ActionResult<unknown>, { ok: false }>;

/** What the client shows when its own zod check fails: the server's wording for the same case. */
export const INVALID_MESSAGE = "Some fields need attention.";

/** A refusal as one line for a form that shows no field errors of its own: the message, then every field's. */
export function refusalText(failure: ActionFailure): string {
  const fe = failure.fieldErrors ? Object.values(failure.fieldErrors).flat().join(" ") : "";
  return `${failure.message}${fe ? ` ${fe}` : ""}`;
}

export function mapActionErrors(
  failure: ActionFailure,
  isField: (name: string) => boolean,
): { message: string; fields: Array<[name: string, message: string]> } {
  const fields: Array<[string, string]> = [];
  const unplaced: string[] = [];
  for (const [name, messages] of Object.entries(failure.fieldErrors ?? {})) {
    const first = messages.find((m) => m.trim() !== "");
    if (!first) continue;
    if (name !== "_" && isField(name)) fields.push([name, first]);
    else if (!unplaced.includes(first) && first !== failure.message) unplaced.push(first);
  }
  return { message: [failure.message, ...unplaced].join(" "), fields };
}
