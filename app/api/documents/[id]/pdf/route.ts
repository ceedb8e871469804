import { z } from "zod";
import { documentLabel, getDocumentFor, renderDocumentPdf } from "@/lib/server/payments";
import { pdfResponse } from "@/lib/server/pdf";
import { route } from "@/lib/server/route";

/** An invoice or receipt as PDF, for the client it is addressed to and the studio. */
export const GET = route({ params: z.object({ id: z.string().uuid() }) }, async ({ actor, params }) => {
  const doc = await getDocumentFor(actor, params.id);
  return pdfResponse(await renderDocumentPdf(doc), `${documentLabel(doc)}.pdf`);
});
