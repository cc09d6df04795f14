// Photos of a job's steps. GET lists those the caller may see; POST takes one photo (multipart:
// file, stepId, phase, and optionally readingId or readingClientId, clientId, takenAt), checked by
// its content and re-encoded by the server. 201 with the photo; 200 with the stored one when its
// clientId was already sent.
import { addPhoto, listPhotos, parsePhotoForm, requirePhotoJob } from "@/db/queries/photos";
import { getJobDetail } from "@/db/queries/jobs";
import { signedInRoute } from "@/lib/auth/route";
import { invalid, notFound } from "@/lib/errors";
import { PHOTO_MAX_BYTES } from "@/lib/photos";
import { readMultipart } from "@/lib/storage/multipart";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export const GET = signedInRoute<{ id: string }>(async (_req, actor, { id }) => {
  if (!(await getJobDetail(actor, id))) throw notFound("job");
  return Response.json({ photos: await listPhotos(actor, id) });
});

export const POST = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  // Who and where before a byte of the body is read (a repeated send is still answered below).
  await requirePhotoJob(actor, id).catch(async (err) => {
    await req.body?.cancel().catch(() => undefined);
    throw err;
  });
  const { fields, file } = await readMultipart(req, PHOTO_MAX_BYTES);
  if (!file) throw invalid("Choose a photo to send.", [{ field: "file", message: "no file was sent" }]);
  const form = parsePhotoForm(fields);
  const { photo, replay } = await addPhoto(actor, id, form, file.data);
  return Response.json({ photo }, { status: replay ? 200 : 201 });
});
