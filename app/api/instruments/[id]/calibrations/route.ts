// Record a recalibration of an instrument (administrator): a new calibration in its history, which
// brings the instrument back into use → 201 `{ calibration, instrument }`.
import { recordCalibration } from "@/db/queries/instruments";
import { assertRegisterEdit } from "@/db/queries/registers-admin";
import { signedInRoute } from "@/lib/auth/route";
import { notFound } from "@/lib/errors";
import { readJson } from "@/lib/http";
import { calibrationCreateSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
export const POST = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  assertRegisterEdit(actor, "instruments");
  const input = calibrationCreateSchema.parse(await readJson(req));
  const recorded = await recordCalibration(actor, id, input);
  if (!recorded) throw notFound("instrument");
  return Response.json(recorded, { status: 201 });
});
