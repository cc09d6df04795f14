/** The starter procedures as data, checked with the builder's own rules (no database here). */
import { procedureRows, procedureSchema, type ProcedureInput } from "@/lib/validations/procedures";
import { AFTER_CRASH, RECHECK } from "./checks";
import { INSTALLATION } from "./installation";

export const STARTER_LIBRARY: readonly ProcedureInput[] = [INSTALLATION, RECHECK, AFTER_CRASH];
export const LIBRARY_VERSION = 1;

/** Check each starter procedure with the builder's own rules; throws naming the step that fails. */
export function starterLibraryRows() {
  return STARTER_LIBRARY.map((p) => {
    const out = procedureRows(procedureSchema.parse(p));
    if (!out.rows)
      throw new Error(
        `starter library "${p.name}": ${out.issues.map((i) => `${i.field}: ${i.message}`).join("; ")}`,
      );
    return out.rows;
  });
}
