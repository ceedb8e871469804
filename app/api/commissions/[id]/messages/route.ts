import { z } from "zod";
import { postMessageSchema, threadQuerySchema } from "@/lib/schemas/messages";
import { asClient } from "@/lib/server/authz";
import { getThread, postMessage } from "@/lib/server/messages";
import { route } from "@/lib/server/route";

export const dynamic = "force-dynamic";

const params = z.object({ id: z.string().uuid("Not a commission id") });

/** The thread (and marks it read). `?as=client` reads it as the client, for someone who is also a member. */
export const GET = route({ params, query: threadQuerySchema }, async ({ actor, params: p, query }) =>
  getThread(query.as === "client" ? asClient(actor) : actor, p.id),
);

export const POST = route({ params, query: threadQuerySchema, body: postMessageSchema }, async ({ actor, params: p, query, body }) => {
  const r = await postMessage(query.as === "client" ? asClient(actor) : actor, p.id, body);
  return Response.json({ message: r }, { status: r.created ? 201 : 200 });
});
