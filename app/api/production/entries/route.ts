import { manualEntrySchema } from "@/lib/schemas/production";
import { addManualEntry } from "@/lib/server/production";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

/** POST /api/production/entries { pieceId, stage, date, startTime, minutes, note } — a manual entry. */
export const POST = route({ body: manualEntrySchema }, async ({ actor, body }) => {
  const e = await addManualEntry(actor, body);
  return Response.json({ entry: { id: e.id, minutes: e.minutes, startedAt: e.startedAt, endedAt: e.endedAt } }, { status: 201 });
});
