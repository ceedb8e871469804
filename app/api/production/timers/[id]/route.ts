import { z } from "zod";
import { timerActionSchema } from "@/lib/schemas/production";
import { changeTimer } from "@/lib/server/production";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a timer id") });

/** PATCH /api/production/timers/:id { action: pause | resume | stop } */
export const PATCH = route({ params, body: timerActionSchema }, async ({ actor, params: p, body }) => {
  const e = await changeTimer(actor, p.id, body.action);
  return { entry: { id: e.id, minutes: e.minutes, endedAt: e.endedAt, paused: e.runningSince === null && e.endedAt === null, flag: e.flag } };
});
