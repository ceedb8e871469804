import { z } from "zod";
import { getPieceDetail, updatePieceFeatures } from "@/lib/server/production";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a piece id") });

/** GET /api/production/pieces/:id — estimate vs logged per stage (live) and the entries. */
export const GET = route({ params }, async ({ actor, params: p }) => getPieceDetail(actor, p.id));

/** PATCH /api/production/pieces/:id { features } — correct the labour features; the estimate follows. */
export const PATCH = route({ params, body: z.unknown() }, async ({ actor, params: p, body }) => updatePieceFeatures(actor, p.id, body));
