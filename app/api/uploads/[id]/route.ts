// The gate for every stored photo: participants of the commission (or, before a request is sent,
// the draft's own browser) get a redirect to a short-lived signed URL; anyone else a 404.
// `?bytes=1` answers the full photo's bytes from this origin instead (the design page's photo import
// reads its pixels, which a cross-origin redirect would keep from a canvas).
import { cookies } from "next/headers";
import { z } from "zod";
import { getActor } from "@/lib/server/authz";
import { notFound } from "@/lib/server/errors";
import { getUploadFor } from "@/lib/server/queries/uploads";
import { draftCookieName } from "@/lib/server/requests";
import { errorResponse } from "@/lib/server/route";
import { getObject } from "@/lib/server/storage";
import { uploadUrl } from "@/lib/server/uploads";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid() });

export async function GET(req: Request, ctx: { params: Promise<{ id: string }> }) {
  try {
    const p = params.safeParse(await ctx.params);
    if (!p.success) throw notFound("That photo");
    const actor = await getActor(req.headers);
    const row = await getUploadFor(actor, p.data.id, async (slug) => (await cookies()).get(draftCookieName(slug))?.value);
    if (new URL(req.url).searchParams.get("bytes") === "1") {
      const body = await getObject(row.objectKey);
      return new Response(new Uint8Array(body), { status: 200, headers: { "content-type": row.contentType, "cache-control": "private, no-store" } });
    }
    const size = new URL(req.url).searchParams.get("size") === "thumb" ? "thumb" : "full";
    const url = await uploadUrl(row, size, 120);
    return new Response(null, { status: 302, headers: { location: url, "cache-control": "private, no-store" } });
  } catch (err) {
    return errorResponse(err);
  }
}
