import { lotSchema, yarnFormSchema } from "@/lib/schemas/yarns";
import { notFound } from "@/lib/server/errors";
import { route } from "@/lib/server/route";
import { createYarn, listYarns } from "@/lib/server/yarns";

export const dynamic = "force-dynamic";

/** GET /api/yarns — the studio's yarns with stock, reservations and the purchase list. */
export const GET = route({}, async ({ actor }) => {
  const m = actor.memberships[0];
  if (!m) throw notFound();
  return listYarns(actor, m.studioId);
});

/** POST /api/yarns { name, colourName, hex, fibre, weightCategory, metresPerSkein, gramsPerSkein, price, lot? } — owner only. */
export const POST = route({ body: yarnFormSchema.extend({ lot: lotSchema.optional() }) }, async ({ actor, body }) => {
  const m = actor.memberships[0];
  if (!m) throw notFound();
  const { lot, ...yarn } = body;
  const y = await createYarn(actor, m.studioId, yarn, lot);
  return Response.json({ yarn: { id: y.id } }, { status: 201 });
});

