// Checks a request that Next.js would try to run as a server action BEFORE the framework decodes it,
// because every failure inside Next's decoding is answered 500 (a foreign or unparsable Origin, a body
// without a length that then runs over the limit, a body that is not React's reply encoding, a
// reference to a part that was not sent). proxy.ts calls these; real actions pass unchanged.
// React's reply encoding (react-server-dom "decodeReply"): a text/plain body is one JSON text (the
// argument list); a multipart body holds that JSON in field "0", further JSON parts in fields named by
// hex ids, and FormData arguments as fields "<id>_<name>". Strings starting with "$" are references or
// special values; a literal "$" is escaped "$$". No-JavaScript forms post multipart fields
// "$ACTION_REF_n" + "$ACTION_n:0" ({id, bound}) + "$ACTION_n:<hex>" parts, or "$ACTION_ID_<id>".
// Kept free of framework imports so the proxy can call it and tests can table it.
import { MAX_ACTION_BYTES } from "./action-body-limit";

/** Our actions take at most a handful of arguments and shallow values; far under React's own limits. */
export const MAX_ACTION_ARGS = 16;
export const MAX_ACTION_DEPTH = 32;
export const MAX_ACTION_NODES = 20_000;

function refuse(status: 400 | 403 | 411 | 413, code: string, message: string): Response {
  return Response.json({ error: { code, message } }, { status });
}

