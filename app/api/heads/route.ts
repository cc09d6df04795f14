// The heads register for the office: list (staff who read it), add (administrator).
import { registerCollectionApi } from "@/lib/register-routes";

export const runtime = "nodejs";
export const { GET, POST } = registerCollectionApi("heads");
