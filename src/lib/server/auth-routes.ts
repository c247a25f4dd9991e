/**
 * The better-auth routes Paneray exposes under /api/auth. Every other path there answers 404: better-auth's
 * organisation, member and sign-up routes do not know Paneray's role rules, so Paneray's own endpoints
 * (/api/v1/**) do that work instead. Read by the catch-all route and by the authorization tests.
 */
export interface AuthRoute {
  method: "GET" | "POST";
  /** Path below /api/auth, with `:name` for one path segment. */
  path: string;
  /** What the route is for. */
  purpose: string;
}

export const AUTH_BASE_PATH = "/api/auth";

export const AUTH_ROUTES: readonly AuthRoute[] = [
  { method: "POST", path: "/sign-in/email", purpose: "sign in with e-mail and password (rate limited per address and per account)" },
  { method: "POST", path: "/sign-out", purpose: "end the session" },
  { method: "GET", path: "/get-session", purpose: "the current session and user" },
  { method: "POST", path: "/request-password-reset", purpose: "mail a password-reset link (rate limited)" },
  { method: "POST", path: "/reset-password", purpose: "set a new password with a reset token" },
  { method: "GET", path: "/reset-password/:token", purpose: "the link in the reset mail; redirects to the reset form" },
  { method: "GET", path: "/verify-email", purpose: "the link in the sign-up mail; confirms the address" },
];

const toRegExp = (path: string) => new RegExp(`^${path.replace(/[.*+?^${}()|[\]\\]/g, "\\$&").replace(/:[A-Za-z]+/g, "[^/]+")}/?$`);
const COMPILED = AUTH_ROUTES.map((r) => ({ route: r, re: toRegExp(AUTH_BASE_PATH + r.path) }));

/** The allowed route a request matches (HEAD counts as GET), or undefined. */
export function matchAuthRoute(method: string, pathname: string): AuthRoute | undefined {
  const m = method.toUpperCase() === "HEAD" ? "GET" : method.toUpperCase();
  return COMPILED.find((c) => c.route.method === m && c.re.test(pathname))?.route;
}
