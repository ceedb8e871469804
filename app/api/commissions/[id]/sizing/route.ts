import { z } from "zod";
import { route } from "@/lib/server/route";
import { getCommissionSizing, saveCommissionSizing } from "@/lib/server/sizing";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a commission id") });

/** GET /api/commissions/:id/sizing — the studio's sizing form (saved, or a first one from the brief). */
export const GET = route({ params }, async ({ actor, params: p }) => {
  const { values, saved } = await getCommissionSizing(actor, p.id);
  return { sizing: values, saved };
});

/** PUT /api/commissions/:id/sizing <sizing form> — saved only when it sizes the garment (owner or assistant). */
export const PUT = route({ params, body: z.unknown() }, async ({ actor, params: p, body }) => saveCommissionSizing(actor, p.id, body));
