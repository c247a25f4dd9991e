import { describe, expect, it } from "vitest";
import { crossSiteRefusal, isApiWrite, trustedOrigins } from "@/lib/server/cross-origin";

const trusted = trustedOrigins({
  BETTER_AUTH_URL: "https://app.paneray.example/",
  TRUSTED_ORIGINS: " http://localhost:4321 , http://127.0.0.1:4321/x",
});
const h = (init: Record<string, string>) => new Headers(init);

describe("trustedOrigins", () => {
  it("takes the origin of BETTER_AUTH_URL and of each TRUSTED_ORIGINS entry", () => {
    expect([...trusted].sort()).toEqual(["http://127.0.0.1:4321", "http://localhost:4321", "https://app.paneray.example"]);
  });
});

describe("isApiWrite", () => {
  it("covers POST, PUT, PATCH and DELETE under /api/v1 only", () => {
    for (const m of ["POST", "PUT", "PATCH", "DELETE", "post"]) expect(isApiWrite(m, "/api/v1/projects")).toBe(true);
    for (const m of ["GET", "HEAD", "OPTIONS"]) expect(isApiWrite(m, "/api/v1/projects")).toBe(false);
    expect(isApiWrite("POST", "/api/auth/sign-in/email")).toBe(false);
    expect(isApiWrite("POST", "/api/v1x")).toBe(false);
    expect(isApiWrite("POST", "/api/v1")).toBe(true);
  });
});

describe("crossSiteRefusal", () => {
  it("lets through requests with neither Origin nor Sec-Fetch-Site", () => {
    expect(crossSiteRefusal(h({}), trusted)).toBeNull();
  });
  it("lets through same-origin browser requests and user-initiated ones", () => {
    expect(crossSiteRefusal(h({ origin: "https://app.paneray.example", "sec-fetch-site": "same-origin" }), trusted)).toBeNull();
    expect(crossSiteRefusal(h({ "sec-fetch-site": "none" }), trusted)).toBeNull();
    expect(crossSiteRefusal(h({ origin: "http://localhost:4321" }), trusted)).toBeNull();
  });
  it("refuses a foreign or opaque Origin", () => {
    expect(crossSiteRefusal(h({ origin: "http://evil.example" }), trusted)).toMatch(/^Cross-site request refused/);
    expect(crossSiteRefusal(h({ origin: "null" }), trusted)).toMatch(/^Cross-site request refused/);
    expect(crossSiteRefusal(h({ origin: "https://app.paneray.example.evil.example" }), trusted)).toMatch(/^Cross-site request refused/);
    expect(crossSiteRefusal(h({ origin: "http://app.paneray.example" }), trusted)).toMatch(/^Cross-site request refused/);
  });
  it("refuses what the browser reports as cross-site or same-site, whatever the Origin", () => {
    expect(crossSiteRefusal(h({ "sec-fetch-site": "cross-site" }), trusted)).toMatch(/^Cross-site request refused/);
    expect(crossSiteRefusal(h({ "sec-fetch-site": "same-site", origin: "https://app.paneray.example" }), trusted)).toMatch(
      /^Cross-site request refused/,
    );
  });
  it("refuses a foreign Origin even when Sec-Fetch-Site claims same-origin", () => {
    expect(crossSiteRefusal(h({ "sec-fetch-site": "same-origin", origin: "http://evil.example" }), trusted)).toMatch(/^Cross-site request refused/);
  });
});
