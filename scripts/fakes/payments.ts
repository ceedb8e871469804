// Local payments service: the small part of the Stripe REST API Darnwell uses, on loopback.
// Form-encoded requests (bracket notation), Stripe-shaped JSON objects and errors, API key check,
// Idempotency-Key honoured, a hosted payment page (/pay/:session) with Pay and Decline, and signed
// webhooks (Stripe-Signature: t=…,v1=HMAC-SHA256 of "t.payload") delivered with retries.
//   tsx scripts/fakes/payments.ts --port 12111 --secret-key sk_test_… --webhook-secret whsec_… \
//     --webhook-url http://127.0.0.1:3000/api/payments/webhook --store .data/payments.json
// Also startable from code (tests): startPaymentsFake({ port: 0, … }).
import { createHash, createHmac, randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createServer, type IncomingMessage, type Server, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { parseArgs } from "node:util";
import { PROVIDER_CURRENCIES, PROVIDER_THREE_DECIMAL, PROVIDER_ZERO_DECIMAL } from "../../lib/core/pricing/provider-currency";

/** The test card that is always declined (as in Stripe's test mode). */
export const DECLINED_CARD = "4000000000000002";
export const GOOD_CARD = "4242424242424242";

type Json = Record<string, unknown>;

interface StoredEvent {
  id: string;
  type: string;
  payload: string;
  deliveries: { at: string; status: number | string }[];
  delivered: boolean;
}

interface State {
  customers: Record<string, Json>;
  sessions: Record<string, Json>;
  paymentIntents: Record<string, Json>;
  charges: Record<string, Json>;
  refunds: Record<string, Json>;
  events: StoredEvent[];
  idempotency: Record<string, { fingerprint: string; status: number; body: string }>;
}

export interface PaymentsFakeOptions {
  port?: number;
  host?: string;
  secretKey: string;
  webhookSecret: string;
  /** where signed webhooks go; may be set later with setWebhookUrl or POST /__fake/config */
  webhookUrl?: string;
  /** deliver in-process instead of over HTTP (tests); returns the HTTP status the app answered */
  deliver?: (payload: string, headers: Record<string, string>) => Promise<number>;
  /** JSON file the state is kept in (survives restarts) */
  store?: string;
  /** first retry delay in ms (doubles each time); default 500 */
  retryBaseMs?: number;
  maxAttempts?: number;
  /** deliver webhooks automatically (default true) */
  autoDeliver?: boolean;
}

export interface PaymentsFake {
  url: string;
  port: number;
  state: State;
  close: () => Promise<void>;
  setWebhookUrl: (url: string) => void;
  /** resolves when every queued webhook has been delivered or given up */
  idle: () => Promise<void>;
  /** the next `count` API requests fail: "error" (500 before doing anything), "error_after" (done, then 500), "hang" */
  injectFault: (mode: FaultMode, count?: number) => void;
  /** turn automatic delivery off (events are kept) or on again */
  setAutoDeliver: (on: boolean) => void;
  /** deliver one stored event now (once, no retries); returns the app's status */
  deliverEvent: (id: string) => Promise<number | string>;
  /** a Stripe-Signature header for a payload, signed with the webhook secret */
  signPayload: (payload: string, timestamp?: number) => string;
}

type FaultMode = "error" | "error_after" | "hang";

const now = () => Math.floor(Date.now() / 1000);
const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString("hex")}`;

/** Form-encoded body in bracket notation → nested object (numeric keys make arrays). */
export function parseForm(body: string): Json {
  const out: Json = {};
  for (const [rawKey, value] of new URLSearchParams(body)) {
    const parts = rawKey.replace(/\]/g, "").split("[");
    let node: Record<string, unknown> | unknown[] = out;
    for (let i = 0; i < parts.length; i++) {
      const key = parts[i];
      const last = i === parts.length - 1;
      const container = node as Record<string, unknown>;
      if (last) {
        container[key] = value;
      } else {
        const nextIsIndex = /^\d+$/.test(parts[i + 1]);
        container[key] ??= nextIsIndex ? [] : {};
        node = container[key] as Record<string, unknown>;
      }
    }
  }
  return out;
}

function stripeError(status: number, type: string, message: string, extra: Json = {}) {
  return { status, body: { error: { type, message, ...extra } } };
}

const escapeHtml = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

// The provider's currency rules in its own API units (docs.stripe.com/currencies): zero-decimal amounts
// are whole units; three-decimal amounts must end in 0; ISK is sent with two decimals that must be 00.
// Written here in API terms, apart from the app's conversion (lib/core/pricing/provider-currency.ts),
// so the tests check that conversion against the rules rather than against itself.
const apiDigits = (code: string) => (PROVIDER_ZERO_DECIMAL.includes(code) ? 0 : PROVIDER_THREE_DECIMAL.includes(code) ? 3 : 2);

/** null when the provider takes the amount, else its error (as the provider words it, roughly). */
export function currencyAmountError(currency: string, amount: number, param: string): ReturnType<typeof stripeError> | null {
  const code = currency.toUpperCase();
  if (!/^[a-z]{3}$/.test(currency) || !PROVIDER_CURRENCIES.includes(code)) {
    return stripeError(400, "invalid_request_error", `Invalid currency: ${currency}. Stripe currently supports these currencies: ${PROVIDER_CURRENCIES.map((c) => c.toLowerCase()).join(", ")}`, { param });
  }
  if (PROVIDER_THREE_DECIMAL.includes(code) && amount % 10 !== 0) {
    return stripeError(400, "invalid_request_error", `Invalid amount. Amounts in ${code} must have a least-significant digit of 0 (round to the nearest ten: ${amount} cannot be charged).`, { code: "amount_invalid", param });
  }
  if (code === "ISK" && amount % 100 !== 0) {
    return stripeError(400, "invalid_request_error", "Invalid amount. Currency ISK has become effectively zero-decimal and charged amounts must be evenly divisible by 100.", { code: "invalid_charge_amount_no_decimal_compatible", param });
  }
  return null;
}

function formatAmount(amount: number, currency: string): string {
  const code = currency.toUpperCase();
  const digits = apiDigits(code);
  const abs = String(Math.abs(amount)).padStart(digits + 1, "0");
  const text = `${amount < 0 ? "-" : ""}${abs.slice(0, abs.length - digits)}${digits > 0 ? "." + abs.slice(abs.length - digits) : ""}`;
  // Exactly the provider's decimals (min = max), never the runtime's locale digits; Intl formats the string exactly.
  return new Intl.NumberFormat("en-GB", { style: "currency", currency: code, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(text as `${number}`);
}

export function signPayload(secret: string, payload: string, timestamp = now()): string {
  const sig = createHmac("sha256", secret).update(`${timestamp}.${payload}`).digest("hex");
  return `t=${timestamp},v1=${sig}`;
}

function emptyState(): State {
  return { customers: {}, sessions: {}, paymentIntents: {}, charges: {}, refunds: {}, events: [], idempotency: {} };
}

export async function startPaymentsFake(opts: PaymentsFakeOptions): Promise<PaymentsFake> {
  const host = opts.host ?? "127.0.0.1";
  const retryBase = opts.retryBaseMs ?? 500;
  const maxAttempts = opts.maxAttempts ?? 8;
  let webhookUrl = opts.webhookUrl;
  let autoDeliver = opts.autoDeliver !== false;
  const state: State = opts.store && existsSync(opts.store) ? { ...emptyState(), ...(JSON.parse(readFileSync(opts.store, "utf8")) as State) } : emptyState();
  const faults: FaultMode[] = [];
  const pending = new Set<Promise<void>>();
  let baseUrl = "";

  const save = () => {
    if (!opts.store) return;
    mkdirSync(path.dirname(opts.store), { recursive: true });
    writeFileSync(opts.store, JSON.stringify(state));
  };

  // --- webhooks -------------------------------------------------------------------------
  async function deliverOnce(ev: StoredEvent): Promise<number | string> {
    const headers = { "content-type": "application/json", "stripe-signature": signPayload(opts.webhookSecret, ev.payload), "user-agent": "Stripe/1.0 (+local fake)" };
    if (opts.deliver) return opts.deliver(ev.payload, headers);
    if (!webhookUrl) return "no webhook url";
    const res = await fetch(webhookUrl, { method: "POST", headers, body: ev.payload, signal: AbortSignal.timeout(10_000) });
    await res.arrayBuffer().catch(() => undefined);
    return res.status;
  }

  function queueDelivery(ev: StoredEvent) {
    if (!autoDeliver) return;
    const run = (async () => {
      for (let attempt = 1; attempt <= maxAttempts; attempt++) {
        let status: number | string;
        try {
          status = await deliverOnce(ev);
        } catch (err) {
          status = (err as Error).message;
        }
        ev.deliveries.push({ at: new Date().toISOString(), status });
        if (typeof status === "number" && status >= 200 && status < 300) {
          ev.delivered = true;
          break;
        }
        if (attempt < maxAttempts) await new Promise((r) => setTimeout(r, retryBase * 2 ** (attempt - 1)));
      }
      save();
    })();
    pending.add(run);
    void run.finally(() => pending.delete(run));
  }

  function emit(type: string, object: Json) {
    const id = newId("evt");
    const payload = JSON.stringify(
      {
        id,
        object: "event",
        api_version: "2025-10-29.clover",
        created: now(),
        data: { object },
        livemode: false,
        pending_webhooks: 1,
        request: { id: null, idempotency_key: null },
        type,
      },
      null,
      2,
    );
    const ev: StoredEvent = { id, type, payload, deliveries: [], delivered: false };
    state.events.push(ev);
    save();
    queueDelivery(ev);
  }

  // --- API ------------------------------------------------------------------------------
  function createCustomer(p: Json): Json {
    const c = { id: newId("cus"), object: "customer", created: now(), email: p.email ?? null, name: p.name ?? null, metadata: p.metadata ?? {}, livemode: false };
    state.customers[c.id] = c;
    return c;
  }

  function createSession(p: Json) {
    const items = (p.line_items as Json[] | undefined) ?? [];
    if (p.mode !== "payment") return stripeError(400, "invalid_request_error", "Only mode=payment is supported here.", { param: "mode" });
    if (!p.success_url) return stripeError(400, "invalid_request_error", "Missing required param: success_url.", { param: "success_url" });
    if (items.length === 0) return stripeError(400, "invalid_request_error", "Missing required param: line_items.", { param: "line_items" });
    let amount = 0;
    let currency = "";
    for (const [i, item] of items.entries()) {
      const pd = item.price_data as Json | undefined;
      const unit = Number(pd?.unit_amount);
      const qty = Number(item.quantity ?? 1);
      if (!pd || !Number.isSafeInteger(unit) || unit < 0) {
        return stripeError(400, "invalid_request_error", `Invalid integer: line_items[${i}][price_data][unit_amount]`, { param: `line_items[${i}][price_data][unit_amount]` });
      }
      const cur = String(pd.currency ?? "");
      const refused = currencyAmountError(cur, unit, `line_items[${i}][price_data][unit_amount]`);
      if (refused) return refused;
      if (currency && cur !== currency) return stripeError(400, "invalid_request_error", "All line items must share one currency.", { param: "line_items" });
      currency = cur;
      amount += unit * qty;
    }
    if (amount <= 0) return stripeError(400, "invalid_request_error", "The total must be above zero.", { param: "line_items" });
    if (p.customer && !state.customers[String(p.customer)]) return stripeError(400, "invalid_request_error", `No such customer: '${String(p.customer)}'`, { code: "resource_missing", param: "customer" });
    const id = `cs_test_${randomBytes(16).toString("hex")}`;
    const s = {
      id,
      object: "checkout.session",
      amount_subtotal: amount,
      amount_total: amount,
      cancel_url: p.cancel_url ?? null,
      client_reference_id: p.client_reference_id ?? null,
      created: now(),
      currency,
      customer: p.customer ?? null,
      customer_email: p.customer_email ?? null,
      expires_at: now() + 24 * 3600,
      livemode: false,
      metadata: p.metadata ?? {},
      mode: "payment",
      payment_intent: null as string | null,
      payment_status: "unpaid",
      status: "open",
      success_url: p.success_url,
      url: `${baseUrl}/pay/${id}`,
      line_items_summary: items.map((it) => ({ name: ((it.price_data as Json).product_data as Json | undefined)?.name ?? "Payment", amount: Number((it.price_data as Json).unit_amount) * Number(it.quantity ?? 1) })),
    };
    state.sessions[id] = s;
    return { status: 200, body: s };
  }

  function expireSession(id: string) {
    const s = state.sessions[id];
    if (!s) return stripeError(404, "invalid_request_error", `No such checkout.session: '${id}'`, { code: "resource_missing", param: "session" });
    if (s.status !== "open") return stripeError(400, "invalid_request_error", `Only Checkout Sessions with a status of open can be expired (this one is ${String(s.status)}).`);
    s.status = "expired";
    emit("checkout.session.expired", s);
    return { status: 200, body: s };
  }

  function createRefund(p: Json) {
    const piId = String(p.payment_intent ?? "");
    const pi = state.paymentIntents[piId];
    if (!pi) return stripeError(400, "invalid_request_error", `No such payment_intent: '${piId}'`, { code: "resource_missing", param: "payment_intent" });
    const charge = state.charges[String(pi.latest_charge)];
    if (!charge || pi.status !== "succeeded") return stripeError(400, "invalid_request_error", "This PaymentIntent has no successful charge to refund.", { code: "charge_not_refundable" });
    const remaining = Number(charge.amount) - Number(charge.amount_refunded);
    const amount = p.amount === undefined ? remaining : Number(p.amount);
    if (!Number.isSafeInteger(amount) || amount <= 0) return stripeError(400, "invalid_request_error", "Invalid positive integer: amount", { param: "amount" });
    const refused = currencyAmountError(String(charge.currency), amount, "amount");
    if (refused) return refused;
    if (amount > remaining) {
      return stripeError(400, "invalid_request_error", `Refund amount (${amount}) is greater than unrefunded amount on charge (${remaining}).`, { code: "amount_too_large", param: "amount" });
    }
    const r = { id: newId("re"), object: "refund", amount, currency: charge.currency, charge: charge.id, payment_intent: piId, created: now(), metadata: p.metadata ?? {}, reason: p.reason ?? null, status: "succeeded" };
    state.refunds[r.id] = r;
    charge.amount_refunded = Number(charge.amount_refunded) + amount;
    charge.refunded = charge.amount_refunded === charge.amount;
    emit("charge.refunded", { ...charge, refunds: { object: "list", data: Object.values(state.refunds).filter((x) => x.charge === charge.id) } });
    return { status: 200, body: r };
  }

  function listRefunds(q: URLSearchParams) {
    const pi = q.get("payment_intent");
    const data = Object.values(state.refunds)
      .filter((r) => !pi || r.payment_intent === pi)
      .sort((a, b) => Number(b.created) - Number(a.created));
    return { status: 200, body: { object: "list", data, has_more: false, url: "/v1/refunds" } };
  }

  function route(method: string, pathname: string, q: URLSearchParams, p: Json): { status: number; body: unknown } {
    let m: RegExpMatchArray | null;
    if (method === "POST" && pathname === "/v1/customers") return { status: 200, body: createCustomer(p) };
    if (method === "GET" && (m = pathname.match(/^\/v1\/customers\/([^/]+)$/))) {
      const c = state.customers[m[1]];
      return c ? { status: 200, body: c } : stripeError(404, "invalid_request_error", `No such customer: '${m[1]}'`, { code: "resource_missing", param: "id" });
    }
    if (method === "POST" && pathname === "/v1/checkout/sessions") return createSession(p);
    if (method === "GET" && (m = pathname.match(/^\/v1\/checkout\/sessions\/([^/]+)$/))) {
      const s = state.sessions[m[1]];
      return s ? { status: 200, body: s } : stripeError(404, "invalid_request_error", `No such checkout.session: '${m[1]}'`, { code: "resource_missing", param: "session" });
    }
    if (method === "POST" && (m = pathname.match(/^\/v1\/checkout\/sessions\/([^/]+)\/expire$/))) return expireSession(m[1]);
    if (method === "GET" && (m = pathname.match(/^\/v1\/payment_intents\/([^/]+)$/))) {
      const pi = state.paymentIntents[m[1]];
      return pi ? { status: 200, body: pi } : stripeError(404, "invalid_request_error", `No such payment_intent: '${m[1]}'`, { code: "resource_missing", param: "intent" });
    }
    if (method === "POST" && pathname === "/v1/refunds") return createRefund(p);
    if (method === "GET" && pathname === "/v1/refunds") return listRefunds(q);
    return stripeError(404, "invalid_request_error", `Unrecognized request URL (${method}: ${pathname}).`);
  }

  // --- hosted page ----------------------------------------------------------------------
  function payPage(s: Json, message?: { tone: "error" | "info"; text: string }): string {
    const amount = formatAmount(Number(s.amount_total), String(s.currency));
    const items = (s.line_items_summary as { name: string }[] | undefined) ?? [];
    const open = s.status === "open";
    return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Pay ${escapeHtml(amount)} (local test payments)</title>
<style>
body{font-family:system-ui,sans-serif;background:#f6f4ef;color:#222;margin:0;padding:24px;line-height:1.5}
main{max-width:420px;margin:0 auto;background:#fff;border:1px solid #ccc;border-radius:8px;padding:24px}
label{display:block;font-weight:600;margin-top:12px}input{font-size:1rem;padding:8px;width:100%;box-sizing:border-box;border:1px solid #777;border-radius:4px}
button{font-size:1rem;padding:10px 18px;border-radius:6px;border:1px solid #333;margin-top:16px;margin-right:8px;cursor:pointer}
.pay{background:#1f4d7a;color:#fff;border-color:#1f4d7a}.decline{background:#fff;color:#222}
:focus-visible{outline:3px solid #b45309;outline-offset:2px}.error{border-left:4px solid #a3342a;padding:8px 12px;background:#fff4f2}.info{border-left:4px solid #1f4d7a;padding:8px 12px}
</style></head>
<body><main>
<p>Local test payments. No real money moves.</p>
<h1>Pay ${escapeHtml(amount)}</h1>
<ul>${items.map((i) => `<li>${escapeHtml(String(i.name))}</li>`).join("")}</ul>
${message ? `<p role="${message.tone === "error" ? "alert" : "status"}" class="${message.tone}">${escapeHtml(message.text)}</p>` : ""}
${
  open
    ? `<form method="post" action="/pay/${escapeHtml(String(s.id))}">
