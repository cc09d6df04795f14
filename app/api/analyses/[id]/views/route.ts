// Saved pictures of an analysis's 3D view: list them (anyone who may see the job) and save one
// (application engineers; multipart `file` = the PNG, `factor`, optional `overlayAnalysisId`, `caption`).
import { z } from "zod";
import { getAnalysis } from "@/db/queries/analyses";
import {
  listAnalysisViews,
  saveAnalysisView,
  VIEW_CAPTION_MAX,
  VIEW_MAX_BYTES,
  viewJson,
} from "@/db/queries/analysis-views";
import { signedInRoute } from "@/lib/auth/route";
import { forbidden, invalid, notFound } from "@/lib/errors";
import { viewSaveRefusal } from "@/lib/policy/analyses";
import { readRoute } from "@/lib/read-route";
import { readMultipart } from "@/lib/storage/multipart";
import { zUuid } from "@/lib/domain/uuid";

export const runtime = "nodejs";
/** Room for the form fields and multipart boundaries beside the picture itself. */
const BODY_OVERHEAD_BYTES = 64 * 1024;

const fieldsSchema = z.object({
  factor: z.coerce.number({ error: "factor must be a number" }).finite({ error: "factor must be a number" }),
  overlayAnalysisId: z
    .string()
    .optional()
    .transform((v) => (v ? v : null))
    .pipe(zUuid("overlayAnalysisId must be an analysis id").nullable()),
  caption: z
    .string()
    .max(VIEW_CAPTION_MAX, { error: `caption is longer than ${VIEW_CAPTION_MAX} characters` })
    .optional()
    .transform((v) => v?.trim() || null),
});

export const GET = readRoute("analysis", listAnalysisViews, (views) =>
  Response.json({ views: views.map(viewJson) }),
);

export const POST = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  // Steps: who, may they see it, may they save, then read the (capped) body, then store.
  if (!(await getAnalysis(actor, id))) throw notFound("analysis");
  const refusal = viewSaveRefusal(actor);
  if (refusal) throw forbidden(refusal);
  const { fields, file } = await readMultipart(req, VIEW_MAX_BYTES + BODY_OVERHEAD_BYTES);
  if (!file || file.data.length === 0)
    throw invalid("Send the picture as the multipart part 'file' (a PNG).", [
      { field: "file", message: "no picture was sent" },
    ]);
  const f = fieldsSchema.parse(fields);
  const view = await saveAnalysisView(actor, id, {
    png: file.data,
    factor: f.factor,
    overlayAnalysisId: f.overlayAnalysisId,
    caption: f.caption,
  });
  return Response.json({ view: viewJson(view) }, { status: 201 });
});
