import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { users } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";

/** The acting user's display unit system (inch or metric). */
export async function getUnitSystem(actor: Actor): Promise<"metric" | "inch"> {
  const [row] = await db.select({ u: users.unitSystem }).from(users).where(eq(users.id, actor.id));
  return row?.u ?? "metric";
}
