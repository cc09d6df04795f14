// Correct one row of the machines register (administrator); audited.
import { registerItemApi } from "@/lib/register-routes";

export const runtime = "nodejs";
export const { PATCH } = registerItemApi("machines");
