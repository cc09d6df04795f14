// The people register (administrator): `GET /api/users?role=installer` for the office's pickers.
import { listPeople } from "@/db/queries/registers";
import { signedInRoute } from "@/lib/auth/route";
import { userListQuerySchema } from "@/lib/validations/registers";

export const runtime = "nodejs";

export const GET = signedInRoute(async (req, actor) => {
  const { role } = userListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return Response.json({ users: await listPeople(actor, role) });
});
