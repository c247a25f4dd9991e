import { SignUpRequest } from "@/lib/contracts/auth";
import { endpoint, json } from "@/lib/server/http";
import { signUp } from "@/lib/server/services/accounts";

/** Creates an account (and its organisation, or joins an invitation's) and signs it in. */
export const POST = endpoint({ auth: "anonymous", body: SignUpRequest, maxBytes: 16 * 1024 }, async ({ body }) => {
  const { headers, userId, organizationId } = await signUp(body);
  const res = json({ userId, organizationId }, 201);
  for (const c of headers.getSetCookie()) res.headers.append("set-cookie", c);
  return res;
});
