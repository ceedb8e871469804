// Which requests the proxy (security headers, forwarding headers moved aside) runs for.
import { unstable_doesMiddlewareMatch } from "next/experimental/testing/server";
import { describe, expect, test } from "vitest";
import { config } from "@/proxy";
import { CLIENT_ADDRESS_HEADER, FORWARDED_CHAIN_HEADER } from "@/lib/server/client-address";

const runs = (url: string, headers: Record<string, string> = {}) => unstable_doesMiddlewareMatch({ config, url, headers });
const UPLOADS = ["/api/studios/hollin-knitworks/request-photos", "/api/commissions/0b0e0c1a-0000-4000-8000-000000000001/uploads", "/api/production/pieces/0b0e0c1a-0000-4000-8000-000000000001/photos"];

describe("the proxy's matcher", () => {
  test.each(["/", "/sign-in", "/studio/commissions/x", "/local-inbox", "/api/auth/sign-in/email", "/api/commissions/x/messages", "/api/payments/webhook", "/api/health"])(
    "runs for %s",
    (url) => expect(runs(url)).toBe(true),
  );

  test.each(["/_next/static/chunks/app.js", "/_next/image", "/favicon.ico"])("skips the build asset %s", (url) => expect(runs(url)).toBe(false));

  test.each(UPLOADS)("skips the streamed upload %s when no forwarding header arrived (Next sets the socket's address)", (url) => {
    expect(runs(url)).toBe(false);
  });

  test.each(UPLOADS.flatMap((url) => ["x-forwarded-for", FORWARDED_CHAIN_HEADER, CLIENT_ADDRESS_HEADER].map((h) => [url, h] as const)))(
    "runs for %s when it carries %s, which it then moves aside",
    (url, header) => expect(runs(url, { [header]: "9.9.9.9" })).toBe(true),
  );

  test.each(["/api/commissions/%ED%A0%80/uploads", "/api/production/pieces/%FF/photos", "/api/studios/%C0%80/request-photos"])(
    "runs for the upload %s whose id is malformed, so it gets the proxy's 400 (lib/path-guard.ts)",
    (url) => expect(runs(url)).toBe(true),
  );

  test("a header a client can add does not switch it off (the prefetch headers of the docs' example are not used)", () => {
    expect(runs("/api/auth/sign-in/email", { "next-router-prefetch": "1", purpose: "prefetch", "x-forwarded-for": "9.9.9.9" })).toBe(true);
  });
});
