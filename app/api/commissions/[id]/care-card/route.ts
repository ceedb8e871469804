import { z } from "zod";
import { pdfResponse } from "@/lib/server/pdf";
import { route } from "@/lib/server/route";
import { renderCareCard } from "@/lib/server/shipping";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a commission id") });

/** GET /api/commissions/:id/care-card — the care card PDF (studio members and the commission's client). */
export const GET = route({ params }, async ({ actor, params: p }) => {
  const { pdf, filename } = await renderCareCard(actor, p.id);
  return pdfResponse(pdf, filename);
});
