// Datasets of a job: GET lists them; POST takes one CSV upload (multipart: file, kind, phase and
// the unit fields of geometry/README.md, "CSV formats"), streamed within the size limit, re-parsed by geometry/'s
// readers and stored only when valid.
import { insertDataset, listDatasets, requireUploadableJob } from "@/db/queries/datasets";
import { signedInRoute } from "@/lib/auth/route";
import { env } from "@/lib/env";
import { invalid } from "@/lib/errors";
import { readMultipart } from "@/lib/storage/multipart";
import { checkPositioningAxisLetter, parseDatasetFile, parseUploadForm } from "@/lib/storage/parse-dataset";
import { readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = readRoute("job", listDatasets, (rows) => Response.json({ datasets: rows }));

export const POST = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  // 1. Who and where, before a byte of the body is read.
  await requireUploadableJob(actor, id);
  // 2. The body, streamed within the limit.
  const { fields, file } = await readMultipart(req, env.UPLOAD_MAX_BYTES);
  const form = parseUploadForm(fields);
  // After approval only some kinds are taken: checked again now that the kind is known.
  const d = await requireUploadableJob(actor, id, form.kind);
  if (!file) throw invalid("Choose a CSV file to upload.", [{ field: "file", message: "no file was sent" }]);
  // 3. Re-parse with geometry/'s readers: 422 naming row and column on any problem.
  const parsed = parseDatasetFile(form, file.data);
  checkPositioningAxisLetter(parsed, d.head);
  // 4. Store the original unchanged, then the rows, in one transaction.
  const row = await insertDataset(actor, id, form, file, parsed);
  return Response.json(
    { id: row.id, kind: row.kind, rows: row.rows, sha256: row.sha256, warnings: row.warnings },
    { status: 201 },
  );
});
