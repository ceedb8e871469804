import { z } from "zod";
import { primaryStudio, assertCan } from "@/lib/server/authz";
import { optionsFromSettings, planChartDocument } from "@/lib/server/colour-plan";
import { notFound } from "@/lib/server/errors";
import { route } from "@/lib/server/route";
import { loadStudioSettings } from "@/lib/server/settings";

export const dynamic = "force-dynamic";

// Options are checked by the core (every message names the field); here only their outer shape.
const body = z.object({
  chart: z.unknown().refine((v) => v !== undefined && v !== null, "chart is missing"),
  options: z.record(z.string(), z.unknown()).optional(),
});

/**
 * POST /api/colourwork/plan { chart: <v1>, options? } → { colours: <plan-colours>, darning: <plan-darning> }.
 * Studio members only; the studio's float and carry limits and darning rates fill what is left out.
 */
export const POST = route({ body }, async ({ actor, body: b }) => {
  const studio = primaryStudio(actor);
  if (!studio) throw notFound("That page");
  assertCan(actor, "studio.view", studio.studioId);
  const defaults = optionsFromSettings(await loadStudioSettings(studio.studioId));
  return planChartDocument(b.chart, (b.options ?? {}) as Parameters<typeof planChartDocument>[1], defaults);
});
