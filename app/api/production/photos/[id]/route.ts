// Share a progress photo with the client, or stop sharing it: { shared: boolean }.
import { z } from "zod";
import { photoShareSchema } from "@/lib/schemas/progress-photos";
import { setPhotoShared } from "@/lib/server/progress-photos";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a photo id") });

/** PATCH /api/production/photos/:id */
export const PATCH = route({ params, body: photoShareSchema }, async ({ actor, params: p, body }) => ({
  photo: await setPhotoShared(actor, p.id, body.shared),
}));
