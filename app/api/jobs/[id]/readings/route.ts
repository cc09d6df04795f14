import { listReadingsJson, recordReading } from "@/db/queries/readings";
import { requireUser } from "@/lib/auth/session";
import { readJson, route } from "@/lib/http";
import { readingCreateSchema } from "@/lib/validations/readings";

type Ctx = { params: Promise<{ id: string }> };

/** Every checklist reading of the job (canonical values: mm or arcsec, unit named beside each). */
export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  return Response.json(await listReadingsJson(actor, id));
});

/**
 * Records a reading, or a correction when `supersedesId` is given (the old reading is kept).
 * 201 with the new reading; 200 with the stored one when its `clientId` was already sent.
 */
export const POST = route<Ctx>(async (req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const input = readingCreateSchema.parse(await readJson(req));
  const { replay, ...reading } = await recordReading(actor, id, input);
  return Response.json({ reading }, { status: replay ? 200 : 201 });
});
