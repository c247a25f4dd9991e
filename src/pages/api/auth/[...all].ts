import type { APIRoute } from "astro";
import { handleAuthRequest } from "@/lib/server/auth-gate";
import { clientAddressOf } from "@/lib/server/client-address";

/**
 * better-auth's routes, behind the gate of lib/server/auth-gate.ts (allowlist, rate limits). The client
 * address is the socket's, or a trusted proxy's forwarded value (lib/server/client-address.ts).
 * Not written with `endpoint(…)`: better-auth reads the request and writes its own answers and errors.
 */
export const ALL: APIRoute = (context) => {
  let astroAddress: string | undefined;
  try {
    astroAddress = context.clientAddress;
  } catch {
    /* no socket address (e.g. prerendering) */
  }
  return handleAuthRequest(context.request, { clientAddress: clientAddressOf(context.request, astroAddress) });
};
