import { describe, expect, test } from "vitest";
import { crossSiteDecision, isJsonContentType } from "@/lib/server/request-guard";

const APP = "http://127.0.0.1:3000";
const req = (method: string, headers: Record<string, string>) => ({ method, headers: new Headers(headers) });

describe("cross-site request guard", () => {
  test.each([
    ["GET from another origin (safe methods are not guarded)", "GET", { origin: "http://127.0.0.1:4000", "sec-fetch-site": "same-site" }, null],
    ["POST from the app's own pages", "POST", { origin: APP, "sec-fetch-site": "same-origin" }, null],
    ["POST from a script (no Origin, no Sec-Fetch-Site)", "POST", {}, null],
    ["POST from another port of the same host (same-site, not same-origin)", "POST", { origin: "http://127.0.0.1:4000", "sec-fetch-site": "same-site" }, 403],
    ["PUT from another site", "PUT", { origin: "https://evil.example", "sec-fetch-site": "cross-site" }, 403],
    ["DELETE with only a foreign Origin", "DELETE", { origin: "http://localhost:3000" }, 403],
    ["PATCH with Origin null (sandboxed frame, data: URL)", "PATCH", { origin: "null" }, 403],
    ["POST with a matching Origin but a cross-site fetch", "POST", { origin: APP, "sec-fetch-site": "cross-site" }, 403],
    ["POST typed into the address bar or from a bookmark", "POST", { "sec-fetch-site": "none" }, 403],
    ["lower-case method name", "post", { origin: "http://127.0.0.1:4000" }, 403],
  ] as const)("%s", (_name, method, headers, status) => {
    expect(crossSiteDecision(req(method, headers), APP)?.status ?? null).toBe(status);
  });

  test("a JSON handler refuses a body not declared as JSON (a plain form's text/plain)", () => {
    const same = { origin: APP, "sec-fetch-site": "same-origin" };
    expect(crossSiteDecision(req("POST", { ...same, "content-type": "text/plain;charset=UTF-8" }), APP, { jsonBody: true })?.status).toBe(415);
    expect(crossSiteDecision(req("POST", same), APP, { jsonBody: true })?.status).toBe(415);
    expect(crossSiteDecision(req("POST", { ...same, "content-type": "application/json; charset=utf-8" }), APP, { jsonBody: true })).toBeNull();
    // Handlers without a JSON body (uploads) accept multipart.
    expect(crossSiteDecision(req("POST", { ...same, "content-type": "multipart/form-data; boundary=x" }), APP)).toBeNull();
  });

  test.each([
    ["application/json", true],
    ["Application/JSON ; charset=utf-8", true],
    ["application/json-patch+json", false],
    ["text/plain", false],
    ["application/x-www-form-urlencoded", false],
    ["", false],
  ])("content type %j is JSON: %s", (value, json) => {
    expect(isJsonContentType(value)).toBe(json);
  });

  test("the refusal names the foreign origin and says what to do", () => {
    const d = crossSiteDecision(req("POST", { origin: "http://127.0.0.1:4000" }), APP);
    expect(d).toMatchObject({ status: 403, code: "cross_site" });
    expect(d!.message).toContain("http://127.0.0.1:4000");
  });
});
