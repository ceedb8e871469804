import { z } from "zod";
import { designIdSchema } from "@/lib/schemas/designs";
import { restoreDesignVersion } from "@/lib/server/designs";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: designIdSchema });
const body = z.object({ versionId: z.string().uuid("Not a version id") });

/** PUT /api/designs/:id/head { versionId } — open a kept version as the current one. */
export const PUT = route({ params, body }, async ({ actor, params: p, body: b }) => {
  const v = await restoreDesignVersion(actor, p.id, b.versionId);
  return { headVersionId: v.id, number: v.number };
});
