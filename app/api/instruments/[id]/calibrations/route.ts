// Record a recalibration of an instrument (administrator): a new calibration in its history, which
// brings the instrument back into use → 201 `{ calibration, instrument }`.
import { recordCalibration } from "@/db/queries/instruments";
import { assertRegisterEdit } from "@/db/queries/registers-admin";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { readJson, route } from "@/lib/http";
import { calibrationCreateSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const POST = route<Ctx>(async (req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  assertRegisterEdit(actor, "instruments");
  const input = calibrationCreateSchema.parse(await readJson(req));
  const recorded = await recordCalibration(actor, id, input);
  if (!recorded) throw notFound("instrument");
  return Response.json(recorded, { status: 201 });
});
