/**
 * The starter library of procedures shipped with Trammel (not demo data): installing a two-axis
 * head, its periodic re-check and the check after a crash. `npm run setup` and the demo seed load
 * it; loading is idempotent by name and version, so an edited procedure (a later version) or a
 * retired one is never touched again.
 */
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { procedureTemplates, templateSteps } from "@/db/schema";
import { LIBRARY_VERSION, starterLibraryRows } from "./starter";

export { STARTER_LIBRARY, starterLibraryRows } from "./starter";

/** Load the starter procedures that are not in the database yet; returns the names loaded. */
export async function loadStarterLibrary(): Promise<string[]> {
  const all = starterLibraryRows();
  return db.transaction(async (tx) => {
    const loaded: string[] = [];
    for (const rows of all) {
      const name = rows.name!;
      const [have] = await tx
        .select({ id: procedureTemplates.id })
        .from(procedureTemplates)
        .where(and(eq(procedureTemplates.name, name), eq(procedureTemplates.version, LIBRARY_VERSION)));
      if (have) continue;
      const [t] = await tx
        .insert(procedureTemplates)
        .values({
          name,
          version: LIBRARY_VERSION,
          description: rows.description,
          isCurrent: true,
          jobKinds: rows.jobKinds,
          headModel: rows.headModel,
        })
        .returning();
      await tx.insert(templateSteps).values(rows.steps.map((s) => ({ ...s, templateId: t!.id })));
      await appendAudit(tx, null, {
        action: "procedure.library_loaded",
        entity: { type: "procedure_template", id: t!.id },
        newValues: { name, version: LIBRARY_VERSION, steps: rows.steps.length },
      });
      loaded.push(name);
    }
    return loaded;
  });
}
