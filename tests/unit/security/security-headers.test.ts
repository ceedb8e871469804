import { describe, expect, test } from "vitest";
import { checkoutOrigins, contentSecurityPolicy, securityHeaders, storageOrigins } from "@/lib/server/security-headers";

const base = { nonce: "abc123==", appUrl: "http://127.0.0.1:3000", storageOrigins: ["http://127.0.0.1:4568"], checkoutOrigins: ["http://127.0.0.1:12111"], dev: false, api: false };
const directives = (csp: string) => new Map(csp.split("; ").map((d) => [d.split(" ")[0], d.split(" ").slice(1)] as const));

describe("security headers", () => {
  test("pages: nonce-based scripts, no framing, no plugins, photos from storage", () => {
    const csp = directives(contentSecurityPolicy(base));
    expect(csp.get("script-src")).toEqual(["'self'", "'nonce-abc123=='", "'strict-dynamic'"]);
    expect(csp.get("script-src")).not.toContain("'unsafe-inline'");
    expect(csp.get("style-src-elem")).not.toContain("'unsafe-inline'");
    expect(csp.get("frame-ancestors")).toEqual(["'none'"]);
    expect(csp.get("object-src")).toEqual(["'none'"]);
    expect(csp.get("img-src")).toContain("http://127.0.0.1:4568");
    expect(csp.get("form-action")).toEqual(["'self'", "http://127.0.0.1:12111"]);
    expect(csp.has("upgrade-insecure-requests")).toBe(false);
    // the editor's garment worker: same-origin scripts, never blob: or data: workers
    expect(csp.get("worker-src")).toEqual(["'self'"]);
  });

  test("eval only under next dev", () => {
    expect(contentSecurityPolicy({ ...base, dev: true })).toContain("'unsafe-eval'");
    expect(contentSecurityPolicy(base)).not.toContain("'unsafe-eval'");
  });

  test("HSTS and upgrade-insecure-requests only when the app's URL is https", () => {
    expect(securityHeaders(base)["Strict-Transport-Security"]).toBeUndefined();
    const https = securityHeaders({ ...base, appUrl: "https://studio.example.com" });
    expect(https["Strict-Transport-Security"]).toMatch(/^max-age=\d{8,}/);
    expect(https["Content-Security-Policy"]).toContain("upgrade-insecure-requests");
  });

  test("every response: nosniff, referrer policy, permissions policy, no framing", () => {
    for (const api of [false, true]) {
      const h = securityHeaders({ ...base, api });
      expect(h["X-Content-Type-Options"]).toBe("nosniff");
      expect(h["Referrer-Policy"]).toBe("strict-origin-when-cross-origin");
      expect(h["Permissions-Policy"]).toContain("camera=()");
      expect(h["X-Frame-Options"]).toBe("DENY");
      expect(h["Content-Security-Policy"]).toContain("frame-ancestors 'none'");
    }
    // API responses (JSON, PDFs) carry no page policy.
    expect(securityHeaders({ ...base, api: true })["Content-Security-Policy"]).toBe("frame-ancestors 'none'");
  });

  test("checkout origins: the local payments fake, or Stripe's hosted checkout", () => {
    expect(checkoutOrigins("http://127.0.0.1:12111/v1")).toEqual(["http://127.0.0.1:12111"]);
    expect(checkoutOrigins(undefined)).toEqual(["https://checkout.stripe.com"]);
  });

  test("storage origins: the configured endpoint, or the bucket's AWS endpoints", () => {
    expect(storageOrigins("http://127.0.0.1:4568/", "darnwell", "us-east-1")).toEqual(["http://127.0.0.1:4568"]);
    expect(storageOrigins(undefined, "darnwell", "eu-west-2")).toEqual(["https://darnwell.s3.eu-west-2.amazonaws.com", "https://s3.eu-west-2.amazonaws.com"]);
  });
});