<label for="card">Card number</label>
<input id="card" name="card" inputmode="numeric" autocomplete="cc-number" value="4242 4242 4242 4242" aria-describedby="card-hint">
<p id="card-hint">Test cards: 4242 4242 4242 4242 is paid; 4000 0000 0000 0002 is declined.</p>
<button class="pay" type="submit" name="action" value="pay">Pay ${escapeHtml(amount)}</button>
<button class="decline" type="submit" name="action" value="decline">Decline</button>
</form>`
    : `<p>This payment is ${escapeHtml(String(s.status))}.</p>`
}
</main></body></html>`;
  }

  function completeSession(s: Json) {
    const piId = newId("pi");
    const chId = newId("ch");
    const amount = Number(s.amount_total);
    state.charges[chId] = { id: chId, object: "charge", amount, amount_refunded: 0, currency: s.currency, payment_intent: piId, refunded: false, paid: true, status: "succeeded", created: now(), metadata: s.metadata };
    state.paymentIntents[piId] = { id: piId, object: "payment_intent", amount, amount_received: amount, currency: s.currency, status: "succeeded", latest_charge: chId, metadata: s.metadata, customer: s.customer, created: now(), last_payment_error: null };
    s.payment_intent = piId;
    s.payment_status = "paid";
    s.status = "complete";
    emit("checkout.session.completed", s);
  }

  function failPayment(s: Json) {
    const piId = (s.payment_intent as string | null) ?? newId("pi");
    const pi = {
      id: piId,
      object: "payment_intent",
      amount: s.amount_total,
      amount_received: 0,
      currency: s.currency,
      status: "requires_payment_method",
      latest_charge: null,
      metadata: s.metadata,
      customer: s.customer,
      created: now(),
      last_payment_error: { type: "card_error", code: "card_declined", decline_code: "generic_decline", message: "Your card was declined." },
    };
    state.paymentIntents[piId] = pi;
    s.payment_intent = piId;
    emit("payment_intent.payment_failed", pi);
  }

  async function handlePay(id: string, req: IncomingMessage, res: ServerResponse) {
    const s = state.sessions[id];
    if (!s) return send(res, 404, "<!doctype html><html lang=en><title>Not found</title><main><h1>No such payment</h1></main></html>", "text/html");
    if (req.method === "GET") return send(res, 200, payPage(s), "text/html");
    const form = new URLSearchParams(await readBody(req));
    if (s.status !== "open") return send(res, 409, payPage(s, { tone: "error", text: "This payment can no longer be made." }), "text/html");
    if (form.get("action") === "decline") {
      s.status = "expired";
      emit("checkout.session.expired", s);
      save();
      return redirect(res, String(s.cancel_url ?? s.success_url));
    }
    const card = (form.get("card") ?? "").replace(/\D/g, "");
    if (card === DECLINED_CARD) {
      failPayment(s);
      save();
      return send(res, 402, payPage(s, { tone: "error", text: "Your card was declined. Try another card, or decline to go back." }), "text/html");
    }
    completeSession(s);
    save();
    return redirect(res, String(s.success_url).replace("{CHECKOUT_SESSION_ID}", id));
  }

  // --- HTTP plumbing ----------------------------------------------------------------------
  function readBody(req: IncomingMessage): Promise<string> {
    return new Promise((resolve, reject) => {
      const chunks: Buffer[] = [];
      req.on("data", (c: Buffer) => chunks.push(c));
      req.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
      req.on("error", reject);
    });
  }
  function send(res: ServerResponse, status: number, body: string, type = "application/json") {
    res.writeHead(status, { "content-type": `${type}; charset=utf-8`, "request-id": newId("req") });
    res.end(body);
  }
  function redirect(res: ServerResponse, to: string) {
    res.writeHead(303, { location: to });
    res.end();
  }

  async function handleApi(req: IncomingMessage, res: ServerResponse, url: URL) {
    const auth = req.headers.authorization ?? "";
    const key = auth.startsWith("Bearer ") ? auth.slice(7) : "";
    const body = await readBody(req);
    if (key !== opts.secretKey) {
      const e = stripeError(401, "invalid_request_error", key ? `Invalid API Key provided: ${key.slice(0, 8)}…` : "You did not provide an API key.");
      return send(res, e.status, JSON.stringify(e.body));
    }
    const fault = faults.shift();
    if (fault === "hang") return; // never answers: the client's timeout decides
    if (fault === "error") return send(res, 500, JSON.stringify(stripeError(500, "api_error", "Something went wrong on the payments side (injected fault).").body));
    const method = req.method ?? "GET";
    const idem = method === "POST" ? (req.headers["idempotency-key"] as string | undefined) : undefined;
    const fingerprint = createHash("sha256").update(`${method} ${url.pathname} ${body}`).digest("hex");
    let status: number;
    let out: string;
    const seen = idem ? state.idempotency[idem] : undefined;
    if (seen) {
      if (seen.fingerprint !== fingerprint) {
        const e = stripeError(400, "idempotency_error", `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idem}' if you meant to execute a different request.`);
        return send(res, e.status, JSON.stringify(e.body));
      }
      status = seen.status;
      out = seen.body;
      res.setHeader("idempotent-replayed", "true");
    } else {
      const r = route(method, url.pathname, url.searchParams, parseForm(body));
      status = r.status;
      out = JSON.stringify(r.body);
      // Stripe keeps results of requests that ran (not of 500s); so do we.
      if (idem && status < 500) state.idempotency[idem] = { fingerprint, status, body: out };
      save();
    }
    if (fault === "error_after") return send(res, 500, JSON.stringify(stripeError(500, "api_error", "The answer was lost (injected fault).").body));
    send(res, status, out);
  }

  async function handleControl(req: IncomingMessage, res: ServerResponse, url: URL) {
    const auth = req.headers.authorization ?? "";
    if (auth !== `Bearer ${opts.secretKey}`) return send(res, 401, JSON.stringify({ error: "key" }));
    const p = parseForm(await readBody(req));
    if (url.pathname === "/__fake/events") return send(res, 200, JSON.stringify(state.events));
    if (url.pathname === "/__fake/config" && typeof p.webhook_url === "string") {
      webhookUrl = p.webhook_url;
      return send(res, 200, JSON.stringify({ webhook_url: webhookUrl }));
    }
    if (url.pathname === "/__fake/faults") {
      for (let i = 0; i < Number(p.count ?? 1); i++) faults.push((p.mode as FaultMode) ?? "error");
      return send(res, 200, JSON.stringify({ queued: faults.length }));
    }
    send(res, 404, JSON.stringify({ error: "unknown control" }));
  }

  const server: Server = createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://fake");
    const done = (p: Promise<void>) => p.catch((err: Error) => send(res, 500, JSON.stringify(stripeError(500, "api_error", err.message).body)));
    if (url.pathname === "/health") return send(res, 200, JSON.stringify({ ok: true }));
    const pay = url.pathname.match(/^\/pay\/([A-Za-z0-9_]+)$/);
    if (pay) return void done(handlePay(pay[1], req, res));
    if (url.pathname.startsWith("/__fake/")) return void done(handleControl(req, res, url));
    if (url.pathname.startsWith("/v1/")) return void done(handleApi(req, res, url));
    send(res, 404, JSON.stringify({ error: { type: "invalid_request_error", message: "Not found" } }));
  });

  await new Promise<void>((resolve) => server.listen(opts.port ?? 0, host, resolve));
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${host}:${port}`;
  // Sessions made before a restart keep working on the new address.
  for (const s of Object.values(state.sessions)) s.url = `${baseUrl}/pay/${String(s.id)}`;
  // Redeliver what was still pending when the fake stopped.
  for (const ev of state.events) if (!ev.delivered && ev.deliveries.length < maxAttempts) queueDelivery(ev);

  return {
    url: baseUrl,
    port,
    state,
    setWebhookUrl: (u) => {
      webhookUrl = u;
    },
    setAutoDeliver: (on) => {
      autoDeliver = on;
    },
    deliverEvent: async (id) => {
      const ev = state.events.find((e) => e.id === id);
      if (!ev) return "no such event";
      const status = await deliverOnce(ev);
      ev.deliveries.push({ at: new Date().toISOString(), status });
      if (typeof status === "number" && status < 300) ev.delivered = true;
      return status;
    },
    injectFault: (mode, count = 1) => {
      for (let i = 0; i < count; i++) faults.push(mode);
    },
    idle: async () => {
      while (pending.size) await Promise.all([...pending]);
    },
    signPayload: (payload, ts) => signPayload(opts.webhookSecret, payload, ts),
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

async function main() {
  const { values } = parseArgs({
    options: {
      port: { type: "string", default: "12111" },
      "secret-key": { type: "string" },
      "webhook-secret": { type: "string" },
      "webhook-url": { type: "string" },
      store: { type: "string" },
    },
  });
  const secretKey = values["secret-key"] ?? process.env.STRIPE_SECRET_KEY;
  const webhookSecret = values["webhook-secret"] ?? process.env.STRIPE_WEBHOOK_SECRET;
  if (!secretKey || !webhookSecret) {
    console.error("payments fake: pass --secret-key and --webhook-secret (or STRIPE_SECRET_KEY / STRIPE_WEBHOOK_SECRET)");
    process.exit(1);
  }
  const fake = await startPaymentsFake({
    port: Number(values.port),
    secretKey,
    webhookSecret,
    webhookUrl: values["webhook-url"],
    store: values.store ? path.resolve(values.store) : undefined,
  });
  console.log(`payments fake on ${fake.url}; webhooks to ${values["webhook-url"] ?? "(not set)"}`);
  const stop = () => void fake.close().then(() => process.exit(0));
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
}

if (process.argv[1] && /payments\.ts$/.test(process.argv[1])) void main();
