import { createDesignSchema, listDesignsQuerySchema } from "@/lib/schemas/designs";
import { createDesign, listDesignsFor } from "@/lib/server/designs";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

/** GET /api/designs?commissionId= — the designs of the actor's studios (members only). */
export const GET = route({ query: listDesignsQuerySchema }, async ({ actor, query }) => ({
  designs: await listDesignsFor(actor, { commissionId: query.commissionId }),
}));

/** POST /api/designs { commissionId, title, charts } — a new design with its first version. */
export const POST = route({ body: createDesignSchema }, async ({ actor, body }) => {
  const { design, version } = await createDesign(actor, body);
  return Response.json({ design, version }, { status: 201 });
});
