import { isIP } from "node:net";

// How the app learns who is asking. scripts/server.ts, in front of Next's request handler, writes the
// address into `clientAddressHeader` on every request, replacing whatever a client sent; the app reads
// it only when that server says it is there (`clientAddressFromServer`), never under a bare `next start`.

export const clientAddressHeader = "x-capgrid-client-address";
/** Set by scripts/server.ts in its own process before Next starts. */
export const serverMarkerVariable = "CAPGRID_CLIENT_ADDRESS_FROM_SERVER";

/** Headers a client could use to pass for someone else; dropped unless proxies in front are trusted. */
export const forwardedHeaders = ["forwarded", "x-forwarded-for", "x-forwarded-host", "x-forwarded-proto", "x-forwarded-port", "x-real-ip"] as const;

/** "::ffff:127.0.0.2" → "127.0.0.2"; anything that is not an IP address → null. */
export function normalizeAddress(raw: string | undefined | null): string | null {
  const value = (raw ?? "").trim().replace(/^\[|\]$/g, "");
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(value);
  const address = mapped ? mapped[1] : value;
  return isIP(address) ? address.toLowerCase() : null;
}

/**
 * The client's address: the socket's own, or — behind `trustedProxies` proxies that each append the
 * address they saw to X-Forwarded-For — the entry that many places from the right.
 */
export function clientAddress(socketAddress: string | undefined, forwardedFor: string | string[] | undefined, trustedProxies: number): string | null {
  const socket = normalizeAddress(socketAddress);
  if (trustedProxies <= 0) return socket;
  const chain = (Array.isArray(forwardedFor) ? forwardedFor.join(",") : (forwardedFor ?? "")).split(",").map((s) => s.trim()).filter(Boolean);
  const hops = [...chain, socket ?? ""];
  return normalizeAddress(hops[Math.max(0, hops.length - 1 - trustedProxies)]);
}

/** The key the sign-in limit counts by: an IPv4 address, or the /64 network of an IPv6 one (one subscriber's block). */
export function addressKey(address: string): string {
  if (isIP(address) !== 6) return address;
  const [head, tail = ""] = address.split("::");
  const left = head ? head.split(":") : [];
  const right = tail ? tail.split(":") : [];
  const groups = address.includes("::") ? [...left, ...Array(8 - left.length - right.length).fill("0"), ...right] : left;
  return `${groups.slice(0, 4).map((g) => g.replace(/^0+(?=.)/, "")).join(":")}::/64`;
}
