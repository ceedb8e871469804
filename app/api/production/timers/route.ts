import { startTimerSchema } from "@/lib/schemas/production";
import { getMyTimer, startTimer } from "@/lib/server/production";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

/** GET /api/production/timers — my running or paused timer (any device), or null. */
export const GET = route({}, async ({ actor }) => ({ timer: await getMyTimer(actor) }));

/** POST /api/production/timers { pieceId, stage } — start a timer (one per person). */
export const POST = route({ body: startTimerSchema }, async ({ actor, body }) => {
  const entry = await startTimer(actor, body.pieceId, body.stage);
  return Response.json({ entry: { id: entry.id, pieceId: entry.pieceId, stage: entry.stage } }, { status: 201 });
});