function contentTypeOf(headers: Headers): string {
  return (headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
}

/** Would Next.js treat this request as a server action (fetch action, or a no-JavaScript form post)? */
export function isActionRequest(method: string, headers: Headers, pathname: string): boolean {
  if (method !== "POST") return false;
  if (headers.has("next-action")) return true;
  return contentTypeOf(headers) === "multipart/form-data" && !pathname.startsWith("/api/");
}

/**
 * The checks that need only the headers: a same-origin Origin when one is sent (Next answers a foreign,
 * "null" or unparsable one with 500), a declared length (411) within the limit (413).
 */
export function actionHeaderRefusal(headers: Headers, limit = MAX_ACTION_BYTES): Response | null {
  const origin = headers.get("origin");
  if (origin !== null) {
    let originHost: string | null = null;
    try {
      originHost = origin === "null" ? null : new URL(origin).host;
    } catch {
      originHost = null;
    }
    const host = headers.get("x-forwarded-host") ?? headers.get("host");
    if (!originHost || !host || originHost !== host.split(",")[0].trim())
      return refuse(403, "cross_origin", "This form was sent from another site; reload the page and try again.");
  }
  const length = headers.get("content-length");
  if (length === null || !/^\d+$/.test(length.trim()))
    return refuse(411, "length_required", "Send the form with a Content-Length.");
  if (Number(length) > limit)
    return refuse(413, "too_large", `The form is larger than ${Math.round(limit / 1024)} KB; send less.`);
  return null;
}

const HEX = /^[0-9a-f]+$/;
const FORBIDDEN_PATH = new Set(["__proto__", "constructor", "prototype"]);

/**
 * Checks one decoded JSON value of a reply: depth, size, and every "$" string is a value React decodes
 * without failing, or a reference to a part that exists (`hasPart(hexId)`). Returns a reason or null.
 */
export function replyValueProblem(root: unknown, hasPart: (id: string) => boolean): string | null {
  let nodes = 0;
  const stack: [unknown, number][] = [[root, 0]];
  while (stack.length) {
    const [v, depth] = stack.pop()!;
    if (++nodes > MAX_ACTION_NODES) return "too many values";
    if (depth > MAX_ACTION_DEPTH) return "nested too deeply";
    if (typeof v === "string") {
      const p = stringProblem(v, hasPart);
      if (p) return p;
    } else if (Array.isArray(v)) {
      for (const x of v) stack.push([x, depth + 1]);
    } else if (v !== null && typeof v === "object") {
      for (const [k, x] of Object.entries(v)) {
        if (k === "__proto__") return "forbidden key";
        stack.push([x, depth + 1]);
      }
    }
  }
  return null;
}

function stringProblem(s: string, hasPart: (id: string) => boolean): string | null {
  if (s[0] !== "$") return null;
  if (s.length === 1) return "bare $"; // never sent (a literal "$" is escaped "$$"); React fails on it
  const kind = s[1];
  const rest = s.slice(2);
  switch (kind) {
    case "$": // an escaped literal
      return null;
    case "u": // undefined
    case "N": // NaN
    case "I": // Infinity
    case "-": // -0 / -Infinity
    case "D": // a date (an invalid one decodes as Invalid Date, which zod refuses)
      return null;
    case "n":
      return /^-?\d{1,300}$/.test(rest) ? null : "bad number";
    case "K": // FormData argument: fields "<id>_<name>", none needed
      return HEX.test(rest) ? null : "bad form reference";
    case "@":
    case "Q":
    case "W":
      return HEX.test(rest) && hasPart(rest) ? null : "reference to a part not sent";
    default: {
      // "$<hex>" or "$<hex>:path:…": an outlined part, possibly a path into it
      const [id, ...path] = s.slice(1).split(":");
      if (!HEX.test(id) || !hasPart(id)) return "reference to a part not sent";
      if (path.some((k) => FORBIDDEN_PATH.has(k))) return "forbidden path";
      return null;
    }
  }
}

function parseJson(text: string): { ok: true; value: unknown } | { ok: false } {
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch {
    return { ok: false };
  }
}

/** Checks a reply: root (an argument list) and every part it can reach. */
function replyProblem(rootText: string | null, part: (id: string) => string | null): string | null {
  if (rootText === null) return "no argument list";
  const seen = new Set<string>();
  const queue: [string, string][] = [["0", rootText]];
  let first = true;
  while (queue.length) {
    const [id, text] = queue.shift()!;
    if (seen.has(id)) continue;
    seen.add(id);
    if (seen.size > 64) return "too many parts";
    const parsed = parseJson(text);
    if (!parsed.ok) return "not a JSON text";
    if (first) {
      first = false;
      if (!Array.isArray(parsed.value)) return "not an argument list";
      if (parsed.value.length > MAX_ACTION_ARGS) return "too many arguments";
    }
    const hasPart = (ref: string) => {
      const key = String(parseInt(ref, 16));
      const t = part(key);
      if (t === null) return false;
      queue.push([key, t]);
      return true;
    };
    const p = replyValueProblem(parsed.value, hasPart);
    if (p) return p;
  }
  return null;
}

function badBody(reason: string): Response {
  return refuse(400, "bad_action_body", `This form arrived in a shape we cannot read (${reason}). Reload the page and try again.`);
}

/**
 * Reads (a clone of) the body of a server-action request whose headers passed and checks it is a reply
 * React decodes without failing. Returns a 400 or null.
 */
export async function actionBodyRefusal(request: Request): Promise<Response | null> {
  const type = contentTypeOf(request.headers);
  const fetchAction = request.headers.has("next-action");
  if (type === "multipart/form-data") {
    let form: FormData;
    try {
      form = await request.clone().formData();
    } catch {
      return badBody("not a readable multipart form");
    }
    const text = (key: string): string | null => {
      const v = form.get(key);
      return typeof v === "string" ? v : null;
    };
    if (fetchAction) {
      const p = replyProblem(text("0"), (id) => text(id));
      return p ? badBody(p) : null;
    }
    // A no-JavaScript form post: check each bound-action reference it carries.
    for (const key of form.keys()) {
      if (!key.startsWith("$ACTION_REF_")) continue;
      const prefix = `$ACTION_${key.slice("$ACTION_REF_".length)}:`;
      const meta = parseJson(text(prefix + "0") ?? "");
      if (!meta.ok || meta.value === null || typeof meta.value !== "object" || Array.isArray(meta.value)) return badBody("no action reference");
      const { id, bound } = meta.value as { id?: unknown; bound?: unknown };
      if (typeof id !== "string") return badBody("no action id");
      if (bound === null || bound === undefined) continue;
      if (typeof bound !== "string" || !/^\$@[0-9a-f]+$/.test(bound)) return badBody("bad bound arguments");
      const boundText = text(prefix + String(parseInt(bound.slice(2), 16)));
      const p = replyProblem(boundText, (pid) => text(prefix + pid));
      if (p) return badBody(p);
    }
    return null;
  }
  if (!fetchAction) return null; // Next does not treat it as an action
  if (type === "application/x-www-form-urlencoded") return null; // Next answers these itself (404)
  let body: string;
  try {
    body = await request.clone().text();
  } catch {
    return badBody("unreadable body");
  }
  const p = replyProblem(body, (id) => (id === "0" ? body : null));
  return p ? badBody(p) : null;
}
