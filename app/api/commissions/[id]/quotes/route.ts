import { z } from "zod";
import { quoteDraftSchema } from "@/lib/schemas/quotes";
import { route } from "@/lib/server/route";
import { listQuotesFor, saveQuoteDraft } from "@/lib/server/quotes";

const params = z.object({ id: z.string().uuid() });

/** Quote versions of a commission (the studio sees drafts, the client only sent versions). */
export const GET = route({ params }, async ({ actor, params: p }) => ({ versions: await listQuotesFor(actor, p.id) }));

/** Owner: save the draft version from the builder. */
export const POST = route({ params, body: quoteDraftSchema }, async ({ actor, params: p, body }) => ({ version: await saveQuoteDraft(actor, p.id, body) }));
