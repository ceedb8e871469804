// Runs before every request except static files: (0) a server action that Next's own decoding would
// answer 500 gets 403/411/413/400 here (foreign Origin, no length, over 1 MB, not React's reply encoding:
// lib/action-request-guard.ts); (1) moves client-sent forwarding headers aside so
// handlers see the socket's address (lib/server/client-address.ts); (2) the security headers and the
// per-request CSP nonce (lib/server/security-headers.ts; Next.js's documented nonce pattern).
// Sessions are checked in each page, action and route, never here.
import { randomBytes } from "node:crypto";
import { NextResponse, type NextRequest } from "next/server";
import { actionBodyRefusal, actionHeaderRefusal, isActionRequest } from "@/lib/action-request-guard";
import { env } from "@/lib/env";
import { malformedPathResponse } from "@/lib/path-guard";
import { moveForwardingHeaders } from "@/lib/server/client-address";
import { checkoutOrigins, contentSecurityPolicy, securityHeaders, storageOrigins } from "@/lib/server/security-headers";

export async function proxy(request: NextRequest) {
  const badPath = malformedPathResponse(request.nextUrl.pathname);
  if (badPath) return badPath;
  // A request Next would run as a server action: refused here if Next's own decoding would fail (500).
  if (isActionRequest(request.method, request.headers, request.nextUrl.pathname)) {
    const refused = actionHeaderRefusal(request.headers) ?? (await actionBodyRefusal(request));
    if (refused) return refused;
  }
  const nonce = randomBytes(16).toString("base64");
  const options = {
    nonce,
    appUrl: env.BETTER_AUTH_URL,
    storageOrigins: storageOrigins(env.S3_ENDPOINT, env.S3_BUCKET, env.S3_REGION),
    checkoutOrigins: checkoutOrigins(env.STRIPE_API_URL),
    dev: env.NODE_ENV === "development",
    api: request.nextUrl.pathname.startsWith("/api/"),
  };
  const headers = moveForwardingHeaders(request.headers);
  headers.delete("x-nonce");
  if (!options.api) {
    headers.set("x-nonce", nonce);
    headers.set("Content-Security-Policy", contentSecurityPolicy(options));
  }
  const response = NextResponse.next({ request: { headers } });
  for (const [k, v] of Object.entries(securityHeaders(options))) response.headers.set(k, v);
  return response;
}

// Next.js buffers the body of every request a proxy runs for (until the whole body has arrived, and
// cut at experimental.proxyClientMaxBodySize). So the photo uploads, which stream their bodies, are
// left out, except when a forwarding header arrived: then the proxy must move it aside (and such an
// upload is buffered, within the limit set in next.config.mjs). Without one, `next start` itself puts
// the socket's address in X-Forwarded-For. Matching happens on the headers as the client sent them
// (checked in tests/unit/security/proxy-matcher.test.ts).
// (Literal on purpose: Next.js reads this config at build time without running it.)
export const config = {
  matcher: [
    // Everything but build assets and the uploads, always (an upload whose id holds a "%" too, so a
    // malformed encoding gets the proxy's 400, lib/path-guard.ts). No `missing` conditions: a header a client can
    // add must not switch the proxy off.
    "/((?!_next/static|_next/image|favicon.ico|api/studios/[^/%]+/request-photos|api/commissions/[^/%]+/uploads|api/production/pieces/[^/%]+/photos).*)",
    { source: "/api/studios/:slug/request-photos", has: [{ type: "header", key: "x-forwarded-for" }] },
    { source: "/api/studios/:slug/request-photos", has: [{ type: "header", key: "x-darnwell-forwarded-for" }] },
    { source: "/api/studios/:slug/request-photos", has: [{ type: "header", key: "x-darnwell-client-address" }] },
    { source: "/api/commissions/:id/uploads", has: [{ type: "header", key: "x-forwarded-for" }] },
    { source: "/api/commissions/:id/uploads", has: [{ type: "header", key: "x-darnwell-forwarded-for" }] },
    { source: "/api/commissions/:id/uploads", has: [{ type: "header", key: "x-darnwell-client-address" }] },
    { source: "/api/production/pieces/:id/photos", has: [{ type: "header", key: "x-forwarded-for" }] },
    { source: "/api/production/pieces/:id/photos", has: [{ type: "header", key: "x-darnwell-forwarded-for" }] },
    { source: "/api/production/pieces/:id/photos", has: [{ type: "header", key: "x-darnwell-client-address" }] },
  ],
};
