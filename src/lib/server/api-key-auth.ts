/**
 * `Authorization: Bearer <key>` on /api/v1: the key into `locals` (the member who made it as `user`, the
 * key as `apiKey`), or the refusal (401 for a missing, malformed, unknown or revoked key; 429 past the
 * key's limit). The endpoint factory then applies the key's scope and organisation (lib/server/http.ts).
 */
import { problem, unavailable } from "@/lib/server/http";
import { isDatabaseUnavailable } from "@/lib/server/db/unavailable";
import { authenticateApiKey, type ApiKeyPrincipal, type UserRow } from "@/lib/server/services/api-keys";

/**
 * The credentials of an `Authorization: Bearer …` header ("" when the header names Bearer without a
 * credential), or null when the request carries no bearer credentials.
 */
export function bearerToken(headers: Headers): string | null {
  const value = headers.get("authorization");
  if (value === null) return null;
  const m = /^\s*bearer(?:\s+(.*))?$/i.exec(value);
  return m ? (m[1] ?? "").trim() : null;
}

export const INVALID_KEY = "The API key is not valid or has been revoked";

/** The signed-in identity a key gives, or the response that refuses it. */
export async function apiKeyIdentity(token: string): Promise<{ user: UserRow; apiKey: ApiKeyPrincipal } | Response> {
  let check: Awaited<ReturnType<typeof authenticateApiKey>>;
  try {
    check = await authenticateApiKey(token);
  } catch (err) {
    if (!isDatabaseUnavailable(err)) throw err;
    console.error("[api-key] key lookup failed:", (err as Error).message);
    return unavailable("The key store is unavailable at the moment; nothing was changed. Try again in a few seconds.");
  }
  if (check.kind === "invalid") {
    const res = problem(401, INVALID_KEY);
    res.headers.set("www-authenticate", 'Bearer realm="paneray", error="invalid_token"');
    return res;
  }
  if (check.kind === "limited") {
    const res = problem(429, `This API key has made more than ${check.limit} requests in a minute; try again in ${check.retryAfterSeconds} s`, {
      retryAfterSeconds: check.retryAfterSeconds,
    });
    res.headers.set("retry-after", String(check.retryAfterSeconds));
    return res;
  }
  // What the caller does is recorded under their name with the key's (histories, comments, "made by"): a change made
  // by a script reads "Ines Halden (API key “Nightly export”)", not as if the owner had made it by hand.
  return { user: { ...check.user, name: `${check.user.name} (API key “${check.apiKey.name}”)` }, apiKey: check.apiKey };
}
