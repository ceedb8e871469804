import { z } from "zod";
import { pdfResponse } from "@/lib/server/pdf";
import { route } from "@/lib/server/route";
import { getQuoteFor, renderQuotePdf } from "@/lib/server/quotes";

export const GET = route({ params: z.object({ id: z.string().uuid() }) }, async ({ actor, params }) => {
  const v = await getQuoteFor(actor, params.id);
  return pdfResponse(await renderQuotePdf(v), `quote-version-${v.number}.pdf`);
});
