import { z } from "zod";
import { yarnFormSchema } from "@/lib/schemas/yarns";
import { route } from "@/lib/server/route";
import { updateYarn } from "@/lib/server/yarns";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a yarn id") });

/** PATCH /api/yarns/:id — the whole record; only the owner may change the price. */
export const PATCH = route({ params, body: yarnFormSchema }, async ({ actor, params: p, body }) => {
  const y = await updateYarn(actor, p.id, body);
  return { yarn: { id: y.id, priceMinor: y.priceMinor } };
});
