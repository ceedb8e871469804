import { z } from "zod";
import { editEntrySchema } from "@/lib/schemas/production";
import { deleteEntry, editEntry } from "@/lib/server/production";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a time entry id") });

/** PATCH /api/production/entries/:id { minutes, note?, confirm? } — correct an entry (audited). */
export const PATCH = route({ params, body: editEntrySchema }, async ({ actor, params: p, body }) => {
  const e = await editEntry(actor, p.id, body);
  return { entry: { id: e.id, minutes: e.minutes, note: e.note, flag: e.flag } };
});

/** DELETE /api/production/entries/:id — remove an entry (kept, marked deleted, audited). */
export const DELETE = route({ params }, async ({ actor, params: p }) => {
  await deleteEntry(actor, p.id);
  return { ok: true };
});
