import { getLogView } from "@/lib/server/production";
import { notFound } from "@/lib/server/errors";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

/** GET /api/production/log — the phone view: my timer, pieces in progress, my recent entries. */
export const GET = route({}, async ({ actor }) => {
  const studio = actor.memberships[0];
  if (!studio) throw notFound();
  return getLogView(actor, studio.studioId);
});
