// The local payments fake for one test file: started before the file's tests with keys of its own,
// its signed events delivered straight into the app's webhook route handler, and the environment put
// back afterwards. Call at the top of a file; `fake()` is ready in any later beforeAll.
import { randomBytes } from "node:crypto";
import { afterAll, beforeAll } from "vitest";
import { POST as webhookPOST } from "@/app/api/payments/webhook/route";
import { startPaymentsFake, type PaymentsFake } from "@/scripts/fakes/payments";

export function paymentsFakeForFile() {
  const secret = `sk_test_${randomBytes(12).toString("hex")}`;
  const webhookSecret = `whsec_${randomBytes(12).toString("hex")}`;
  const hook = (payload: string, signature: string) =>
    webhookPOST(new Request("http://127.0.0.1/api/payments/webhook", { method: "POST", headers: { "stripe-signature": signature, "content-type": "application/json" }, body: payload }));
  let running: PaymentsFake | undefined;
  const saved = { key: process.env.STRIPE_SECRET_KEY, hook: process.env.STRIPE_WEBHOOK_SECRET, url: process.env.STRIPE_API_URL };
  beforeAll(async () => {
    running = await startPaymentsFake({
      port: 0,
      secretKey: secret,
      webhookSecret,
      retryBaseMs: 20,
      maxAttempts: 4,
      deliver: async (payload, headers) => (await hook(payload, headers["stripe-signature"])).status,
    });
    process.env.STRIPE_SECRET_KEY = secret;
    process.env.STRIPE_WEBHOOK_SECRET = webhookSecret;
    process.env.STRIPE_API_URL = running.url;
  });
  afterAll(async () => {
    await running?.close();
    for (const [k, v] of [["STRIPE_SECRET_KEY", saved.key], ["STRIPE_WEBHOOK_SECRET", saved.hook], ["STRIPE_API_URL", saved.url]] as const) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  });
  return {
    secret,
    webhookSecret,
    hook,
    fake(): PaymentsFake {
      if (!running) throw new Error("the payments fake starts in beforeAll: call fake() inside a hook or a test");
      return running;
    },
  };
}
