import { z } from "zod";
import { designIdSchema } from "@/lib/schemas/designs";
import { getDesignWithHead } from "@/lib/server/designs";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: designIdSchema });

/** GET /api/designs/:id — the design, its head version (charts) and the list of versions. */
export const GET = route({ params }, async ({ actor, params: p }) => getDesignWithHead(actor, p.id));
