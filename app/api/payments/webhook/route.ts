// Provider webhooks. No session here: the Stripe-Signature on the raw body is the authority, and
// payment state changes only from events that verify (lib/server/payments handleWebhook).
import { readTextLimited } from "@/lib/server/body-limit";
import { errorResponse } from "@/lib/server/route";
import { handleWebhook, MAX_WEBHOOK_BYTES } from "@/lib/server/payments";

export async function POST(req: Request): Promise<Response> {
  try {
    const raw = await readTextLimited(req, MAX_WEBHOOK_BYTES, "The event is larger than 1 MB; it was not read.");
    const { status, body } = await handleWebhook(raw, req.headers.get("stripe-signature"));
    return Response.json(body, { status });
  } catch (err) {
    // A non-2xx answer makes the provider retry later; the event was not recorded.
    return errorResponse(err);
  }
}
