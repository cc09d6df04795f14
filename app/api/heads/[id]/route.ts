// Correct one row of the heads register (administrator); audited.
import { registerItemApi } from "@/lib/register-routes";

export const runtime = "nodejs";
export const { PATCH } = registerItemApi("heads");
