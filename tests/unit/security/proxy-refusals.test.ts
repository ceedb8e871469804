// The proxy itself, called as Next calls it: requests Next's own code would answer 500 are refused
// first (400/403/411/413), and a real action request goes on (no response of its own: NextResponse.next).
import { NextRequest } from "next/server";
import { describe, expect, test, vi } from "vitest";
import { proxy } from "@/proxy";

vi.hoisted(() => {
  // The settings the proxy reads for its headers (no service is contacted).
  process.env.DATABASE_URL ??= "postgres://darnwell@127.0.0.1:1/none";
  process.env.BETTER_AUTH_SECRET ??= "test-secret-test-secret-test-secret-0123";
  process.env.SMTP_URL ??= "smtp://127.0.0.1:1";
});

const HOST = "127.0.0.1:3301";
const req = (path: string, init: { method?: string; headers?: Record<string, string>; body?: string } = {}) =>
  new NextRequest(`http://${HOST}${path}`, { method: init.method ?? "GET", headers: { host: HOST, ...init.headers }, body: init.body });
const action = (body: string, headers: Record<string, string> = {}) =>
  req("/portal", {
    method: "POST",
    body,
    headers: { "next-action": "7f".padEnd(42, "a"), origin: `http://${HOST}`, "content-type": "text/plain;charset=UTF-8", "content-length": String(Buffer.byteLength(body)), ...headers },
  });
const passes = (r: Response) => r.headers.get("x-middleware-next") === "1";

describe("proxy refusals", () => {
  test.each([
    ["malformed path", req("/studio/pieces/%ED%A0%80"), 400],
    ["garbage action body", action("garbage{"), 400],
    ["action without a length", action("[]", { "content-length": "" }), 411],
    ["action over 1 MB", action("[]", { "content-length": String(2 * 1024 * 1024) }), 413],
    ["action from another site", action("[]", { origin: "https://evil.test" }), 403],
  ])("%s → %s", async (_label, request, status) => {
    const res = await proxy(request);
    expect(passes(res)).toBe(false);
    expect(res.status).toBe(status);
  });

  test("a well-formed action and ordinary pages go on to Next", async () => {
    expect(passes(await proxy(action('["hollin-knitworks",{"name":"Ada"}]')))).toBe(true);
    expect(passes(await proxy(req("/studio/pieces/0b0e0c1a-0000-4000-8000-000000000001")))).toBe(true);
    expect(passes(await proxy(req("/api/yarns", { method: "POST", body: "{}", headers: { "content-type": "application/json" } })))).toBe(true);
  });
});
