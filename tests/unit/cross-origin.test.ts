import { describe, expect, it } from "vitest";
import { crossSiteRefusal, formWriteRefusal, isApiWrite, trustedOrigins } from "@/lib/server/cross-origin";

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

describe("formWriteRefusal", () => {
  const own = "http://127.0.0.1:4321";
  it("refuses writes with a form body or none unless they carry this server's origin or a trusted one", () => {
    for (const type of ["application/x-www-form-urlencoded", "multipart/form-data; boundary=x", "text/plain;charset=UTF-8"]) {
      expect(formWriteRefusal("POST", h({ "content-type": type }), own, trusted), type).toMatch(/^Cross-site POST form submission refused/);
      expect(formWriteRefusal("POST", h({ "content-type": type, origin: "http://evil.example" }), own, trusted), type).not.toBeNull();
      expect(formWriteRefusal("POST", h({ "content-type": type, origin: own }), own, trusted), type).toBeNull();
      expect(formWriteRefusal("POST", h({ "content-type": type, origin: "https://app.paneray.example" }), own, trusted), type).toBeNull();
    }
    expect(formWriteRefusal("DELETE", h({}), own, trusted)).toMatch(/^Cross-site DELETE form submission refused/);
    expect(formWriteRefusal("DELETE", h({ origin: own }), own, trusted)).toBeNull();
  });
  it("leaves JSON writes and reads to the other checks", () => {
    expect(formWriteRefusal("POST", h({ "content-type": "application/json" }), own, trusted)).toBeNull();
    expect(formWriteRefusal("GET", h({}), own, trusted)).toBeNull();
    expect(formWriteRefusal("HEAD", h({ "content-type": "text/plain" }), own, trusted)).toBeNull();
  });
});
