/**
 * The edge in front of better-auth's handler: only the routes of AUTH_ROUTES reach it, sign-in and
 * password-reset requests are rate limited (per client address, and per account), and the sign-in answer
 * carries the session in its cookie only.
 */
import { auth, CLIENT_IP_HEADER } from "./auth";
import { matchAuthRoute } from "./auth-routes";
import { clientAddressOf } from "./client-address";
import { problem } from "./http";
import { AUTH_LIMITS, hit, peek, rateLimitsEnabled, resetLimit, type LimitResult } from "./rate-limit";

export interface AuthGateOptions {
  /** The client's address (clientAddressOf). */
  clientAddress: string;
  /** Overrides AUTH_RATE_LIMIT (tests). */
  rateLimits?: boolean;
}

export function tooManyRequests(limit: LimitResult, detail: string): Response {
  const res = problem(429, detail, { retryAfterSeconds: limit.retryAfterSeconds });
  res.headers.set("retry-after", String(limit.retryAfterSeconds));
  return res;
}

const MAX_AUTH_BODY_BYTES = 16 * 1024;
const WAIT = "Too many attempts; wait a while and try again";

function emailOf(text: string): string | undefined {
  try {
    const body: unknown = JSON.parse(text);
    const email = body && typeof body === "object" ? (body as { email?: unknown }).email : undefined;
    return typeof email === "string" && email.trim() ? email.trim().toLowerCase() : undefined;
  } catch {
    return undefined;
  }
}

/** Removes `token` from better-auth's sign-in JSON; status and headers (the session cookie) stay. */
async function withoutToken(res: Response): Promise<Response> {
  if (!res.headers.get("content-type")?.includes("application/json")) return res;
  const data: unknown = await res.json();
  if (data && typeof data === "object") delete (data as { token?: unknown }).token;
  const headers = new Headers(res.headers);
  headers.delete("content-length");
  return new Response(JSON.stringify(data), { status: res.status, statusText: res.statusText, headers });
}

export async function handleAuthRequest(request: Request, opts: AuthGateOptions): Promise<Response> {
  const url = new URL(request.url);
  const route = matchAuthRoute(request.method, url.pathname);
  if (!route) return problem(404, "No such authentication endpoint");
  const limits = opts.rateLimits ?? rateLimitsEnabled();

  const headers = new Headers(request.headers);
  headers.set(CLIENT_IP_HEADER, opts.clientAddress);
  let body: string | undefined;
  if (request.method === "POST") {
    if (Number(request.headers.get("content-length") ?? 0) > MAX_AUTH_BODY_BYTES) return problem(413, "The request body is too large");
    body = await request.text();
    if (body.length > MAX_AUTH_BODY_BYTES) return problem(413, "The request body is too large");
  }
  const forward = () => auth.handler(new Request(request.url, { method: request.method, headers, body, signal: request.signal }));

  if (route.path === "/sign-in/email") {
    const email = emailOf(body ?? "");
    if (limits) {
      const perAddress = await hit(AUTH_LIMITS.signIn, opts.clientAddress);
      if (!perAddress.allowed) return tooManyRequests(perAddress, WAIT);
      if (email) {
        const perAccount = await peek(AUTH_LIMITS.signInFailuresPerAccount, email);
        if (!perAccount.allowed) return tooManyRequests(perAccount, "Too many failed sign-ins for this account; wait a while and try again");
      }
    }
    const res = await forward();
    if (limits && email) {
      if (res.ok) await resetLimit(AUTH_LIMITS.signInFailuresPerAccount, email);
      else if (res.status === 401) await hit(AUTH_LIMITS.signInFailuresPerAccount, email);
    }
    return res.ok ? withoutToken(res) : res;
  }

  if (route.path === "/request-password-reset" && limits) {
    const perAddress = await hit(AUTH_LIMITS.passwordReset, opts.clientAddress);
    if (!perAddress.allowed) return tooManyRequests(perAddress, WAIT);
    const email = emailOf(body ?? "");
    if (email) {
      const perAccount = await hit(AUTH_LIMITS.passwordResetPerAccount, email);
      if (!perAccount.allowed) return tooManyRequests(perAccount, WAIT);
    }
  }
  return forward();
}

/**
 * Counts a sign-up from the request's client address; answers 429 past the limit, else null. `astroAddress` is
 * Astro's clientAddress (used only when no socket address was recorded, see clientAddressOf).
 */
export async function limitSignUp(request: Request, astroAddress: string | undefined, rateLimits = rateLimitsEnabled()): Promise<Response | null> {
  if (!rateLimits) return null;
  const limit = await hit(AUTH_LIMITS.signUp, clientAddressOf(request, astroAddress));
  return limit.allowed ? null : tooManyRequests(limit, "Too many sign-ups from this address; wait a while and try again");
}
