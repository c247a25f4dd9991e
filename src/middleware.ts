import { defineMiddleware } from "astro:middleware";
import { auth } from "@/lib/server/auth";
import { problem, unavailable } from "@/lib/server/http";
import { serverEnv } from "@/lib/server/env";
import { crossSiteRefusal, formWriteRefusal, isApiWrite, trustedOrigins } from "@/lib/server/cross-origin";
import { isDatabaseUnavailable } from "@/lib/server/db/unavailable";
import { apiKeyIdentity, bearerToken } from "@/lib/server/api-key-auth";
import "@/lib/server/client-address"; // records each request's socket address from the first request on

/** Pages that need a signed-in user; anonymous visitors are sent to /signin and back. */
const PROTECTED_PAGES = [/^\/dashboard\/?$/, /^\/glazing\/?$/, /^\/library\/?$/, /^\/projects(\/|$)/, /^\/orgs(\/|$)/, /^\/account(\/|$)/];

/** API routes open to anonymous callers. */
const PUBLIC_API = [/^\/api\/health$/, /^\/api\/auth\//, /^\/api\/v1\/signup$/, /^\/api\/v1\/openapi\.json$/, /^\/api\/v1\/invitations\/[^/]+$/];

let trusted: ReadonlySet<string> | undefined;
const TRUSTED = () => (trusted ??= trustedOrigins(serverEnv()));

/** The branded 503 page that page requests get while the database cannot be reached. */
const UNAVAILABLE_PAGE = "/unavailable";

export const onRequest = defineMiddleware(async (context, next) => {
  if (context.isPrerendered) return next();
  const path = context.url.pathname;
  const headers = context.request.headers;
  const bearer = bearerToken(headers);
  // A request with a bearer key and no cookie cannot be forged by a browser page: a page cannot add an
  // Authorization header to a cross-site request without a CORS preflight this server never approves, and
  // without cookies the browser lends the request no identity. Such a request proves who it is by its key.
  const keyOnly = bearer !== null && !headers.has("cookie");
  if (!(keyOnly && path.startsWith("/api/v1/"))) {
    const refusal =
      (isApiWrite(context.request.method, path) ? crossSiteRefusal(headers, TRUSTED()) : null) ??
      formWriteRefusal(context.request.method, headers, context.url.origin, TRUSTED());
    if (refusal) return problem(403, refusal);
  }
  if (bearer !== null && path.startsWith("/api/auth/")) {
    return problem(403, "This route needs a signed-in session; API keys cannot call it");
  }
  if (bearer !== null && path.startsWith("/api/v1/")) {
    // The key alone decides who the caller is (a session cookie beside it is ignored).
    const identity = await apiKeyIdentity(bearer);
    if (identity instanceof Response) return identity;
    context.locals.user = identity.user as NonNullable<App.Locals["user"]>;
    context.locals.session = null;
    context.locals.apiKey = identity.apiKey;
    return next();
  }
  if (path.startsWith("/api/auth/") || path === "/api/health" || path === UNAVAILABLE_PAGE) {
    context.locals.user = null;
    context.locals.session = null;
    return next();
  }
  let session: Awaited<ReturnType<typeof auth.api.getSession>> = null;
  let reroute: string | undefined;
  try {
    session = await auth.api.getSession({ headers: context.request.headers });
  } catch (err) {
    console.error("[auth] session lookup failed:", (err as Error).message);
    if (path.startsWith("/api/"))
      return unavailable("The session store is unavailable at the moment; nothing was changed. Try again in a few seconds.");
    reroute = UNAVAILABLE_PAGE;
  }
  context.locals.user = session?.user ?? null;
  context.locals.session = session?.session ?? null;

  if (!context.locals.user && !reroute) {
    if (path.startsWith("/api/") && !PUBLIC_API.some((r) => r.test(path))) {
      return problem(401, "Sign in to use this endpoint");
    }
    if (PROTECTED_PAGES.some((r) => r.test(path))) {
      return context.redirect(`/signin?next=${encodeURIComponent(path + context.url.search)}`, 303);
    }
  }
  let response: Response;
  try {
    response = await (reroute ? next(reroute) : next());
  } catch (err) {
    // A page's loader lost the database: the branded 503 page instead of a bare 500.
    if (reroute || path.startsWith("/api/") || !isDatabaseUnavailable(err)) throw err;
    console.error(`[page] ${path}: database unavailable:`, (err as Error).message);
    context.locals.user = null;
    context.locals.session = null;
    return context.rewrite(UNAVAILABLE_PAGE);
  }
  // Headers every response carries (nosniff, referrer, opener, permissions) are set by the server in
  // front of Astro, scripts/server.mjs, so that static files get them too.
  return response;
});
