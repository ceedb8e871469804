import { z } from "zod";
import { PIECE_STAGES } from "@/lib/core/workflow/pieces";
import { movePiece } from "@/lib/server/production";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a piece id") });
const body = z.object({ toStage: z.enum(PIECE_STAGES, { message: "Choose a stage." }) });

/** POST /api/production/pieces/:id/move { toStage } — a stage change through the core rules. */
export const POST = route({ params, body }, async ({ actor, params: p, body: b }) => {
  const piece = await movePiece(actor, p.id, b.toStage);
  return { piece: { id: piece.id, stage: piece.stage } };
});
