import { z } from "zod";
import { priceBodySchema } from "@/lib/schemas/money";
import { route } from "@/lib/server/route";
import { setCommissionPrice } from "@/lib/server/queries/commissions";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a commission id") });

/** PUT /api/commissions/:id/price { priceMinor } — the studio owner only. */
export const PUT = route({ params, body: priceBodySchema }, async ({ actor, params: p, body }) => ({
  commission: await setCommissionPrice(actor, p.id, body.priceMinor),
}));
