import { defineMiddleware } from "astro:middleware";
import { auth } from "@/lib/server/auth";
import { problem } from "@/lib/server/http";
import "@/lib/server/client-address"; // records each request's socket address from the first request on

/** Pages that need a signed-in user; anonymous visitors are sent to /signin and back. */
const PROTECTED_PAGES = [/^\/dashboard\/?$/, /^\/glazing\/?$/, /^\/projects(\/|$)/, /^\/orgs(\/|$)/, /^\/account(\/|$)/];

/** API routes open to anonymous callers. */
const PUBLIC_API = [/^\/api\/health$/, /^\/api\/auth\//, /^\/api\/v1\/signup$/, /^\/api\/v1\/invitations\/[^/]+$/];

export const onRequest = defineMiddleware(async (context, next) => {
  if (context.isPrerendered) return next();
  const path = context.url.pathname;
  if (path.startsWith("/api/auth/") || path === "/api/health") {
    context.locals.user = null;
    context.locals.session = null;
    return next();
  }
  let session: Awaited<ReturnType<typeof auth.api.getSession>> = null;
  try {
    session = await auth.api.getSession({ headers: context.request.headers });
  } catch (err) {
    console.error("[auth] session lookup failed:", (err as Error).message);
    if (path.startsWith("/api/")) return problem(503, "The session store is unavailable; try again shortly");
  }
  context.locals.user = session?.user ?? null;
  context.locals.session = session?.session ?? null;

  if (!context.locals.user) {
    if (path.startsWith("/api/") && !PUBLIC_API.some((r) => r.test(path))) {
      return problem(401, "Sign in to use this endpoint");
    }
    if (PROTECTED_PAGES.some((r) => r.test(path))) {
      return context.redirect(`/signin?next=${encodeURIComponent(path + context.url.search)}`, 303);
    }
  }
  const response = await next();
  if (!response.headers.has("x-content-type-options")) {
    try {
      response.headers.set("x-content-type-options", "nosniff");
      response.headers.set("referrer-policy", "same-origin");
    } catch {
      /* immutable (e.g. redirect) responses keep their headers */
    }
  }
  return response;
});
