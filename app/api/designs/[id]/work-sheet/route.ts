import { z } from "zod";
import { designIdSchema } from "@/lib/schemas/designs";
import { pdfResponse } from "@/lib/server/pdf";
import { route } from "@/lib/server/route";
import { buildWorkSheet } from "@/lib/server/work-sheet";

export const dynamic = "force-dynamic";
export const runtime = "nodejs";

const params = z.object({ id: designIdSchema });

/** GET /api/designs/:id/work-sheet — the printable work sheet of the current version (members only). */
export const GET = route({ params }, async ({ actor, params: p }) => {
  const { pdf, filename } = await buildWorkSheet(actor, p.id);
  return pdfResponse(pdf, filename);
});
