import { listReadingsJson, recordReading } from "@/db/queries/readings";
import { signedInRoute } from "@/lib/auth/route";
import { readJson } from "@/lib/http";
import { readingCreateSchema } from "@/lib/validations/readings";

/** Every checklist reading of the job (canonical values: mm or arcsec, unit named beside each). */
export const GET = signedInRoute<{ id: string }>(async (_req, actor, { id }) => {
  return Response.json(await listReadingsJson(actor, id));
});

/**
 * Records a reading, or a correction when `supersedesId` is given (the old reading is kept).
 * 201 with the new reading; 200 with the stored one when its `clientId` was already sent.
 */
export const POST = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  const input = readingCreateSchema.parse(await readJson(req));
  const { replay, ...reading } = await recordReading(actor, id, input);
  return Response.json({ reading }, { status: replay ? 200 : 201 });
});
