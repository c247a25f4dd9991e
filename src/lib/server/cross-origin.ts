/**
 * Refusal of cross-site writes to the JSON API. A browser tells us where a request comes from in
 * `Sec-Fetch-Site` (set by the browser itself, never by page scripts) and `Origin`; a write whose
 * headers name another site is refused, whatever cookies it carries. A request with neither header
 * (curl, scripts, server-to-server calls) does not come from a browser page and is let through; it
 * still needs a session like any other call.
 *
 * Besides, a write whose body an HTML form could send (a form content type, or no content type) must carry
 * one of our origins, whatever the path (`formWriteRefusal`); the middleware skips both checks for requests
 * that carry an API key and no cookie, which no browser page can forge.
 */
import type { ServerEnv } from "@/lib/server/env";

const WRITE_METHODS = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** The browser origins our pages are served from: BETTER_AUTH_URL's and those in TRUSTED_ORIGINS. */
export function trustedOrigins(env: Pick<ServerEnv, "BETTER_AUTH_URL" | "TRUSTED_ORIGINS">): ReadonlySet<string> {
  const origins = new Set<string>();
  for (const raw of [env.BETTER_AUTH_URL, ...env.TRUSTED_ORIGINS.split(",")]) {
    const value = raw.trim();
    if (!value) continue;
    try {
      origins.add(new URL(value).origin);
    } catch {
      console.error(`[config] TRUSTED_ORIGINS: "${value}" is not an origin (scheme://host[:port]); ignored`);
    }
  }
  return origins;
}

/** Whether the request is a write under /api/v1, the requests the check applies to. */
export function isApiWrite(method: string, pathname: string): boolean {
  return WRITE_METHODS.has(method.toUpperCase()) && (pathname === "/api/v1" || pathname.startsWith("/api/v1/"));
}

/**
 * Why a write must be refused as cross-site, or null when it may proceed: `Sec-Fetch-Site` present
 * and neither `same-origin` nor `none`, or `Origin` present and not one of the trusted origins.
 */
export function crossSiteRefusal(headers: Headers, trusted: ReadonlySet<string>): string | null {
  const site = headers.get("sec-fetch-site")?.trim().toLowerCase();
  if (site !== undefined && site !== "same-origin" && site !== "none") {
    return `Cross-site request refused: the browser reports it as coming from a ${site === "" ? "unnamed" : `"${site}"`} page`;
  }
  const origin = headers.get("origin");
  if (origin !== null && !trusted.has(origin.trim())) {
    return `Cross-site request refused: origin "${origin.slice(0, 200)}" is not one of this server's origins`;
  }
  return null;
}

/** The content types an HTML form (or a CORS-simple request) can send without a preflight. */
const FORM_TYPES = ["application/x-www-form-urlencoded", "multipart/form-data", "text/plain"];

/**
 * Why a write that a plain HTML form could send (a form content type, or none at all) must be refused, or
 * null: it must carry an `Origin` that is the request's own origin or a trusted one.
 */
export function formWriteRefusal(method: string, headers: Headers, ownOrigin: string, trusted: ReadonlySet<string>): string | null {
  const m = method.toUpperCase();
  if (!WRITE_METHODS.has(m)) return null;
  const type = headers.get("content-type");
  if (type !== null && !FORM_TYPES.some((t) => type.toLowerCase().includes(t))) return null;
  const origin = headers.get("origin")?.trim();
  if (origin !== undefined && (origin === ownOrigin || trusted.has(origin))) return null;
  return `Cross-site ${m} form submission refused: a request with a form body or none must carry this server's Origin`;
}
