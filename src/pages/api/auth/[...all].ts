import type { APIRoute } from "astro";
import { auth, CLIENT_IP_HEADER } from "@/lib/server/auth";
import { isDatabaseUnavailable } from "@/lib/server/db/unavailable";
import { problem, unavailable } from "@/lib/server/http";

/**
 * better-auth's own routes. The socket's address is passed on in a header of our own (any value the
 * client sent under that name is replaced), so that rate limits apply per client, not to everyone at once.
 * Not written with `endpoint(…)`: better-auth reads the request and writes its own answers and errors;
 * what it throws besides those (its database gone, or a bug) is answered here: 503 with Retry-After
 * for a lost database, 500 without internals otherwise.
 */
export const ALL: APIRoute = async ({ request, clientAddress, url }) => {
  const headers = new Headers(request.headers);
  let ip = "";
  try {
    ip = clientAddress;
  } catch {
    /* no socket address (e.g. prerendering) */
  }
  if (ip) headers.set(CLIENT_IP_HEADER, ip);
  else headers.delete(CLIENT_IP_HEADER);
  const forwarded = new Request(request, { headers });
  try {
    return await auth.handler(forwarded);
  } catch (err) {
    if (isDatabaseUnavailable(err)) {
      console.error(`[auth] ${request.method} ${url.pathname}: database unavailable:`, (err as Error).message);
      return unavailable();
    }
    console.error(`[auth] ${request.method} ${url.pathname} failed:`, err);
    return problem(500, "Something went wrong on our side; try again.");
  }
};
