import { SignUpRequest, SignUpResponse } from "@/lib/contracts/auth";
import { limitSignUp } from "@/lib/server/auth-gate";
import { endpoint, jsonOf } from "@/lib/server/http";
import { SIGN_UP_PENDING_MESSAGE, signUp } from "@/lib/server/services/accounts";

/**
 * Creates an account. Without an invitation: 201 and a confirmation mail (the same answer whether or not the
 * address already has an account). With an invitation: 201, the new member is signed in (session cookie).
 */
export const POST = endpoint({ auth: "anonymous", body: SignUpRequest, maxBytes: 16 * 1024 }, async ({ body, request, context }) => {
  let astroAddress: string | undefined;
  try {
    astroAddress = context.clientAddress;
  } catch {
    /* no socket address */
  }
  const limited = await limitSignUp(request, astroAddress);
  if (limited) return limited;
  const result = await signUp(body);
  if (result.kind === "pending-verification") return jsonOf(SignUpResponse, { status: "verification-sent", message: SIGN_UP_PENDING_MESSAGE }, 201);
  const res = jsonOf(SignUpResponse, { userId: result.userId, organizationId: result.organizationId }, 201);
  for (const c of result.headers.getSetCookie()) res.headers.append("set-cookie", c);
  return res;
});
