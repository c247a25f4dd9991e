import type { APIRoute } from "astro";
import { handleAuthRequest } from "@/lib/server/auth-gate";
import { clientAddressOf } from "@/lib/server/client-address";
import { isDatabaseUnavailable } from "@/lib/server/db/unavailable";
import { problem, unavailable } from "@/lib/server/http";

/**
 * better-auth's routes, behind the gate of lib/server/auth-gate.ts (allowlist, rate limits). The client
 * address is the socket's, or a trusted proxy's forwarded value (lib/server/client-address.ts).
 * Not written with `endpoint(…)`: better-auth reads the request and writes its own answers and errors;
 * what it throws besides those (its database gone, or a bug) is answered here: 503 with Retry-After
 * for a lost database, 500 without internals otherwise.
 */
export const ALL: APIRoute = async (context) => {
  let astroAddress: string | undefined;
  try {
    astroAddress = context.clientAddress;
  } catch {
    /* no socket address (e.g. prerendering) */
  }
  const { request, url } = context;
  try {
    return await handleAuthRequest(request, { clientAddress: clientAddressOf(request, astroAddress) });
  } catch (err) {
    if (isDatabaseUnavailable(err)) {
      console.error(`[auth] ${request.method} ${url.pathname}: database unavailable:`, (err as Error).message);
      return unavailable();
    }
    console.error(`[auth] ${request.method} ${url.pathname} failed:`, err);
    return problem(500, "Something went wrong on our side; try again.");
  }
};
