// The client's address, for limits keyed on it (sign-in, anonymous photos). No client can choose it:
//
// - `next start` sets X-Forwarded-For to the socket's address only when the request has none, so a
//   client-sent value would reach route handlers unchanged. proxy.ts therefore moves whatever arrived
//   in X-Forwarded-For into FORWARDED_CHAIN_HEADER and deletes X-Forwarded-For; Next then fills it
//   with the socket's address before the handler runs (checked against `next start` 16.4: a request
//   sent with `X-Forwarded-For: 9.9.9.9` from 127.0.0.1 reaches the handler with x-forwarded-for
//   127.0.0.1 and the chain 9.9.9.9).
// - The chain is believed only through the proxies named in TRUSTED_PROXIES (none by default): the
//   addresses [chain…, peer] are walked from the right, skipping trusted proxies; the first other one
//   is the client. With none trusted, that is always the peer.
//
// No "server-only" here: proxy.ts imports the header helpers.
import { BlockList, isIP } from "node:net";
import { env } from "@/lib/env";

/** What arrived in X-Forwarded-For, moved aside by proxy.ts. */
export const FORWARDED_CHAIN_HEADER = "x-darnwell-forwarded-for";
/** The resolved address handed to better-auth (set by the auth route, never taken from a client). */
export const CLIENT_ADDRESS_HEADER = "x-darnwell-client-address";
/** Forwarding headers a client could set; proxy.ts removes them all before any handler runs. */
const CLIENT_SETTABLE = ["x-forwarded-for", "x-real-ip", FORWARDED_CHAIN_HEADER, CLIENT_ADDRESS_HEADER];

/** For proxy.ts: the request headers with the forwarding chain moved aside (see above). */
export function moveForwardingHeaders(incoming: Headers): Headers {
  const out = new Headers(incoming);
  const chain = incoming.get("x-forwarded-for");
  for (const h of CLIENT_SETTABLE) out.delete(h);
  if (chain) out.set(FORWARDED_CHAIN_HEADER, chain.slice(0, 2000));
  return out;
}

/** "::ffff:1.2.3.4" → "1.2.3.4"; brackets and IPv4 ports removed; null when not an address. */
export function normaliseAddress(raw: string | undefined | null): string | null {
  if (!raw) return null;
  let a = raw.trim();
  if (a.startsWith("[") && a.includes("]")) a = a.slice(1, a.indexOf("]"));
  else if (/^\d+\.\d+\.\d+\.\d+:\d+$/.test(a)) a = a.slice(0, a.lastIndexOf(":"));
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(a);
  if (mapped) a = mapped[1]!;
  const v = isIP(a);
  if (v === 4) return a;
  if (v === 6) return a.toLowerCase();
  return null;
}

/** Parses TRUSTED_PROXIES entries (addresses or CIDR ranges) into a matcher. */
export function trustedProxyList(entries: readonly string[]): BlockList {
  const list = new BlockList();
  for (const entry of entries) {
    const [addr, prefix] = entry.split("/");
    const a = normaliseAddress(addr);
    if (!a) throw new Error(`TRUSTED_PROXIES: ${entry} is not an address or CIDR range`);
    const type = isIP(a) === 4 ? "ipv4" : "ipv6";
    if (prefix === undefined) list.addAddress(a, type);
    else list.addSubnet(a, Number(prefix), type);
  }
  return list;
}

const isTrusted = (list: BlockList, a: string) => list.check(a, isIP(a) === 4 ? "ipv4" : "ipv6");

/**
 * The client's address from the request headers as proxy.ts and Next leave them; "unknown" when the
 * peer is not known (in-process calls without headers). IPv6 addresses are kept whole; keyed limits
 * may group them with addressKey().
 */
export function clientAddress(headers: Headers, trusted: BlockList = new BlockList()): string {
  const peer = normaliseAddress(headers.get("x-forwarded-for")?.split(",").at(-1));
  if (!peer) return "unknown";
  const chain = (headers.get(FORWARDED_CHAIN_HEADER) ?? "").split(",").filter((s) => s.trim());
  let client = peer;
  if (!isTrusted(trusted, client)) return client;
  for (let i = chain.length - 1; i >= 0; i--) {
    const hop = normaliseAddress(chain[i]);
    // A trusted proxy writes addresses; anything else was written further left by a client.
    if (!hop) return client;
    client = hop;
    if (!isTrusted(trusted, hop)) return hop;
  }
  return client;
}

/** The key for per-address limits: IPv4 as is, IPv6 by its /64 (one household or host usually has one). */
export function addressKey(address: string): string {
  if (isIP(address) !== 6) return address;
  const [head = "", tail = ""] = address.split("::");
  const left = head ? head.split(":") : [];
  const right = tail ? tail.split(":") : [];
  const groups = address.includes("::") ? [...left, ...Array(8 - left.length - right.length).fill("0"), ...right] : left;
  return `${groups.slice(0, 4).map((g) => parseInt(g || "0", 16).toString(16)).join(":")}::/64`;
}

let trustedCache: { source: readonly string[]; list: BlockList } | undefined;

/** clientAddress() with the TRUSTED_PROXIES setting: the one helper every address-keyed limit uses. */
export function requestClientAddress(headers: Headers): string {
  const source = env.TRUSTED_PROXIES;
  if (trustedCache?.source !== source) trustedCache = { source, list: trustedProxyList(source) };
  return clientAddress(headers, trustedCache.list);
}
