import { z } from "zod";
import { asClient } from "@/lib/server/authz";
import { listCommissionPayments } from "@/lib/server/payments";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a commission id") });

/**
 * The client's view of a commission's payments (kind and state only): the portal polls it after the
 * pay page sends the client back, until the provider's confirmation has landed.
 */
export const GET = route({ params }, async ({ actor, params: p }) => {
  const rows = await listCommissionPayments(asClient(actor), p.id);
  return { payments: rows.map((r) => ({ id: r.id, kind: r.kind, status: r.status })) };
});
