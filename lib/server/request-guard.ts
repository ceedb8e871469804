import "server-only";
// Refuses cross-site state changes before a handler runs. A browser sends `Origin` (and, in current
// browsers, `Sec-Fetch-Site`) with every POST/PUT/PATCH/DELETE, so a page on another origin (another
// port on the same host included: same-site, but not same-origin) is recognised and refused even when
// it carries the signed-in person's cookies. Requests with neither header come from scripts, not
// browsers, and carry no victim's cookies, so they pass. JSON bodies must be declared as JSON: a
// `text/plain` body is what a plain HTML form can send cross-site without a preflight.
import { env } from "@/lib/env";

const UNSAFE = new Set(["POST", "PUT", "PATCH", "DELETE"]);

export interface GuardDecision {
  status: 403 | 415;
  code: "cross_site" | "unsupported_media_type";
  message: string;
}

/** The app's own origin, from BETTER_AUTH_URL (scheme, host and port). */
export function appOrigin(): string {
  return new URL(env.BETTER_AUTH_URL).origin;
}

/** True when the media type of a Content-Type header is application/json (parameters allowed). */
export function isJsonContentType(value: string | null): boolean {
  if (!value) return false;
  return value.split(";")[0]!.trim().toLowerCase() === "application/json";
}

/**
 * The pure decision: null when the request may go on, otherwise why not. `jsonBody` is true when the
 * handler reads a JSON body.
 */
export function crossSiteDecision(
  req: { method: string; headers: Headers },
  origin: string,
  opts: { jsonBody?: boolean } = {},
): GuardDecision | null {
  if (!UNSAFE.has(req.method.toUpperCase())) return null;
  const site = req.headers.get("sec-fetch-site");
  const from = req.headers.get("origin");
  if (site !== null && site !== "same-origin") {
    return { status: 403, code: "cross_site", message: "This request came from another site, so it was refused. Use Darnwell's own pages." };
  }
  if (from !== null && from !== origin) {
    return { status: 403, code: "cross_site", message: `This request came from another origin (${from.slice(0, 100)}), so it was refused. Use Darnwell's own pages.` };
  }
  if (opts.jsonBody && !isJsonContentType(req.headers.get("content-type"))) {
    return { status: 415, code: "unsupported_media_type", message: "Send the body as JSON with the header Content-Type: application/json." };
  }
  return null;
}

/** The answer for a refused request, or null to go on. Called first by route() and by handlers outside it. */
export function refuseCrossSite(req: Request, opts: { jsonBody?: boolean } = {}): Response | null {
  const d = crossSiteDecision(req, appOrigin(), opts);
  if (!d) return null;
  return Response.json({ error: { code: d.code, message: d.message } }, { status: d.status });
}
