import { z } from "zod";
import { restoreEntry } from "@/lib/server/production";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a time entry id") });

/** POST /api/production/entries/:id/restore — undo a delete made in the last half hour (audited). */
export const POST = route({ params }, async ({ actor, params: p }) => {
  const e = await restoreEntry(actor, p.id);
  return { entry: { id: e.id, minutes: e.minutes } };
});
