import { describe, expect, it } from "vitest";
import { addressKey, clientAddress, normalizeAddress } from "@/lib/client-address";

describe("the client's address", () => {
  it("is the socket's own when no proxy is trusted, whatever X-Forwarded-For says", () => {
    expect(clientAddress("127.0.0.2", "10.0.0.1", 0)).toBe("127.0.0.2");
    expect(clientAddress("::ffff:203.0.113.9", undefined, 0)).toBe("203.0.113.9");
  });

  it("behind n trusted proxies, is the entry n places from the right of X-Forwarded-For plus the socket", () => {
    // client → proxy (socket 10.0.0.5): the proxy appended the client's 203.0.113.9; a forged entry stands to its left.
    expect(clientAddress("10.0.0.5", "6.6.6.6, 203.0.113.9", 1)).toBe("203.0.113.9");
    expect(clientAddress("10.0.0.6", ["6.6.6.6, 203.0.113.9", "10.0.0.5"], 2)).toBe("203.0.113.9");
    // Fewer entries than proxies: the leftmost there is.
    expect(clientAddress("10.0.0.5", undefined, 1)).toBe("10.0.0.5");
  });

  it("must be an IP address", () => {
    expect(clientAddress("10.0.0.5", "not-an-ip", 1)).toBeNull();
    expect(normalizeAddress("[2001:DB8::1]")).toBe("2001:db8::1");
    expect(normalizeAddress(undefined)).toBeNull();
  });
});

describe("the sign-in limit's address key", () => {
  it("is the IPv4 address itself", () => {
    expect(addressKey("198.51.100.7")).toBe("198.51.100.7");
  });
  it("is the /64 network of an IPv6 address, so one subscriber cannot rotate through its block", () => {
    expect(addressKey("2001:db8:aa:bb:1:2:3:4")).toBe("2001:db8:aa:bb::/64");
    expect(addressKey("2001:db8:aa:bb::99")).toBe("2001:db8:aa:bb::/64");
    expect(addressKey("2001:db8::1")).toBe("2001:db8:0:0::/64");
    expect(addressKey("::1")).toBe("0:0:0:0::/64");
  });
});
