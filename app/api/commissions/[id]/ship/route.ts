import { z } from "zod";
import { shipSchema } from "@/lib/schemas/production";
import { route } from "@/lib/server/route";
import { shipCommission } from "@/lib/server/shipping";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a commission id") });
const body = shipSchema.omit({ commissionId: true });

/** POST /api/commissions/:id/ship { carrier, tracking } — the studio owner only. */
export const POST = route({ params, body }, async ({ actor, params: p, body: b }) => {
  const { outcome, shipment } = await shipCommission(actor, { commissionId: p.id, ...b });
  return { state: outcome.to, shipment: { id: shipment.id, carrier: shipment.carrier, tracking: shipment.tracking } };
});
