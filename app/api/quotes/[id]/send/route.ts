import { z } from "zod";
import { route } from "@/lib/server/route";
import { sendQuote } from "@/lib/server/quotes";

/** Owner: send a draft version to the client (frozen from now on). */
export const POST = route({ params: z.object({ id: z.string().uuid() }) }, async ({ actor, params }) => ({ version: await sendQuote(actor, params.id) }));
