// Runs before every request except static files: (1) moves client-sent forwarding headers aside so
// handlers see the socket's address (lib/server/client-address.ts); (2) the security headers and the
// per-request CSP nonce (lib/server/security-headers.ts; Next.js's documented nonce pattern).
// Sessions are checked in each page, action and route, never here.
import { randomBytes } from "node:crypto";
import { NextResponse, type NextRequest } from "next/server";
import { env } from "@/lib/env";
import { moveForwardingHeaders } from "@/lib/server/client-address";
import { checkoutOrigins, contentSecurityPolicy, securityHeaders, storageOrigins } from "@/lib/server/security-headers";

export function proxy(request: NextRequest) {
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

// Every request but build assets, so no handler ever sees a client's own X-Forwarded-For. No
// `missing` conditions: a header a client can add must not switch this off.
export const config = {
  matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"],
};
