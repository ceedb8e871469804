import { z } from "zod";
import { creditNoteLabel, getCreditNoteFor, renderCreditNotePdf } from "@/lib/server/credit-notes";
import { pdfResponse } from "@/lib/server/pdf";
import { route } from "@/lib/server/route";

/** A credit note as PDF, for the client it is addressed to and the studio. */
export const GET = route({ params: z.object({ id: z.string().uuid() }) }, async ({ actor, params }) => {
  const cn = await getCreditNoteFor(actor, params.id);
  return pdfResponse(await renderCreditNotePdf(cn), `${creditNoteLabel(cn.number)}.pdf`);
});
