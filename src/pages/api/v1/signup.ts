import { SignUpRequest } from "@/lib/contracts/auth";
import { endpoint, json, readJson } from "@/lib/server/http";
import { signUp } from "@/lib/server/services/accounts";

export const prerender = false;

/** Creates an account (and its organisation, or joins an invitation's) and signs it in. */
export const POST = endpoint(async ({ request }) => {
  const input = await readJson(request, SignUpRequest, 16 * 1024);
  const { headers, userId, organizationId } = await signUp(input);
  const res = json({ userId, organizationId }, 201);
  for (const c of headers.getSetCookie()) res.headers.append("set-cookie", c);
  return res;
});
