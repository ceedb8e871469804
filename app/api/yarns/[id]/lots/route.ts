import { z } from "zod";
import { lotSchema } from "@/lib/schemas/yarns";
import { route } from "@/lib/server/route";
import { setLotStock } from "@/lib/server/yarns";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a yarn id") });

/** PUT /api/yarns/:id/lots { lotCode, stockSkeins } — add a dye lot or set its stock. */
export const PUT = route({ params, body: lotSchema }, async ({ actor, params: p, body }) => {
  const lot = await setLotStock(actor, p.id, body);
  return { lot: { id: lot.id, lotCode: lot.lotCode, stockSkeins: lot.stockSkeins } };
});
