// Which address counts as the client's: the socket's, unless the socket is a configured proxy.
import { describe, expect, it } from "vitest";
import { normaliseAddress, parseTrustedProxies, resolveClientAddress } from "@/lib/server/client-address";
import { matchAuthRoute } from "@/lib/server/auth-routes";

const h = (o: Record<string, string>) => new Headers(o);

describe("resolveClientAddress", () => {
  const none = parseTrustedProxies("");
  const proxies = parseTrustedProxies("10.0.0.0/8, 192.0.2.7, ::1");

  it("ignores X-Forwarded-For and Forwarded from a socket that is not a trusted proxy", () => {
    expect(resolveClientAddress("198.51.100.9", h({ "x-forwarded-for": "203.0.113.1" }), none)).toBe("198.51.100.9");
    expect(resolveClientAddress("198.51.100.9", h({ forwarded: "for=203.0.113.1" }), proxies)).toBe("198.51.100.9");
    expect(resolveClientAddress("::ffff:127.0.0.1", h({ "x-forwarded-for": "203.0.113.1" }), none)).toBe("127.0.0.1");
  });

  it("behind trusted proxies takes the nearest address that is not a proxy (a client-set first entry is ignored)", () => {
    expect(resolveClientAddress("10.1.2.3", h({ "x-forwarded-for": "1.1.1.1, 203.0.113.5" }), proxies)).toBe("203.0.113.5");
    expect(resolveClientAddress("10.1.2.3", h({ "x-forwarded-for": "1.1.1.1, 203.0.113.5, 192.0.2.7" }), proxies)).toBe("203.0.113.5");
    expect(resolveClientAddress("::1", h({ forwarded: 'for="[2001:db8::5]:4711";proto=https, for=10.0.0.2' }), proxies)).toBe("2001:db8::5");
    expect(resolveClientAddress("10.1.2.3", h({}), proxies)).toBe("10.1.2.3");
  });

  it("stops at an entry that is not an IP address", () => {
    expect(resolveClientAddress("10.1.2.3", h({ "x-forwarded-for": "203.0.113.5, garbage" }), proxies)).toBe("10.1.2.3");
  });

  it("refuses a TRUSTED_PROXIES entry that is not an address or block", () => {
    expect(() => parseTrustedProxies("10.0.0.0/33")).toThrow(/10.0.0.0\/33/);
    expect(() => parseTrustedProxies("proxy.example")).toThrow(/proxy.example/);
    expect(normaliseAddress("192.0.2.1:8080")).toBe("192.0.2.1");
  });
});

describe("matchAuthRoute", () => {
  it("matches the listed routes only", () => {
    expect(matchAuthRoute("POST", "/api/auth/sign-in/email")?.path).toBe("/sign-in/email");
    expect(matchAuthRoute("GET", "/api/auth/reset-password/abc123")?.path).toBe("/reset-password/:token");
    expect(matchAuthRoute("GET", "/api/auth/reset-password/abc/def")).toBeUndefined();
    expect(matchAuthRoute("GET", "/api/auth/sign-in/email")).toBeUndefined();
    expect(matchAuthRoute("POST", "/api/auth/organization/update-member-role")).toBeUndefined();
  });
});
