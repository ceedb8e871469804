import { describe, expect, test } from "vitest";
import { isLoopbackAddress, localInboxRefusal, type InboxRequest } from "@/lib/server/local-inbox-gate";

const ok: InboxRequest = { localMailApi: "http://127.0.0.1:2580", appUrl: "http://127.0.0.1:3000", client: "127.0.0.1", host: "127.0.0.1:3000" };

describe("the local inbox is shown only on this machine with the local mail service", () => {
  test("shown: local mail, loopback app URL, loopback client, the app's own Host", () => {
    expect(localInboxRefusal(ok)).toBeNull();
    expect(localInboxRefusal({ ...ok, appUrl: "http://localhost:3000", host: "localhost:3000", client: "::1" })).toBeNull();
  });

  test.each<[string, Partial<InboxRequest>, string]>([
    ["a real SMTP server is configured", { localMailApi: undefined }, "no_local_mail"],
    ["the app's URL is public", { appUrl: "https://studio.example.com", host: "studio.example.com" }, "app_not_loopback"],
    ["the app's URL is a LAN address", { appUrl: "http://192.168.1.20:3000", host: "192.168.1.20:3000" }, "app_not_loopback"],
    ["the request comes from another machine", { client: "192.168.1.30" }, "client_not_loopback"],
    ["the client address is unknown", { client: "unknown" }, "client_not_loopback"],
    ["the client is an IPv6 address that is not ::1", { client: "fe80::1" }, "client_not_loopback"],
    ["another site's name resolving to 127.0.0.1 (DNS rebinding)", { host: "rebind.example:3000" }, "foreign_host"],
    ["no Host header", { host: null }, "foreign_host"],
  ])("refused when %s", (_why, change, reason) => {
    expect(localInboxRefusal({ ...ok, ...change })).toBe(reason);
  });

  test.each([
    ["127.0.0.1", true],
    ["127.8.9.10", true],
    ["::1", true],
    ["[::1]", true],
    ["::ffff:127.0.0.1", true],
    ["10.0.0.1", false],
    ["128.0.0.1", false],
    ["localhost", false],
  ])("%s is loopback: %s", (a, yes) => {
    expect(isLoopbackAddress(a)).toBe(yes);
  });
});
