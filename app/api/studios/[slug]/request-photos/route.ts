// Reference photos for a request draft. Open to signed-out visitors on purpose: the photo belongs
// to the draft of this browser's cookie token and is shown only to that draft (and, once the request
// is sent, to the commission's participants).
import { cookies } from "next/headers";
import { getActor } from "@/lib/server/authz";
import { getStudioBySlug } from "@/lib/server/clients";
import { AppError, notFound } from "@/lib/server/errors";
import { addDraftPhoto, draftCookieName, loadDraft } from "@/lib/server/requests";
import { errorResponse } from "@/lib/server/route";
import { refuseCrossSite } from "@/lib/server/request-guard";
import { requestClientAddress } from "@/lib/server/client-address";
import { takeDraftPhotoAllowance } from "@/lib/server/request-upkeep";
import { readUploadedFile, storeUpload } from "@/lib/server/uploads";
import { MAX_REFERENCE_PHOTOS } from "@/lib/schemas/request";

export const dynamic = "force-dynamic";

export async function POST(req: Request, ctx: { params: Promise<{ slug: string }> }) {
  const refused = refuseCrossSite(req);
  if (refused) return refused;
  try {
    const { slug } = await ctx.params;
    const studio = await getStudioBySlug(slug);
    if (!studio) throw notFound("That studio");
    const token = (await cookies()).get(draftCookieName(slug))?.value;
    const draft = await loadDraft(studio.id, token);
    if (!token) throw new AppError(409, "no_draft", "Reload the page and try again: your draft could not be found.");
    // The first photo may come before the first autosave: addDraftPhoto then creates the draft.
    if ((draft?.data.uploadIds?.length ?? 0) >= MAX_REFERENCE_PHOTOS) {
      throw new AppError(422, "too_many_photos", `Add at most ${MAX_REFERENCE_PHOTOS} photos.`);
    }
    const actor = await getActor(req.headers);
    // Signed-out visitors have hourly allowances per visitor and per address, so a script cannot fill
    // the storage and one visitor cannot use up what the studio's other visitors may add.
    if (!actor) await takeDraftPhotoAllowance({ studioId: studio.id, visitorToken: token, address: requestClientAddress(req.headers) });
    const bytes = await readUploadedFile(req);
    const row = await storeUpload({ studioId: studio.id, commissionId: null, kind: "reference", uploadedBy: actor?.userId ?? null, bytes });
    await addDraftPhoto(studio.id, token, row.id);
    return Response.json({ upload: { id: row.id, width: row.width, height: row.height, thumbUrl: `/api/uploads/${row.id}?size=thumb` } }, { status: 201 });
  } catch (err) {
    return errorResponse(err);
  }
}
