import { defineMiddleware } from "astro:middleware";
import { auth } from "@/lib/server/auth";
import { problem, unavailable } from "@/lib/server/http";
import { serverEnv } from "@/lib/server/env";
import { crossSiteRefusal, isApiWrite, trustedOrigins } from "@/lib/server/cross-origin";
import { isDatabaseUnavailable } from "@/lib/server/db/unavailable";
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
  if (isApiWrite(context.request.method, path)) {
    const refusal = crossSiteRefusal(context.request.headers, TRUSTED());
    if (refusal) return problem(403, refusal);
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
