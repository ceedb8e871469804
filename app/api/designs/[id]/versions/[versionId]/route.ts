import { z } from "zod";
import { designIdSchema } from "@/lib/schemas/designs";
import { getDesignVersion } from "@/lib/server/designs";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: designIdSchema, versionId: z.string().uuid("Not a version id") });

/** GET /api/designs/:id/versions/:versionId — one kept version with its charts. */
export const GET = route({ params }, async ({ actor, params: p }) => ({ version: await getDesignVersion(actor, p.id, p.versionId) }));
