// Progress photos of one piece: the studio's list, and a multipart upload (field "file", plus
// "stage" and an optional "shared" checkbox). Studio members of the piece only; others get a 404.
import { z } from "zod";
import { progressPhotoFieldsSchema } from "@/lib/schemas/progress-photos";
import { addProgressPhoto, assertPiecePhotoAccess, listPiecePhotos } from "@/lib/server/progress-photos";
import { route } from "@/lib/server/route";
import { readUploadedForm } from "@/lib/server/uploads";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a piece id") });

/** GET /api/production/pieces/:id/photos */
export const GET = route({ params }, async ({ actor, params: p }) => ({ photos: await listPiecePhotos(actor, p.id) }));

/** POST /api/production/pieces/:id/photos (multipart) */
export const POST = route({ params }, async ({ req, actor, params: p }) => {
  await assertPiecePhotoAccess(actor, p.id);
  const { bytes, form } = await readUploadedForm(req);
  const fields = progressPhotoFieldsSchema.parse({ stage: form.get("stage") ?? undefined, shared: form.get("shared") });
  const photo = await addProgressPhoto(actor, p.id, fields, bytes);
  return Response.json({ photo }, { status: 201 });
});
