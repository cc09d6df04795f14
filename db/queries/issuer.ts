import "server-only";
import { eq } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { issuerSettings } from "@/db/schema";
import type * as schema from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { forbidden } from "@/lib/errors";
import { issuerSettingsRefusal } from "@/lib/policy/issuer";
import {
  DEFAULT_REPRODUCTION_STATEMENT,
  issuerSettingsSchema,
  type IssuerSettingsInput,
} from "@/lib/validations/issuer";

/**
 * The issuer's details: one row (id 1). `npm run setup` inserts it with empty name and address
 * (which block issuing until the administrator fills them in); the demo seed fills it.
 */
export type Issuer = IssuerSettingsInput;

const EMPTY: Issuer = {
  name: "",
  address: "",
  contactEmail: "",
  contactPhone: "",
  accreditation: "",
  reproductionStatement: DEFAULT_REPRODUCTION_STATEMENT,
};

/** The issuer as reports print it; the empty defaults when no row exists yet. */
export async function getIssuer(): Promise<Issuer> {
  const [row] = await db.select().from(issuerSettings).where(eq(issuerSettings.id, 1));
  if (!row) return { ...EMPTY };
  return {
    name: row.name,
    address: row.address,
    contactEmail: row.contactEmail,
    contactPhone: row.contactPhone,
    accreditation: row.accreditation,
    reproductionStatement: row.reproductionStatement,
  };
}

/** The row with empty defaults, if none exists (setup); changes nothing otherwise. */
export async function ensureIssuerRow(tx: NodePgDatabase<typeof schema>): Promise<void> {
  await tx
    .insert(issuerSettings)
    .values({ id: 1, ...EMPTY })
    .onConflictDoNothing();
}

/** The administrator's form for the issuer: administrator only. */
export async function getIssuerForEdit(actor: Actor): Promise<Issuer> {
  const refusal = issuerSettingsRefusal(actor);
  if (refusal) throw forbidden(refusal);
  return getIssuer();
}

/** Saves the issuer's details (administrator), with the old and new values in the audit trail, in one transaction. */
export async function updateIssuer(actor: Actor, raw: IssuerSettingsInput): Promise<Issuer> {
  const refusal = issuerSettingsRefusal(actor);
  if (refusal) throw forbidden(refusal);
  const input = issuerSettingsSchema.parse(raw);
  return db.transaction(async (tx) => {
    const [old] = await tx.select().from(issuerSettings).where(eq(issuerSettings.id, 1)).for("update");
    const values = { ...input, updatedById: actor.id, updatedAt: new Date() };
    await tx
      .insert(issuerSettings)
      .values({ id: 1, ...values })
      .onConflictDoUpdate({ target: issuerSettings.id, set: values });
    await appendAudit(tx, actor, {
      action: "issuer_settings.update",
      entity: { type: "issuer_settings", id: "1" },
      oldValues: old
        ? {
            name: old.name,
            address: old.address,
            contactEmail: old.contactEmail,
            contactPhone: old.contactPhone,
            accreditation: old.accreditation,
            reproductionStatement: old.reproductionStatement,
          }
        : null,
      newValues: input,
    });
    return input;
  });
}
