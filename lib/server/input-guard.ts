import "server-only";
// Defence in depth for every entry point: reading a JSON body within a byte limit (checked while
// reading, never after), and a cheap walk of whatever was parsed (JSON, FormData, query, params)
// that refuses nesting deeper than MAX_DEPTH and any text PostgreSQL cannot store, before zod or
// the database see it. The zod schemas in lib/schemas say the same with field-level messages.
import { isSafeNext } from "@/lib/safe-redirect";
import { isStorableText, UNSTORABLE_MESSAGE } from "@/lib/schemas/common";
import { AppError } from "./errors";

/** The largest JSON body a route handler reads (charts and quote drafts are far smaller). */
export const MAX_JSON_BYTES = 1024 * 1024;
/** Deeper than this is no shape of ours (a chart is about 5 levels). */
export const MAX_DEPTH = 32;
/** More values than this in one input is no form or chart of ours either. */
export const MAX_NODES = 200_000;

const tooLarge = (limit: number) =>
  new AppError(413, "too_large", `The request body is larger than ${Math.round(limit / 1024)} KB; send less.`);

/** Reads a JSON body, counting bytes as they arrive: 415 for another content type, 413 past the limit, 400 for bad JSON. */
export async function readJsonBody(req: Request, limit = MAX_JSON_BYTES, opts: { allowEmpty?: boolean } = {}): Promise<unknown> {
  const type = (req.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
  if (type && type !== "application/json" && !/^application\/[a-z0-9.+-]+\+json$/.test(type)) {
    throw new AppError(415, "unsupported_media_type", "Send the request body as JSON (Content-Type: application/json).");
  }
  const declared = Number(req.headers.get("content-length"));
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit);
  if (!req.body) throw new AppError(400, "bad_json", "The request body is missing; send JSON.");
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(limit);
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new AppError(400, "bad_encoding", "The request body is not valid UTF-8 text.");
  }
  if (opts.allowEmpty && text.trim() === "") return undefined;
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError(400, "bad_json", "The request body is not valid JSON.");
  }
}

/**
 * Refuses input that no schema of ours accepts anyway but that could crash a layer before zod
 * answers: nesting deeper than MAX_DEPTH (400), more than MAX_NODES values (413), and a NUL or a
 * lone surrogate in any string or key (422, naming the field). Iterative, so it cannot overflow.
 */
export function assertSafeInput(value: unknown, where = "body"): void {
  const stack: { v: unknown; path: string; depth: number }[] = [{ v: value, path: "", depth: 0 }];
  let nodes = 0;
  while (stack.length) {
    const { v, path, depth } = stack.pop()!;
    if (++nodes > MAX_NODES) throw new AppError(413, "too_large", `The ${where} holds too many values; send less.`);
    if (typeof v === "string") {
      if (!isStorableText(v)) throw unstorable(path);
      continue;
    }
    if (v === null || typeof v !== "object") continue;
    if (depth >= MAX_DEPTH) throw new AppError(400, "too_deep", `The ${where} is nested more than ${MAX_DEPTH} levels deep.`);
    if (Array.isArray(v)) {
      for (let i = 0; i < v.length; i++) stack.push({ v: v[i], path: path ? `${path}.${i}` : String(i), depth: depth + 1 });
      continue;
    }
    for (const [k, child] of Object.entries(v)) {
      const p = path ? `${path}.${k}` : k;
      if (!isStorableText(k)) throw unstorable(path || "_form");
      stack.push({ v: child, path: p, depth: depth + 1 });
    }
  }
}

function unstorable(path: string): AppError {
  const field = path || "_form";
  return new AppError(422, "invalid_input", "Some fields need attention.", { [field]: [UNSTORABLE_MESSAGE] });
}

/** The same checks for FormData: every key and every text value (files are checked by their readers). */
export function assertSafeForm(form: FormData): void {
  let n = 0;
  for (const [k, v] of form.entries()) {
    if (++n > 10_000) throw new AppError(413, "too_large", "The form holds too many fields; send less.");
    if (!isStorableText(k)) throw unstorable("_form");
    if (typeof v === "string" && !isStorableText(v)) throw unstorable(k);
  }
}

/**
 * Last line: a PostgreSQL "data exception" (SQLSTATE class 22: bad date, NUL, out of range…) can
 * only come from a value that got past the checks above. It is answered 422, never 500, and still
 * logged so the gap is seen and closed in the schema.
 */
export function dataExceptionAsInputError(err: unknown): AppError | null {
  for (let e = err, i = 0; e && typeof e === "object" && i < 4; e = (e as { cause?: unknown }).cause, i++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === "string" && /^22[0-9A-Z]{3}$/.test(code)) {
      console.error("input reached the database and was refused there:", code, (e as Error).message);
      return new AppError(422, "invalid_input", "A value in this request cannot be stored. Check dates, numbers and text, and try again.");
    }
  }
  return null;
}

/** Keys through which better-auth is told where to send the browser afterwards. */
const REDIRECT_KEYS = ["callbackURL", "newUserCallbackURL", "errorCallbackURL", "redirectTo"] as const;

function assertRedirects(source: Record<string, unknown>): void {
  for (const k of REDIRECT_KEYS) {
    if (source[k] !== undefined && !isSafeNext(source[k])) {
      throw new AppError(400, "bad_redirect", `${k} must be a path on this site (starting with a single "/").`, { [k]: ["Use a path on this site."] });
    }
  }
}

/** The better-auth endpoints get the same checks: body limit, JSON, storable text, same-origin callbacks. */
export async function guardAuthRequest(req: Request): Promise<Request> {
  const query = Object.fromEntries(new URL(req.url).searchParams);
  assertSafeInput(query, "query");
  assertRedirects(query);
  if (req.method !== "POST" || !req.body) return req;
  const body = await readJsonBody(req, 64 * 1024, { allowEmpty: true });
  if (body === undefined) return new Request(req.url, { method: req.method, headers: req.headers });
  assertSafeInput(body);
  if (body && typeof body === "object" && !Array.isArray(body)) assertRedirects(body as Record<string, unknown>);
  const headers = new Headers(req.headers);
  headers.delete("content-length");
  return new Request(req.url, { method: req.method, headers, body: JSON.stringify(body) });
}
