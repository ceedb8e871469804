import { describe, expect, test } from "vitest";
import { addressKey, clientAddress, FORWARDED_CHAIN_HEADER, moveForwardingHeaders, normaliseAddress, trustedProxyList } from "@/lib/server/client-address";

/** Headers as a route handler sees them: what proxy.ts moved aside, then Next's socket address. */
function asHandlerSees(sent: Record<string, string>, socket: string): Headers {
  const h = moveForwardingHeaders(new Headers(sent));
  if (!h.has("x-forwarded-for")) h.set("x-forwarded-for", socket); // what `next start` does when there is none
  return h;
}

describe("the client address", () => {
  test("with no trusted proxy, client-sent forwarding headers are ignored: the socket address counts", () => {
    for (const spoof of ["9.9.9.9", "1.1.1.1, 2.2.2.2", "garbage", ""]) {
      const h = asHandlerSees({ "x-forwarded-for": spoof, "x-real-ip": "8.8.8.8", [FORWARDED_CHAIN_HEADER]: "7.7.7.7", "x-darnwell-client-address": "6.6.6.6" }, "203.0.113.5");
      expect(clientAddress(h)).toBe("203.0.113.5");
    }
  });

  test("proxy.ts removes every forwarding header a client can set and keeps what arrived aside", () => {
    const h = moveForwardingHeaders(new Headers({ "x-forwarded-for": "9.9.9.9", "x-real-ip": "8.8.8.8", "x-darnwell-client-address": "6.6.6.6", cookie: "a=b" }));
    expect(h.get("x-forwarded-for")).toBeNull();
    expect(h.get("x-real-ip")).toBeNull();
    expect(h.get("x-darnwell-client-address")).toBeNull();
    expect(h.get(FORWARDED_CHAIN_HEADER)).toBe("9.9.9.9");
    expect(h.get("cookie")).toBe("a=b");
    // A client's own chain header is never kept when it sent no X-Forwarded-For.
    expect(moveForwardingHeaders(new Headers({ [FORWARDED_CHAIN_HEADER]: "7.7.7.7" })).get(FORWARDED_CHAIN_HEADER)).toBeNull();
  });

  test("through a trusted proxy, the address it reports is used", () => {
    const trusted = trustedProxyList(["10.0.0.0/24"]);
    expect(clientAddress(asHandlerSees({ "x-forwarded-for": "198.51.100.7" }, "10.0.0.2"), trusted)).toBe("198.51.100.7");
    // A client's own prefix before the proxy's entry is not believed.
    expect(clientAddress(asHandlerSees({ "x-forwarded-for": "1.2.3.4, 198.51.100.7" }, "10.0.0.2"), trusted)).toBe("198.51.100.7");
    // Two trusted hops.
    expect(clientAddress(asHandlerSees({ "x-forwarded-for": "198.51.100.7, 10.0.0.9" }, "10.0.0.2"), trusted)).toBe("198.51.100.7");
    // Junk to the left of a trusted hop: the hop itself.
    expect(clientAddress(asHandlerSees({ "x-forwarded-for": "nonsense" }, "10.0.0.2"), trusted)).toBe("10.0.0.2");
    // A peer that is not trusted: its chain is ignored.
    expect(clientAddress(asHandlerSees({ "x-forwarded-for": "198.51.100.7" }, "203.0.113.5"), trusted)).toBe("203.0.113.5");
  });

  test("IPv6 and mapped addresses", () => {
    expect(normaliseAddress("::ffff:127.0.0.1")).toBe("127.0.0.1");
    expect(normaliseAddress("[2001:DB8::1]")).toBe("2001:db8::1");
    expect(normaliseAddress("1.2.3.4:5678")).toBe("1.2.3.4");
    expect(normaliseAddress("not an address")).toBeNull();
    const trusted = trustedProxyList(["::1"]);
    expect(clientAddress(asHandlerSees({ "x-forwarded-for": "2001:db8::7" }, "::1"), trusted)).toBe("2001:db8::7");
    expect(addressKey("2001:db8:1:2:3:4:5:6")).toBe("2001:db8:1:2::/64");
    expect(addressKey("2001:db8::1")).toBe("2001:db8:0:0::/64");
    expect(addressKey("192.0.2.1")).toBe("192.0.2.1");
  });

  test("no peer at all (in-process call) is 'unknown'; a bad TRUSTED_PROXIES entry is named", () => {
    expect(clientAddress(new Headers())).toBe("unknown");
    expect(() => trustedProxyList(["10.0.0.0/24", "proxy.internal"])).toThrow(/proxy\.internal/);
  });
});
