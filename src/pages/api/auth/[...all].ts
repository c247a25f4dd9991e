import type { APIRoute } from "astro";
import { auth, CLIENT_IP_HEADER } from "@/lib/server/auth";

/**
 * better-auth's own routes. The socket's address is passed on in a header of our own (any value the
 * client sent under that name is replaced), so that rate limits apply per client, not to everyone at once.
 * Not written with `endpoint(…)`: better-auth reads the request and writes its own answers and errors.
 */
export const ALL: APIRoute = ({ request, clientAddress }) => {
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
  return auth.handler(forwarded);
};
