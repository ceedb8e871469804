// Photos for a commission (message attachments; progress photos from the studio). The bytes are
// checked and re-encoded in lib/server/uploads.ts; only participants may upload.
import { z } from "zod";
import { asClient, memberRole } from "@/lib/server/authz";
import { forbidden } from "@/lib/server/errors";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { route } from "@/lib/server/route";
import { readUploadedFile, storeUpload } from "@/lib/server/uploads";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a commission id") });
const query = z.object({ kind: z.enum(["message", "progress"]).default("message"), as: z.enum(["studio", "client"]).default("studio") });

export const POST = route({ params, query }, async ({ req, actor, params: p, query: q }) => {
  const who = q.as === "client" ? asClient(actor) : actor;
  const c = await getCommissionFor(who, p.id);
  if (q.kind === "progress" && !memberRole(who, c.studioId)) throw forbidden("Progress photos come from the studio.");
  const bytes = await readUploadedFile(req);
  // Progress photos stay with the studio until someone shares them (the piece page does that).
  const row = await storeUpload({
    studioId: c.studioId,
    commissionId: c.id,
    kind: q.kind,
    uploadedBy: actor.userId,
    bytes,
    ...(q.kind === "progress" ? { sharedWithClient: false } : {}),
  });
  return Response.json(
    { upload: { id: row.id, width: row.width, height: row.height, thumbUrl: `/api/uploads/${row.id}?size=thumb`, url: `/api/uploads/${row.id}` } },
    { status: 201 },
  );
});
