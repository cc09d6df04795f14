// The people register (administrator): `GET /api/users?role=installer` for the office's pickers.
import { listPeople } from "@/db/queries/registers";
import { requireUser } from "@/lib/auth/session";
import { route } from "@/lib/http";
import { userListQuerySchema } from "@/lib/validations/registers";

export const runtime = "nodejs";

export const GET = route(async (req) => {
  const actor = await requireUser();
  const { role } = userListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return Response.json({ users: await listPeople(actor, role) });
});
